export type { AcidStep, AcidSystem, AlternativeValue, LiquidForm, Provenance, ProvenanceLevel, Reagent, StepProvenance, StrongIon } from './types';
export { checked, levelLabel, levelText, practice, recalled, stepProvenances, stepSourceText } from './provenance';
export { ATOMIC_WEIGHTS_G_PER_MOL } from './elements';
import { ACID_SYSTEMS as CORE_SYSTEMS } from './systems';
import { AMBIGUOUS_NAMES as CORE_AMBIGUOUS_NAMES, REAGENTS as CORE_REAGENTS } from './reagents';
import { AMINO_ACID_AMBIGUOUS_NAMES, AMINO_ACID_REAGENTS, AMINO_ACID_SYSTEMS } from './aminoAcids';
import { EXCIPIENT_AMBIGUOUS_NAMES, EXCIPIENTS } from './excipients';
import type { AcidSystem, Reagent } from './types';

// The catalogue is assembled here: each class keeps its own file.
export const ACID_SYSTEMS: readonly AcidSystem[] = [...CORE_SYSTEMS, ...AMINO_ACID_SYSTEMS];
export const REAGENTS: readonly Reagent[] = [...CORE_REAGENTS, ...AMINO_ACID_REAGENTS, ...EXCIPIENTS];
export const AMBIGUOUS_NAMES: readonly { name: string; choices: string[] }[] = [...CORE_AMBIGUOUS_NAMES, ...AMINO_ACID_AMBIGUOUS_NAMES, ...EXCIPIENT_AMBIGUOUS_NAMES];
export { STRONG_IONS, strongIonById } from './ions';
export { ADDIN_VERSION, CATALOGUE_VERSION } from './version';
export { SIT_EPSILON, SIT_EPSILON_BAND_C, SIT_ESTIMATE_SOURCE, SIT_ESTIMATE_UNCERTAINTY, sitEpsilonRow, sitEstimate } from './sitEpsilon';
export type { SitEpsilonRow } from './sitEpsilon';
export { DENSITY_ESTIMATE, DENSITY_FITS } from './densities';
export type { DensityFit, DensityPart } from './densities';
