export type { AcidStep, AcidSystem, AlternativeValue, LiquidForm, Provenance, ProvenanceLevel, Reagent, StepProvenance, StrongIon } from './types';
export { checked, levelLabel, levelText, practice, recalled, stepProvenances, stepSourceText } from './provenance';
export { ATOMIC_WEIGHTS_G_PER_MOL } from './elements';
export { ACID_SYSTEMS } from './systems';
export { AMBIGUOUS_NAMES, REAGENTS } from './reagents';
export { STRONG_IONS, strongIonById } from './ions';
export { ADDIN_VERSION, CATALOGUE_VERSION } from './version';
