import { fail, quote } from '../engine';
import type { MixtureRow } from '../engine';

// Cells arrive as a single value or a 2-D array; an omitted optional argument as null;
// an empty cell as null, "" or 0 depending on the host.

export type Cell = unknown;

export function isBlank(value: Cell): boolean {
  return value === null || value === undefined || (typeof value === 'string' && value.trim() === '');
}

export function toMatrix(value: Cell): Cell[][] {
  if (Array.isArray(value)) {
    if (value.length === 0) return [];
    return value.map((row) => (Array.isArray(row) ? row : [row]));
  }
  return [[value]];
}

function shapeText(m: Cell[][]): string {
  return `${m.length}×${m[0]?.length ?? 0}`;
}

function sameShape(a: Cell[][], b: Cell[][]): boolean {
  return a.length === b.length && a.every((row, i) => row.length === b[i].length);
}

/** Reads the reagents, amounts and units arguments into batch-record rows. */
export function mixtureRows(reagents: Cell, amounts: Cell, units: Cell, names = { reagents: 'reagents', amounts: 'amounts', units: 'units' }): MixtureRow[] {
  const r = toMatrix(reagents), a = toMatrix(amounts), u = toMatrix(units);
  if (!sameShape(r, a)) {
    fail({ code: 'shape_mismatch', argument: names.amounts, received: `a ${shapeText(a)} range`, expected: `the same shape as ${names.reagents} (${shapeText(r)})` });
  }
  const oneUnit = u.length === 1 && u[0].length === 1;
  if (!oneUnit && !sameShape(r, u)) {
    fail({ code: 'shape_mismatch', argument: names.units, received: `a ${shapeText(u)} range`, expected: `one unit for every row, or the same shape as ${names.reagents} (${shapeText(r)})` });
  }
  const rows: MixtureRow[] = [];
  let index = 0;
  for (let i = 0; i < r.length; i++) {
    for (let j = 0; j < r[i].length; j++) {
      index++;
      const reagent = r[i][j];
      const amount = a[i][j];
      const unit = oneUnit ? u[0][0] : u[i][j];
      const reagentBlank = isBlank(reagent) || reagent === 0;
      const amountBlank = isBlank(amount) || amount === 0;
      if (reagentBlank && amountBlank) continue;
      if (reagentBlank) {
        fail({ code: 'bad_argument', argument: names.reagents, row: index, received: 'a blank reagent beside an amount', expected: 'a reagent name, formula or stock on every row that has an amount' });
      }
      if (typeof reagent !== 'string') {
        fail({ code: 'unknown_reagent', argument: names.reagents, row: index, received: quote(reagent), expected: 'text: a catalogue name, a formula or a stock such as 1 M HCl' });
      }
      if (isBlank(amount)) {
        fail({ code: 'bad_amount', argument: names.amounts, row: index, received: 'a blank amount', expected: `a number for ${reagent.trim()}` });
      }
      if (typeof amount !== 'number' || !Number.isFinite(amount) || amount < 0) {
        fail({ code: 'bad_amount', argument: names.amounts, row: index, received: quote(amount), expected: 'a number zero or above' });
      }
      if (isBlank(unit)) {
        fail({ code: 'bad_unit', argument: names.units, row: index, received: 'a blank unit', expected: 'g mg kg µg, mol mmol µmol, M mM µM or L mL µL' });
      }
      if (typeof unit !== 'string') {
        fail({ code: 'bad_unit', argument: names.units, row: index, received: quote(unit), expected: 'a unit as text: g mg kg µg, mol mmol µmol, M mM µM or L mL µL' });
      }
      rows.push({ reagent, amount, unit, row: index });
    }
  }
  return rows;
}

export interface NumberRule {
  min?: number;
  max?: number;
  /** what the user should type, for the message */
  expected: string;
  integer?: boolean;
}

function checkNumber(value: Cell, argument: string, rule: NumberRule): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) fail({ code: 'bad_argument', argument, received: quote(value), expected: rule.expected });
  if ((rule.min !== undefined && value < rule.min) || (rule.max !== undefined && value > rule.max) || (rule.integer && !Number.isInteger(value))) {
    fail({ code: rule.min !== undefined && value < rule.min || rule.max !== undefined && value > rule.max ? 'out_of_range' : 'bad_argument', argument, received: String(value), expected: rule.expected });
  }
  return value;
}

export function requiredNumber(value: Cell, argument: string, rule: NumberRule): number {
  const v = Array.isArray(value) ? singleCell(value, argument) : value;
  if (isBlank(v)) fail({ code: 'bad_argument', argument, received: 'an empty cell', expected: rule.expected });
  return checkNumber(v, argument, rule);
}

export function optionalNumber(value: Cell, argument: string, fallback: number, rule: NumberRule): number;
export function optionalNumber(value: Cell, argument: string, fallback: undefined, rule: NumberRule): number | undefined;
export function optionalNumber(value: Cell, argument: string, fallback: number | undefined, rule: NumberRule): number | undefined {
  const v = Array.isArray(value) ? singleCell(value, argument) : value;
  if (isBlank(v)) return fallback;
  return checkNumber(v, argument, rule);
}

export function requiredText(value: Cell, argument: string, expected: string): string {
  const v = Array.isArray(value) ? singleCell(value, argument) : value;
  if (typeof v !== 'string' || v.trim() === '') fail({ code: 'bad_argument', argument, received: quote(v), expected });
  return v;
}

export function optionalText(value: Cell, argument: string): string | undefined {
  const v = Array.isArray(value) ? singleCell(value, argument) : value;
  if (isBlank(v)) return undefined;
  if (typeof v !== 'string') fail({ code: 'bad_argument', argument, received: quote(v), expected: 'text' });
  return v;
}

function singleCell(value: Cell[], argument: string): Cell {
  const m = toMatrix(value);
  if (m.length === 1 && m[0].length === 1) return m[0][0];
  return fail({ code: 'shape_mismatch', argument, received: `a ${shapeText(m)} range`, expected: 'a single cell' });
}

export const TEMPERATURE_RULE: NumberRule = { expected: 'a temperature in °C (default 25)' };
export const PH_RULE: NumberRule = { min: -1, max: 15, expected: 'a pH between −1 and 15' };
export const VOLUME_RULE: NumberRule = { min: 1e-9, max: 1e6, expected: 'a volume in litres, above zero' };
export const IONIC_STRENGTH_RULE: NumberRule = { min: 0, max: 5, expected: 'an ionic strength from 0 to 5 mol/L (default 0)' };
