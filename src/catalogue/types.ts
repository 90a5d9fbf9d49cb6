// Shapes of the catalogue's data. Every constant carries the text of its source and a provenance level.

/**
 * How far a constant's value has been traced:
 * - `checked`: read in the named source itself (its fitted equation, table or abstract; `where` says which)
 *   and the catalogue value agrees with it (pKa within 0.003, ΔrH° within 1 kJ/mol, ΔrCp° within 30 J/(K·mol), or
 *   within the source's own stated ± where that is larger);
 * - `recalled`: taken from the named compilation as remembered, not checked against it;
 * - `common practice`: a convention of the trade with no source to cite;
 * - `user`: typed by the user (custom systems).
 */
export type ProvenanceLevel = 'checked' | 'recalled' | 'common practice' | 'user';

export interface Provenance {
  level: ProvenanceLevel;
  /** the paper, table or standard, with year */
  source: string;
  /** for `checked`: where in the source the value was read (e.g. "abstract, fitted pK(T) at 298.15 K") */
  where?: string;
  /** the ± the source states for a pKa (its standard uncertainty or the fit's standard deviation), pKa units */
  pKaPlusMinus?: number;
}

/** The provenance of each constant of a step; null where the catalogue has no value for it. */
export interface StepProvenance {
  pKa: Provenance;
  dH: Provenance | null;
  dCp: Provenance | null;
}

/**
 * A second published pKa that disagrees with the one used beyond their uncertainties. The catalogue keeps
 * both: `rule` says why the step's own value is the one used; CONSTANTS shows what the other would do to the pH.
 */
export interface AlternativeValue {
  pKa: number;
  provenance: Provenance;
  rule: string;
}

/** One proton-loss step of an acid system, at 25 °C and I = 0. */
export interface AcidStep {
  pKa: number;
  /** standard enthalpy of the ionisation, kJ/mol */
  dHkJPerMol?: number;
  /** standard heat-capacity change of the ionisation, J/(K·mol) */
  dCpJPerKMol?: number;
  /** one line for display, built from `provenance` */
  source: string;
  provenance: StepProvenance;
  alternative?: AlternativeValue;
}

export interface AcidSystem {
  id: string;
  name: string;
  aliases: string[];
  /** charge of the most protonated form */
  chargeMostProtonated: number;
  /** formula of the most protonated form, without its charge (for form molar masses) */
  formulaMostProtonated: string;
  /** labels of the forms, most protonated first (steps.length + 1 entries) */
  forms: string[];
  steps: AcidStep[];
  /** temperature range, °C, in which results are computed */
  temperatureRangeC: [number, number];
  /**
   * the range, °C, the underlying measurements cover, where `temperatureRangeC` extends past it by van 't Hoff
   * extrapolation; results outside it carry a warning that names it
   */
  measuredRangeC?: [number, number];
  notes?: string;
  /** above this total of the system, mol/L, the catalogue's model of it no longer holds: results carry a warning */
  concentrationLimit?: { maxTotalM: number; reason: string; source: string; level: ProvenanceLevel };
  /**
   * the solubility of one form (index into `forms`), mol/L: above it at equilibrium the solution cannot exist as
   * modelled, and results carry a warning
   */
  formSolubility?: { formIndex: number; maxM: number; temperatureC: number; consequence: string; source: string; level: ProvenanceLevel; where?: string };
  /** metal ions the system binds or precipitates with, which the model leaves out: results carry a warning */
  bindsIons?: { ionIds: string[]; reason: string; source: string };
  /** true for systems a user defined (pane or --systems file) */
  custom?: boolean;
}

/** A fully dissociated ion a reagent releases (counter-ions, strong-acid anions, strong-base cations). */
export interface StrongIon {
  id: string;
  charge: number;
}

export interface LiquidForm {
  /** density of the liquid as sold, g/mL, at about 20 °C */
  densityGPerML: number;
  /** mass fraction of the named compound in the liquid */
  massFraction: number;
  source: string;
  level: ProvenanceLevel;
}

export interface Reagent {
  id: string;
  name: string;
  aliases: string[];
  /** anhydrous formula of one formula unit */
  formula: string;
  /** molecules of water of crystallisation per formula unit */
  hydrateWater: number;
  /** acid systems the reagent releases, moles per mole of reagent */
  systems: { systemId: string; count: number }[];
  /** fully dissociated ions the reagent releases, moles per mole of reagent */
  ions: { ionId: string; count: number }[];
  liquid?: LiquidForm;
  /** a handbook molar mass, g/mol, that the tests check the formula against */
  handbookMolarMass?: { gPerMol: number; source: string; level: ProvenanceLevel };
  /**
   * an excipient with no acid–base effect (sugar, polyol, surfactant): it releases nothing, and the source says
   * why it is taken as inert; a mixture of molecules (polysorbates) has only a nominal molar mass, so amounts in mol are refused
   */
  excipient?: { source: string; nominalMolarMass?: boolean };
  /** the solvent itself (water, WFI): a row adds volume only */
  solvent?: boolean;
  /** equivalents per mole, for normality (N) of strong acids and bases only */
  normalityEqPerMol?: number;
  /** the most concentrated aqueous solution that exists at about 20–25 °C, mol/L: a stock above it is refused */
  solubilityLimit?: { maxM: number; source: string };
}
