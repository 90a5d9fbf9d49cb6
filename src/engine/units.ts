import { fail, quote } from './failure';

export type UnitKind = 'mass' | 'amount' | 'concentration' | 'volume' | 'massConcentration' | 'normality';

/** A unit and its factor to the base of its kind: g, mol, mol/L, L, g/L, eq/L. */
export interface Unit {
  symbol: string;
  kind: UnitKind;
  toBase: number;
}

const UNITS: readonly Unit[] = [
  { symbol: 'g', kind: 'mass', toBase: 1 },
  { symbol: 'mg', kind: 'mass', toBase: 1e-3 },
  { symbol: 'kg', kind: 'mass', toBase: 1e3 },
  { symbol: 'µg', kind: 'mass', toBase: 1e-6 },
  { symbol: 'mol', kind: 'amount', toBase: 1 },
  { symbol: 'mmol', kind: 'amount', toBase: 1e-3 },
  { symbol: 'µmol', kind: 'amount', toBase: 1e-6 },
  { symbol: 'nmol', kind: 'amount', toBase: 1e-9 },
  { symbol: 'M', kind: 'concentration', toBase: 1 },
  { symbol: 'mM', kind: 'concentration', toBase: 1e-3 },
  { symbol: 'µM', kind: 'concentration', toBase: 1e-6 },
  { symbol: 'nM', kind: 'concentration', toBase: 1e-9 },
  { symbol: 'mol/L', kind: 'concentration', toBase: 1 },
  { symbol: 'mmol/L', kind: 'concentration', toBase: 1e-3 },
  { symbol: 'µmol/L', kind: 'concentration', toBase: 1e-6 },
  { symbol: 'nmol/L', kind: 'concentration', toBase: 1e-9 },
  { symbol: 'L', kind: 'volume', toBase: 1 },
  { symbol: 'mL', kind: 'volume', toBase: 1e-3 },
  { symbol: 'µL', kind: 'volume', toBase: 1e-6 },
  { symbol: 'g/L', kind: 'massConcentration', toBase: 1 },
  { symbol: 'mg/L', kind: 'massConcentration', toBase: 1e-3 },
  { symbol: 'mg/mL', kind: 'massConcentration', toBase: 1 },
  { symbol: 'µg/mL', kind: 'massConcentration', toBase: 1e-3 },
  { symbol: '% w/v', kind: 'massConcentration', toBase: 10 }, // g per 100 mL
  { symbol: 'N', kind: 'normality', toBase: 1 },
];

export const UNIT_LIST = 'g mg kg µg, mol mmol µmol nmol, M mM µM nM, L mL µL, g/L mg/L mg/mL µg/mL % w/v, N';

/** Normalises the micro sign (`u`, the Greek mu and the micro sign all mean µ), the case of `l`, and `% w/v` spellings. */
function canonical(text: string): string {
  return text.trim().replace(/^[uμ]/, 'µ').replace(/\/[uμ]/, '/µ').replace(/(^|[mµn/])l$/, '$1L')
    .replace(/^%\s*\(?\s*w\s*\/\s*v\s*\)?$/i, '% w/v').replace(/^w\/v\s*%$/i, '% w/v');
}

/**
 * Finds a unit. Prefixes keep their SI case (`M` is molar and mega, `m` milli), so `Mg`, `ML`, `MG` and `Mmol`
 * are not units here (see unitCaseHint); only the litre's `l`/`L` and the micro sign have spellings.
 */
export function findUnit(text: string): Unit | undefined {
  const t = canonical(text);
  return UNITS.find((u) => u.symbol === t);
}

/** For a text that is a unit in another case (`Mg`, `ML`): the unit most likely meant and why it is refused. */
export function unitCaseHint(text: string): string | undefined {
  const t = canonical(text);
  const meant = UNITS.filter((u) => u.symbol.toLowerCase() === t.toLowerCase());
  if (meant.length === 0) return undefined;
  const mega = /^M(g|G|L|l|mol|MOL)$/.test(t) ? '; M is the SI prefix mega' : '';
  return `${meant.map((u) => u.symbol).join(' or ')} (prefixes keep their SI case${mega})`;
}

/**
 * A concentration in the final solution (mol/L, g/L, % w/v, N): a row in it holds its value times the final volume,
 * so its concentration does not change with the volume (mixture.ts, rowMoles).
 * @example isConcentrationUnit(parseUnit('g/L', 'units')) // true; parseUnit('g', ...) → false
 */
export function isConcentrationUnit(unit: Unit): boolean {
  return unit.kind === 'concentration' || unit.kind === 'massConcentration' || unit.kind === 'normality';
}

export function parseUnit(value: unknown, argument: string, row?: number, allowed?: readonly UnitKind[]): Unit {
  const unit = typeof value === 'string' ? findUnit(value) : undefined;
  const kinds = allowed ?? ['mass', 'amount', 'concentration', 'volume', 'massConcentration', 'normality'];
  if (!unit || !kinds.includes(unit.kind)) {
    const hint = typeof value === 'string' && !unit ? unitCaseHint(value) : undefined;
    const expected = UNITS.filter((u) => kinds.includes(u.kind) && !/^[mµn]?mol\//.test(u.symbol)).map((u) => u.symbol).join(' ');
    fail({ code: 'bad_unit', argument, row, received: quote(value), expected: hint ? `${hint}` : `one of ${expected} (u may stand for µ)` });
  }
  return unit;
}

const NUMBER = String.raw`(\d+(?:\.\d+)?(?:[eE][-+]?\d+)?|\.\d+)`;
const MASS_UNIT = String.raw`(g\/[lL]|mg\/m[lL]|mg\/[lL]|[uµμ]g\/m[lL]|%\s*\(?\s*w\/v\s*\)?)`;
const MOLAR_UNIT = String.raw`(M|mM|[uµμ]M|nM|mol\/[lL]|mmol\/[lL]|[uµμ]mol\/[lL]|nmol\/[lL]|N)`;

/** A concentration written before or after a reagent, as batch records do: `1 M NaOH`, `NaOH 1 M`, `NaOH (1 M)`. */
function splitAround(text: string, unitPattern: string): { value: number; unit: string; rest: string } | undefined {
  const before = new RegExp(String.raw`^\s*${NUMBER}\s*${unitPattern}\s+(\S.*)$`).exec(text);
  if (before) return { value: Number(before[1]), unit: before[2], rest: before[3].trim() };
  const after = new RegExp(String.raw`^\s*(\S.*?)\s*(?:\(\s*${NUMBER}\s*${unitPattern}\s*\)|\s${NUMBER}\s*${unitPattern})\s*$`).exec(text);
  if (after) {
    const value = after[2] ?? after[4];
    const unit = after[3] ?? after[5];
    return { value: Number(value), unit, rest: after[1].trim() };
  }
  return undefined;
}

// g per litre of stock for each mass-concentration unit a batch record writes beside a reagent
const MASS_STOCK_G_PER_L: Record<string, number> = { 'g/l': 1, 'mg/ml': 1, 'mg/l': 1e-3, 'µg/ml': 1e-3, 'ug/ml': 1e-3, 'μg/ml': 1e-3, '%w/v': 10 };

/** A stock by mass beside a reagent: `50 g/L NaCl`, `10 mg/mL Tris`, `10% w/v NaOH`, `10% (w/v) NaOH`, `NaOH 10% w/v`. */
export function splitMassStock(text: string): { gramsPerL: number; rest: string } | undefined {
  const found = splitAround(text, MASS_UNIT);
  if (!found) return undefined;
  const factor = MASS_STOCK_G_PER_L[found.unit.toLowerCase().replace(/[\s()]+/g, '')];
  return { gramsPerL: found.value * factor, rest: found.rest };
}

/**
 * A stock by amount beside a reagent: `1.2 M HCl`, `0.1 mol/l NaOH`, `500 mM Tris`, `NaCl 5 M`, `NaOH (1 M)`;
 * `normality` is set for `1 N NaOH` (eq/L, converted by the caller, which knows the reagent).
 */
export function splitStock(text: string): { concentrationM: number; rest: string; normality?: number } | undefined {
  const found = splitAround(text, MOLAR_UNIT);
  if (!found) return undefined;
  if (found.unit === 'N') return { concentrationM: Number.NaN, normality: found.value, rest: found.rest };
  const unit = findUnit(found.unit) as Unit;
  return { concentrationM: found.value * unit.toBase, rest: found.rest };
}
