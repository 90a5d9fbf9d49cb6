import { checked, practice, recalled, stepSourceText } from './provenance';
import type { AcidStep, AcidSystem, AlternativeValue, Provenance } from './types';

// Thermodynamic pKa, ΔrH° and ΔrCp° at 25 °C, I = 0. Values were taken from the table of
// Goldberg, Kishore & Lennen 2002 (J. Phys. Chem. Ref. Data 31, 231) as recalled; the compilation itself could
// not be read here, so each stays "recalled" unless it was checked in a primary measurement's own text
// (its abstract or fitted equation), which the step's provenance then names, with where the value was read.
const GKL_SOURCE = 'Goldberg, Kishore & Lennen 2002, J. Phys. Chem. Ref. Data 31, 231';
const GKL = recalled(GKL_SOURCE);

interface StepInput { pKa?: Provenance; dH?: Provenance; dCp?: Provenance; alternative?: AlternativeValue }

/** A step; each constant's provenance defaults to the recalled compilation, none where the value is absent. */
function step(pKa: number, dHkJPerMol?: number, dCpJPerKMol?: number, input: StepInput = {}): AcidStep {
  const provenance = {
    pKa: input.pKa ?? GKL,
    dH: dHkJPerMol === undefined ? null : input.dH ?? GKL,
    dCp: dCpJPerKMol === undefined ? null : input.dCp ?? GKL,
  };
  return { pKa, dHkJPerMol, dCpJPerKMol, source: stepSourceText(provenance), provenance, ...(input.alternative ? { alternative: input.alternative } : {}) };
}

/** The same checked source for all three constants of a step. */
const all = (p: Provenance): StepInput => ({ pKa: p, dH: p, dCp: p });

const HPA_1945 = recalled('Hamer, Pinching & Acree 1945, J. Res. NBS 35, 539: ΔrH°, ΔrCp° from the slope and curvature at 298.15 K of the recalled fit pK1 = 561.57/T − 1.2843 + 0.0078833·T');
const PB_1948 = recalled('Pinching & Bates 1948, J. Res. NBS 40, 405: ΔrH°, ΔrCp° from the slope and curvature at 298.15 K of the recalled fit pK2 = 1423.8/T − 6.5007 + 0.020095·T');

// Primary measurements read here (abstracts with their fitted equations or 25 °C values). A checked value agrees
// with the source within 0.003 pKa, 1 kJ/mol ΔrH° and 30 J/(K·mol) ΔrCp°; ΔrH° and ΔrCp° from a fit are its slope
// and curvature at 298.15 K (ΔrH° = −R T² ln10 dpK/dT, ΔrCp° = dΔrH°/dT).
const PLUMMER_1982 = 'Plummer & Busenberg 1982, Geochim. Cosmochim. Acta 46, 1011';
const MANOV_1944 = 'Manov, DeLollis & Acree 1944, J. Res. NBS 33, 287';
const ROY_1997_JCED = 'Roy et al. 1997, J. Chem. Eng. Data 42, 41';
const ROY_1997_JSC = 'Roy et al. 1997, J. Solution Chem. 26, 1209';
const ROY_1997_JCT = 'Roy et al. 1997, J. Chem. Thermodyn. 29, 749';
const ROY_2006 = 'Roy et al. 2006, J. Chem. Thermodyn. 38, 413';
const VEGA_BATES_1976 = 'Vega & Bates 1976, Anal. Chem. 48, 1293';
const BENEZETH_1997 = 'Bénézeth, Palmer & Wesolowski 1997, J. Solution Chem. 26, 63';
const BATES_1951 = 'Bates 1951, J. Res. NBS 47, 127';
const TRIS_1987 = 'Acid association quotients of Tris in aqueous NaCl media to 200 °C, J. Solution Chem. 16 (7), 1987 (OSTI 6977699)';
const KETTLER_1991 = 'Kettler, Palmer & Wesolowski 1991, J. Solution Chem. 20 (9)';
const DALTON_1994 = 'Potentiometric study of the protonation equilibria of tartaric acid in aqueous NaClO4 at 25 °C, J. Chem. Soc., Dalton Trans. 1994, 2729';
const BELL_1993 = 'Bell, Wesolowski & Palmer 1993, J. Solution Chem. 22, 125: formic acid in NaCl media to 200 °C';
const KETTLER_1995 = 'Kettler, Wesolowski & Palmer 1995, J. Solution Chem. 24 (1)';

// Where the compilation and a primary study disagree beyond their uncertainties, the step keeps the compilation's
// value and carries the other as `alternative`: one study read only in its abstract does not overturn an evaluated
// selection; CONSTANTS shows what the other value does to the pH.
const KEEP_COMPILATION = "the compilation's evaluated value is used; the single study is shown beside it until the fuller source is read";

/** Data from 25 °C with ΔrCp° extrapolate reliably over about this range (common practice). */
const RANGE_GKL: [number, number] = [0, 60];

export const ACID_SYSTEMS: readonly AcidSystem[] = [
  {
    id: 'phosphate', name: 'phosphate', aliases: ['phosphoric acid', 'orthophosphate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H3PO4',
    forms: ['H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'],
    // step 1 checked: Bates 1951 (abstract, −log K1 = 799.31/T − 4.5535 + 0.013486·T, 0–60 °C, ± 0.005; the
    // abstract's scan garbles two digits, read against the recalled coefficients): at 298.15 K 2.148, ΔrH° −7.65
    // kJ/mol, ΔrCp° −154 J/(K·mol), all within the checked bounds.
    steps: [
      step(2.148, -8.0, -141, all(checked(BATES_1951, 'abstract, fitted −log K1(T), 0–60 °C, at 298.15 K: 2.148, −7.65 kJ/mol, −154 J/(K·mol); stated accuracy ± 0.005', 0.005))),
      step(7.198, 3.6, -230), step(12.35, 16.0, -242),
    ],
    temperatureRangeC: RANGE_GKL,
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'CaHPO4 and MgHPO4 ion pairs and calcium phosphate precipitation are not modelled', source: 'common practice' },
  },
  {
    id: 'citrate', name: 'citrate', aliases: ['citric acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C6H8O7',
    forms: ['H3Cit', 'H2Cit⁻', 'HCit²⁻', 'Cit³⁻'],
    // checked: Bénézeth et al. 1997, abstract, 25 °C values (log K −3.127, −4.759, −6.397; ΔrH° 4.1, 2.2, −3.6 kJ/mol;
    // ΔrCp° −162 ± 7, −192 ± 15, −231 ± 7 J/(K·mol)); step 1's ΔrCp° (recalled −131) changed to the source's −162.
    steps: [
      step(3.128, 4.07, -162, all(checked(BENEZETH_1997, 'abstract, 25 °C: log K1a −3.127 ± 0.002, ΔH 4.1 ± 0.2 kJ/mol, ΔCp −162 ± 7 J/(K·mol)', 0.002))),
      step(4.761, 2.23, -178, all(checked(BENEZETH_1997, 'abstract, 25 °C: log K2a −4.759 ± 0.001, ΔH 2.2 ± 0.1 kJ/mol, ΔCp −192 ± 15 J/(K·mol)', 0.001))),
      step(6.396, -3.38, -254, all(checked(BENEZETH_1997, 'abstract, 25 °C: log K3a −6.397 ± 0.002, ΔH −3.6 ± 0.2 kJ/mol, ΔCp −231 ± 7 J/(K·mol)', 0.002))),
    ],
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
    // checked: the log K1, log K2 and log KH equations of Plummer & Busenberg 1982 (abstract) at 298.15 K give
    // pK1 6.352, ΔrH° 9.11 kJ/mol, ΔrCp° −367; pK2 10.329, ΔrH° 14.90, ΔrCp° −290.5 (recalled −249 changed); KH 0.0340.
    steps: [
      step(6.351, 9.15, -371, all(checked(PLUMMER_1982, 'abstract, log K1(T) equation at 298.15 K: 6.352, 9.11 kJ/mol, −367 J/(K·mol)'))),
      step(10.329, 14.7, -290.5, all(checked(PLUMMER_1982, 'abstract, log K2(T) equation at 298.15 K: 10.329, 14.90 kJ/mol, −290.5 J/(K·mol)'))),
    ],
    temperatureRangeC: [0, 50],
    formSolubility: {
      formIndex: 0, maxM: 0.034, temperatureC: 25, source: `Henry's law constant of CO2, 0.0340 mol/(kg·atm) at 25 °C, ${PLUMMER_1982}`,
      level: 'checked', where: 'abstract, log KH(T) equation at 298.15 K: log KH = −1.468',
      consequence: 'CO2 comes out as bubbles, and in an open vessel the pH rises above this closed-system value',
    },
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'carbonate ion pairs and CaCO3 precipitation are not modelled', source: 'common practice' },
    notes: 'Closed system: no exchange of CO2 with air. CO2(aq) and H2CO3 are counted together.',
  },
  {
    id: 'borate', name: 'borate', aliases: ['boric acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H3BO3',
    forms: ['B(OH)3', 'B(OH)4⁻'],
    // checked: the fit pK = 2237.94/T + 0.016883·T − 3.305 (Manov et al. 1944, abstract, 0–60 °C) gives 9.235,
    // ΔrH° 14.11 kJ/mol and ΔrCp° −192.7 J/(K·mol) at 298.15 K; the recalled ΔrCp° −240 (0.013 off at 50 °C) and
    // ΔrH° 13.8 changed to the fit's (pKa kept: within 0.002 of the fit).
    steps: [step(9.237, 14.1, -192.7, all(checked(MANOV_1944, 'abstract, fitted pK(T), 0–60 °C, at 298.15 K: 9.235, 14.11 kJ/mol, −192.7 J/(K·mol)')))],
    temperatureRangeC: RANGE_GKL,
    formSolubility: {
      formIndex: 0, maxM: 0.92, temperatureC: 25, source: 'CRC Handbook, boric acid about 57 g/L in water at 25 °C', level: 'recalled',
      consequence: 'boric acid may crystallise out',
    },
    notes: 'Monomeric borate only.',
    concentrationLimit: {
      maxTotalM: 0.025,
      reason: 'polyborate ions form, which this monomeric model leaves out; the further below pH 9, the higher the computed pH reads',
      source: 'common practice', level: 'common practice',
    },
  },
  {
    id: 'phthalate', name: 'phthalate', aliases: ['phthalic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C8H6O4',
    forms: ['H2Phth', 'HPhth⁻', 'Phth²⁻'],
    // ΔrH° and ΔrCp° of step 1 from the slope and curvature at 298.15 K of the Harned-cell fit
    // pK1 = 561.57/T − 1.2843 + 0.0078833·T; a recalled +2.7 kJ/mol had the sign wrong.
    steps: [step(2.95, -2.67, -90, { dH: HPA_1945, dCp: HPA_1945 }), step(5.408, -2.17, -295)],
    temperatureRangeC: RANGE_GKL,
    formSolubility: {
      formIndex: 0, maxM: 0.036, temperatureC: 25, source: 'CRC Handbook, phthalic acid about 6 g/L in water at 25 °C', level: 'recalled',
      consequence: 'phthalic acid may crystallise out (solutions near the limit can stay supersaturated for a while)',
    },
  },
  {
    id: 'oxalate', name: 'oxalate', aliases: ['oxalic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C2H2O4',
    forms: ['H2C2O4', 'HC2O4⁻', 'C2O4²⁻'],
    // ΔrH° and ΔrCp° of step 2 from the slope and curvature at 298.15 K of the Harned-cell fit
    // pK2 = 1423.8/T − 6.5007 + 0.020095·T; a recalled +7.3 kJ/mol had the sign wrong.
    // Kettler, Palmer & Wesolowski 1991 (abstract, 25 °C, I = 0): log K1a −1.277 ± 0.010, ΔH −4.1 ± 1.1 kJ/mol,
    // ΔCp −168 ± 41 J/(K·mol): step 1's pKa and ΔrH° agree, its recalled ΔrCp° −231 changed to −168. Step 2: log K2a
    // −4.275 ± 0.006 against the catalogue's 4.266 (a dispute, kept as the alternative); ΔH −6.8 ± 0.5 agrees with the
    // fit's −6.94; ΔCp −261 ± 12 against the recalled fit's −229 is a second disagreement, left with the pKa's choice.
    steps: [
      step(1.27, -3.9, -168, all(checked(KETTLER_1991, 'abstract, 25 °C: log K1a −1.277 ± 0.010, ΔH −4.1 ± 1.1 kJ/mol, ΔCp −168 ± 41 J/(K·mol)', 0.010))),
      step(4.266, -6.94, -229, { dH: checked(KETTLER_1991, 'abstract, 25 °C: ΔH2a −6.8 ± 0.5 kJ/mol'), dCp: PB_1948,
        alternative: { pKa: 4.275, rule: KEEP_COMPILATION, provenance: checked(KETTLER_1991, 'abstract, 25 °C: log K2a −4.275 ± 0.006; ΔCp2a −261 ± 12 J/(K·mol)', 0.006) } }),
    ],
    temperatureRangeC: RANGE_GKL,
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'calcium oxalate is sparingly soluble and may precipitate; oxalate complexes are not modelled', source: 'common practice' },
  },
  {
    id: 'tartrate', name: 'tartrate', aliases: ['tartaric acid', 'L-tartrate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C4H6O6',
    forms: ['H2Tart', 'HTart⁻', 'Tart²⁻'],
    steps: [
      // the alternative: thermodynamic protonation constants log β1 4.36 ± 0.02, log β2 7.36 ± 0.02 from 0.5–3 M NaClO4
      // extrapolated with a Bromley model (J. Chem. Soc., Dalton Trans. 1994, 2729, abstract): pKa1 = 7.36 − 4.36 = 3.00
      step(3.036, 3.19, -144, { alternative: { pKa: 3.00, rule: KEEP_COMPILATION,
        provenance: checked(DALTON_1994, 'abstract: log β2 − log β1 = 7.36 − 4.36 (each ± 0.02), extrapolated to I = 0 from 0.5–3 M NaClO4', 0.03) } }),
      step(4.366, 0.93, -217, { pKa: checked(DALTON_1994, 'abstract: log β1 4.36 ± 0.02 at 25 °C, I = 0', 0.02) }),
    ],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'succinate', name: 'succinate', aliases: ['succinic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'C4H6O4',
    forms: ['H2Succ', 'HSucc⁻', 'Succ²⁻'],
    // checked: Kettler et al. 1995, abstract, 25 °C: log K1a −4.210 ± 0.003, ΔH 2.9 ± 0.2, ΔCp −98 ± 3; log K2a
    // −5.638 ± 0.001, ΔH −0.5 ± 0.1, ΔCp −215 ± 8: all within the checked bounds, so unchanged.
    steps: [
      step(4.207, 3.0, -121, all(checked(KETTLER_1995, 'abstract, 25 °C: log K1a −4.210 ± 0.003, ΔH 2.9 ± 0.2 kJ/mol, ΔCp −98 ± 3 J/(K·mol)', 0.003))),
      step(5.636, -0.5, -217, all(checked(KETTLER_1995, 'abstract, 25 °C: log K2a −5.638 ± 0.001, ΔH −0.5 ± 0.1 kJ/mol, ΔCp −215 ± 8 J/(K·mol)', 0.001))),
    ],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'formate', name: 'formate', aliases: ['formic acid'],
    chargeMostProtonated: 0, formulaMostProtonated: 'CH2O2',
    forms: ['HCOOH', 'HCOO⁻'],
    // Bell, Wesolowski & Palmer 1993 (abstract, OSTI 6709085): log K −3.755 ± 0.002, ΔH −0.09 ± 0.15 kJ/mol, ΔCp
    // −147 ± 4 J/(K·mol) at 25 °C: ΔrH° and ΔrCp° agree; the pKa differs by 0.005, beyond the ±, and is the alternative.
    steps: [step(3.75, -0.1, -165, { dH: checked(BELL_1993, 'abstract, 25 °C: ΔH −0.09 ± 0.15 kJ/mol'), dCp: checked(BELL_1993, 'abstract, 25 °C: ΔCp −147 ± 4 J/(K·mol)'),
      alternative: { pKa: 3.755, rule: KEEP_COMPILATION, provenance: checked(BELL_1993, 'abstract, 25 °C: log K −3.755 ± 0.002', 0.002) } })],
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
    steps: [
      step(1.92, 1.1, -21, { alternative: { pKa: 2.038, rule: KEEP_COMPILATION,
        provenance: checked('primary acidity constant of maleic acid at 298.2 K by conductance and e.m.f. (BITS Pilani repository, handle 123456789/18980)',
          'abstract: pK 2.038 ± 0.008 with ion-size parameter 5 Å, "significantly higher than that generally accepted"', 0.008) } }),
      step(6.27, -3.6, -314),
    ],
    temperatureRangeC: RANGE_GKL,
  },
  {
    id: 'sulfate', name: 'sulfate', aliases: ['sulfuric acid', 'hydrogen sulfate', 'bisulfate', 'sulphate'],
    chargeMostProtonated: 0, formulaMostProtonated: 'H2SO4',
    forms: ['H2SO4', 'HSO4⁻', 'SO4²⁻'],
    steps: [
      step(-3, undefined, undefined, { pKa: practice('common practice: the first step is complete; pKa −3 keeps it so down to pH −1') }),
      step(1.987, -22.4, -258, { alternative: { pKa: 1.947, rule: KEEP_COMPILATION,
        provenance: checked('J. Chem. Soc., Faraday Trans. 1, 1973, 69, 94 (e.m.f. of Pt,H2 | Na2SO4, NaHSO4, NaCl | AgCl | Ag)',
          'abstract: K2 = 0.0113 ± 0.0005 mol/kg at 25 °C, pK 1.947 ± 0.02', 0.02) } }),
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
    // ΔrH° and ΔrCp° checked: the Oak Ridge study (abstract) gives for the association Tris + H⁺ at 25 °C, I = 0,
    // ΔH −47.53 ± 0.13 kJ/mol and ΔCp 67 ± 13 J/(K·mol); its log K there (8.701) does not match any Tris pKa and
    // was not used, so the pKa stays recalled.
    steps: [step(8.072, 47.45, -59, { dH: checked(TRIS_1987, 'abstract: association ΔH −47.53 ± 0.13 kJ/mol at 25 °C'), dCp: checked(TRIS_1987, 'abstract: association ΔCp 67 ± 13 J/(K·mol) at 25 °C') })],
    temperatureRangeC: RANGE_GKL,
  },
  good('hepes', 'HEPES', 'C8H18N2O4S', 7.564, 20.4, 47, 0, { pKa: checked(VEGA_BATES_1976, 'abstract, pK2 at 25 °C: 7.565') }),
  good('mes', 'MES', 'C6H13NO4S', 6.27, 14.8, 5, 0, { pKa: checked(`${VEGA_BATES_1976}; ${ROY_1997_JSC}`, 'abstracts, pK2 at 25 °C: 6.270 and 6.269') }),
  good('mops', 'MOPS', 'C7H15NO4S', 7.184, 21.1, 25),
  good('pipes', 'PIPES', 'C8H17N2O6S2', 7.141, 11.2, 22, -1),
  good('aces', 'ACES', 'C4H10N2O4S', 6.847, 30.43, -49, 0, all(checked(ROY_1997_JCED, 'abstract, fitted pK2(T), 5–55 °C, at 298.15 K: 6.847, 30.43 kJ/mol, −62 J/(K·mol); fit standard deviation 0.00058', 0.00058))),
  good('tes', 'TES', 'C6H15NO6S', 7.55, 32.13, 0, 0, { pKa: checked(`${VEGA_BATES_1976}; ${ROY_1997_JSC}`, 'abstracts, pK2 at 25 °C: 7.550 in both') }),
  good('bicine', 'bicine', 'C6H13NO4', 8.334, 26.34, 0),
  good('tricine', 'tricine', 'C6H13NO5', 8.135, 31.37, -53),
  // TAPS: recalled 8.44, 40.4, 15 changed to Roy et al. 2006 (abstract: pK2 8.502 ± 0.0007 at 298.15 K; the fit
  // pK2 = 2969.61/T − 17.05052 + 2.73697 ln T gives ΔrH° 41.23 kJ/mol and ΔrCp° −52.4 J/(K·mol)).
  good('taps', 'TAPS', 'C7H17NO6S', 8.502, 41.23, -52.4, 0, all(checked(ROY_2006, 'abstract: pK2 8.502 ± 0.0007 at 298.15 K; fitted pK2(T), 5–55 °C, at 298.15 K: 41.23 kJ/mol, −52.4 J/(K·mol)', 0.0007))),
  good('ches', 'CHES', 'C8H17NO3S', 9.394, 39.55, 9, 0, all(checked(ROY_1997_JCED, 'abstract, fitted pK2(T), 5–55 °C, at 298.15 K: 9.394, 39.55 kJ/mol, 9.5 J/(K·mol); fit standard deviation 0.00097', 0.00097))),
  // CAPS: the fit pK2 = 1046.64/T + 35.10191 − 4.9342 ln T (Roy et al. 1997, abstract) gives 10.499, 48.20 kJ/mol and
  // ΔrCp° 94.5 J/(K·mol) at 298.15 K: the recalled ΔrCp° 57 changed.
  good('caps', 'CAPS', 'C9H19NO3S', 10.499, 48.1, 94.5, 0, all(checked(ROY_1997_JCT, 'abstract, fitted pK2(T), 5–55 °C, at 298.15 K: 10.499, 48.20 kJ/mol, 94.5 J/(K·mol)'))),
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
      formIndex: 2, maxM: 0.27, temperatureC: 25, source: 'CRC Handbook, L-histidine about 42 g/L in water at 25 °C', level: 'recalled',
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
    // The EDTA data hold for 5–45 °C; below 5 °C the pKa are extrapolated by van 't Hoff with the catalogue ΔrH°
    // (the two steps without one keep their 25 °C value) and results carry a warning naming the measured range.
    temperatureRangeC: [0, 45],
    measuredRangeC: [5, 45],
    formSolubility: {
      formIndex: 2, maxM: 0.0017, temperatureC: 25, source: 'Merck Index, EDTA free acid about 0.5 g/L in water at 25 °C', level: 'recalled',
      consequence: 'EDTA free acid may precipitate; it dissolves only as base is added',
    },
    bindsIons: { ionIds: ['Ca2+', 'Mg2+'], reason: 'EDTA binds Ca²⁺ and Mg²⁺ strongly, releasing protons, which the model leaves out: the pH reads high', source: 'common practice' },
  },
];

/** A Good's buffer with one step in its working range, most protonated form charge `z0`. */
function good(id: string, name: string, formula: string, pKa: number, dH: number, dCp: number, z0: number = 0, provenance: StepInput = {}): AcidSystem {
  const acidLabel = z0 === 0 ? `H${name}±` : `H${name}⁻`;
  const baseLabel = z0 === 0 ? `${name}⁻` : `${name}²⁻`;
  return {
    id, name, aliases: [`${name} buffer`],
    chargeMostProtonated: z0, formulaMostProtonated: formula,
    forms: [acidLabel, baseLabel],
    steps: [step(pKa, dH, dCp, provenance)],
    temperatureRangeC: RANGE_GKL,
    notes: 'Only the step in the working range is modelled; a carboxyl or sulfonate step below pH 3 is not.',
  };
}
