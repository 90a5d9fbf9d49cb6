// npm run demo: the main job on the bundled examples. Evaluates each workbook in examples/
// in a real spreadsheet engine and prints it as a readable table.
import { readdirSync, readFileSync } from 'fs';
import { join } from 'path';
import { parseCsv, typedCell } from './lib/csv';
import { evaluateSheet } from './lib/sheetEngine';
import type { SheetValue } from './lib/sheetEngine';
import { writeExampleWorkbooks } from './lib/xlsxExamples';

function show(v: SheetValue): string {
  if (v === null || v === '') return '';
  if (typeof v === 'object') return `${v.error} ${v.message}`;
  if (typeof v === 'number') {
    if (v === 0) return '0';
    const a = Math.abs(v);
    return a >= 1e-3 && a < 1e6 ? String(Number(v.toPrecision(5))) : v.toExponential(3);
  }
  return String(v);
}

export function renderWorkbook(csvText: string): string {
  const values = evaluateSheet(parseCsv(csvText).map((row) => row.map(typedCell)));
  const rows = values.map((row) => row.map(show));
  const width = Math.max(...rows.map((r) => r.length));
  const used = Array.from({ length: width }, (_, c) => rows.some((r) => (r[c] ?? '') !== ''));
  const cols = used.map((u, c) => (u ? c : -1)).filter((c) => c >= 0);
  // the first row is the title; the widths come from the rest
  const widths = cols.map((c) => Math.min(60, Math.max(...rows.slice(1).map((r) => (r[c] ?? '').length))));
  const lines = [rows[0].filter((x) => x !== '').join(' '), '-'.repeat(Math.min(100, rows[0].join(' ').trim().length))];
  for (const r of rows.slice(1)) {
    if (r.every((x) => x === '')) { lines.push(''); continue; }
    lines.push(cols.map((c, i) => (r[c] ?? '').padEnd(widths[i])).join('  ').trimEnd());
  }
  return lines.join('\n');
}

async function main(): Promise<void> {
  const dir = 'examples';
  const files = readdirSync(dir).filter((f) => f.endsWith('.csv')).sort();
  for (const file of files) {
    process.stdout.write(`\n${file}\n${renderWorkbook(readFileSync(join(dir, file), 'utf8'))}\n`);
  }
  const workbooks = await writeExampleWorkbooks();
  process.stdout.write([
    '',
    'The same examples as Excel workbooks (formulas with their computed values, generated from the CSV files):',
    ...workbooks.map((w) => `  ${w}`),
    'Open them in Excel with Protic sideloaded, or check one outside Excel: npm run verify -- ' + workbooks[0],
  ].join('\n') + '\n');
  process.stdout.write([
    '',
    'Cautions: a calculated pH does not replace a measurement with a calibrated meter. Handle concentrated acids',
    'and bases as their safety data sheets say. Site procedures, local codes and licensed practice come first.',
    '',
  ].join('\n'));
}

if (require.main === module) main().catch((e: Error) => { process.stderr.write(`demo: ${e.message}\n`); process.exitCode = 1; });
