import { CRC_DENSITY, r } from './reagents';
import type { Reagent } from './types';

// Excipients with no acid–base effect in the working range: they release no acid system and no ion, so a row of
// them changes neither pH nor ionic strength in this model. They are here so that a bill of materials can be passed
// whole, and so READBACK shows what was weighed.
const NO_ACID_BASE_SUGAR = 'no acid–base group between pH 2 and 11: sugar and polyol hydroxyls ionise only near pH 12–13 (common practice)';
const NO_ACID_BASE_SURFACTANT = 'non-ionic surfactant, no acid–base group (common practice); a mixture of esters, so its molar mass is nominal';
// Nominal molar masses of the polysorbates as the pharmacopoeial monographs state them.
const POLYSORBATE_MM = 'Ph. Eur. monograph, nominal relative molecular mass (from memory)';

function surfactant(id: string, name: string, aliases: string[], formula: string, nominal: number): Reagent {
  const reagent = r({ id, name, aliases, formula, excipient: { source: NO_ACID_BASE_SURFACTANT, nominalMolarMass: true } });
  return { ...reagent, handbookMolarMass: { gPerMol: nominal, source: POLYSORBATE_MM, level: 'recalled' } };
}

export const EXCIPIENTS: readonly Reagent[] = [
  r({ id: 'sucrose', name: 'sucrose', aliases: ['saccharose'], formula: 'C12H22O11', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 342.30 }),
  r({ id: 'trehalose', name: 'trehalose anhydrous', aliases: ['anhydrous trehalose', 'α,α-trehalose anhydrous'], formula: 'C12H22O11', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 342.30 }),
  r({ id: 'trehalose-2', name: 'trehalose dihydrate', aliases: ['α,α-trehalose dihydrate', 'D-(+)-trehalose dihydrate'], formula: 'C12H22O11', hydrateWater: 2, excipient: { source: NO_ACID_BASE_SUGAR }, mm: 378.33 }),
  r({ id: 'lactose-1', name: 'lactose monohydrate', aliases: ['α-lactose monohydrate'], formula: 'C12H22O11', hydrateWater: 1, excipient: { source: NO_ACID_BASE_SUGAR }, mm: 360.31 }),
  r({ id: 'glucose', name: 'D-glucose anhydrous', aliases: ['glucose anhydrous', 'dextrose anhydrous', 'anhydrous glucose'], formula: 'C6H12O6', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 180.16 }),
  r({ id: 'glucose-1', name: 'D-glucose monohydrate', aliases: ['glucose monohydrate', 'dextrose monohydrate'], formula: 'C6H12O6', hydrateWater: 1, excipient: { source: NO_ACID_BASE_SUGAR }, mm: 198.17 }),
  r({ id: 'mannitol', name: 'D-mannitol', aliases: ['mannitol'], formula: 'C6H14O6', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 182.17 }),
  r({ id: 'sorbitol', name: 'D-sorbitol', aliases: ['sorbitol', 'D-glucitol'], formula: 'C6H14O6', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 182.17 }),
  r({ id: 'glycerol', name: 'glycerol', aliases: ['glycerin', 'glycerine', 'glycerol anhydrous'], formula: 'C3H8O3', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 92.09,
    liquid: { densityGPerML: 1.261, massFraction: 1.0, source: CRC_DENSITY, level: 'recalled' } }),
  r({ id: 'propylene-glycol', name: 'propylene glycol', aliases: ['1,2-propanediol', 'propane-1,2-diol'], formula: 'C3H8O2', excipient: { source: NO_ACID_BASE_SUGAR }, mm: 76.09,
    liquid: { densityGPerML: 1.036, massFraction: 1.0, source: CRC_DENSITY, level: 'recalled' } }),
  surfactant('polysorbate-20', 'polysorbate 20', ['Tween 20', 'polyoxyethylene (20) sorbitan monolaurate', 'PS20', 'PS 20'], 'C58H114O26', 1228),
  surfactant('polysorbate-80', 'polysorbate 80', ['Tween 80', 'polyoxyethylene (20) sorbitan monooleate', 'PS80', 'PS 80'], 'C64H124O26', 1310),
];

/** Trade names used for more than one form. */
export const EXCIPIENT_AMBIGUOUS_NAMES: readonly { name: string; choices: string[] }[] = [
  { name: 'trehalose', choices: ['trehalose dihydrate', 'trehalose anhydrous'] },
  { name: 'glucose', choices: ['D-glucose anhydrous', 'D-glucose monohydrate'] },
  { name: 'dextrose', choices: ['D-glucose anhydrous', 'D-glucose monohydrate'] },
  { name: 'lactose', choices: ['lactose monohydrate'] },
];
