import { buildContents, prepareProblem, shiftConstants, solve } from '../src/engine';
import type { MixtureRow } from '../src/engine';
import { ASSUMED_PKA_HALF_WIDTH, ASSUMED_PKW_HALF_WIDTH, uncertaintyBudget } from '../src/functions/uncertainty';

// Mixtures of our own (no published budget exists for them): amounts, the ± limits a lab might state, a volume.
export type Case = [string, string[], number[], string[], number, number, number[], number, number];
export const CASES: Case[] = [
  // name, reagents, amounts, units, volume L, temperature °C, amount ± limits, volume ±, temperature ±
  ['phosphate 1:1', ['KH2PO4', 'Na2HPO4'], [3.4, 3.55], ['g', 'g'], 1, 25, [0.01, 0.01], 0.002, 0.5],
  ['acetate + NaOH', ['acetic acid', 'NaOH'], [6.0, 2.0], ['g', 'g'], 1, 25, [0.05, 0.02], 0.004, 1],
  ['Tris + HCl', ['Tris', '1 M HCl'], [12.11, 50], ['g', 'mL'], 1, 20, [0.02, 0.1], 0.002, 1],
  ['citrate', ['citric acid monohydrate', 'trisodium citrate dihydrate'], [2.1, 2.94], ['g', 'g'], 0.5, 25, [0.005, 0.005], 0.001, 0.5],
  ['HEPES + NaOH', ['HEPES', 'NaOH'], [11.9, 0.8], ['g', 'g'], 1, 37, [0.02, 0.01], 0.003, 0.5],
  ['borate', ['boric acid', 'NaOH'], [1.24, 0.4], ['g', 'g'], 1, 25, [0.005, 0.005], 0.002, 1],
  ['TAPS + NaOH', ['TAPS', 'NaOH'], [12.2, 1.0], ['g', 'g'], 1, 25, [0.02, 0.01], 0.002, 1],
  ['bicarbonate', ['sodium bicarbonate', 'sodium carbonate'], [0.84, 1.06], ['g', 'g'], 1, 25, [0.005, 0.005], 0.002, 1],
  ['MES + NaCl', ['MES', 'NaOH', 'NaCl'], [9.76, 0.6, 8.8], ['g', 'g', 'g'], 1, 25, [0.02, 0.01, 0.05], 0.002, 0.5],
  ['succinate by concentration', ['succinic acid', 'NaOH'], [20, 25], ['mM', 'mM'], 1, 25, [0.1, 0.1], 0.002, 1],
];

/** mulberry32: a small seeded generator, so the Monte Carlo run is the same on every machine. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => { a = (a + 0x6d2b79f5) >>> 0; let t = a; t = Math.imul(t ^ (t >>> 15), t | 1); t ^= t + Math.imul(t ^ (t >>> 7), t | 61); return ((t ^ (t >>> 14)) >>> 0) / 4294967296; };
}

/**
 * JCGM 101:2008 Monte Carlo: every input drawn from its distribution (rectangular ± limits; a stated ± as a normal
 * standard deviation), each draw solved by the engine itself, u(pH) the standard deviation of the results.
 * The draws change A and ρw with temperature too, which the linear budget leaves out.
 */
export function monteCarlo(c: Case, draws: number, seed: number, model: 'davies' | 'sit' = 'davies'): number {
  const [, reagents, amounts, units, volumeL, temperatureC, amountTol, volumeTol, temperatureTol] = c;
  const budget = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, temperatureC, model, amountTol.map((t) => [t]), volumeTol, temperatureTol);
  const pKaLines = budget.lines.filter((l) => l.input.startsWith('pKa '));
  const random = rng(seed);
  const uniform = (half: number) => (2 * random() - 1) * half;
  const normal = (sd: number) => sd * Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  let sum = 0, sumSq = 0;
  for (let d = 0; d < draws; d++) {
    const rows: MixtureRow[] = reagents.map((reagent, i) => ({ reagent, amount: amounts[i] + uniform(amountTol[i]), unit: units[i], row: i + 1 }));
    const problem = prepareProblem(buildContents(rows, volumeL + uniform(volumeTol)), temperatureC + uniform(temperatureTol), model);
    let line = 0;
    const shifts = problem.systems.map((s) => s.system.steps.map(() => {
      const l = pKaLines[line++];
      return l.distribution.startsWith('normal') ? normal(l.u) : uniform(ASSUMED_PKA_HALF_WIDTH);
    }));
    shiftConstants(problem, shifts, uniform(ASSUMED_PKW_HALF_WIDTH));
    const pH = solve(problem).pH;
    sum += pH; sumSq += pH * pH;
  }
  const mean = sum / draws;
  return Math.sqrt((sumSq - draws * mean * mean) / (draws - 1));
}

/** The linear budget's u(pH) for a case. */
export function linearU(c: Case, model: 'davies' | 'sit' = 'davies'): number {
  const [, reagents, amounts, units, volumeL, temperatureC, amountTol, volumeTol, temperatureTol] = c;
  return uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, temperatureC, model, amountTol.map((t) => [t]), volumeTol, temperatureTol).combined;
}
