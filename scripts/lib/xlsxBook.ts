// Between the runner's forms: a CSV sheet as a workbook, and an evaluated workbook as the
// .xlsx to write (formulas with their computed values, spills at their computed size).
import { parseCsv, typedCell } from './csv';
import { readFormula, savedFormula } from './xlsxFormula';
import { cellKey } from './xlsxEvaluate';
import type { Evaluated } from './xlsxEvaluate';
import type { SavedCell, SavedWorkbook } from './xlsxRead';
import type { WriteCell, WriteWorkbook } from './xlsxWrite';

/** A CSV of typed cells (as the CSV runner reads it) as a one-sheet workbook with nothing saved yet. */
export function csvToSaved(csvText: string, sheetName: string): SavedWorkbook {
  const cells: SavedCell[] = [];
  let rows = 0, cols = 0;
  parseCsv(csvText).forEach((row, r) => row.forEach((text, c) => {
    const v = typedCell(text);
    if (v === null) return;
    const cell: SavedCell = { row: r, col: c, value: null };
    if (typeof v === 'string' && v.startsWith('=')) {
      cell.saved = v.slice(1);
      cell.formula = readFormula(cell.saved);
    } else cell.value = v;
    cells.push(cell);
    rows = Math.max(rows, r + 1);
    cols = Math.max(cols, c + 1);
  }));
  return { sheets: [{ name: sheetName, cells, rows, cols }], names: [], settings: [], externalLinks: [], forms: [] };
}

/** The evaluated workbook as cells to write: every formula kept (in its saved form) with its computed value. */
export function toWriteWorkbook(book: SavedWorkbook, evaluated: Evaluated, settings: { name: string; value: string }[] = []): WriteWorkbook {
  const sheets = book.sheets.map((sheet, s) => {
    const values = evaluated.values[s] ?? [];
    const cells: (WriteCell | null)[][] = values.map((row) => row.map((v) => (v === null || v === '' ? null : { value: v })));
    const at = (r: number, c: number): WriteCell | null => {
      while (cells.length <= r) cells.push([]);
      return cells[r][c] ?? null;
    };
    for (const cell of sheet.cells) {
      if (!cell.saved) continue;
      const value = at(cell.row, cell.col)?.value ?? null;
      const out: WriteCell = { value, saved: savedFormula(cell.saved) };
      // a typed PROTIC.NAME call is written as Excel writes one entered with the add-in loaded: a one-cell dynamic array at least
      const typed = cell.formula?.forms.includes('PROTIC.NAME as typed') && !cell.spill;
      const shape = evaluated.shapes.get(cellKey(s, cell.row, cell.col)) ?? cell.spill ?? (typed ? [1, 1] as [number, number] : undefined);
      if (shape) {
        out.spill = shape;
        out.dynamic = cell.spill ? cell.dynamic !== false : true;
      }
      cells[cell.row][cell.col] = out;
    }
    return { name: sheet.name, cells };
  });
  const kept = settings.length > 0 ? settings : book.settings.map((s) => ({ name: s.name, value: s.value }));
  return { sheets, names: book.names, settings: kept };
}
