// Bench section: verify rate for a saved workbook of many Protic cells, and where the time goes.
import { mkdtempSync, statSync, writeFileSync } from 'fs';
import { tmpdir } from 'os';
import { join } from 'path';
import { performance } from 'perf_hooks';
import { csvToSaved, toWriteWorkbook } from '../lib/xlsxBook';
import { evaluateSaved } from '../lib/xlsxEvaluate';
import { writeWorkbookBytes } from '../lib/xlsxWrite';
import { verifyFile } from '../lib/xlsxVerify';
import { ph } from '../../src/functions/impl';

export interface XlsxBench { cells: number; fileMiB: number; peakRssMiB: number; seconds: Record<string, number>; cellsPerSecond: number; cellsPerCpuSecond: number; differing: number }

/**
 * A what-if workbook of `cells` PHMIX cells (every row its own NaCl, so no two calls are the
 * same), saved with its computed values, then verified from the file as a reviewer would.
 */
export async function benchXlsx(cells = Number(process.env.PROTIC_BENCH_XLSX_CELLS ?? 100000)): Promise<{ lines: string[]; results: XlsxBench }> {
  const rows = ['What-if,,,,KH2PO4,Na2HPO4,NaCl', ',,,,g,g,mM'];
  for (let i = 0; i < cells; i++) rows.push(`3.4,3.55,${(i * 0.005).toFixed(3)},"=PROTIC.PHMIX($E$1:$G$1,A${i + 3}:C${i + 3},$E$2:$G$2,1)"`);
  const book = csvToSaved(rows.join('\n') + '\n', 'what-if');
  const path = join(mkdtempSync(join(tmpdir(), 'protic-bench-xlsx-')), 'what-if.xlsx');
  writeFileSync(path, await writeWorkbookBytes(toWriteWorkbook(book, evaluateSaved(book))));
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const r = await verifyFile(path);
  const total = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  const seconds: Record<string, number> = { ...r.seconds, total };
  // the solves alone, outside the sheet: the same calls with amounts the cache has not seen
  const t1 = performance.now();
  for (let i = 0; i < cells; i++) ph([['KH2PO4', 'Na2HPO4', 'NaCl']], [[3.4, 3.55, i * 0.005 + 1e-7]], [['g', 'g', 'mM']], 1);
  seconds.solvesAlone = (performance.now() - t1) / 1000;
  const differing = r.cells.filter((c) => c.status !== 'agrees').length;
  const rate = r.cells.length / total;
  const results: XlsxBench = { cells: r.cells.length, fileMiB: statSync(path).size / 1048576, peakRssMiB: process.resourceUsage().maxRSS / 1024, seconds, cellsPerSecond: rate, cellsPerCpuSecond: r.cells.length / cpuSeconds, differing };
  const share = (k: string): string => `${k} ${seconds[k].toFixed(2)} s (${((100 * seconds[k]) / total).toFixed(0)} %)`;
  return {
    results,
    lines: [
      `verify: ${r.cells.length} PHMIX cells saved in a ${results.fileMiB.toFixed(1)} MiB .xlsx, verified from the file`,
      `  ${rate.toFixed(0)} cells/s (goal ≥ 2,000), ${total.toFixed(2)} s in all; ${results.cellsPerCpuSecond.toFixed(0)} cells per CPU second (the machine is shared); ${differing} cells not agreeing (expected 0); peak RSS ${results.peakRssMiB.toFixed(0)} MiB (this process, generation included)`,
      `  where the time goes: ${['read', 'evaluate', 'compare'].map(share).join(', ')}`,
      `  of evaluate, the ${cells} PHMIX calls themselves take ${seconds.solvesAlone.toFixed(2)} s when timed outside the sheet; the rest is HyperFormula building its dependency graph (a range vertex per row), and GC`,
      '  (read: unzip and ExcelJS parse of the cells; compare: the per-cell comparison and the report rows)',
    ],
  };
}

if (require.main === module) {
  benchXlsx().then(({ lines }) => process.stdout.write(lines.join('\n') + '\n'), (e: Error) => { process.stderr.write(`${e.message}\n`); process.exitCode = 1; });
}
