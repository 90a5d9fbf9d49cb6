import { fail, quote } from './failure';

export type UnitKind = 'mass' | 'amount' | 'concentration' | 'volume';

/** A unit and its factor to the base of its kind: g, mol, mol/L, L. */
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
  { symbol: 'M', kind: 'concentration', toBase: 1 },
  { symbol: 'mM', kind: 'concentration', toBase: 1e-3 },
  { symbol: 'µM', kind: 'concentration', toBase: 1e-6 },
  { symbol: 'mol/L', kind: 'concentration', toBase: 1 },
  { symbol: 'mmol/L', kind: 'concentration', toBase: 1e-3 },
  { symbol: 'µmol/L', kind: 'concentration', toBase: 1e-6 },
  { symbol: 'L', kind: 'volume', toBase: 1 },
  { symbol: 'mL', kind: 'volume', toBase: 1e-3 },
  { symbol: 'µL', kind: 'volume', toBase: 1e-6 },
];

export const UNIT_LIST = 'g mg kg µg, mol mmol µmol, M mM µM, L mL µL';

/** Normalises the micro sign: `u`, the Greek mu and the micro sign all mean µ. */
function normaliseMicro(text: string): string {
  return text.replace(/^[uμ]/, 'µ').replace(/\/[uμ]/, '/µ');
}

/** Finds a unit; `M` is case-sensitive (M vs m), litres and grams accept any case. */
export function findUnit(text: string): Unit | undefined {
  const t = normaliseMicro(text.trim());
  const exact = UNITS.find((u) => u.symbol === t);
  if (exact) return exact;
  return UNITS.find((u) => u.kind !== 'concentration' && u.symbol.toLowerCase() === t.toLowerCase() && !/^[mµ]?M$/.test(t));
}

export function parseUnit(value: unknown, argument: string, row?: number, allowed?: readonly UnitKind[]): Unit {
  const unit = typeof value === 'string' ? findUnit(value) : undefined;
  const kinds = allowed ?? ['mass', 'amount', 'concentration', 'volume'];
  if (!unit || !kinds.includes(unit.kind)) {
    const expected = UNITS.filter((u) => kinds.includes(u.kind) && !u.symbol.includes('/')).map((u) => u.symbol).join(' ');
    fail({ code: 'bad_unit', argument, row, received: quote(value), expected: `one of ${expected} (u may stand for µ)` });
  }
  return unit;
}

// g per litre of stock for each mass-concentration unit a batch record writes before a reagent
const MASS_STOCK_G_PER_L: Record<string, number> = { 'g/l': 1, 'mg/ml': 1, 'mg/l': 1e-3, 'µg/ml': 1e-3, 'ug/ml': 1e-3, 'μg/ml': 1e-3, '%w/v': 10 };

/** A stock by mass written before a reagent: `50 g/L NaCl`, `10 mg/mL Tris`, `10% w/v NaOH` (g per 100 mL). */
export function splitMassStock(text: string): { gramsPerL: number; rest: string } | undefined {
  const match = /^\s*(\d+(?:\.\d+)?(?:[eE][-+]?\d+)?|\.\d+)\s*(g\/L|mg\/mL|mg\/L|[uµμ]g\/mL|%\s*w\/v)\s+(\S.*)$/i.exec(text);
  if (!match) return undefined;
  const factor = MASS_STOCK_G_PER_L[match[2].toLowerCase().replace(/\s+/g, '')];
  return { gramsPerL: Number(match[1]) * factor, rest: match[3].trim() };
}

/** A stock written before a reagent: `1.2 M HCl`, `0.1 mol/L NaOH`, `500 mM Tris`. */
export function splitStock(text: string): { concentrationM: number; rest: string } | undefined {
  const match = /^\s*(\d+(?:\.\d+)?(?:[eE][-+]?\d+)?|\.\d+)\s*(M|mM|[uµμ]M|mol\/L|mmol\/L|[uµμ]mol\/L)\s+(\S.*)$/.exec(text);
  if (!match) return undefined;
  const unit = findUnit(match[2]) as Unit;
  return { concentrationM: Number(match[1]) * unit.toBase, rest: match[3].trim() };
}
