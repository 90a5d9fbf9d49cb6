// Shapes of the catalogue's data. Every constant carries the text of its source.

/** One proton-loss step of an acid system, at 25 °C and I = 0. */
export interface AcidStep {
  pKa: number;
  /** standard enthalpy of the ionisation, kJ/mol */
  dHkJPerMol?: number;
  /** standard heat-capacity change of the ionisation, J/(K·mol) */
  dCpJPerKMol?: number;
  source: string;
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
  /** temperature range, °C, in which the data hold */
  temperatureRangeC: [number, number];
  notes?: string;
  /** above this total of the system, mol/L, the catalogue's model of it no longer holds: results carry a warning */
  concentrationLimit?: { maxTotalM: number; reason: string; source: string };
  /**
   * the solubility of one form (index into `forms`), mol/L: above it at equilibrium the solution cannot exist as
   * modelled, and results carry a warning
   */
  formSolubility?: { formIndex: number; maxM: number; temperatureC: number; consequence: string; source: string };
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
  handbookMolarMass?: { gPerMol: number; source: string };
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
