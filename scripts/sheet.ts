// npm run sheet -- FILE.csv [--messages]: evaluates a CSV of cells and Protic formulas in a
// real spreadsheet engine and prints the evaluated grid as CSV.
import { readFileSync } from 'fs';
import { csvField, parseCsv, typedCell } from './lib/csv';
import { evaluateSheet } from './lib/sheetEngine';
import type { SheetValue } from './lib/sheetEngine';
import { loadSystemsFile } from './lib/systemsFile';

function formatValue(v: SheetValue, messages: boolean): string {
  if (v === null) return '';
  if (typeof v === 'object') return messages ? `${v.error} ${v.message}` : v.error;
  if (typeof v === 'number') return String(v);
  return String(v);
}

export function runSheet(csvText: string, messages: boolean): string {
  const cells = parseCsv(csvText).map((row) => row.map(typedCell));
  const values = evaluateSheet(cells);
  return values.map((row) => row.map((v) => csvField(formatValue(v, messages))).join(',')).join('\n') + '\n';
}

function main(argv: string[]): number {
  const messages = argv.includes('--messages');
  const systemsAt = argv.indexOf('--systems');
  const files = argv.filter((a, i) => !a.startsWith('--') && argv[i - 1] !== '--systems');
  if (files.length !== 1) {
    process.stderr.write('usage: npm run sheet -- FILE.csv [--messages] [--systems FILE.json]\n');
    return 2;
  }
  if (systemsAt >= 0) {
    const problems = loadSystemsFile(argv[systemsAt + 1]);
    if (problems.length > 0) {
      process.stderr.write(`custom systems rejected:\n${problems.map((p) => `  ${p}`).join('\n')}\n`);
      return 1;
    }
  }
  process.stdout.write(runSheet(readFileSync(files[0], 'utf8'), messages));
  return 0;
}

if (require.main === module) {
  // a reader that stops early (| head) is not an error
  process.stdout.on('error', (error: NodeJS.ErrnoException) => { if (error.code === 'EPIPE') process.exit(0); else throw error; });
  process.exitCode = main(process.argv.slice(2));
}
