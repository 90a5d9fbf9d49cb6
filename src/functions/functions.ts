/* global CustomFunctions */
import * as impl from './impl';
import { toCellFailure } from './outcome';

// The cell functions Excel loads. Each is a thin wrapper over impl.ts; a failure becomes a
// #VALUE! (bad input) or #N/A (no such result) with one clear message.

function run<T>(compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    const failure = toCellFailure(error);
    const code = failure.kind === '#N/A' ? CustomFunctions.ErrorCode.notAvailable : CustomFunctions.ErrorCode.invalidValue;
    throw new CustomFunctions.Error(code, failure.message);
  }
}

/**
 * pH of a mixture at equilibrium, on the activity scale a calibrated meter reads.
 * @customfunction PHMIX
 * @helpurl https://localhost:3000/README.md#phmix
 * @param reagents Reagent names, formulas (Na2HPO4·7H2O) or stocks (1 M HCl), one per row.
 * @param amounts Amount of each reagent, same shape as reagents.
 * @param units Unit of each amount (g mg kg µg, mol mmol µmol nmol, M mM µM nM, g/L mg/mL % w/v, N, L mL µL; water by volume): one cell or one per row.
 * @param [volume] Final volume of the solution, L. Needed when a row is a mass, amount or volume.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @returns pH (activity scale).
 */
function PHMIX(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): number {
  return run(() => impl.ph(reagents, amounts, units, volume, temperature, model));
}

/**
 * Amount of titrant that brings the mixture to a target pH, the titrant's own volume included.
 * @customfunction TITRANT
 * @helpurl https://localhost:3000/README.md#titrant
 * @param targetPH Target pH (activity scale).
 * @param reagents Reagents of the mixture, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Volume of the mixture before the titrant goes in, L.
 * @param titrant A stock such as 1 M NaOH, or a solid such as NaOH.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @param [resultUnit] Unit of the result: mL (default for solutions), g (default for solids), L µL mg kg mol mmol.
 * @returns Amount of titrant in resultUnit.
 */
function TITRANT(targetPH: number, reagents: any[][], amounts: any[][], units: any[][], volume: number, titrant: string,
  temperature?: any, model?: any, resultUnit?: any): number {
  return run(() => impl.titrant(targetPH, reagents, amounts, units, volume, titrant, temperature, model, resultUnit));
}

/**
 * Titration curve for charting: titrant added against pH.
 * @customfunction CURVE
 * @helpurl https://localhost:3000/README.md#curve
 * @param reagents Reagents of the mixture, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Volume of the mixture before the titrant goes in, L.
 * @param titrant A stock such as 1 M NaOH, or a solid such as NaOH.
 * @param maxAmount Largest amount of titrant, in resultUnit.
 * @param [points] Number of rows, 2 to 1001 (default 51).
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @param [resultUnit] Unit of the titrant column (default mL for solutions, g for solids).
 * @returns A points×2 spill: titrant added, pH.
 */
function CURVE(reagents: any[][], amounts: any[][], units: any[][], volume: number, titrant: string, maxAmount: number,
  points?: any, temperature?: any, model?: any, resultUnit?: any): any[][] {
  return run(() => impl.curve(reagents, amounts, units, volume, titrant, maxAmount, points, temperature, model, resultUnit));
}

/**
 * Fraction of each form of an acid system at a pH, most protonated first.
 * @customfunction FRACTIONS
 * @helpurl https://localhost:3000/README.md#fractions
 * @param system A system name (phosphate, citrate, Tris) or any reagent of that system.
 * @param pH pH (activity scale).
 * @param [temperature] Temperature, °C (default 25).
 * @param [ionicStrength] Ionic strength, mol/L (default 0: thermodynamic constants; above 0: Davies).
 * @returns A 1×(n+1) spill of fractions.
 */
function FRACTIONS(system: string, pH: number, temperature?: any, ionicStrength?: any): number[][] {
  return run(() => impl.fractions(system, pH, temperature, ionicStrength));
}

/**
 * Every species at equilibrium with its charge, concentration, activity coefficient and activity, then pH, ionic strength, residual, model and any warning.
 * @customfunction SPECIES
 * @helpurl https://localhost:3000/README.md#species
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @returns A spill with a header row.
 */
function SPECIES(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): any[][] {
  return run(() => impl.species(reagents, amounts, units, volume, temperature, model));
}

/**
 * Every constant the mixture's solve used, with its source: each pKa at the temperature and at the mixture's ionic strength, pKw, A, water density.
 * @customfunction CONSTANTS
 * @helpurl https://localhost:3000/README.md#constants
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @returns A spill with a header row.
 */
function CONSTANTS(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): any[][] {
  return run(() => impl.constants(reagents, amounts, units, volume, temperature, model));
}

/**
 * The mixture's model warnings (activity model out of range, polyborates, a form above its solubility, metal binding), or "none".
 * @customfunction WARNINGS
 * @helpurl https://localhost:3000/README.md#warnings
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @returns Warning text, or none.
 */
function WARNINGS(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): string {
  return run(() => impl.warnings(reagents, amounts, units, volume, temperature, model));
}

/**
 * Ionic strength at equilibrium, mol/L.
 * @customfunction IONICSTRENGTH
 * @helpurl https://localhost:3000/README.md#ionicstrength
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @returns Ionic strength, mol/L.
 */
function IONICSTRENGTH(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): number {
  return run(() => impl.ionicStrength(reagents, amounts, units, volume, temperature, model));
}

/**
 * Buffer capacity β, mol/(L·pH), water included.
 * @customfunction CAPACITY
 * @helpurl https://localhost:3000/README.md#capacity
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @returns Buffer capacity, mol/(L·pH).
 */
function CAPACITY(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): number {
  return run(() => impl.capacity(reagents, amounts, units, volume, temperature, model));
}

/**
 * pKa of one step of an acid system at a temperature; with an ionic strength, the apparent (Davies) value.
 * @customfunction PKA
 * @helpurl https://localhost:3000/README.md#pka
 * @param system A system name or any reagent of that system.
 * @param step Step, 1 = first proton lost.
 * @param [temperature] Temperature, °C (default 25).
 * @param [ionicStrength] Ionic strength, mol/L (default 0).
 * @returns pKa.
 */
function PKA(system: string, step: number, temperature?: any, ionicStrength?: any): number {
  return run(() => impl.pka(system, step, temperature, ionicStrength));
}

/**
 * Grams of an acid form and a base form to weigh for a buffer of a total concentration at a target pH.
 * @customfunction RECIPE
 * @helpurl https://localhost:3000/README.md#recipe
 * @param acidForm The acid form, e.g. NaH2PO4·H2O.
 * @param baseForm The base form, e.g. Na2HPO4·7H2O.
 * @param targetPH Target pH (activity scale).
 * @param concentration Total concentration of the buffer system, mol/L.
 * @param volume Final volume, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @param [otherReagents] Other reagents in the buffer (a salt, say).
 * @param [otherAmounts] Their amounts.
 * @param [otherUnits] Their units.
 * @returns A 2×2 spill: each form and the grams to weigh.
 */
function RECIPE(acidForm: string, baseForm: string, targetPH: number, concentration: number, volume: number, temperature?: any, model?: any,
  otherReagents?: any[][], otherAmounts?: any[][], otherUnits?: any[][]): any[][] {
  return run(() => impl.recipe(acidForm, baseForm, targetPH, concentration, volume, temperature, model, otherReagents, otherAmounts, otherUnits));
}

/**
 * Molar mass from the IUPAC standard atomic weights, g/mol.
 * @customfunction MOLARMASS
 * @helpurl https://localhost:3000/README.md#molarmass
 * @param formula A formula such as Na2HPO4·7H2O, or a catalogue name.
 * @returns Molar mass, g/mol.
 */
function MOLARMASS(formula: string): number {
  return run(() => impl.molarMass(formula));
}

/**
 * The add-in's and the catalogue's versions, for stamping a record.
 * @customfunction VERSION
 * @helpurl https://localhost:3000/README.md#version
 * @returns Version text.
 */
function VERSION(): string {
  return run(() => impl.version());
}

// The metadata plugin's loader appends CustomFunctions.associate for each @customfunction above.
export const EXCEL_FUNCTIONS = { PHMIX, TITRANT, CURVE, FRACTIONS, SPECIES, CONSTANTS, WARNINGS, IONICSTRENGTH, CAPACITY, PKA, RECIPE, MOLARMASS, VERSION };
