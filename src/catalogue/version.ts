// Bump on any change of a constant, a reagent or a source, so stamped records can be traced.
export const CATALOGUE_VERSION = '2026.12.3';
export const ADDIN_VERSION = '0.1.0';
