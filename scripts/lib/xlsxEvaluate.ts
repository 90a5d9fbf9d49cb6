// Recomputes a saved workbook in HyperFormula: every sheet, cross-sheet references, defined
// names. Spilled cells are left empty for the engine to fill from the anchor's formula.
import type { RawCellContent } from 'hyperformula';
import { sheetValue, withWorkbook } from './sheetEngine';
import type { SheetValue } from './sheetEngine';
import { a1 } from './xlsxRead';
import type { SavedCell, SavedWorkbook } from './xlsxRead';

export interface Problem { kind: 'unparseable' | 'circular' | 'external' | 'name' | 'foreign' | 'unsupported'; where: string; message: string }

export interface Evaluated {
  values: SheetValue[][][];
  /** the true shape of each spilled Protic result, by "sheet:row:col" */
  shapes: Map<string, [number, number]>;
  /** for the cells asked: the computed cells among their inputs (A1, sheet-qualified when elsewhere) */
  computedInputs: Map<string, string[]>;
  problems: Problem[];
}

export const cellKey = (sheet: number, row: number, col: number): string => `${sheet}:${row}:${col}`;

function rawValue(cell: SavedCell): RawCellContent {
  const v = cell.value;
  if (v === null) return null;
  if (typeof v === 'object') return v.error;
  return v;
}

function quoteSheet(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

export interface EvaluateOptions {
  /** cells whose computed inputs are wanted (verify marks them) */
  inputsFor?: { sheet: number; row: number; col: number }[];
  progress?: (done: number) => void;
}

export function evaluateSaved(book: SavedWorkbook, options: EvaluateOptions = {}): Evaluated {
  const problems: Problem[] = [];
  const hints = new Map<string, [number, number]>();
  const computed = new Set<string>();
  const grids = book.sheets.map((sheet, s) => {
    const grid: RawCellContent[][] = Array.from({ length: sheet.rows }, () => new Array<RawCellContent>(sheet.cols).fill(null));
    const covered = new Set<string>();
    for (const cell of sheet.cells) {
      if (!cell.spill) continue;
      hints.set(cellKey(s, cell.row, cell.col), cell.spill);
      for (let r = 0; r < cell.spill[0]; r++) for (let c = 0; c < cell.spill[1]; c++) {
        covered.add(`${cell.row + r}:${cell.col + c}`);
        computed.add(cellKey(s, cell.row + r, cell.col + c));
      }
    }
    for (const cell of sheet.cells) {
      const where = `${sheet.name}!${a1(cell.row, cell.col)}`;
      if (cell.formula) {
        computed.add(cellKey(s, cell.row, cell.col));
        if (cell.formula.external) {
          problems.push({ kind: 'external', where, message: `refers to another workbook (${cell.saved}); its saved value is used, not recomputed` });
          grid[cell.row][cell.col] = rawValue(cell);
          continue;
        }
        for (const f of cell.formula.foreign) problems.push({ kind: 'foreign', where, message: `${f}: a function of another add-in, or one Excel saved without its name; not recomputed here` });
        grid[cell.row][cell.col] = `=${cell.formula.engine}`;
      } else if (!covered.has(`${cell.row}:${cell.col}`)) {
        grid[cell.row][cell.col] = rawValue(cell);
      }
    }
    return grid;
  });
  const names = book.names.map((n) => ({ name: n.name, expression: n.expression.startsWith('=') ? n.expression : `=${n.expression}`, scope: n.scope }));
  let evaluated = 0;
  const shapes = new Map<string, [number, number]>();
  const run = (namesUsed: typeof names): Omit<Evaluated, 'problems'> => withWorkbook({ sheets: book.sheets.map((s, i) => ({ name: s.name, cells: grids[i] })), names: namesUsed }, (hf) => {
    const values = book.sheets.map((_s, i) => hf.getSheetValues(i).map((row) => row.map(sheetValue)));
    const computedInputs = new Map<string, string[]>();
    for (const at of options.inputsFor ?? []) {
      const found: string[] = [];
      const add = (sheet: number, row: number, col: number): void => {
        if (!computed.has(cellKey(sheet, row, col))) return;
        const ref = a1(row, col);
        found.push(sheet === at.sheet ? ref : `${quoteSheet(book.sheets[sheet].name)}!${ref}`);
      };
      for (const p of hf.getCellPrecedents({ sheet: at.sheet, row: at.row, col: at.col })) {
        if ('start' in p) {
          for (let r = p.start.row; r <= p.end.row; r++) for (let c = p.start.col; c <= p.end.col; c++) add(p.start.sheet, r, c);
        } else if (p.sheet >= 0) add(p.sheet, p.row, p.col);
      }
      if (found.length > 0) computedInputs.set(cellKey(at.sheet, at.row, at.col), found);
    }
    return { values, shapes, computedInputs };
  }, {
    sizeHint: (sheet, row, col) => hints.get(cellKey(sheet, row, col)),
    evaluated: (_name, sheet, row, col, shape) => {
      if (shape) shapes.set(cellKey(sheet, row, col), shape);
      evaluated++;
      if (options.progress && evaluated % 1000 === 0) options.progress(evaluated);
    },
  });
  let result: Omit<Evaluated, 'problems'>;
  try {
    result = run(names);
  } catch (e) {
    // a defined name the engine refuses: drop the names one by one to find it, report it, go on
    const kept = names.filter((n) => {
      try {
        withWorkbook({ sheets: [{ name: 'Sheet1', cells: [] }], names: [{ ...n, scope: undefined }] }, () => undefined);
        return true;
      } catch (inner) {
        problems.push({ kind: 'name', where: n.name, message: `defined name not usable here (${(inner as Error).message})` });
        return false;
      }
    });
    if (kept.length === names.length) throw e;
    evaluated = 0;
    shapes.clear();
    result = run(kept);
  }
  book.sheets.forEach((sheet, s) => {
    for (const cell of sheet.cells) {
      if (!cell.formula || cell.formula.external) continue;
      const v = result.values[s]?.[cell.row]?.[cell.col];
      if (v && typeof v === 'object') {
        const where = `${sheet.name}!${a1(cell.row, cell.col)}`;
        if (v.error === '#ERROR!' && /pars/i.test(v.message)) problems.push({ kind: 'unparseable', where, message: `the formula cannot be parsed here: =${cell.saved}` });
        else if (v.error === '#CYCLE!') problems.push({ kind: 'circular', where, message: `circular reference: =${cell.saved}` });
        else if (v.error === '#NAME?' && !(cell.value && typeof cell.value === 'object' && cell.value.error === '#NAME?') && cell.formula.foreign.length === 0) {
          problems.push({ kind: 'unsupported', where, message: `${v.message || 'a function or name the engine does not know'}: =${cell.saved}` });
        }
      }
    }
  });
  return { ...result, problems };
}
