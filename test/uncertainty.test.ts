import { buildContents, prepareProblem, shiftConstants, solve } from '../src/engine';
import type { MixtureRow } from '../src/engine';
import { ASSUMED_PKA_HALF_WIDTH, ASSUMED_PKW_HALF_WIDTH, uncertaintyBudget } from '../src/functions/uncertainty';
import { evaluateSheet } from '../scripts/lib/sheetEngine';

// Mixtures of our own (no published budget exists for them): amounts, the ± limits a lab might state, a volume.
type Case = [string, string[], number[], string[], number, number, number[], number, number];
const CASES: Case[] = [
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
function monteCarlo(c: Case, draws: number, seed: number): number {
  const [, reagents, amounts, units, volumeL, temperatureC, amountTol, volumeTol, temperatureTol] = c;
  const budget = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, temperatureC, null, amountTol.map((t) => [t]), volumeTol, temperatureTol);
  const pKaLines = budget.lines.filter((l) => l.input.startsWith('pKa '));
  const random = rng(seed);
  const uniform = (half: number) => (2 * random() - 1) * half;
  const normal = (sd: number) => sd * Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  let sum = 0, sumSq = 0;
  for (let d = 0; d < draws; d++) {
    const rows: MixtureRow[] = reagents.map((reagent, i) => ({ reagent, amount: amounts[i] + uniform(amountTol[i]), unit: units[i], row: i + 1 }));
    const problem = prepareProblem(buildContents(rows, volumeL + uniform(volumeTol)), temperatureC + uniform(temperatureTol), 'davies');
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

describe('UNCERTAINTY: GUM budget against a JCGM 101 Monte Carlo', () => {
  test.each(CASES)('%s: linear u(pH) within 5 %% of 100,000 seeded draws', (...c) => {
    const [, reagents, amounts, units, volumeL, temperatureC, amountTol, volumeTol, temperatureTol] = c;
    const budget = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, temperatureC, null, amountTol.map((t) => [t]), volumeTol, temperatureTol);
    const mc = monteCarlo(c, 100_000, 20261201);
    expect(Math.abs(budget.combined / mc - 1)).toBeLessThan(0.05);
  });
});

describe('UNCERTAINTY: one input', () => {
  test('HCl alone with a mass tolerance: u(pH) is that input\'s |sensitivity| × u, and the sensitivity is −1/(m ln 10) to first order', () => {
    // 0.3646 g HCl in 1 L ± 0.003 g: pH ≈ −log10(γ m/M); d pH/dm = −1/(m ln 10) (1 + d ln γ/d ln c), activity part < 3 % here
    const b = uncertaintyBudget([['HCl']], [[0.3646]], [['g']], 1, 25, 'ideal', [[0.003]], 0, 0);
    const amount = b.lines[0];
    expect(amount.u).toBeCloseTo(0.003 / Math.sqrt(3), 12);
    const others = b.lines.slice(1).reduce((s, l) => s + (l.sensitivity * l.u) ** 2, 0);
    expect(others).toBeLessThan(1e-16); // pKw does not matter at pH 2; no volume or temperature tolerance
    expect(Math.abs(b.combined / (Math.abs(amount.sensitivity) * amount.u) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(amount.sensitivity / (-1 / (0.3646 * Math.LN10)) - 1)).toBeLessThan(1e-6);
  });

  test('through the sheet: the spill\'s last rows are u(pH) and U = 2u', () => {
    const v = evaluateSheet([
      ['KH2PO4', 3.4, 'g', 0.01], ['Na2HPO4', 3.55, 'g', 0.01],
      ['=PROTIC.UNCERTAINTY(A1:A2,B1:B2,C1:C2,1,25,"davies",D1:D2,0.002,0.5)'],
    ]);
    const rows = v.slice(2).filter((r) => typeof r[0] === 'string' && r[0] !== '');
    const u = rows.find((r) => r[0] === 'combined standard uncertainty u(pH)')![1] as number;
    const U = rows.find((r) => r[0] === 'expanded uncertainty U (k = 2)')![1] as number;
    expect(U).toBeCloseTo(2 * u, 12);
    const contributions = rows.filter((r) => typeof r[7] === 'number').map((r) => r[7] as number);
    expect(Math.hypot(...contributions)).toBeCloseTo(u, 12);
  });
});

describe('UNCERTAINTY: each implicit sensitivity against a central difference of the full solve', () => {
  // The code under test never differences the solve; here the solve is re-run at x ± h as an independent check.
  const solvePH = (reagents: string[], amounts: number[], units: string[], volumeL: number, temperatureC: number, shift?: (p: ReturnType<typeof prepareProblem>) => void) => {
    const rows: MixtureRow[] = reagents.map((reagent, i) => ({ reagent, amount: amounts[i], unit: units[i], row: i + 1 }));
    const problem = prepareProblem(buildContents(rows, volumeL), temperatureC, 'davies');
    shift?.(problem);
    return solve(problem).pH;
  };
  test.each(CASES)('%s', (...c) => {
    const [, reagents, amounts, units, volumeL, temperatureC, amountTol] = c;
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, temperatureC, null, amountTol.map((t) => [t]), 0, 0);
    const close = (analytic: number, numeric: number) => expect(Math.abs(analytic - numeric)).toBeLessThan(1e-5 * Math.max(1, Math.abs(numeric)) + 1e-7);
    amounts.forEach((a, i) => {
      const h = a * 1e-5;
      const up = [...amounts]; up[i] = a + h;
      const down = [...amounts]; down[i] = a - h;
      close(b.lines[i].sensitivity, (solvePH(reagents, up, units, volumeL, temperatureC) - solvePH(reagents, down, units, volumeL, temperatureC)) / (2 * h));
    });
    const vLine = b.lines.find((l) => l.input === 'final volume')!;
    const hv = volumeL * 1e-5;
    close(vLine.sensitivity, (solvePH(reagents, amounts, units, volumeL + hv, temperatureC) - solvePH(reagents, amounts, units, volumeL - hv, temperatureC)) / (2 * hv));
    const tLine = b.lines.find((l) => l.input === 'temperature')!;
    close(tLine.sensitivity, (solvePH(reagents, amounts, units, volumeL, temperatureC + 0.01) - solvePH(reagents, amounts, units, volumeL, temperatureC - 0.01)) / 0.02);
    const pKaLines = b.lines.filter((l) => l.input.startsWith('pKa '));
    let n = 0;
    const problem = prepareProblem(buildContents(reagents.map((reagent, i) => ({ reagent, amount: amounts[i], unit: units[i], row: i + 1 })), volumeL), temperatureC, 'davies');
    problem.systems.forEach((s, i) => s.system.steps.forEach((_, k) => {
      const shifted = (d: number) => solvePH(reagents, amounts, units, volumeL, temperatureC, (p) => shiftConstants(p, p.systems.map((_, j) => (j === i ? s.system.steps.map((__, m) => (m === k ? d : 0)) : [])), 0));
      close(pKaLines[n++].sensitivity, (shifted(1e-4) - shifted(-1e-4)) / 2e-4);
    }));
    const w = b.lines.find((l) => l.input === 'pKw')!;
    const kw = (d: number) => solvePH(reagents, amounts, units, volumeL, temperatureC, (p) => shiftConstants(p, [], d));
    close(w.sensitivity, (kw(1e-4) - kw(-1e-4)) / 2e-4);
  });
});
