/* global Excel */
import { address } from './blocks';
import type { Block } from './blocks';
import { Refusal } from './refusal';

// Writes a block at the selected cell without losing work: the whole block range (its spills' room
// included) is read first, and cells that hold anything are replaced only when the user says so.

/** The largest block the pane writes, cells (1001 table rows × a few columns); anything larger is refused unwritten. */
export const MAX_BLOCK_CELLS = 12000;

/** Asks the user whether to replace `count` non-empty cells in `range` (an A1 range); resolves true to go ahead. */
export type ConfirmReplace = (range: string, count: number) => Promise<boolean>;

export type WriteOutcome = { kind: 'written'; range: string; replaced: number } | { kind: 'cancelled'; range: string; count: number };

/** Cells of a read range that hold anything: a value, a formula, or text. */
export function nonEmptyCount(formulas: unknown[][]): number {
  return formulas.reduce((n, row) => n + row.filter((v) => v !== '' && v !== null && v !== undefined).length, 0);
}

function sameContents(a: unknown[][], b: unknown[][]): boolean {
  return a.length === b.length && a.every((row, i) => row.length === b[i].length && row.every((v, j) => v === b[i][j]));
}

/** Writes a block at the selected cell (Excel JavaScript API), asking before any non-empty cell is replaced. */
export async function writeBlockAtSelection(build: (top: number, left: number) => Block, confirmReplace: ConfirmReplace): Promise<WriteOutcome> {
  return Excel.run(async (context) => {
    const selected = context.workbook.getSelectedRange();
    selected.load('rowIndex,columnIndex');
    await context.sync();
    const block = build(selected.rowIndex, selected.columnIndex);
    const rows = block.cells.length, cols = Math.max(0, ...block.cells.map((r) => r.length));
    if (rows === 0 || cols === 0) throw new Refusal('Nothing to write.');
    if (rows * cols > MAX_BLOCK_CELLS) throw new Refusal(`That block would be ${rows} × ${cols} cells, more than ${MAX_BLOCK_CELLS}; nothing was written.`);
    if (block.cells.some((r) => r.length !== cols)) throw new Error('internal error: a block row of the wrong width; nothing was written.');
    const range = `${address(selected.rowIndex, selected.columnIndex)}:${address(selected.rowIndex + rows - 1, selected.columnIndex + cols - 1)}`;
    const target = selected.worksheet.getRangeByIndexes(selected.rowIndex, selected.columnIndex, rows, cols);
    target.load('formulas');
    await context.sync();
    const before = target.formulas as unknown[][];
    const count = nonEmptyCount(before);
    if (count > 0) {
      if (!(await confirmReplace(range, count))) return { kind: 'cancelled', range, count };
      // the sheet may have changed while the user decided: write only over what they saw
      target.load('formulas');
      await context.sync();
      if (!sameContents(before, target.formulas as unknown[][])) throw new Refusal(`${range} changed while the pane was asking; nothing was written. Insert again.`);
      // the user agreed to replace these cells, spills' room included, so a spill is not blocked by old contents
      target.clear('Contents');
    }
    // null cells are left as they are (a spill's room, padding): only the block's own cells are written
    target.formulas = block.cells as (string | number)[][];
    target.format.autofitColumns();
    await context.sync();
    return { kind: 'written', range, replaced: count };
  });
}
