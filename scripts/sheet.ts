// npm run sheet -- FILE.csv|FILE.xlsx [--sheet NAME] [--messages] [--systems FILE.json]
//   [--out FILE.xlsx|FILE.csv] [--max-size MB]: evaluates cells and Protic formulas in a real
// spreadsheet engine and prints the evaluated grid as CSV, or writes it. A workbook is read
// whole: every sheet, cross-sheet references, defined names; `--out FILE.xlsx` writes the
// formulas with their computed values so the file opens in Excel with results in place.
import { readFileSync, writeFileSync } from 'fs';
import { basename } from 'path';
import { csvField, parseCsv, typedCell } from './lib/csv';
import { evaluateSheet } from './lib/sheetEngine';
import type { SheetValue } from './lib/sheetEngine';
import { loadSystemsFile } from './lib/systemsFile';
import { csvToSaved, toWriteWorkbook } from './lib/xlsxBook';
import { evaluateSaved } from './lib/xlsxEvaluate';
import type { Evaluated } from './lib/xlsxEvaluate';
import { readWorkbookFile } from './lib/xlsxRead';
import { failureExit, runCommand } from './lib/cli';
import type { SavedWorkbook } from './lib/xlsxRead';
import { writeWorkbookBytes } from './lib/xlsxWrite';
import { SETTINGS_KEY, loadCustomSystems } from './lib/xlsxVerify';

function formatValue(v: SheetValue, messages: boolean): string {
  if (v === null) return '';
  if (typeof v === 'object') return messages ? `${v.error} ${v.message}` : v.error;
  if (typeof v === 'number') return String(v);
  return String(v);
}

/** An evaluated grid as CSV text. */
export function gridCsv(values: SheetValue[][], messages: boolean): string {
  return values.map((row) => row.map((v) => csvField(formatValue(v, messages))).join(',')).join('\n') + '\n';
}

export function runSheet(csvText: string, messages: boolean): string {
  const cells = parseCsv(csvText).map((row) => row.map(typedCell));
  return gridCsv(evaluateSheet(cells), messages);
}

export interface SheetRun { book: SavedWorkbook; evaluated: Evaluated; systems: string }

/** Reads (an .xlsx, or a CSV as a one-sheet workbook) and evaluates every sheet. */
export async function runWorkbook(path: string, systemsFile: string | undefined, maxMB?: number): Promise<SheetRun> {
  const book = /\.csv$/i.test(path) ? csvToSaved(readFileSync(path, 'utf8'), basename(path).replace(/\.csv$/i, '').slice(0, 31)) : await readWorkbookFile(path, { maxMB });
  const problems: SheetRun['evaluated']['problems'] = [];
  const systems = loadCustomSystems(book, systemsFile, problems);
  const evaluated = evaluateSaved(book);
  evaluated.problems.unshift(...problems, ...book.externalLinks.map((l) => ({ kind: 'external' as const, where: 'workbook', message: `links to another workbook: ${l}` })));
  return { book, evaluated, systems };
}

/** The printed form: one sheet as plain CSV; several, each under a `# sheet NAME` line. */
export function workbookCsv(run: SheetRun, sheet: string | undefined, messages: boolean): string {
  const chosen = run.book.sheets.map((s, i) => ({ name: s.name, i })).filter((s) => sheet === undefined || s.name === sheet);
  if (chosen.length === 1) return gridCsv(run.evaluated.values[chosen[0].i], messages);
  return chosen.map((s) => `# sheet ${s.name}\n${gridCsv(run.evaluated.values[s.i], messages)}`).join('\n');
}

const USAGE = 'usage: npm run sheet -- FILE.csv|FILE.xlsx [--sheet NAME] [--messages] [--systems FILE.json] [--out FILE.xlsx|FILE.csv] [--max-size MB]\n';

export async function main(argv: string[], out: (s: string) => void = (s) => process.stdout.write(s), err: (s: string) => void = (s) => process.stderr.write(s)): Promise<number> {
  const valued = ['--systems', '--sheet', '--out', '--max-size'];
  const value = (name: string): string | undefined => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);
  const messages = argv.includes('--messages');
  const files = argv.filter((a, i) => !a.startsWith('--') && !valued.includes(argv[i - 1]));
  const unknown = argv.filter((a) => a.startsWith('--') && !valued.includes(a) && a !== '--messages');
  if (files.length !== 1 || unknown.length > 0) { err(USAGE); return 2; }
  const outPath = value('--out');
  if (outPath !== undefined && !/\.(xlsx|csv)$/i.test(outPath)) { err('--out: FILE.xlsx or FILE.csv\n'); return 2; }
  const sheet = value('--sheet');
  const isCsv = /\.csv$/i.test(files[0]);
  if (isCsv && !outPath && sheet === undefined) {
    // the CSV runner as it always was
    const systemsFile = value('--systems');
    if (systemsFile !== undefined) {
      const problems = loadSystemsFile(systemsFile);
      if (problems.length > 0) { err(`custom systems rejected:\n${problems.map((p) => `  ${p}`).join('\n')}\n`); return 1; }
    }
    try {
      out(runSheet(readFileSync(files[0], 'utf8'), messages));
    } catch (e) {
      err(`sheet: ${files[0]}: cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})\n`);
      return 2;
    }
    return 0;
  }
  try {
    const maxSize = value('--max-size');
    const run = await runWorkbook(files[0], value('--systems'), maxSize === undefined ? undefined : Number(maxSize));
    if (sheet !== undefined && !run.book.sheets.some((s) => s.name === sheet)) {
      err(`sheet: no sheet named "${sheet}" (sheets: ${run.book.sheets.map((s) => s.name).join(', ')})\n`);
      return 2;
    }
    if (outPath && /\.xlsx$/i.test(outPath)) {
      // custom systems from --systems travel with the written workbook, where the pane finds them
      const systemsFile = value('--systems');
      const settings = systemsFile !== undefined && !run.book.settings.some((x) => x.name === SETTINGS_KEY)
        ? [{ name: SETTINGS_KEY, value: JSON.stringify(JSON.stringify(JSON.parse(readFileSync(systemsFile, 'utf8')))) }] : [];
      writeFileSync(outPath, await writeWorkbookBytes(toWriteWorkbook(run.book, run.evaluated, settings)));
      err(`wrote ${outPath}: ${run.book.sheets.length} sheet(s), formulas with their computed values\n`);
    } else if (outPath) {
      if (sheet === undefined && run.book.sheets.length > 1) {
        err(`sheet: a CSV holds one sheet; name it with --sheet (sheets: ${run.book.sheets.map((s) => s.name).join(', ')})\n`);
        return 2;
      }
      writeFileSync(outPath, workbookCsv(run, sheet, messages));
    } else {
      out(workbookCsv(run, sheet, messages));
    }
    for (const p of run.evaluated.problems) err(`cannot evaluate ${p.where}: ${p.message}\n`);
    return run.evaluated.problems.length > 0 ? 2 : 0;
  } catch (e) {
    return failureExit('sheet', files[0], e, err);
  }
}

if (require.main === module) runCommand('sheet', (argv) => main(argv));
