// The sit model's cost: one solve under sit as a multiple of one Davies solve of the same mixture (goal ≤ 2×),
// and charge-balance evaluations per sit solve (goal ≤ 6), on prepared problems, alternating batches.
import { performance } from 'perf_hooks';
import { buildContents, prepareProblem, solve } from '../../src/engine';
import type { MixtureRow } from '../../src/engine';

const row = (reagent: string, amount: number, unit: string, n: number): MixtureRow => ({ reagent, amount, unit, row: n });
const CASES: Record<string, MixtureRow[]> = {
  'phosphate 50 mM, pH ≈ 7': [row('NaH2PO4', 2.4, 'g', 1), row('Na2HPO4', 4.26, 'g', 2)],
  'phosphate 50 mM + 0.5 M NaCl': [row('NaH2PO4', 2.4, 'g', 1), row('Na2HPO4', 4.26, 'g', 2), row('NaCl', 0.5, 'M', 3)],
  'phosphate 50 mM + 2 M NaCl': [row('NaH2PO4', 2.4, 'g', 1), row('Na2HPO4', 4.26, 'g', 2), row('NaCl', 2, 'M', 3)],
  'three-system mixture (phosphate, citrate, Tris, NaCl)': [row('KH2PO4', 1.36, 'g', 1), row('trisodium citrate dihydrate', 2.94, 'g', 2), row('Tris', 1.21, 'g', 3), row('NaCl', 8.77, 'g', 4)],
  '1.2 M ammonium sulfate + 50 mM phosphate': [row('ammonium sulfate', 1.2, 'M', 1), row('NaH2PO4', 2.4, 'g', 2), row('Na2HPO4', 4.26, 'g', 3)],
  'EDTA with a strong base': [row('disodium EDTA dihydrate', 18.6, 'g', 1), row('NaOH', 2.0, 'g', 2)],
};

function batchUs(run: () => void, perBatch: number): number {
  const t0 = performance.now();
  for (let i = 0; i < perBatch; i++) run();
  return ((performance.now() - t0) * 1000) / perBatch;
}

export interface SitFigure {
  case: string; daviesUs: number; sitUs: number; ratio: number; daviesEvaluations: number; sitEvaluations: number;
  /** prepare + solve of a fresh problem, as PHMIX does on a cache miss */
  daviesFreshUs: number; sitFreshUs: number; freshRatio: number;
}

/** Runs the sit benchmark; the fastest of 31 alternating batches each (interference only adds time). */
export function sitBench(): { lines: string[]; results: { figures: SitFigure[]; worstRatio: number; worstFreshRatio: number; meanSitEvaluations: number; sitWithin2x: boolean; sitEvaluationsAtMost6: boolean } } {
  const figures: SitFigure[] = Object.entries(CASES).map(([name, rows]) => {
    const contents = buildContents(rows, 1);
    const davies = prepareProblem(contents, 25, 'davies'), sit = prepareProblem(contents, 25, 'sit');
    // evaluations of a fresh problem (offsets start from zero, as on a cache miss)
    const d = solve(prepareProblem(contents, 25, 'davies')), s = solve(prepareProblem(contents, 25, 'sit'));
    const freshDavies = (): void => { solve(prepareProblem(contents, 25, 'davies')); };
    const freshSit = (): void => { solve(prepareProblem(contents, 25, 'sit')); };
    for (let i = 0; i < 500; i++) { solve(davies); solve(sit); freshDavies(); freshSit(); }
    let dUs = Infinity, sUs = Infinity, dFresh = Infinity, sFresh = Infinity;
    for (let b = 0; b < 31; b++) {
      dUs = Math.min(dUs, batchUs(() => solve(davies), 400));
      sUs = Math.min(sUs, batchUs(() => solve(sit), 400));
      dFresh = Math.min(dFresh, batchUs(freshDavies, 200));
      sFresh = Math.min(sFresh, batchUs(freshSit, 200));
    }
    return { case: name, daviesUs: dUs, sitUs: sUs, ratio: sUs / dUs, daviesEvaluations: d.evaluations, sitEvaluations: s.evaluations, daviesFreshUs: dFresh, sitFreshUs: sFresh, freshRatio: sFresh / dFresh };
  });
  const worstRatio = Math.max(...figures.map((f) => f.ratio));
  const worstFreshRatio = Math.max(...figures.map((f) => f.freshRatio));
  const meanSitEvaluations = figures.reduce((sum, f) => sum + f.sitEvaluations, 0) / figures.length;
  const lines = [
    'sit: one solve under sit as a multiple of one Davies solve of the same mixture (fastest of 31 alternating batches): re-solve of a prepared problem, and prepare + solve of a fresh one',
    ...figures.map((f) => `  ${f.case.padEnd(54)} re-solve ${f.sitUs.toFixed(2)} / ${f.daviesUs.toFixed(2)} µs = ${f.ratio.toFixed(2)}×  fresh ${f.sitFreshUs.toFixed(2)} / ${f.daviesFreshUs.toFixed(2)} µs = ${f.freshRatio.toFixed(2)}×  evaluations sit ${f.sitEvaluations}, davies ${f.daviesEvaluations}`),
    `  worst ratio: re-solve ${worstRatio.toFixed(2)}×, fresh ${worstFreshRatio.toFixed(2)}× (goal ≤ 2×); mean evaluations per fresh sit solve ${meanSitEvaluations.toFixed(2)} (goal ≤ 6)`,
  ];
  return { lines, results: { figures, worstRatio, worstFreshRatio, meanSitEvaluations, sitWithin2x: Math.max(worstRatio, worstFreshRatio) <= 2, sitEvaluationsAtMost6: meanSitEvaluations <= 6 } };
}

if (require.main === module) process.stdout.write(sitBench().lines.join('\n') + '\n');
