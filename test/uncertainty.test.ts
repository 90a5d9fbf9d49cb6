import { buildContents, prepareProblem, shiftConstants, solutionDensity, solve } from '../src/engine';
import * as impl from '../src/functions/impl';
import type { MixtureRow } from '../src/engine';
import { uncertaintyBudget } from '../src/functions/uncertainty';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { CASES } from './uncertaintyCases';

describe('UNCERTAINTY: one input', () => {
  test('HCl alone with a mass tolerance: u(pH) is that input\'s |sensitivity| × u, and the sensitivity is −1/(m ln 10) to first order', () => {
    // 0.3646 g HCl in 1 L ± 0.003 g: pH ≈ −log10(γ m/M); d pH/dm = −1/(m ln 10) (1 + d ln γ/d ln c), activity part < 3 % here
    const b = uncertaintyBudget([['HCl']], [[0.3646]], [['g']], 1, 25, 'ideal', [[0.003]], 0, 0);
    const amount = b.lines[0];
    expect(amount.u).toBeCloseTo(0.003 / Math.sqrt(3), 12);
    const others = b.lines.slice(1).reduce((s, l) => s + (l.sensitivity * l.u) ** 2, 0);
    expect(others).toBeLessThan(1e-16); // pKw does not matter at pH 2; no volume or temperature tolerance
    expect(Math.abs(b.combined / (Math.abs(amount.sensitivity) * amount.u) - 1)).toBeLessThan(1e-6);
    // ideal: pH = −log10(c/w), so besides −1/(m ln 10) the sensitivity has (d ln w/dm)/ln 10, w the kg of water per
    // litre, which the HCl's own volume lowers (1.9e-4 of the first term here)
    const molarMass = impl.molarMass('HCl');
    const lnW = (g: number): number => Math.log(solutionDensity([
      { part: 'H+', label: 'H⁺', charge: 1, concentrationM: g / molarMass, molarMassGPerMol: 1.008, organic: false },
      { part: 'Cl-', label: 'Cl⁻', charge: -1, concentrationM: g / molarMass, molarMassGPerMol: 35.45, organic: false }], 25).waterKgPerL);
    const viaDensity = (lnW(0.3646 * 1.001) - lnW(0.3646 * 0.999)) / (0.002 * 0.3646) / Math.LN10;
    expect(Math.abs(amount.sensitivity / (-1 / (0.3646 * Math.LN10) + viaDensity) - 1)).toBeLessThan(1e-6);
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

describe('UNCERTAINTY: the volume line with rows given as mass concentrations or normality', () => {
  // g/L, mg/mL, % w/v and N are concentrations of the final solution, like mol/L: the volume does not dilute them
  const cases: [string[], number[], string[]][] = [
    [['KH2PO4', 'Na2HPO4', 'NaCl'], [3.4, 3.55, 5], ['g/L', 'g/L', 'g']],
    [['KH2PO4', 'Na2HPO4', 'NaCl'], [3.4, 3.55, 0.5], ['g', 'g', '% w/v']],
    [['KH2PO4', 'Na2HPO4', 'NaCl'], [3.4, 3.55, 5], ['mg/mL', 'g', 'g']],
    [['acetic acid', 'NaOH'], [6, 0.05], ['g', 'N']],
  ];
  test.each(cases)('%j in %j %j: against a central difference of the full solve', (reagents, amounts, units) => {
    const rows = (): MixtureRow[] => reagents.map((reagent, i) => ({ reagent, amount: amounts[i], unit: units[i], row: i + 1 }));
    const at = (volumeL: number): number => solve(prepareProblem(buildContents(rows(), volumeL), 25, 'davies')).pH;
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), 1, 25, 'davies', null, 0.002, 0);
    const numeric = (at(1 + 1e-5) - at(1 - 1e-5)) / 2e-5;
    expect(Math.abs(b.lines.find((l) => l.input === 'final volume')!.sensitivity - numeric)).toBeLessThan(1e-6 * Math.max(1, Math.abs(numeric)));
  });
});

describe('UNCERTAINTY: where first order does not hold over a ± limit, the line and the combined u say so', () => {
  // each case's own departure, from full solves at the ends of the ± limit against the budget's sensitivity
  const cases: [string, string[], number[], string[], number, number[], string][] = [
    ['an unbuffered row at 0 (1 M HCl into saline)', ['NaCl', '1 M HCl'], [5.8, 0], ['g', 'mL'], 1, [0.01, 0.05], 'davies'],
    ['an equivalence point', ['0.1 M HCl', '0.1 M NaOH'], [500, 500], ['mL', 'mL'], 1.1, [0.5, 0.5], 'davies'],
    ['the equivalence point under sit', ['0.1 M HCl', '0.1 M NaOH'], [500, 500], ['mL', 'mL'], 1.1, [0.5, 0.5], 'sit'],
    ['a phosphate buffer', ['KH2PO4', 'Na2HPO4'], [3.4, 3.55], ['g', 'g'], 1, [0.01, 0.01], 'davies'],
    ['an acetate buffer under sit', ['acetic acid', 'NaOH', 'NaCl'], [6.0, 2.0, 58.44], ['g', 'g', 'g'], 1, [0.05, 0.02, 0.5], 'sit'],
  ];
  test.each(cases)('%s', (name, reagents, amounts, units, volumeL, tol, model) => {
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, 25, model, tol.map((t) => [t]), 0, 0);
    const at = (i: number, d: number) => solve(prepareProblem(buildContents(reagents.map((reagent, k) => ({ reagent, amount: amounts[k] + (k === i ? d : 0), unit: units[k], row: k + 1 })), volumeL), 25, model as 'davies' | 'sit')).pH;
    reagents.forEach((_r, i) => {
      const s = b.lines[i].sensitivity, a = tol[i];
      const ends = [at(i, a) - b.pH, ...(amounts[i] >= a ? [b.pH - at(i, -a)] : [])];
      const departure = Math.max(...ends.map((m) => Math.abs(m / (s * a) - 1)));
      expect([i, /not linear/.test(b.lines[i].note)]).toEqual([i, departure > 0.1 && Math.abs(s * a) >= 1e-4]);
    });
    expect(b.nonlinear.length > 0).toBe(b.lines.some((l) => /not linear/.test(l.note)));
    expect(b.nonlinear.length > 0).toBe(/equivalence|unbuffered/.test(name)); // the buffers are linear over their limits
  });
});

describe('UNCERTAINTY: a u(pH) that first order cannot carry is no number in its cell', () => {
  // 0.1 M HCl against 0.1 M NaOH at equivalence, ± 0.5 mL each: the first-order u is far off, so u and U are words
  const sheet = (tolerance: number) => evaluateSheet([
    ['0.1 M HCl', 500, 'mL', tolerance], ['0.1 M NaOH', 500, 'mL', tolerance],
    ['=PROTIC.UNCERTAINTY(A1:A2,B1:B2,C1:C2,1.1,25,"davies",D1:D2,0,0)'],
  ]);
  const cell = (v: unknown[][], name: string) => v.slice(2).find((r) => r[0] === name)!;
  test('at an equivalence point u(pH) and U are texts that give the first-order value and the reason, and a formula on them is an error', () => {
    const v = sheet(0.5);
    const b = uncertaintyBudget([['0.1 M HCl'], ['0.1 M NaOH']], [[500], [500]], [['mL'], ['mL']], 1.1, 25, 'davies', [[0.5], [0.5]], 0, 0);
    expect(b.nonlinear.length).toBeGreaterThan(0);
    const u = cell(v, 'combined standard uncertainty u(pH)')[1], U = cell(v, 'expanded uncertainty U (k = 2)')[1];
    expect(u).toBe(`not reliable: ${Number(b.combined.toPrecision(3))} by first order, but first order does not hold, or could not be checked, over the ± limit of ${b.nonlinear.join(', ')}; check by a Monte Carlo (JCGM 101) or narrow the tolerance`);
    expect(String(U)).toMatch(new RegExp(`^not reliable: ${Number((2 * b.combined).toPrecision(3))} by first order`));
    // a cell that doubles u, as a record might: not a number
    const offset = v.slice(2).findIndex((r) => r[0] === 'combined standard uncertainty u(pH)') + 1;
    const doubled = evaluateSheet([
      ['0.1 M HCl', 500, 'mL', 0.5], ['0.1 M NaOH', 500, 'mL', 0.5],
      [`=2*INDEX(PROTIC.UNCERTAINTY(A1:A2,B1:B2,C1:C2,1.1,25,"davies",D1:D2,0,0),${offset},2)`],
    ])[2][0];
    expect(typeof doubled).not.toBe('number');
  });

  test('the same mixture with tolerances first order carries (± 0.001 mL) keeps its numbers', () => {
    const v = sheet(0.001);
    const u = cell(v, 'combined standard uncertainty u(pH)')[1], U = cell(v, 'expanded uncertainty U (k = 2)')[1];
    expect(typeof u).toBe('number');
    expect(U).toBeCloseTo(2 * (u as number), 12);
  });
});

describe('UNCERTAINTY: first-order checks that cannot be made are said', () => {
  test('a ± limit larger than the amount, and ends the data refuse (HCl 10 mM ± 50,000 mM)', () => {
    const b = uncertaintyBudget([['HCl']], [[10]], [['mM']], 1, 25, 'davies', [[50000]], 0, 0);
    expect(b.lines[0].note).toContain('larger than the amount');
    expect(b.lines[0].note).toContain('could not be checked');
    expect(b.nonlinear).toEqual(['amount: HCl (row 1)']);
  });
});

describe('UNCERTAINTY: a row at amount 0, its density share in a small volume', () => {
  // one kg of sucrose against 1 mL: the density formula's step is 1 mmol/L of the row, not a fraction of one unit
  test('MgSO4 0 g beside 1 mM HCl: the density formula\'s kinks near 0 are not stepped across', () => {
    const b = uncertaintyBudget([['MgSO4'], ['HCl']], [[0], [1]], [['g'], ['mM']], 1, 25, 'davies', null, 0, 0);
    const at = (d: number) => solve(prepareProblem(buildContents([{ reagent: 'MgSO4', amount: d, unit: 'g', row: 1 }, { reagent: 'HCl', amount: 1, unit: 'mM', row: 2 }], 1), 25, 'davies')).pH;
    const h = 1e-6; // g: Richardson forward difference of the full solve
    expect(Math.abs(b.lines[0].sensitivity / ((4 * at(h) - at(2 * h) - 3 * at(0)) / (2 * h)) - 1)).toBeLessThan(1e-5);
  });

  test.each([[1e-3], [1e-4]])('sucrose 0 kg beside 1 mM HCl in %p L', (volumeL) => {
    const b = uncertaintyBudget([['sucrose'], ['HCl']], [[0], [1]], [['kg'], ['mM']], volumeL, 25, 'davies', null, 0, 0);
    const at = (d: number) => solve(prepareProblem(buildContents([{ reagent: 'sucrose', amount: d, unit: 'kg', row: 1 }, { reagent: 'HCl', amount: 1, unit: 'mM', row: 2 }], volumeL), 25, 'davies')).pH;
    const h = 1e-9 * volumeL * 1e3; // kg: Richardson forward difference of the full solve
    expect(Math.abs(b.lines[0].sensitivity / ((4 * at(h) - at(2 * h) - 3 * at(0)) / (2 * h)) - 1)).toBeLessThan(1e-5);
  });
});

describe('UNCERTAINTY: a row at amount 0', () => {
  // a batch record's pH-adjustment row at 0 ± its tolerance: the slope at 0 is the reagent's own, not a silent 0
  const solvePH = (amounts: number[]): number => solve(prepareProblem(buildContents(['KH2PO4', 'Na2HPO4', 'NaCl'].map((reagent, i) => ({ reagent, amount: amounts[i], unit: 'g', row: i + 1 })), 1), 25, 'davies')).pH;
  test.each([[[3.4, 0, 5.8], 1, 1e-6], [[3.4, 3.55, 0], 2, 1e-4]])('amounts %j: row %i against a forward difference of the full solve', (amounts, r, h) => {
    const b = uncertaintyBudget([['KH2PO4'], ['Na2HPO4'], ['NaCl']], amounts.map((a) => [a]), [['g'], ['g'], ['g']], 1, 25, 'davies', [[0.01], [0.01], [0.01]], 0, 0);
    const at = (d: number): number => solvePH(amounts.map((a, k) => (k === r ? d : a)));
    const numeric = (4 * at(h) - at(2 * h) - 3 * at(0)) / (2 * h); // Richardson-extrapolated forward difference, error of order h²
    expect(Math.abs(b.lines[r].sensitivity / numeric - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b.lines[r].sensitivity)).toBeGreaterThan(1e-3);
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
