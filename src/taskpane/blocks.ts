import { HANDCHECK_HEADER } from '../functions/handcheck';
import { CONSTANTS_HEADER } from '../functions/impl';
import { READBACK_HEADER } from '../functions/readback';
import { UNCERTAINTY_HEADER } from '../functions/uncertainty';
import { Refusal } from './refusal';

// Labelled blocks the pane writes into the sheet at the selected cell: inputs in cells and a
// formula that references them, so a reviewer sees every number the result depends on.

export type BlockCell = string | number;

export interface Block {
  /**
   * cells, row by row; text starting with = is a formula; null is a cell the block does not write (a spill
   * lands there, or padding): Excel leaves a null cell of a written 2-D array unchanged.
   */
  cells: (BlockCell | null)[][];
}

/** The activity model a block passes on when the pane has no other choice (the functions' own default). */
export const DEFAULT_MODEL = 'davies';

export interface MixtureInput {
  rows: { reagent: string; amount: number; unit: string }[];
  volumeL: number;
  temperatureC: number;
  /** an activity model id the functions take (davies, bates-guggenheim, ideal) */
  model?: string;
}

export type Shape = [rows: number, columns: number];

/**
 * Rows × columns each spilling function fills, as the blocks call it: one entry per function, and the
 * blocks leave exactly this much room (unwritten) below and beside the formula.
 */
export const SPILL_SHAPES = {
  RECIPE: (): Shape => [2, 3],
  CURVE: (points: number): Shape => [points, 3],
  FRACTIONS: (formCount: number): Shape => [1, formCount],
  SPECIES: (tableRows: number): Shape => [tableRows, 5],
  CONSTANTS: (tableRows: number): Shape => [tableRows, CONSTANTS_HEADER.length],
  READBACK: (tableRows: number): Shape => [tableRows, READBACK_HEADER.length],
  HANDCHECK: (tableRows: number): Shape => [tableRows, HANDCHECK_HEADER.length],
  UNCERTAINTY: (tableRows: number): Shape => [tableRows, UNCERTAINTY_HEADER.length],
};

/** The formula in the first cell of its spill, the rest of the spill left unwritten. */
export function spillRows(formula: string, [rows, columns]: Shape): (BlockCell | null)[][] {
  return Array.from({ length: rows }, (_, i) => [i === 0 ? formula : null, ...Array(columns - 1).fill(null)]);
}

/** Column letters of a zero-based column index (0 → A, 26 → AA). */
export function columnName(index: number): string {
  let name = '';
  for (let n = index + 1; n > 0; n = Math.floor((n - 1) / 26)) name = String.fromCharCode(65 + ((n - 1) % 26)) + name;
  return name;
}

export function address(row: number, col: number): string {
  return `${columnName(col)}${row + 1}`;
}

/** A text cell that Excel must not read as a formula or number. */
export function text(value: string): string {
  return /^[=+\-@]/.test(value) ? `'${value}` : value;
}

/** Rows made one width: the cells a row does not use are left unwritten (null), never blanked. */
export function pad(rows: (BlockCell | null)[][]): (BlockCell | null)[][] {
  const width = Math.max(...rows.map((r) => r.length));
  return rows.map((r) => [...r, ...Array(width - r.length).fill(null)]);
}

interface MixtureRefs { reagents: string; amounts: string; units: string; volume: string; temperature: string; model: string }

/** The mixture as labelled cells: reagents, volume, temperature (unless a table supplies it), activity model. */
function mixtureRows(m: MixtureInput, top: number, left: number, withTemperature = true): { rows: (BlockCell | null)[][]; refs: MixtureRefs; next: number } {
  const rows: (BlockCell | null)[][] = [['Reagent', 'Amount', 'Unit']];
  for (const r of m.rows) rows.push([text(r.reagent), r.amount, text(r.unit)]);
  const first = top + 1, last = top + m.rows.length;
  let next = last + 1;
  const at = (): string => address(next++, left + 1);
  rows.push(['Volume (L)', m.volumeL]);
  const volume = at();
  let temperature = '';
  if (withTemperature) {
    rows.push(['Temperature (°C)', m.temperatureC]);
    temperature = at();
  }
  rows.push(['Activity model', text(m.model ?? DEFAULT_MODEL)]);
  const model = at();
  const range = (c: number): string => `${address(first, left + c)}:${address(last, left + c)}`;
  return { rows, refs: { reagents: range(0), amounts: range(1), units: range(2), volume, temperature, model }, next };
}

/** The mixture's arguments as the cells reference them (PHMIX, WARNINGS, SPECIES, CONSTANTS order). */
function refArgs(refs: MixtureRefs, temperature = refs.temperature): string {
  return `${refs.reagents},${refs.amounts},${refs.units},${refs.volume},${temperature},${refs.model}`;
}

export function phBlock(m: MixtureInput, top: number, left: number): Block {
  const { rows, refs } = mixtureRows(m, top, left);
  rows.push(['pH', `=PROTIC.PHMIX(${refArgs(refs)})`]);
  // Beside every result, so a number outside the model's range is never silent in the record.
  rows.push(['Warnings', `=PROTIC.WARNINGS(${refArgs(refs)})`]);
  return { cells: pad(rows) };
}

/** The titrant block; `titrantUnitSymbol` is the unit the titrant is dispensed in (mL for a stock, g for a solid), written and passed to TITRANT. */
export function titrantBlock(m: MixtureInput, titrant: string, targetPH: number, titrantUnitSymbol: string, top: number, left: number): Block {
  const { rows, refs, next } = mixtureRows(m, top, left);
  rows.push(['Titrant', text(titrant)]);
  rows.push(['Target pH', targetPH]);
  const titrantRef = address(next, left + 1), targetRef = address(next + 1, left + 1), unitRef = address(next + 2, left + 2);
  rows.push(['Titrant to add', `=PROTIC.TITRANT(${targetRef},${refs.reagents},${refs.amounts},${refs.units},${refs.volume},${titrantRef},${refs.temperature},${refs.model},${unitRef})`, text(titrantUnitSymbol)]);
  rows.push(['Warnings (before titrant)', `=PROTIC.WARNINGS(${refArgs(refs)})`]);
  return { cells: pad(rows) };
}

/** A titration curve as a table: titrant added and pH down the rows (CURVE's spill), in the titrant's own unit. */
export function curveBlock(m: MixtureInput, titrant: string, maxAmount: number, points: number, titrantUnitSymbol: string, top: number, left: number): Block {
  const { rows, refs, next } = mixtureRows(m, top, left);
  rows.push(['Titrant', text(titrant)]);
  rows.push(['Titrant up to', maxAmount, text(titrantUnitSymbol)]);
  rows.push(['Points', points]);
  const [titrantRef, maxRef, pointsRef, unitRef] = [address(next, left + 1), address(next + 1, left + 1), address(next + 2, left + 1), address(next + 1, left + 2)];
  rows.push(['Titrant added', 'pH']);
  rows.push(...spillRows(`=PROTIC.CURVE(${refs.reagents},${refs.amounts},${refs.units},${refs.volume},${titrantRef},${maxRef},${pointsRef},${refs.temperature},${refs.model},${unitRef})`, SPILL_SHAPES.CURVE(points)));
  return { cells: pad(rows) };
}

/** The audit view: the mixture, then SPECIES and CONSTANTS, with their spills' room left unwritten. */
export function speciesBlock(m: MixtureInput, speciesRows: number, constantsRows: number, top: number, left: number): Block {
  const { rows, refs } = mixtureRows(m, top, left);
  rows.push(...spillRows(`=PROTIC.SPECIES(${refArgs(refs)})`, SPILL_SHAPES.SPECIES(speciesRows)));
  rows.push(...spillRows(`=PROTIC.CONSTANTS(${refArgs(refs)})`, SPILL_SHAPES.CONSTANTS(constantsRows)));
  return { cells: pad(rows) };
}

/** Common working temperatures, °C: cold room, ambient range, 37 °C (common practice). Cells the user can edit. */
export const WHAT_IF_TEMPERATURES_C = [4, 10, 15, 20, 25, 30, 37, 40];

/** A what-if table: the mixture at each temperature in a column of editable cells, pH and warnings beside it. */
export function temperatureTableBlock(m: MixtureInput, temperaturesC: number[], top: number, left: number): Block {
  const { rows, refs, next } = mixtureRows(m, top, left, false);
  rows.push(['Temperature (°C)', 'pH', 'Warnings']);
  temperaturesC.forEach((t, i) => {
    const cell = address(next + 1 + i, left);
    rows.push([t, `=PROTIC.PHMIX(${refArgs(refs, cell)})`, `=PROTIC.WARNINGS(${refArgs(refs, cell)})`]);
  });
  return { cells: pad(rows) };
}

export interface RecipeInput { acidForm: string; baseForm: string; targetPH: number; concentrationM: number; volumeL: number; temperatureC: number; model?: string }

export function recipeBlock(r: RecipeInput, top: number, left: number): Block {
  const b = (i: number): string => address(top + i, left + 1);
  const rows: (BlockCell | null)[][] = [
    ['Acid form', text(r.acidForm)], ['Base form', text(r.baseForm)], ['Target pH', r.targetPH],
    ['Buffer concentration (mol/L)', r.concentrationM], ['Volume (L)', r.volumeL], ['Temperature (°C)', r.temperatureC],
    ['Activity model', text(r.model ?? DEFAULT_MODEL)],
    ['Weigh', 'grams'],
    ...spillRows(`=PROTIC.RECIPE(${b(0)},${b(1)},${b(2)},${b(3)},${b(4)},${b(5)},${b(6)})`, SPILL_SHAPES.RECIPE()),
  ];
  return { cells: pad(rows) };
}

export interface FractionsInput { system: string; forms: string[]; fromPH: number; toPH: number; stepPH: number; temperatureC: number; ionicStrengthM: number }

/** Most rows a table block writes (the CURVE limit too); the pane refuses more before anything is written. */
export const MAX_TABLE_ROWS = 1001;

/** Rows of a fractions table, or a sentence saying why there are none (step not above 0, from above to, too many). */
export function fractionsRowCount(fromPH: number, toPH: number, stepPH: number): number | string {
  if (!(stepPH > 0)) return `the pH step must be above 0 (received ${stepPH})`;
  if (fromPH > toPH) return `“pH from” (${fromPH}) must not be above “to” (${toPH})`;
  const count = Math.floor((toPH - fromPH) / stepPH + 1e-9) + 1;
  return count > MAX_TABLE_ROWS ? `${count} rows is more than ${MAX_TABLE_ROWS}: take a larger step` : count;
}

export function fractionsBlock(f: FractionsInput, top: number, left: number): Block {
  const count = fractionsRowCount(f.fromPH, f.toPH, f.stepPH);
  if (typeof count === 'string') throw new Refusal(`Fractions table: ${count}.`);
  const rows: (BlockCell | null)[][] = [['pH', ...f.forms.map(text)]];
  for (let i = 0; i < count; i++) {
    const r = top + 1 + i;
    const pH = Math.round((f.fromPH + i * f.stepPH) * 1e6) / 1e6;
    rows.push([pH, ...spillRows(`=PROTIC.FRACTIONS("${f.system.replace(/"/g, '""')}",${address(r, left)},${f.temperatureC},${f.ionicStrengthM})`, SPILL_SHAPES.FRACTIONS(f.forms.length))[0]]);
  }
  return { cells: pad(rows) };
}
