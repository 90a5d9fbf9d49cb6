/* global Excel */
import { address } from './blocks';
import type { Block } from './blocks';

/** Writes a block at the selected cell (Excel JavaScript API); returns the address written. */
export async function writeBlockAtSelection(build: (top: number, left: number) => Block): Promise<string> {
  return Excel.run(async (context) => {
    const selected = context.workbook.getSelectedRange();
    selected.load('rowIndex,columnIndex');
    await context.sync();
    const block = build(selected.rowIndex, selected.columnIndex);
    const rows = block.cells.length, cols = block.cells[0].length;
    const target = selected.worksheet.getRangeByIndexes(selected.rowIndex, selected.columnIndex, rows, cols);
    target.formulas = block.cells as (string | number)[][];
    target.format.autofitColumns();
    await context.sync();
    return `${address(selected.rowIndex, selected.columnIndex)}:${address(selected.rowIndex + rows - 1, selected.columnIndex + cols - 1)}`;
  });
}
