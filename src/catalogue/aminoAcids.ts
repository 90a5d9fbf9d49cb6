import { r } from './reagents';
import { checked, recalled, stepSourceText } from './provenance';
import type { AcidStep, AcidSystem, Reagent, StepProvenance } from './types';

// Amino acids used as formulation buffers and excipients. pKa at 25 °C, I → 0.
// The step constants are the commonly tabulated thermodynamic values (CRC Handbook, "Dissociation constants of
// organic acids and bases"; Martell & Smith, Critical Stability Constants), recalled: each step's provenance says so.
const CRC_PKA = 'CRC Handbook, dissociation constants of organic acids and bases, 25 °C';
// ΔrH° of ionisation: the averages over simple α-amino acids at I = 0, 298.15 K, of Bretti, Giuffrè, Lando &
// Sammartano 2016 (SpringerPlus 5, 928): amino group protonation −44.5 ± 0.4 kJ/mol, carboxylate −2.5 ± 1.6 kJ/mol
// (abstract checked). They are applied here to the amino acids below, for which the group value was not checked.
const BRETTI_AMINO = 44.5;
const BRETTI_CARBOXYL = 2.5;
const WITH_AMINO_AVERAGE = 'α-amino average of Bretti et al. 2016, SpringerPlus 5, 928 (its abstract read), applied to an amino acid it was not measured for';
const WITH_CARBOXYL_AVERAGE = 'carboxyl average of Bretti et al. 2016, SpringerPlus 5, 928 (its abstract read), applied to an amino acid it was not measured for';
// The guanidinium pKa of arginine: potentiometry and NMR give 13.8 ± 0.1, well above the 12.5 long tabulated.
const FITCH_2015 = 'Fitch, Platzer, Okon, Garcia-Moreno & McIntosh 2015, Protein Sci. 24, 752';

// the group averages are checked in their abstract, but applied to acids they were not measured for: recalled, not checked
function withProvenance(pKa: number, dHkJPerMol: number | undefined, provenance: StepProvenance): AcidStep {
  return { pKa, dHkJPerMol, source: stepSourceText(provenance), provenance };
}
function carboxyl(pKa: number): AcidStep {
  return withProvenance(pKa, BRETTI_CARBOXYL, { pKa: recalled(CRC_PKA), dH: recalled(WITH_CARBOXYL_AVERAGE), dCp: null });
}
function amino(pKa: number): AcidStep {
  return withProvenance(pKa, BRETTI_AMINO, { pKa: recalled(CRC_PKA), dH: recalled(WITH_AMINO_AVERAGE), dCp: null });
}

/** A step without a ΔrH° keeps its 25 °C value; the system's range is held close to 25 °C for it (common practice). */
const RANGE_NEAR_25: [number, number] = [15, 35];
const RANGE_AMINO: [number, number] = [0, 60];

export const AMINO_ACID_SYSTEMS: readonly AcidSystem[] = [
  {
    id: 'arginine', name: 'arginine', aliases: ['L-arginine'],
    chargeMostProtonated: 2, formulaMostProtonated: 'C6H16N4O2',
    forms: ['H3Arg²⁺', 'H2Arg⁺', 'HArg±', 'Arg⁻'],
    steps: [carboxyl(2.17), amino(9.04), withProvenance(13.8, undefined, { pKa: checked(FITCH_2015, 'abstract, 13.8 ± 0.1 by potentiometry and NMR'), dH: null, dCp: null })],
    temperatureRangeC: RANGE_NEAR_25,
    notes: 'The guanidinium step has no ΔrH° here, so the data are held to 15–35 °C.',
  },
  {
    id: 'lysine', name: 'lysine', aliases: ['L-lysine'],
    chargeMostProtonated: 2, formulaMostProtonated: 'C6H16N2O2',
    forms: ['H3Lys²⁺', 'H2Lys⁺', 'HLys±', 'Lys⁻'],
    steps: [carboxyl(2.16), amino(9.06), withProvenance(10.54, undefined, { pKa: recalled(CRC_PKA), dH: null, dCp: null })],
    temperatureRangeC: RANGE_NEAR_25,
    notes: 'The ε-amino step has no ΔrH° here, so the data are held to 15–35 °C.',
  },
  {
    id: 'glutamate', name: 'glutamate', aliases: ['glutamic acid', 'L-glutamate'],
    chargeMostProtonated: 1, formulaMostProtonated: 'C5H10NO4',
    forms: ['H3Glu⁺', 'H2Glu±', 'HGlu⁻', 'Glu²⁻'],
    steps: [carboxyl(2.19), carboxyl(4.25), amino(9.67)],
    temperatureRangeC: RANGE_AMINO,
    formSolubility: {
      formIndex: 1, maxM: 0.058, temperatureC: 25, source: 'CRC Handbook, L-glutamic acid about 8.6 g/L in water at 25 °C (from memory)', level: 'recalled',
      consequence: 'glutamic acid may crystallise out',
    },
  },
  {
    id: 'aspartate', name: 'aspartate', aliases: ['aspartic acid', 'L-aspartate'],
    chargeMostProtonated: 1, formulaMostProtonated: 'C4H8NO4',
    forms: ['H3Asp⁺', 'H2Asp±', 'HAsp⁻', 'Asp²⁻'],
    steps: [carboxyl(1.99), carboxyl(3.9), amino(9.9)],
    temperatureRangeC: RANGE_AMINO,
    formSolubility: {
      formIndex: 1, maxM: 0.037, temperatureC: 25, source: 'CRC Handbook, L-aspartic acid about 5 g/L in water at 25 °C (from memory)', level: 'recalled',
      consequence: 'aspartic acid may crystallise out',
    },
  },
  {
    id: 'methionine', name: 'methionine', aliases: ['L-methionine'],
    chargeMostProtonated: 1, formulaMostProtonated: 'C5H12NO2S',
    forms: ['H2Met⁺', 'HMet±', 'Met⁻'],
    steps: [carboxyl(2.28), amino(9.21)],
    temperatureRangeC: RANGE_AMINO,
    formSolubility: {
      formIndex: 1, maxM: 0.38, temperatureC: 25, source: 'CRC Handbook, L-methionine about 56 g/L in water at 25 °C (from memory)', level: 'recalled',
      consequence: 'methionine may crystallise out',
    },
  },
];

/** Amino acids as the trade sells them: free acid or base, hydrochlorides, sodium and potassium salts, hydrates said. */
export const AMINO_ACID_REAGENTS: readonly Reagent[] = [
  r({ id: 'arginine', name: 'L-arginine', aliases: ['arginine', 'L-arginine free base', 'arginine base'], formula: 'C6H14N4O2', system: 'arginine', mm: 174.20 }),
  r({ id: 'arginine-hcl', name: 'L-arginine monohydrochloride', aliases: ['L-arginine hydrochloride', 'arginine hydrochloride', 'arginine HCl', 'L-arginine HCl', 'arginine monohydrochloride'],
    formula: 'C6H14N4O2·HCl', system: 'arginine', ions: { 'Cl-': 1 }, mm: 210.66 }),
  r({ id: 'lysine', name: 'L-lysine', aliases: ['lysine', 'L-lysine free base'], formula: 'C6H14N2O2', system: 'lysine', mm: 146.19 }),
  r({ id: 'lysine-hcl', name: 'L-lysine monohydrochloride', aliases: ['L-lysine hydrochloride', 'lysine hydrochloride', 'lysine HCl', 'L-lysine HCl', 'lysine monohydrochloride'],
    formula: 'C6H14N2O2·HCl', system: 'lysine', ions: { 'Cl-': 1 }, mm: 182.65 }),
  // one lysine and one acetic acid per formula unit: two acid systems
  r({ id: 'lysine-acetate', name: 'L-lysine acetate', aliases: ['lysine acetate', 'L-lysine monoacetate'], formula: 'C6H14N2O2·C2H4O2', systemsMap: { lysine: 1, acetate: 1 }, mm: 206.24 }),
  r({ id: 'glutamic', name: 'L-glutamic acid', aliases: ['glutamic acid'], formula: 'C5H9NO4', system: 'glutamate', mm: 147.13 }),
  r({ id: 'msg', name: 'monosodium L-glutamate', aliases: ['monosodium glutamate', 'monosodium glutamate anhydrous', 'sodium L-glutamate anhydrous'],
    formula: 'C5H8NNaO4', system: 'glutamate', ions: { 'Na+': 1 }, mm: 169.11 }),
  r({ id: 'msg-1', name: 'monosodium L-glutamate monohydrate', aliases: ['monosodium glutamate monohydrate', 'sodium L-glutamate monohydrate', 'sodium glutamate monohydrate', 'MSG monohydrate'],
    formula: 'C5H8NNaO4', hydrateWater: 1, system: 'glutamate', ions: { 'Na+': 1 }, mm: 187.13 }),
  r({ id: 'mkg-1', name: 'monopotassium L-glutamate monohydrate', aliases: ['potassium L-glutamate monohydrate', 'potassium glutamate monohydrate', 'monopotassium glutamate monohydrate'],
    formula: 'C5H8KNO4', hydrateWater: 1, system: 'glutamate', ions: { 'K+': 1 }, mm: 203.23 }),
  r({ id: 'aspartic', name: 'L-aspartic acid', aliases: ['aspartic acid'], formula: 'C4H7NO4', system: 'aspartate', mm: 133.10 }),
  r({ id: 'naasp-1', name: 'sodium L-aspartate monohydrate', aliases: ['monosodium L-aspartate monohydrate', 'sodium aspartate monohydrate'],
    formula: 'C4H6NNaO4', hydrateWater: 1, system: 'aspartate', ions: { 'Na+': 1 }, mm: 173.10 }),
  r({ id: 'methionine', name: 'L-methionine', aliases: ['methionine'], formula: 'C5H11NO2S', system: 'methionine', mm: 149.21 }),
];

/** Salts named without their form or water. */
export const AMINO_ACID_AMBIGUOUS_NAMES: readonly { name: string; choices: string[] }[] = [
  { name: 'sodium glutamate', choices: ['monosodium L-glutamate', 'monosodium L-glutamate monohydrate'] },
  { name: 'sodium L-glutamate', choices: ['monosodium L-glutamate', 'monosodium L-glutamate monohydrate'] },
  { name: 'MSG', choices: ['monosodium L-glutamate', 'monosodium L-glutamate monohydrate'] },
  { name: 'potassium glutamate', choices: ['monopotassium L-glutamate monohydrate'] },
  { name: 'sodium aspartate', choices: ['sodium L-aspartate monohydrate'] },
  { name: 'glutamate', choices: ['L-glutamic acid', 'monosodium L-glutamate', 'monosodium L-glutamate monohydrate', 'monopotassium L-glutamate monohydrate'] },
];
