/* global CustomFunctions */
import { handcheck } from './handcheck';
import * as impl from './impl';
import { readback } from './readback';
import { uncertainty } from './uncertainty';
import { phTemp } from './phtemp';
import { saltDose } from './saltdose';
import { toCellFailure } from './outcome';
import { stock } from './stock';
import { ensureWorkbookSystems, workbookSystemsReady } from './workbookSystems';

// The cell functions Excel loads. Each is a thin wrapper over impl.ts; a failure becomes a
// #VALUE! (bad input) or #N/A (no such result) with one clear message.

function run<T>(compute: () => T): T {
  // A reopened workbook's custom systems are read before any cell is answered, even before the pane starts;
  // until Office hands over the document, the cell waits (Excel takes a promise from any function).
  if (!ensureWorkbookSystems()) return workbookSystemsReady().then(() => run(compute)) as unknown as T;
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
 * @helpurl https://localhost:3000/help.html#phmix
 * @param reagents Reagent names, formulas (Na2HPO4·7H2O) or stocks (1 M HCl), one per row.
 * @param amounts Amount of each reagent, same shape as reagents.
 * @param units Unit of each amount (g mg kg µg, mol mmol µmol nmol, M mM µM nM, g/L mg/mL % w/v, N, L mL µL; water by volume): one cell or one per row.
 * @param [volume] Final volume of the solution, L. Needed when a row is a mass, amount or volume.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @returns pH (activity scale).
 */
function PHMIX(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): number {
  return run(() => impl.ph(reagents, amounts, units, volume, temperature, model));
}

/**
 * Amount of titrant that brings the mixture to a target pH, checked by a forward solve. volume is the mixture before the titrant (its own volume adds), unlike RECIPE's final volume; with finalVolume the solution is made up to that volume.
 * @customfunction TITRANT
 * @helpurl https://localhost:3000/help.html#titrant
 * @param targetPH Target pH (activity scale).
 * @param reagents Reagents of the mixture, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Volume of the mixture before the titrant goes in, L.
 * @param titrant A stock such as 1 M NaOH, or a solid such as NaOH.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @param [resultUnit] Unit of the result: mL (default for solutions), g (default for solids), L µL mg kg mol mmol.
 * @param [finalVolume] Make the adjusted solution up to this volume, L, as a batch record does (default: no make-up).
 * @returns Amount of titrant in resultUnit.
 */
function TITRANT(targetPH: number, reagents: any[][], amounts: any[][], units: any[][], volume: number, titrant: string,
  temperature?: any, model?: any, resultUnit?: any, finalVolume?: any): number {
  return run(() => impl.titrant(targetPH, reagents, amounts, units, volume, titrant, temperature, model, resultUnit, finalVolume));
}

/**
 * Titration curve for charting: titrant added against pH, with a check text per point.
 * @customfunction CURVE
 * @helpurl https://localhost:3000/help.html#curve
 * @param reagents Reagents of the mixture, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Volume of the mixture before the titrant goes in, L.
 * @param titrant A stock such as 1 M NaOH, or a solid such as NaOH.
 * @param maxAmount Largest amount of titrant, in resultUnit.
 * @param [points] Number of rows, 2 to 1001 (default 51).
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @param [resultUnit] Unit of the titrant column (default mL for solutions, g for solids).
 * @returns A points×3 spill: titrant added, pH, check text (empty inside the model's validity, else the reason).
 */
function CURVE(reagents: any[][], amounts: any[][], units: any[][], volume: number, titrant: string, maxAmount: number,
  points?: any, temperature?: any, model?: any, resultUnit?: any): any[][] {
  return run(() => impl.curve(reagents, amounts, units, volume, titrant, maxAmount, points, temperature, model, resultUnit));
}

/**
 * Fraction of each form of an acid system at a pH, most protonated first.
 * @customfunction FRACTIONS
 * @helpurl https://localhost:3000/help.html#fractions
 * @param system A system name (phosphate, citrate, Tris) or any reagent of that system.
 * @param pH pH (activity scale).
 * @param [temperature] Temperature, °C (default 25).
 * @param [ionicStrength] Ionic strength, mol/L (default 0: thermodynamic constants; above 0: the model's apparent constants).
 * @param [model] Activity model at that ionic strength: davies (default), bates-guggenheim, sit (NaCl medium) or ideal.
 * @returns A 1×(n+1) spill of fractions.
 */
function FRACTIONS(system: string, pH: number, temperature?: any, ionicStrength?: any, model?: any): number[][] {
  return run(() => impl.fractions(system, pH, temperature, ionicStrength, model));
}

/**
 * Every species at equilibrium with its charge, concentration, activity coefficient and activity, then pH, ionic strength, residual, model and any warning.
 * @customfunction SPECIES
 * @helpurl https://localhost:3000/help.html#species
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @returns A spill with a header row.
 */
function SPECIES(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): any[][] {
  return run(() => impl.species(reagents, amounts, units, volume, temperature, model));
}

/**
 * Every constant the mixture's solve used, with its source: each pKa at the temperature and at the mixture's ionic strength, pKw, A, the solution density and kg of water per litre.
 * @customfunction CONSTANTS
 * @helpurl https://localhost:3000/help.html#constants
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @returns A spill with a header row.
 */
function CONSTANTS(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): any[][] {
  return run(() => impl.constants(reagents, amounts, units, volume, temperature, model));
}

/**
 * The mixture's model warnings (activity model out of range, polyborates, a form above its solubility, metal binding), or "none".
 * @customfunction WARNINGS
 * @helpurl https://localhost:3000/help.html#warnings
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @returns Warning text, or none.
 */
function WARNINGS(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): string {
  return run(() => impl.warnings(reagents, amounts, units, volume, temperature, model));
}

/**
 * Ionic strength at equilibrium, mol/L.
 * @customfunction IONICSTRENGTH
 * @helpurl https://localhost:3000/help.html#ionicstrength
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @returns Ionic strength, mol/L.
 */
function IONICSTRENGTH(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): number {
  return run(() => impl.ionicStrength(reagents, amounts, units, volume, temperature, model));
}

/**
 * Buffer capacity β, mol/(L·pH), water included.
 * @customfunction CAPACITY
 * @helpurl https://localhost:3000/help.html#capacity
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @returns Buffer capacity, mol/(L·pH).
 */
function CAPACITY(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, model?: any): number {
  return run(() => impl.capacity(reagents, amounts, units, volume, temperature, model));
}

/**
 * pKa of one step of an acid system at a temperature; with an ionic strength, the apparent value under the model (default davies).
 * @customfunction PKA
 * @helpurl https://localhost:3000/help.html#pka
 * @param system A system name or any reagent of that system.
 * @param step Step, 1 = first proton lost.
 * @param [temperature] Temperature, °C (default 25).
 * @param [ionicStrength] Ionic strength, mol/L (default 0).
 * @param [model] Activity model at that ionic strength: davies (default), bates-guggenheim, sit (NaCl medium) or ideal.
 * @returns pKa.
 */
function PKA(system: string, step: number, temperature?: any, ionicStrength?: any, model?: any): number {
  return run(() => impl.pka(system, step, temperature, ionicStrength, model));
}

/**
 * Amounts of an acid form and a base form for a buffer of a total concentration at a target pH, checked by a forward solve. volume is the final volume, unlike TITRANT's volume before titrant.
 * @customfunction RECIPE
 * @helpurl https://localhost:3000/help.html#recipe
 * @param acidForm The acid form, e.g. NaH2PO4·H2O.
 * @param baseForm The base form, e.g. Na2HPO4·7H2O.
 * @param targetPH Target pH (activity scale).
 * @param concentration Total concentration of the buffer system, mol/L.
 * @param volume Final volume, L (everything made up to it).
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @param [otherReagents] Other reagents in the buffer (a salt, say).
 * @param [otherAmounts] Their amounts.
 * @param [otherUnits] Their units.
 * @returns A 2×3 spill: each form, the amount, its unit (g to weigh a solid, mL of a stock or liquid as sold).
 */
function RECIPE(acidForm: string, baseForm: string, targetPH: number, concentration: number, volume: number, temperature?: any, model?: any,
  otherReagents?: any[][], otherAmounts?: any[][], otherUnits?: any[][]): any[][] {
  return run(() => impl.recipe(acidForm, baseForm, targetPH, concentration, volume, temperature, model, otherReagents, otherAmounts, otherUnits));
}

/**
 * Amount of a salt that brings the mixture's equilibrium ionic strength to a target, checked by a forward solve.
 * @customfunction SALTDOSE
 * @helpurl https://localhost:3000/help.html#saltdose
 * @param targetIonicStrength Target ionic strength, mol/L (as IONICSTRENGTH).
 * @param salt A salt such as NaCl, or a stock such as 4 M NaCl.
 * @param reagents Reagents of the mixture, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Final volume, L, salt included.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @param [resultUnit] Unit of the result: g (default for solids), mL (default for stocks), mg kg mol mmol L µL.
 * @returns Amount of salt in resultUnit.
 */
function SALTDOSE(targetIonicStrength: number, salt: string, reagents: any[][], amounts: any[][], units: any[][], volume: number,
  temperature?: any, model?: any, resultUnit?: any): number {
  return run(() => saltDose(targetIonicStrength, salt, reagents, amounts, units, volume, temperature, model, resultUnit));
}

/**
 * Temperature at which the mixture's pH crosses a limit, checked by a forward solve there; #N/A with the pH range when it does not cross, or when it crosses more than once (each crossing named).
 * @customfunction PHTEMP
 * @helpurl https://localhost:3000/help.html#phtemp
 * @param limitPH The pH limit (activity scale).
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [model] Activity model: davies (default), bates-guggenheim or ideal.
 * @param [fromC] Lowest temperature searched, °C (default: the lowest the mixture's data hold for).
 * @param [toC] Highest temperature searched, °C (default: the highest the mixture's data hold for).
 * @returns Temperature, °C.
 */
function PHTEMP(limitPH: number, reagents: any[][], amounts: any[][], units: any[][], volume?: any, model?: any, fromC?: any, toC?: any): number {
  return run(() => phTemp(limitPH, reagents, amounts, units, volume, model, fromC, toC));
}

/**
 * Molar mass from the IUPAC standard atomic weights, g/mol.
 * @customfunction MOLARMASS
 * @helpurl https://localhost:3000/help.html#molarmass
 * @param formula A formula such as Na2HPO4·7H2O, or a catalogue name.
 * @returns Molar mass, g/mol.
 */
function MOLARMASS(formula: string): number {
  return run(() => impl.molarMass(formula));
}

/**
 * The add-in's and the catalogue's versions, for stamping a record.
 * @customfunction VERSION
 * @helpurl https://localhost:3000/help.html#version
 * @returns Version text.
 */
function VERSION(): string {
  return run(() => impl.version());
}

/**
 * A made solution as one text cell (name, what went in, to what volume, and its exact composition), usable wherever a reagent is, dispensed by volume.
 * @customfunction STOCK
 * @helpurl https://localhost:3000/help.html#stock
 * @param reagents Reagents of the stock, one per row (names, formulas, stocks, or other STOCK cells).
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Final volume of the stock, L.
 * @param [name] A name for the stock, shown in the cell (e.g. 10× PBS).
 * @returns The stock's handle text.
 */
function STOCK(reagents: any[][], amounts: any[][], units: any[][], volume: number, name?: any): string {
  return run(() => stock(reagents, amounts, units, volume, name));
}

/**
 * Each input row as read: reagent, formula, molar mass, assay or density or stock, moles, final concentration, what it releases.
 * @customfunction READBACK
 * @helpurl https://localhost:3000/help.html#readback
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @returns A spill with a header row, one row per input row, then the final volume and temperature.
 */
function READBACK(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any): any[][] {
  return run(() => readback(reagents, amounts, units, volume, temperature));
}

/**
 * Why a hand value differs: the textbook estimate, the exact pH, and the shift of each neglected effect in a fixed order.
 * @customfunction HANDCHECK
 * @helpurl https://localhost:3000/help.html#handcheck
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param [volume] Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [handPH] A pH worked out by hand, to find the step it matches.
 * @returns A labelled spill: estimate, exact pH, six shifts, their sum, and with handPH the differences.
 */
function HANDCHECK(reagents: any[][], amounts: any[][], units: any[][], volume?: any, temperature?: any, handPH?: any): any[][] {
  return run(() => handcheck(reagents, amounts, units, volume, temperature, handPH));
}

/**
 * The uncertainty budget of the pH (GUM): each input's standard uncertainty, sensitivity and contribution, then u(pH) and U (k = 2).
 * @customfunction UNCERTAINTY
 * @helpurl https://localhost:3000/help.html#uncertainty
 * @param reagents Reagents, one per row.
 * @param amounts Amount of each reagent.
 * @param units Unit of each amount: one cell or one per row.
 * @param volume Final volume of the solution, L.
 * @param [temperature] Temperature, °C (default 25).
 * @param [model] Activity model: davies (default), bates-guggenheim, sit (to about 3 mol/kg) or ideal.
 * @param [amountTolerances] ± tolerance of each amount in its own unit: one cell for all, or one per row.
 * @param [volumeTolerance] ± tolerance of the final volume, L.
 * @param [temperatureTolerance] ± tolerance of the temperature, °C.
 * @returns A spill with a header row: one line per input, then the combined and expanded uncertainty.
 */
function UNCERTAINTY(reagents: any[][], amounts: any[][], units: any[][], volume: any, temperature?: any, model?: any,
  amountTolerances?: any, volumeTolerance?: any, temperatureTolerance?: any): any[][] {
  return run(() => uncertainty(reagents, amounts, units, volume, temperature, model, amountTolerances, volumeTolerance, temperatureTolerance));
}

// The metadata plugin's loader appends CustomFunctions.associate for each @customfunction above.
export const EXCEL_FUNCTIONS = {
  PHMIX,
  TITRANT,
  CURVE,
  FRACTIONS,
  SPECIES,
  CONSTANTS,
  WARNINGS,
  IONICSTRENGTH,
  CAPACITY,
  PKA,
  RECIPE,
  MOLARMASS,
  VERSION,
  READBACK,
  HANDCHECK,
  UNCERTAINTY,
  STOCK,
  SALTDOSE,
  PHTEMP,
};
