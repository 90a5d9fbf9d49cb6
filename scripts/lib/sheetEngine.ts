// Registers Protic's cell functions in HyperFormula (GPL-3.0 licence key), a real spreadsheet
// engine used by the headless runner, the demo, the benchmarks and the tests. It is not part
// of the add-in bundle.
import { ArraySize, CellError, DetailedCellError, EmptyValue, ErrorType, FunctionArgumentType, FunctionPlugin, HyperFormula, SimpleRangeValue } from 'hyperformula';
import type { RawCellContent } from 'hyperformula';
import * as impl from '../../src/functions/impl';
import { uncertainty } from '../../src/functions/uncertainty';
import { readback } from '../../src/functions/readback';
import { handcheck } from '../../src/functions/handcheck';
import { phTemp } from '../../src/functions/phtemp';
import { saltDose } from '../../src/functions/saltdose';
import { toCellFailure } from '../../src/functions/outcome';
import { stock } from '../../src/functions/stock';
import type { CellFailure } from '../../src/functions/outcome';

type Impl = (...args: unknown[]) => unknown;

interface ProticFunction {
  name: string;
  fn: Impl;
  arity: [number, number];
  /** spill size when the arguments cannot be read at parse time: [rows, columns] */
  fallback?: [number, number];
}

export const PROTIC_FUNCTIONS: ProticFunction[] = [
  { name: 'PHMIX', fn: impl.ph as Impl, arity: [3, 6] },
  { name: 'TITRANT', fn: impl.titrant as Impl, arity: [6, 10] },
  { name: 'CURVE', fn: impl.curve as Impl, arity: [6, 10], fallback: [51, 3] },
  { name: 'FRACTIONS', fn: impl.fractions as Impl, arity: [2, 5], fallback: [1, 7] },
  { name: 'SPECIES', fn: impl.species as Impl, arity: [3, 6], fallback: [40, 5] },
  { name: 'CONSTANTS', fn: impl.constants as Impl, arity: [3, 6], fallback: [30, 11] },
  { name: 'WARNINGS', fn: impl.warnings as Impl, arity: [3, 6] },
  { name: 'IONICSTRENGTH', fn: impl.ionicStrength as Impl, arity: [3, 6] },
  { name: 'CAPACITY', fn: impl.capacity as Impl, arity: [3, 6] },
  { name: 'PKA', fn: impl.pka as Impl, arity: [2, 5] },
  { name: 'RECIPE', fn: impl.recipe as Impl, arity: [5, 10], fallback: [2, 3] },
  { name: 'SALTDOSE', fn: saltDose as Impl, arity: [6, 9] },
  { name: 'PHTEMP', fn: phTemp as Impl, arity: [4, 8] },
  { name: 'MOLARMASS', fn: impl.molarMass as Impl, arity: [1, 1] },
  { name: 'VERSION', fn: impl.version as Impl, arity: [0, 0] },
  { name: 'STOCK', fn: stock as Impl, arity: [4, 5] },
  { name: 'UNCERTAINTY', fn: uncertainty as Impl, arity: [4, 9], fallback: [40, 9] },
  { name: 'READBACK', fn: readback as Impl, arity: [3, 5], fallback: [20, 9] },
  { name: 'HANDCHECK', fn: handcheck as Impl, arity: [3, 6], fallback: [20, 4] },
];

const SPILLS = new Set(['CURVE', 'FRACTIONS', 'SPECIES', 'CONSTANTS', 'RECIPE', 'UNCERTAINTY', 'READBACK', 'HANDCHECK']);
const BY_NAME = new Map(PROTIC_FUNCTIONS.map((f) => [f.name, f] as [string, ProticFunction]));

/**
 * Spill results worked out while the sheet is parsed (to size them), keyed on the function and
 * its arguments, so evaluating the same call does not compute it a second time.
 */
const spillResults = new Map<string, unknown>();

function spillKey(name: string, values: unknown[]): string {
  return `${name}\u0000${JSON.stringify(values)}`;
}

/** Raw contents of the sheets being built (by sheet id), so spill sizes can be worked out from typed arguments. */
let rawGrids: RawCellContent[][][] = [];

/**
 * What a workbook run may ask of the plugin: a spill size for a call whose arguments are
 * computed (the size a saved workbook recorded), and notice of each Protic cell evaluated.
 */
export interface EvaluationHooks {
  sizeHint?: (sheet: number, row: number, col: number) => [number, number] | undefined;
  evaluated?: (name: string, sheet: number, row: number, col: number, shape: [number, number] | undefined) => void;
}
let hooks: EvaluationHooks = {};
/** The failure of a spill's call while the sheet was parsed, by formula address. */
const sizeFailures = new Map<string, CellFailure>();

function addressKey(address: unknown): string {
  const a = address as { sheet?: number; row?: number; col?: number };
  return `${a.sheet}:${a.row}:${a.col}`;
}

function asHostPasses(arg: AstLike, value: Plain): Plain {
  return arg.type === 'CELL_RANGE' && !Array.isArray(value) && !(value instanceof CellError) ? [[value]] : value;
}


type Plain = unknown;

function plainScalar(v: unknown): Plain {
  if (v === EmptyValue) return null;
  if (v instanceof CellError) return v;
  if (typeof v === 'object' && v !== null && 'val' in v) return (v as { val: unknown }).val;
  return v;
}

function plain(v: unknown): Plain {
  if (v instanceof SimpleRangeValue) return v.data.map((row) => row.map(plainScalar));
  return plainScalar(v);
}

function firstError(values: Plain[]): CellError | undefined {
  for (const v of values) {
    if (v instanceof CellError) return v;
    if (Array.isArray(v)) for (const row of v) for (const c of row as unknown[]) if (c instanceof CellError) return c;
  }
  return undefined;
}

interface AstLike { type: string; value?: unknown; reference?: { toSimpleCellAddress(base: unknown): { sheet: number; row: number; col: number } }; start?: AstLike['reference']; end?: AstLike['reference']; args?: AstLike[] }

function rawAt(sheet: number, row: number, col: number): unknown {
  const v = rawGrids[sheet]?.[row]?.[col];
  if (typeof v === 'string' && v.startsWith('=')) return undefined;
  return v === undefined || v === '' ? null : v;
}

/** The value of an argument as typed, or undefined when it is computed. */
function literal(ast: AstLike, base: unknown): unknown {
  switch (ast.type) {
    case 'NUMBER': case 'STRING': return ast.value;
    case 'EMPTY': return null;
    case 'MINUS_UNARY_OP': { const inner = literal(ast.value as AstLike, base); return typeof inner === 'number' ? -inner : undefined; }
    case 'CELL_REFERENCE': { const a = ast.reference!.toSimpleCellAddress(base); return rawAt(a.sheet, a.row, a.col); }
    case 'CELL_RANGE': {
      const s = ast.start!.toSimpleCellAddress(base), e = ast.end!.toSimpleCellAddress(base);
      const out: unknown[][] = [];
      for (let r = s.row; r <= e.row; r++) {
        const row: unknown[] = [];
        for (let c = s.col; c <= e.col; c++) {
          const v = rawAt(s.sheet, r, c);
          if (v === undefined) return undefined;
          row.push(v);
        }
        out.push(row);
      }
      return out;
    }
    default: return undefined;
  }
}

function shapeOf(result: unknown): [number, number] | undefined {
  if (!Array.isArray(result)) return undefined;
  return [result.length, Math.max(...result.map((r: unknown[]) => r.length))];
}

export class ProticPlugin extends FunctionPlugin {
  static implementedFunctions: Record<string, never> = {};

  run(name: string, ast: { args: AstLike[] }, state: { formulaAddress: unknown; formulaVertex?: unknown }): unknown {
    const entry = BY_NAME.get(name) as ProticFunction;
    // a range is a 2-D array even when it is one cell, as Excel passes it (HyperFormula gives a 1×1 range as its value)
    const values = ast.args.map((arg) => (arg.type === 'EMPTY' ? null : asHostPasses(arg, plain(this.evaluateAst(arg as never, state as never)))));
    const error = firstError(values);
    if (error) return error;
    const spill = SPILLS.has(name);
    const key = spill ? spillKey(name, values) : '';
    let result: unknown = spill ? spillResults.get(key) : undefined;
    if (result === undefined) {
      try {
        result = entry.fn(...values);
      } catch (e) {
        const failure = toCellFailure(e);
        return new CellError(failure.kind === '#N/A' ? ErrorType.NA : ErrorType.VALUE, failure.message);
      }
    }
    const at = state.formulaAddress as { sheet: number; row: number; col: number };
    if (hooks.evaluated) hooks.evaluated(name, at.sheet, at.row, at.col, spill ? shapeOf(result) : undefined);
    if (!spill) return result;
    // the size reserved at parse time is on the array vertex; work it out again only without one
    const vertex = state.formulaVertex as { width?: number; height?: number } | undefined;
    const size: [number, number] = vertex && typeof vertex.width === 'number' && typeof vertex.height === 'number'
      ? [vertex.height, vertex.width] : this.sizeFor(name, ast, state);
    const shape = shapeOf(result) as [number, number];
    if (shape[0] > size[0] || shape[1] > size[1]) {
      // sizing failed: its failure is the real one, not the size it left reserved
      const sizing = sizeFailures.get(addressKey(state.formulaAddress));
      if (sizing) return new CellError(sizing.kind === '#N/A' ? ErrorType.NA : ErrorType.VALUE, `${name}: the sheet could not size this spill: ${sizing.message}`);
      return new CellError(ErrorType.VALUE, `${name}: the result is ${shape[0]}×${shape[1]} but the sheet reserved ${size[0]}×${size[1]}; type the arguments that set its size into cells rather than computing them`);
    }
    const padded = Array.from({ length: size[0] }, (_, r) => Array.from({ length: size[1] }, (_, c) => (result as unknown[][])[r]?.[c] ?? ''));
    return SimpleRangeValue.onlyValues(padded as never);
  }

  sizeFor(name: string, ast: { args: AstLike[] }, state: { formulaAddress: unknown }): [number, number] {
    const entry = BY_NAME.get(name) as ProticFunction;
    const values = ast.args.map((arg) => literal(arg, state.formulaAddress));
    if (values.some((v) => v === undefined)) {
      const at = state.formulaAddress as { sheet: number; row: number; col: number };
      // a saved workbook's spill size (its layout fits it); a result that grew since shows as a difference
      return hooks.sizeHint?.(at.sheet, at.row, at.col) ?? entry.fallback ?? [1, 1];
    }
    try {
      const result = entry.fn(...values);
      spillResults.set(spillKey(name, values), result);
      return shapeOf(result) ?? [1, 1];
    } catch (e) {
      // the call fails: it will show its error in one cell (and this one, should the evaluated call not fit)
      sizeFailures.set(addressKey(state.formulaAddress), toCellFailure(e));
      return [1, 1];
    }
  }
}

for (const f of PROTIC_FUNCTIONS) {
  const method = `fn_${f.name}`;
  const sizeMethod = `size_${f.name}`;
  const params = Array.from({ length: f.arity[1] }, (_, i) => ({ argumentType: FunctionArgumentType.ANY, optionalArg: i >= f.arity[0] }));
  (ProticPlugin.implementedFunctions as Record<string, unknown>)[`PROTIC.${f.name}`] = {
    method,
    parameters: params,
    ...(SPILLS.has(f.name) ? { sizeOfResultArrayMethod: sizeMethod } : {}),
  };
  (ProticPlugin.prototype as unknown as Record<string, unknown>)[method] = function (this: ProticPlugin, ast: { args: AstLike[] }, state: { formulaAddress: unknown }) {
    return this.run(f.name, ast, state);
  };
  if (SPILLS.has(f.name)) {
    (ProticPlugin.prototype as unknown as Record<string, unknown>)[sizeMethod] = function (this: ProticPlugin, ast: { args: AstLike[] }, state: { formulaAddress: unknown }) {
      const [rows, cols] = this.sizeFor(f.name, ast, state);
      return new ArraySize(cols, rows);
    };
  }
}

let registered = false;
function register(): void {
  if (registered) return;
  const names: Record<string, string> = {};
  for (const f of PROTIC_FUNCTIONS) names[`PROTIC.${f.name}`] = `PROTIC.${f.name}`;
  HyperFormula.registerFunctionPlugin(ProticPlugin as never, { enGB: names, enUS: names } as never);
  registered = true;
}

export type SheetValue = number | string | boolean | null | { error: string; message: string };

export function sheetValue(v: unknown): SheetValue {
  return v instanceof DetailedCellError ? { error: v.value, message: v.message } : (v as SheetValue);
}

/** A workbook to build: sheets in order (their ids are their positions) and defined names. */
export interface WorkbookInput {
  sheets: { name: string; cells: RawCellContent[][] }[];
  names?: { name: string; expression: string; scope?: number }[];
}

/**
 * Builds a workbook (cross-sheet references, defined names), hands the live engine to `use`
 * and frees it afterwards. Example: `withWorkbook({ sheets: [{ name: 'S', cells: [[1, '=A1*2']] }] }, (hf) => hf.getSheetValues(0))`.
 */
export function withWorkbook<T>(book: WorkbookInput, use: (hf: HyperFormula) => T, evaluationHooks: EvaluationHooks = {}): T {
  register();
  rawGrids = book.sheets.map((s) => s.cells);
  hooks = evaluationHooks;
  const sheets: Record<string, RawCellContent[][]> = {};
  for (const s of book.sheets) sheets[s.name] = s.cells;
  let hf: HyperFormula | undefined;
  try {
    hf = HyperFormula.buildFromSheets(sheets, { licenseKey: 'gpl-v3', maxRows: 1_100_000, smartRounding: false, useArrayArithmetic: true }, book.names ?? []);
    return use(hf);
  } finally {
    hf?.destroy();
    rawGrids = [];
    hooks = {};
    spillResults.clear();
    sizeFailures.clear();
  }
}

/** Builds a sheet from raw cells (formulas as `=...`) and returns its evaluated values. */
export function evaluateSheet(cells: RawCellContent[][]): SheetValue[][] {
  return withWorkbook({ sheets: [{ name: 'Sheet1', cells }] }, (hf) => hf.getSheetValues(0).map((row) => row.map(sheetValue)));
}
