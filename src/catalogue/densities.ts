import type { ProvenanceLevel } from './types';

// Solution density: per-solute fits of the apparent density of the solute in water (Laliberté & Cooper 2004 form),
// combined over the solutes of a mixture by their mixing rule. engine/density.ts evaluates them.

/**
 * A part of a solute as the engine's speciation names it: a strong ion id (`Na+`, `Cl-`), `H+` or `OH-`, or a form of
 * an acid system as `<system id>#<protons lost>` (`phosphate#1` is H2PO4⁻, `ammonium#0` is NH4⁺, `ammonium#1` is NH3),
 * or an excipient reagent as `excipient:<reagent id>`.
 */
export type DensityPart = string;

/**
 * One solute with a fitted apparent density: ρapp (kg/m³) = (c0 w + c1) exp(1e−6 (t + c4)²) / (w + c2 + c3 t),
 * with w the mass fraction of all solutes and t in °C (Laliberté & Cooper 2004, J. Chem. Eng. Data 49, 1141, eq. 12).
 */
export interface DensityFit {
  /** anhydrous formula of one formula unit, for its molar mass */
  formula: string;
  /** what one formula unit is made of (a salt: its cation and anion; a neutral solute: itself) */
  parts: { part: DensityPart; count: number }[];
  c: [number, number, number, number, number];
  /** the temperatures, °C, and the largest solute mass fraction, of the data the fit was made to */
  rangeC: [number, number];
  maxMassFraction: number;
  source: string;
  level: ProvenanceLevel;
}

// The coefficients as the open-source `chemicals` library transcribes Laliberté's updated table
// (chemicals/Electrolytes/Laliberte2009.tsv); rounded here to 7 significant figures, not checked against the paper.
const LALIBERTE_2009 = 'Laliberté 2009, J. Chem. Eng. Data 54, 1725, updated parameters, as the chemicals library transcribes them';

type Coefficients = DensityFit['c'];
function fit(formula: string, parts: Record<DensityPart, number>, c: Coefficients, rangeC: [number, number], maxMassFraction: number): DensityFit {
  return { formula, parts: Object.entries(parts).map(([part, count]) => ({ part, count })), c, rangeC, maxMassFraction, source: LALIBERTE_2009, level: 'recalled' };
}

export const DENSITY_FITS: readonly DensityFit[] = [
  // chlorides
  fit('NaCl', { 'Na+': 1, 'Cl-': 1 }, [-0.003241122, 0.06363543, 1.013714, 0.01459510, 3317.349], [0, 140], 0.2659),
  fit('KCl', { 'K+': 1, 'Cl-': 1 }, [-0.8559289, 6.040736, 2.817874, 0.02539246, 2681.617], [5, 125], 0.2643),
  fit('LiCl', { 'Li+': 1, 'Cl-': 1 }, [1777.712, 208.0957, 0.09240329, -0.00009651382, -303.2121], [-5, 127], 0.4539),
  fit('CaCl2', { 'Ca2+': 1, 'Cl-': 2 }, [-9.728937, 14.70054, 4.190333, 0.03974036, 2708.128], [15, 126.7], 0.5132),
  fit('MgCl2', { 'Mg2+': 1, 'Cl-': 2 }, [-0.02150014, 0.04412021, 1.532276, -0.009807851, -3478.365], [0, 98.67], 0.3238),
  fit('NH4Cl', { 'ammonium#0': 1, 'Cl-': 1 }, [16.88822, 318.5603, 5.086556, -0.01506165, -1769.122], [12.5, 100], 0.4),
  fit('HCl', { 'H+': 1, 'Cl-': 1 }, [0.0002838723, 0.003949470, 2.850200, -0.01577470, -3766.209], [5, 98.8], 0.3757),
  // sulfates
  fit('Na2SO4', { 'Na+': 2, 'sulfate#2': 1 }, [0.000004450254, 0.000009120865, 0.08403584, 0.004657675, 4349.505], [0, 125], 0.3252),
  fit('K2SO4', { 'K+': 2, 'sulfate#2': 1 }, [0.000007105994, 0.00004655587, 0.3495668, 0.007510536, 4200.094], [0, 98.67], 0.1515),
  fit('(NH4)2SO4', { 'ammonium#0': 2, 'sulfate#2': 1 }, [618.2408, 966.1281, 0.6027062, 0.001627903, 667.5734], [15, 55], 0.4292),
  fit('MgSO4', { 'Mg2+': 1, 'sulfate#2': 1 }, [98.12017, 59.26576, -0.03034050, 0.0005036192, 1763.759], [0, 125], 0.2682),
  fit('NaHSO4', { 'Na+': 1, 'sulfate#1': 1 }, [422.2586, 303.9298, 0.2790062, 0.003247608, 1179.462], [25, 45], 0.2982),
  // phosphates
  fit('NaH2PO4', { 'Na+': 1, 'phosphate#1': 1 }, [1614.752, 1267.614, 0.3310395, 0.001253549, 347.0401], [25, 45], 0.3571),
  fit('Na2HPO4', { 'Na+': 2, 'phosphate#2': 1 }, [0.00000002713348, 0.000000008298301, -0.04743518, 0.002594721, 5012.937], [25, 45], 0.0766),
  fit('Na3PO4', { 'Na+': 3, 'phosphate#3': 1 }, [155.8041, 251.2182, -0.1631607, 0.0003012208, 1298.070], [25, 80], 0.3),
  fit('KH2PO4', { 'K+': 1, 'phosphate#1': 1 }, [0.1751271, 0.05838011, 0.1701945, 0.003234401, 3062.751], [20, 40], 0.2321),
  fit('K2HPO4', { 'K+': 2, 'phosphate#2': 1 }, [0.01021016, 0.4771736, 0.2720686, 0.001841100, 2889.865], [24.95, 25], 0.181),
  fit('K3PO4', { 'K+': 3, 'phosphate#3': 1 }, [-1.368083, 1335.049, -0.2680934, 0.01743935, 1046.120], [24.85, 25], 0.2094),
  fit('H3PO4', { 'phosphate#0': 1 }, [1288.255, -4126.675, -4.646826, 0.004661680, -944.4597], [15.85, 81.4], 0.85),
  // hydroxides, nitrates, bromides
  fit('NaOH', { 'Na+': 1, 'OH-': 1 }, [319.0205, 528.5924, -0.1021979, 0.0003504207, 765.9705], [4, 120], 0.5029),
  fit('KOH', { 'K+': 1, 'OH-': 1 }, [821.1190, 1043.202, 0.1128733, 0.001240236, 539.6304], [4, 95], 0.5186),
  fit('NaNO3', { 'Na+': 1, 'NO3-': 1 }, [22.34993, 66.44787, 0.9898883, 0.009471651, 1971.551], [0, 100], 0.4892),
  fit('KNO3', { 'K+': 1, 'NO3-': 1 }, [1.490687, 6.672924, 1.471507, 0.01558727, 2539.227], [5, 95], 0.2840),
  fit('NH4NO3', { 'ammonium#0': 1, 'NO3-': 1 }, [1412.563, 1214.076, 0.7050713, 0.001177609, 107.0818], [25, 95], 0.7874),
  fit('HNO3', { 'H+': 1, 'NO3-': 1 }, [0.2720708, -0.3996060, -2.336920, 0.006621124, -3089.018], [-10, 95], 0.7011),
  fit('NaBr', { 'Na+': 1, 'Br-': 1 }, [23.76594, 210.7219, 2.010235, 0.01639412, 1941.829], [0, 95], 0.5482),
  fit('KBr', { 'K+': 1, 'Br-': 1 }, [-13.15139, 190.7454, 5.397386, 0.04026625, 2153.225], [0, 95], 0.5037),
  // carbonates, carboxylates
  fit('Na2CO3', { 'Na+': 2, 'carbonate#2': 1 }, [0.0000005454865, 0.0000001721549, -0.08258502, 0.001688229, 4705.398], [0, 100.14], 0.2094),
  fit('NaHCO3', { 'Na+': 1, 'carbonate#1': 1 }, [0.03773781, 0.007100297, 0.07357334, 0.001683698, 3291.384], [0, 125], 0.1264),
  fit('K2CO3', { 'K+': 2, 'carbonate#2': 1 }, [2290.109, 1038.774, 0.1097693, 0.0004977833, -74.07869], [5, 95], 0.3606),
  fit('KHCO3', { 'K+': 1, 'carbonate#1': 1 }, [0.04584793, 0.07491278, 0.5057669, 0.006439519, 3163.652], [5, 95], 0.3438),
  fit('NaCH3CO2', { 'Na+': 1, 'acetate#1': 1 }, [1732.570, 83.54135, 0.04004297, 0.00004715697, -274.9274], [5, 95], 0.3171),
  fit('KCH3CO2', { 'K+': 1, 'acetate#1': 1 }, [-12939.12, 69601.65, 116.5993, 0.3826326, 1096.809], [15, 55], 0.5955),
  fit('CH3COOH', { 'acetate#0': 1 }, [647.2892, -1054.582, -1.746108, 0.0003655664, -822.9995], [5, 85], 1),
  fit('NaHCO2', { 'Na+': 1, 'formate#1': 1 }, [757.6205, 1317.081, 0.7569154, 0.003164687, 687.3445], [25, 45], 0.4060),
  fit('HCOOH', { 'formate#0': 1 }, [426.9317, 2908.857, 3.769335, 0.01381261, 763.3231], [15, 55], 1),
  // neutral
  fit('NH3', { 'ammonium#1': 1 }, [0.06376317, 0.06817998, 1.237600, -0.005998525, -3078.578], [20, 140.65], 0.5219),
  fit('C12H22O11', { 'excipient:sucrose': 1 }, [532.9199, 13692.59, 12.61273, 0.02664159, 649.0492], [15, 55], 0.5066),
];

/**
 * What a solute with no fit is taken to occupy: an apparent specific volume, L per kg of solute, and its stated ±.
 * Organic solutes and salts of organic ions: 0.6 (small neutral organics and sugars lie near 0.6–0.8, organic salts
 * lower); inorganic salts: 0.25 (the fitted inorganic salts above lie at about 0.05–0.35 near 1 mol/L). From memory,
 * not a measured value for any one solute: results where such solutes are a large part of the solution say so.
 */
export const DENSITY_ESTIMATE = {
  organicLPerKg: 0.6,
  inorganicLPerKg: 0.25,
  plusMinusLPerKg: 0.2,
  /** molar mass assumed for a form whose formula is unknown (user-defined systems), g/mol */
  unknownMolarMassGPerMol: 150,
  source: 'estimate from memory: an apparent specific volume of 0.6 L/kg for organic solutes and 0.25 L/kg for inorganic salts (±0.2 L/kg)',
} as const;
