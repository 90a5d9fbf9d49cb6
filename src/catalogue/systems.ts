import type { AcidStep, AcidSystem } from './types';

// Thermodynamic pKa, ΔrH° and ΔrCp° at 25 °C, I = 0. Values were taken from the table of
// Goldberg, Kishore & Lennen 2002 (J. Phys. Chem. Ref. Data 31, 231) as recalled; they could not
// be checked against the paper here, so each says "from memory" until someone does.
const GKL = 'Goldberg, Kishore & Lennen 2002, J. Phys. Chem. Ref. Data 31, 231 (from memory)';

function step(pKa: number, dHkJPerMol?: number, dCpJPerKMol?: number, source: string = GKL): AcidStep {
  return { pKa, dHkJPerMol, dCpJPerKMol, source };
}

const HPA_1945 = 'pKa: Goldberg, Kishore & Lennen 2002; ΔrH°, ΔrCp°: Hamer, Pinching & Acree 1945, J. Res. NBS 35, 539 (both from memory)';

const PB_1948 = 'pKa: Goldberg, Kishore & Lennen 2002; ΔrH°, ΔrCp°: Pinching & Bates 1948, J. Res. NBS 40, 405 (both from memory)';

/** Data from 25 °C with ΔrCp° extrapolate reliably over about this range (common practice). */
const RANGE_GKL: [number, number] = [0, 60];

export const ACID_SYSTEMS: readonly AcidSystem[] = [
  {
    id: 'phosphate', name: 'phosphate', aliases: ['phosphoric acid', 'orthophosphate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H3PO4',
    forms: ['H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'],
    steps: [step(2.148, -8.0, -141), step(7.198, 3.6, -230), step(12.35, 16.0, -242)],
    temperatureRangeC: RANGE_GKL,
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'CaHPO4 and MgHPO4 ion pairs and calcium phosphate precipitation are not modelled', source: 'common practice' },
  },
  {
    id: 'citrate', name: 'citrate', aliases: ['citric acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C6H8O7',
    forms: ['H3Cit', 'H2Cit⁻', 'HCit²⁻', 'Cit³⁻'],
    steps: [step(3.128, 4.07, -131), step(4.761, 2.23, -178), step(6.396, -3.38, -254)],
    temperatureRangeC: RANGE_GKL,
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'citrate binds Ca²⁺ and Mg²⁺, releasing protons, which the model leaves out: the pH reads high', source: 'common practice' },
  },
  {
    id: 'acetate', name: 'acetate', aliases: ['acetic acid', 'ethanoate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C2H4O2',
    forms: ['CH3COOH', 'CH3COO⁻'],
    steps: [step(4.756, -0.41, -142)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'carbonate', name: 'carbonate', aliases: ['carbonic acid', 'bicarbonate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H2CO3',
    forms: ['CO2(aq)', 'HCO3⁻', 'CO3²⁻'],
    steps: [step(6.351, 9.15, -371), step(10.329, 14.7, -249)],
    temperatureRangeC: [0, 50],
    formSolubility: {
      formIndex: 0, maxM: 0.034, temperatureC: 25, source: "Henry's law constant of CO2, about 0.034 mol/(L·atm) at 25 °C (from memory)",
      consequence: 'CO2 comes out as bubbles, and in an open vessel the pH rises above this closed-system value',
    },
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'carbonate ion pairs and CaCO3 precipitation are not modelled', source: 'common practice' },
    notes: 'Closed system: no exchange of CO2 with air. CO2(aq) and H2CO3 are counted together.',
  },
  {
    id: 'borate', name: 'borate', aliases: ['boric acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H3BO3',
    forms: ['B(OH)3', 'B(OH)4⁻'],
    steps: [step(9.237, 13.8, -240)],
    temperatureRangeC: RANGE_GKL,
    formSolubility: {
      formIndex: 0, maxM: 0.92, temperatureC: 25, source: 'CRC Handbook, boric acid about 57 g/L in water at 25 °C (from memory)',
      consequence: 'boric acid may crystallise out',
    },
    notes: 'Monomeric borate only.',
    concentrationLimit: {
      maxTotalM: 0.025,
      reason: 'polyborate ions form, which this monomeric model leaves out; the further below pH 9, the higher the computed pH reads',
      source: 'common practice',
    },
  },
  {
    id: 'phthalate', name: 'phthalate', aliases: ['phthalic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C8H6O4',
    forms: ['H2Phth', 'HPhth⁻', 'Phth²⁻'],
    // ΔrH° and ΔrCp° of step 1 from the slope and curvature at 298.15 K of the Harned-cell fit
    // pK1 = 561.57/T − 1.2843 + 0.0078833·T; a recalled +2.7 kJ/mol had the sign wrong.
    steps: [step(2.95, -2.67, -90, HPA_1945), step(5.408, -2.17, -295)],
    temperatureRangeC: RANGE_GKL,
    formSolubility: {
      formIndex: 0, maxM: 0.036, temperatureC: 25, source: 'CRC Handbook, phthalic acid about 6 g/L in water at 25 °C (from memory)',
      consequence: 'phthalic acid may crystallise out (solutions near the limit can stay supersaturated for a while)',
    },
  },
  {
    id: 'oxalate', name: 'oxalate', aliases: ['oxalic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C2H2O4',
    forms: ['H2C2O4', 'HC2O4⁻', 'C2O4²⁻'],
    // ΔrH° and ΔrCp° of step 2 from the slope and curvature at 298.15 K of the Harned-cell fit
    // pK2 = 1423.8/T − 6.5007 + 0.020095·T; a recalled +7.3 kJ/mol had the sign wrong.
    steps: [step(1.27, -3.9, -231), step(4.266, -6.94, -229, PB_1948)],
    temperatureRangeC: RANGE_GKL,
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'calcium oxalate is sparingly soluble and may precipitate; oxalate complexes are not modelled', source: 'common practice' },
  },
  {
    id: 'tartrate', name: 'tartrate', aliases: ['tartaric acid', 'L-tartrate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C4H6O6',
    forms: ['H2Tart', 'HTart⁻', 'Tart²⁻'],
    steps: [step(3.036, 3.19, -144), step(4.366, 0.93, -217)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'succinate', name: 'succinate', aliases: ['succinic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C4H6O4',
    forms: ['H2Succ', 'HSucc⁻', 'Succ²⁻'],
    steps: [step(4.207, 3.0, -121), step(5.636, -0.5, -217)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'formate', name: 'formate', aliases: ['formic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'CH2O2',
    forms: ['HCOOH', 'HCOO⁻'],
    steps: [step(3.75, -0.1, -165)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'lactate', name: 'lactate', aliases: ['lactic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C3H6O3',
    forms: ['HLac', 'Lac⁻'],
    steps: [step(3.86, -0.33, -141)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'maleate', name: 'maleate', aliases: ['maleic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C4H4O4',
    forms: ['H2Mal', 'HMal⁻', 'Mal²⁻'],
    steps: [step(1.92, 1.1, -21), step(6.27, -3.6, -314)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'sulfate', name: 'sulfate', aliases: ['sulfuric acid', 'hydrogen sulfate', 'bisulfate', 'sulphate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H2SO4',
    forms: ['H2SO4', 'HSO4⁻', 'SO4²⁻'],
    steps: [
      step(-3, undefined, undefined, 'common practice: the first step is complete; pKa −3 keeps it so down to pH −1'),
      step(1.987, -22.4, -258),
    ],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'ammonium', name: 'ammonium', aliases: ['ammonia'],
    chargeMostProtonated: 1, formulaMostProtonated: 'NH4',
    forms: ['NH4⁺', 'NH3'],
    steps: [step(9.245, 51.95, 8)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'tris', name: 'Tris', aliases: ['trometamol', 'tromethamine', 'THAM', 'tris(hydroxymethyl)aminomethane'],
    chargeMostProtonated: 1, formulaMostProtonated: 'C4H12NO3',
    forms: ['TrisH⁺', 'Tris'],
    steps: [step(8.072, 47.45, -59)],
    temperatureRangeC: RANGE_GKL,
  },
  good('hepes', 'HEPES', 'C8H18N2O4S', 7.564, 20.4, 47, 0, 'pK at 25 °C checked against Vega & Bates 1976, Anal. Chem. 48, 1293'),
  good('mes', 'MES', 'C6H13NO4S', 6.27, 14.8, 5, 0, 'pK at 25 °C checked against Vega & Bates 1976, Anal. Chem. 48, 1293'),
  good('mops', 'MOPS', 'C7H15NO4S', 7.184, 21.1, 25),
  good('pipes', 'PIPES', 'C8H17N2O6S2', 7.141, 11.2, 22, -1),
  good('aces', 'ACES', 'C4H10N2O4S', 6.847, 30.43, -49, 0, 'pK(T) checked against Roy et al. 1997, J. Chem. Eng. Data 42, 41, 5–55 °C, within 0.003'),
  good('tes', 'TES', 'C6H15NO6S', 7.55, 32.13, 0, 0, 'pK at 25 °C checked against Vega & Bates 1976, Anal. Chem. 48, 1293'),
  good('bicine', 'bicine', 'C6H13NO4', 8.334, 26.34, 0),
  good('tricine', 'tricine', 'C6H13NO5', 8.135, 31.37, -53),
  good('taps', 'TAPS', 'C7H17NO6S', 8.44, 40.4, 15),
  good('ches', 'CHES', 'C8H17NO3S', 9.394, 39.55, 9, 0, 'pK(T) checked against Roy et al. 1997, J. Chem. Eng. Data 42, 41, 5–55 °C, within 0.003'),
  good('caps', 'CAPS', 'C9H19NO3S', 10.499, 48.1, 57),
  {
    id: 'glycine', name: 'glycine', aliases: ['glycinate'],
    chargeMostProtonated: 1, formulaMostProtonated: 'C2H6NO2',
    forms: ['H2Gly⁺', 'HGly±', 'Gly⁻'],
    steps: [step(2.351, 4.0, -139), step(9.78, 44.2, -57)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'histidine', name: 'histidine', aliases: ['L-histidine'],
    chargeMostProtonated: 2, formulaMostProtonated: 'C6H11N3O2',
    forms: ['H3His²⁺', 'H2His⁺', 'HHis±', 'His⁻'],
    steps: [step(1.54, 3.6), step(6.07, 29.5, 176), step(9.34, 43.8, -233)],
    temperatureRangeC: RANGE_GKL,
    formSolubility: {
      formIndex: 2, maxM: 0.27, temperatureC: 25, source: 'CRC Handbook, L-histidine about 42 g/L in water at 25 °C (from memory)',
      consequence: 'histidine may crystallise out',
    },
  },
  {
    id: 'imidazole', name: 'imidazole', aliases: ['glyoxaline'],
    chargeMostProtonated: 1, formulaMostProtonated: 'C3H5N2',
    forms: ['ImH⁺', 'Im'],
    steps: [step(6.993, 36.64, -9)],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'edta', name: 'EDTA', aliases: ['edetate', 'ethylenediaminetetraacetic acid'],
    chargeMostProtonated: 2, formulaMostProtonated: 'C10H18N2O8',
    forms: ['H6Y²⁺', 'H5Y⁺', 'H4Y', 'H3Y⁻', 'H2Y²⁻', 'HY³⁻', 'Y⁴⁻'],
    steps: [step(0.0), step(1.5), step(2.0, 1.3), step(2.69, 1.7), step(6.273, 16.4), step(10.948, 23.4)],
    temperatureRangeC: [5, 45],
    formSolubility: {
      formIndex: 2, maxM: 0.0017, temperatureC: 25, source: 'Merck Index, EDTA free acid about 0.5 g/L in water at 25 °C (from memory)',
      consequence: 'EDTA free acid may precipitate; it dissolves only as base is added',
    },
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'EDTA binds Ca²⁺ and Mg²⁺ strongly, releasing protons, which the model leaves out: the pH reads high', source: 'common practice' },
  },
];

/** A Good's buffer with one step in its working range, most protonated form charge `z0`. */
function good(id: string, name: string, formula: string, pKa: number, dH: number, dCp: number, z0: number = 0, checked = ''): AcidSystem {
  const acidLabel = z0 === 0 ? `H${name}±` : `H${name}⁻`;
  const baseLabel = z0 === 0 ? `${name}⁻` : `${name}²⁻`;
  return {
    id, name, aliases: [`${name} buffer`],
    chargeMostProtonated: z0, formulaMostProtonated: formula,
    forms: [acidLabel, baseLabel],
    steps: [step(pKa, dH, dCp, checked ? `${GKL}; ${checked}` : GKL)],
    temperatureRangeC: RANGE_GKL,
    notes: 'Only the step in the working range is modelled; a carboxyl or sulfonate step below pH 3 is not.',
  };
}
