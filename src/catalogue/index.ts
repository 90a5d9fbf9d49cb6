export type { AcidStep, AcidSystem, LiquidForm, Reagent, StrongIon } from './types';
export { ATOMIC_WEIGHTS_G_PER_MOL } from './elements';
export { ACID_SYSTEMS } from './systems';
export { AMBIGUOUS_NAMES, REAGENTS } from './reagents';
export { STRONG_IONS, strongIonById } from './ions';
export { ADDIN_VERSION, CATALOGUE_VERSION } from './version';
