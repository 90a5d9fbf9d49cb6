import { performance } from 'perf_hooks';
import * as impl from '../../src/functions/impl';
import { stock } from '../../src/functions/stock';

// A bill of materials of 10,000 rows (goal: under 0.5 s for one PHMIX over it): catalogue names,
// formulas, stocks, a STOCK handle and a pH-adjusted stock, each repeated, as a long batch record would.

export interface StockBench { rows: number; seconds: number; goalSeconds: number }

export function benchStock(): { figures: StockBench; lines: string[] } {
  const handle = stock([['NaCl'], ['KCl'], ['Na2HPO4'], ['KH2PO4']], [[80], [2], [14.2], [2.4]], 'g', 1, '10× PBS');
  const kinds: [string, number, string][] = [
    ['NaCl', 0.01, 'g'], ['Na2HPO4·7H2O', 0.002, 'g'], ['KH2PO4', 0.001, 'g'], ['1 M NaOH', 0.0005, 'mL'],
    [handle, 0.01, 'mL'], ['1 M Tris-HCl pH 8.0', 0.002, 'mL'], ['Tris', 0.001, 'g'], ['sodium acetate trihydrate', 0.001, 'g'],
  ];
  const rows = 10000;
  const reagents: string[][] = [], amounts: number[][] = [], units: string[][] = [];
  for (let i = 0; i < rows; i++) {
    const [r, a, u] = kinds[i % kinds.length];
    // amounts differ row by row, so no row is a cached repeat of the whole mixture
    reagents.push([r]); amounts.push([a * (1 + i * 1e-6)]); units.push([u]);
  }
  const t0 = performance.now();
  const pH = impl.ph(reagents, amounts, units, 1);
  const seconds = (performance.now() - t0) / 1000;
  if (!Number.isFinite(pH)) throw new Error('bill of materials did not solve');
  return {
    figures: { rows, seconds, goalSeconds: 0.5 },
    lines: [`bill of materials: one PHMIX over ${rows} rows (names, formulas, stocks, a STOCK handle, a pH stock): ${seconds.toFixed(3)} s (goal ≤ 0.5 s)`],
  };
}
