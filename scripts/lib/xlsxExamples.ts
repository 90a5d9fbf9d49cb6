// The bundled examples as Excel workbooks, generated from the same CSV source: formulas in the
// form Excel saves an add-in's functions, with their computed values, spills as dynamic arrays.
// Generated, not committed: saved values follow the catalogue, and a binary copy would go stale
// (and be unreviewable in a diff) on every catalogue change.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'fs';
import { basename, join } from 'path';
import { csvToSaved, toWriteWorkbook } from './xlsxBook';
import { evaluateSaved } from './xlsxEvaluate';
import { writeWorkbookBytes } from './xlsxWrite';

/** Writes `outDir/NAME.xlsx` for every `srcDir/NAME.csv`; returns the paths written. */
export async function writeExampleWorkbooks(srcDir = 'examples', outDir = join('examples', 'xlsx')): Promise<string[]> {
  mkdirSync(outDir, { recursive: true });
  const written: string[] = [];
  for (const file of readdirSync(srcDir).filter((f) => f.endsWith('.csv')).sort()) {
    const name = basename(file, '.csv');
    const book = csvToSaved(readFileSync(join(srcDir, file), 'utf8'), name.slice(0, 31));
    const path = join(outDir, `${name}.xlsx`);
    writeFileSync(path, await writeWorkbookBytes(toWriteWorkbook(book, evaluateSaved(book))));
    written.push(path);
  }
  return written;
}
