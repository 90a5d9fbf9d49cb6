// UNCERTAINTY's cost against one PHMIX solve (parse, contents, prepare, solve, uncached), same mixtures, same run.
import { performance } from 'perf_hooks';
import { buildContents, prepareProblem, solve } from '../../src/engine';
import { mixtureRows } from '../../src/functions/args';
import { uncertaintyBudget } from '../../src/functions/uncertainty';

const MIXTURES: [string, string[], number[], string[], number[]][] = [
  ['phosphate 1:1', ['KH2PO4', 'Na2HPO4'], [3.4, 3.55], ['g', 'g'], [0.01, 0.01]],
  ['citrate + NaOH', ['citric acid monohydrate', 'NaOH'], [21.01, 6.0], ['g', 'g'], [0.01, 0.01]],
  ['Tris + HCl + NaCl', ['Tris', '1 M HCl', 'NaCl'], [12.11, 50, 8.77], ['g', 'mL', 'g'], [0.01, 0.05, 0.01]],
  ['EDTA with a strong base', ['disodium EDTA dihydrate', 'NaOH'], [18.6, 2.0], ['g', 'g'], [0.01, 0.01]],
  // a stock written with a pH: its re-adjustment as the constants move, and its stated pH's line
  ['Tris-HCl pH 8.0 stock + NaCl', ['1 M Tris-HCl pH 8.0', 'NaCl'], [50, 8.77], ['mL', 'g'], [0.5, 0.01]],
];

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function timeUs(run: () => void): number {
  const batches: number[] = [];
  for (let b = 0; b < 30; b++) {
    const t0 = performance.now();
    for (let i = 0; i < 100; i++) run();
    batches.push(((performance.now() - t0) * 1000) / 100);
  }
  return median(batches);
}

export interface QaBench { lines: string[]; results: Record<string, { phmixUs: number; uncertaintyUs: number; ratio: number }>; firstStockBudget: { budgetUs: number; phmixUs: number }; targets: { uncertaintyWithin20xPhmix: boolean } }

export function qaBench(): QaBench {
  const results: QaBench['results'] = {};
  for (const [name, reagents, amounts, units, tol] of MIXTURES) {
    const R = reagents.map((r) => [r]), A = amounts.map((a) => [a]), U = units.map((u) => [u]), T = tol.map((t) => [t]);
    // warm up both paths first, as the other sections do: otherwise the first mixture pays the budget's compilation
    for (let i = 0; i < 2000; i++) { solve(prepareProblem(buildContents(mixtureRows(R, A, U), 1), 25, 'davies')); uncertaintyBudget(R, A, U, 1, 25, null, T, 0.002, 0.5); }
    const phmixUs = timeUs(() => { solve(prepareProblem(buildContents(mixtureRows(R, A, U), 1), 25, 'davies')); });
    const uncertaintyUs = timeUs(() => { uncertaintyBudget(R, A, U, 1, 25, null, T, 0.002, 0.5); });
    results[name] = { phmixUs, uncertaintyUs, ratio: uncertaintyUs / phmixUs };
  }
  // a stock's own partials and re-made titrants are worked out once per stock (stockReadjustment.ts), so the row above
  // pays them only on its first budget: what a first budget on a new stock costs beyond PHMIX on that stock
  let fresh = 0;
  const freshStock = (): string[][] => [[`1 M Tris-HCl pH ${(7.9 + 1e-7 * fresh++).toFixed(7)}`], ['NaCl']];
  const A = [[50], [8.77]], U = [['mL'], ['g']], T = [[0.5], [0.01]];
  const firstPhmixUs = timeUs(() => { solve(prepareProblem(buildContents(mixtureRows(freshStock(), A, U), 1), 25, 'davies')); });
  const firstBudgetUs = timeUs(() => { uncertaintyBudget(freshStock(), A, U, 1, 25, null, T, 0.002, 0.5); });
  const worst = Math.max(...Object.values(results).map((r) => r.ratio));
  return {
    results,
    firstStockBudget: { budgetUs: firstBudgetUs, phmixUs: firstPhmixUs },
    targets: { uncertaintyWithin20xPhmix: worst <= 20 },
    lines: [
      'UNCERTAINTY: one budget against one PHMIX solve (rows read, contents, prepare, solve; uncached), median of 30 batches of 100 after 2000 of each to warm up',
      ...Object.entries(results).map(([name, r]) => `  ${name.padEnd(28)} PHMIX ${r.phmixUs.toFixed(2)} µs  UNCERTAINTY ${r.uncertaintyUs.toFixed(2)} µs  ratio ${r.ratio.toFixed(1)}`),
      `  worst ratio ${worst.toFixed(1)} (target ≤ 20)`,
      `  a first budget on a new pH-adjusted stock (its partials and re-made titrants, then kept for that stock): ${firstBudgetUs.toFixed(1)} µs against PHMIX on it, stock made, ${firstPhmixUs.toFixed(1)} µs`,
    ],
  };
}

if (require.main === module) process.stdout.write(qaBench().lines.join('\n') + '\n');
