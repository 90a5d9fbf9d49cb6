import { readdirSync, readFileSync } from 'fs';
import { join } from 'path';
import * as activity from '../src/engine/activity';
import {
  ProticError, buildContents, iterateActivity, parseReagentSpec, prepareProblem, solve, solveFixedActivity, solveInverse, titrantForTarget, withTitrant,
} from '../src/engine';
import { prepareTarget, reagentVector } from '../src/engine/linearTarget';
import * as impl from '../src/functions/impl';
import { A, HOSTILE, R } from '../scripts/lib/hostileCases';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { saltDose } from '../src/functions/saltdose';
import type { SheetValue } from '../scripts/lib/sheetEngine';

// Every amount TITRANT, RECIPE and SALTDOSE return is fed back here through the spreadsheet engine
// (PHMIX or IONICSTRENGTH reading the cell the inverse function filled), or the cell is a coded #N/A.

type Row = [string, number, string];
const PHOSPHATE: Row[] = [['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g']];

interface FedBack { amount: SheetValue; check: SheetValue }

/** The mixture rows, a titrant row whose amount is the TITRANT cell, and PHMIX of all of them below. */
function titrantSheet(rows: Row[], volumeL: number, titrant: string, targetPH: number, extra = '', unit = 'g', checkVolume = ''): FedBack {
  const n = rows.length;
  const formula = `=PROTIC.TITRANT(${targetPH},A1:A${n},B1:B${n},C1:C${n},${volumeL},"${titrant}"${extra})`;
  const cells: (string | number | null)[][] = [...rows.map((r) => [...r]), [titrant, formula, unit]];
  cells.push([`=PROTIC.PHMIX(A1:A${n + 1},B1:B${n + 1},C1:C${n + 1},${checkVolume || volumeL}${extra.split(',').slice(1, 3).map((x) => `,${x}`).join('')})`]);
  const v = evaluateSheet(cells);
  return { amount: v[n][1], check: v[n + 1][0] };
}

const errorOf = (v: SheetValue): { error: string; message: string } => v as { error: string; message: string };

describe('the issue\'s TITRANT examples: the amount that reaches the target, fed back through PHMIX, or #N/A with the reachable range', () => {
  test.each([
    // [target, grams the old code gave and the pH they gave]
    [8.626, '4.839 g gave pH 7.073'], [8.3, '193 g gave 8.79'], [7.05, '16.2 g'], [7.1, '10.2 g'],
  ])('phosphate sheet, Na2HPO4·7H2O to pH %d (before: %s)', (target) => {
    const r = titrantSheet(PHOSPHATE, 1, 'Na2HPO4·7H2O', target);
    expect(typeof r.amount).toBe('number');
    expect(Math.abs((r.check as number) - target)).toBeLessThanOrEqual(1e-6);
  });

  test('the four phosphate amounts grow with the target (7.05 < 7.1 < 8.3 < 8.626)', () => {
    const grams = [7.05, 7.1, 8.3, 8.626].map((t) => impl.titrant(t, PHOSPHATE.map((r) => [r[0]]), PHOSPHATE.map((r) => [r[1]]), 'g', 1, 'Na2HPO4·7H2O'));
    for (let i = 1; i < grams.length; i++) expect(grams[i]).toBeGreaterThan(grams[i - 1]);
  });

  test.each([
    ['7.88 g Tris hydrochloride, sodium acetate trihydrate to pH 7.772 (before: 28.8 g → 6.733)', [['Tris hydrochloride', 7.88, 'g']] as Row[], 'sodium acetate trihydrate', 7.772],
    ['4.2 g citric acid monohydrate, KH2PO4 to pH 4.455 (before: 0.0698 g → 2.465)', [['citric acid monohydrate', 4.2, 'g']] as Row[], 'KH2PO4', 4.455],
    ['phosphate sheet, solid NaOH to pH 15 (before: 7.956 g → 12.96)', PHOSPHATE, 'NaOH', 15],
    ['phosphate sheet, solid NaOH to pH 14.6 (before: 115.9 g)', PHOSPHATE, 'NaOH', 14.6],
  ])('%s', (_label, rows, titrant, target) => {
    const r = titrantSheet(rows, 1, titrant, target);
    expect(typeof r.amount).toBe('number');
    expect(Math.abs((r.check as number) - target)).toBeLessThanOrEqual(1e-6);
  });

  test('solid NaOH: pH 15 takes more than pH 14.6 (the old answers were not monotonic)', () => {
    const at = (t: number): number => impl.titrant(t, [['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 'NaOH');
    expect(at(15)).toBeGreaterThan(at(14.6));
  });

  test.each([
    // Tris 6.057 g in 0.8 L, trisodium citrate dihydrate to pH 10.83; before: bates-guggenheim 392,784 g, ideal 3,667 g, davies 6.6e-16 g
    // the search now stops where the citrate would fill the litre by itself (the density), below the 20 mol/L cap:
    // with pure water's density the ranges were 10.43 to 10.43 and 10.43 to 10.68
    ['bates-guggenheim', /reachable pH 10\.43\d* to 10\.59\d*\./],
    ['ideal', /reachable pH 10\.43\d* to 10\.75\d*\./],
  ])('Tris in 0.8 L, trisodium citrate dihydrate to pH 10.83, %s: #N/A naming the reachable range', (model, range) => {
    const r = titrantSheet([['Tris', 6.057, 'g']], 0.8, 'trisodium citrate dihydrate', 10.83, `,25,"${model}"`);
    expect(errorOf(r.amount).error).toBe('#N/A');
    expect(errorOf(r.amount).message).toMatch(/trisodium citrate dihydrate can reach with as much as the solution can hold \(its solutes' volume\) and the activity model converges for/);
    expect(errorOf(r.amount).message).toMatch(range);
  });

  test('Tris in 0.8 L, trisodium citrate dihydrate to pH 10.83, davies: an amount that reaches it (before: 6.6e-16 g, pH stayed 10.43)', () => {
    const r = titrantSheet([['Tris', 6.057, 'g']], 0.8, 'trisodium citrate dihydrate', 10.83, ',25,"davies"');
    expect(r.amount as number).toBeGreaterThan(1);
    expect(Math.abs((r.check as number) - 10.83)).toBeLessThanOrEqual(1e-6);
  });

  test('a target the titrant drives away from is #N/A with the reachable range', () => {
    const r = titrantSheet(PHOSPHATE, 1, '1 M NaOH', 5, '', 'mL', '');
    expect(errorOf(r.amount).error).toBe('#N/A');
    expect(errorOf(r.amount).message).toMatch(/starts at pH 6\.88 and 1 M sodium hydroxide raises it.*reachable pH 6\.8758 to 1\d\.\d+/);
  });
});

describe('the issue\'s RECIPE examples', () => {
  test('Na2HPO4/Na3PO4 at pH 13, 0.5 M, 37 °C (before: 33.55 g + 43.23 g gave 12.31): #N/A, the forms reach pH 9.51 to 12.97', () => {
    const v = evaluateSheet([['=PROTIC.RECIPE("Na2HPO4","Na3PO4",13,0.5,1,37)']]);
    expect(errorOf(v[0][0]).error).toBe('#N/A');
    expect(errorOf(v[0][0]).message).toMatch(/alone, disodium hydrogen phosphate gives pH 9\.51 and trisodium phosphate gives pH 12\.97; reachable pH 9\.50\d* to 12\.9\d*\./);
  });

  test('Na2HPO4/Na3PO4 at pH 12.9, 0.5 M, 37 °C: the amounts, fed back through PHMIX', () => {
    const v = evaluateSheet([
      ['=PROTIC.RECIPE("Na2HPO4","Na3PO4",12.9,0.5,1,37)', null, null],
      [null, null, null],
      ['=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1,37)', null, null],
    ]);
    expect(v[0][2]).toBe('g');
    expect(Math.abs((v[2][0] as number) - 12.9)).toBeLessThanOrEqual(1e-6);
  });

  test('0.1 M KH2PO4 and K2HPO4 stocks for 0.5 M in 1 L (before: 2,233 mL + 2,676 mL into 1 L): refused with the most concentrated buffer they make', () => {
    const v = evaluateSheet([['=PROTIC.RECIPE("0.1 M KH2PO4","0.1 M K2HPO4",7,0.5,1)']]);
    expect(errorOf(v[0][0]).error).toBe('#N/A');
    expect(errorOf(v[0][0]).message).toMatch(/the stocks and liquids take 5000 mL, more than the final 1 L.*at most 0\.1 mol\/L with these stocks at pH 7/);
  });

  test('the most concentrated buffer a refusal quotes is one the stocks make, and a little more is refused', () => {
    const message = (c: number): string => { try { impl.recipe('1 M HCl', 'Tris', 8, c, 1); return 'fits'; } catch (e) { return (e as Error).message; } };
    const quoted = Number(/at most ([\d.]+) mol\/L/.exec(message(2))![1]);
    expect(quoted).toBeGreaterThan(1.5);
    const lines = impl.recipe('1 M HCl', 'Tris', 8, quoted, 1) as (string | number)[][];
    expect(lines[0][1] as number).toBeLessThanOrEqual(1000);
    expect(lines[0][1] as number).toBeGreaterThan(999.5);
    expect(message(quoted * 1.001)).toMatch(/at most 1\.69\d* mol\/L/); // 1.67 with pure water's density
  });

  test('stocks that fit: mL of each, fed back through PHMIX', () => {
    const v = evaluateSheet([
      ['=PROTIC.RECIPE("1 M KH2PO4","1 M K2HPO4",7,0.1,1)', null, null],
      [null, null, null],
      ['=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1)', null, null],
    ]);
    expect([v[0][2], v[1][2]]).toEqual(['mL', 'mL']);
    expect((v[0][1] as number) + (v[1][1] as number)).toBeCloseTo(100, 9); // 0.1 mol of phosphate from 1 M stocks
    expect(Math.abs((v[2][0] as number) - 7)).toBeLessThanOrEqual(1e-6);
  });

  test('a liquid as sold is given in mL, from its density and assay (a 37 % HCl "g" was read as mL)', () => {
    const v = evaluateSheet([
      ['=PROTIC.RECIPE("hydrochloric acid 37%","Tris",8,0.05,1)', null, null],
      [null, null, null],
      ['=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1)', null, null],
    ]);
    expect([v[0][0], v[0][2], v[1][0], v[1][2]]).toEqual(['hydrochloric acid 37%', 'mL', 'Tris', 'g']);
    expect(Math.abs((v[2][0] as number) - 8)).toBeLessThanOrEqual(1e-6);
  });

  test('a 1×1 range as a form (before: "name.trim is not a function")', () => {
    const v = evaluateSheet([['NaH2PO4·H2O', 'Na2HPO4·7H2O'], ['=PROTIC.RECIPE(A1:A1,B1:B1,7.4,0.1,1)', null, null], [null, null, null]]);
    expect(v[1][0]).toBe('NaH2PO4·H2O');
    expect(v[2][0]).toBe('Na2HPO4·7H2O');
    expect(v[1][2]).toBe('g');
    expect(v[1][1] as number).toBeGreaterThan(0);
  });
});

describe('TITRANT finalVolume: adjust, then make up to volume', () => {
  test('fed back through PHMIX at the final volume, and different from the undiluted answer', () => {
    const made = titrantSheet(PHOSPHATE, 0.8, '1 M NaOH', 7.4, ',25,"davies","mL",1', 'mL', '1');
    expect(Math.abs((made.check as number) - 7.4)).toBeLessThanOrEqual(1e-6);
    const plain = titrantSheet(PHOSPHATE, 0.8, '1 M NaOH', 7.4, '', 'mL', '');
    expect(made.amount).not.toBeCloseTo(plain.amount as number, 3);
  });

  test('without it, the titrant\'s own volume adds (the documented behaviour)', () => {
    const mL = impl.titrant(7.4, [['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, '1 M NaOH');
    expect(impl.ph([['KH2PO4'], ['Na2HPO4'], ['1 M NaOH']], [[3.4], [3.55], [mL]], [['g'], ['g'], ['mL']], 1 + mL / 1000)).toBeCloseTo(7.4, 6);
  });

  test('a final volume smaller than the mixture is refused; one with no room left for a stock is #N/A', () => {
    expect(() => impl.titrant(7.4, [['KH2PO4']], [[3.4]], 'g', 1, '1 M NaOH', 25, 'davies', 'mL', 0.5)).toThrow(/finalVolume: value not usable/);
    try {
      impl.titrant(7.4, [['KH2PO4']], [[3.4]], 'g', 1, '1 M NaOH', 25, 'davies', 'mL', 1);
      throw new Error('expected a failure');
    } catch (e) {
      expect((e as ProticError).failure.code).toBe('unreachable_target');
    }
  });
});

describe('SALTDOSE: the salt that brings the ionic strength to a target', () => {
  function saltSheet(target: number, salt: string, unit: string): { amount: SheetValue; check: SheetValue } {
    const v = evaluateSheet([
      ['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'],
      [salt, `=PROTIC.SALTDOSE(${target},"${salt}",A1:A2,B1:B2,C1:C2,1)`, unit],
      ['=PROTIC.IONICSTRENGTH(A1:A3,B1:B3,C1:C3,1)'],
    ]);
    return { amount: v[2][1], check: v[3][0] };
  }
  test.each([[0.15, 'NaCl', 'g'], [0.5, 'Na2SO4', 'g'], [1.5, '4 M NaCl', 'mL'], [0.3, 'magnesium chloride hexahydrate', 'g']])('to %d mol/L with %s, fed back through IONICSTRENGTH within 1e-9', (target, salt, unit) => {
    const r = saltSheet(target, salt, unit);
    expect(r.amount as number).toBeGreaterThan(0);
    expect(Math.abs((r.check as number) - target)).toBeLessThanOrEqual(1e-9 * target);
  });
  test('a target below the mixture\'s own ionic strength is #N/A naming it', () => {
    const r = saltSheet(0.05, 'NaCl', 'g');
    expect(errorOf(r.amount).error).toBe('#N/A');
    expect(errorOf(r.amount).message).toMatch(/ionic strength is already 0\.1 mol\/L before any sodium chloride; reachable ionic strength 0\.1\d* to \d+\.?\d* mol\/L/);
  });
  test('a stock that cannot reach the target within the volume is #N/A with the reachable range', () => {
    const r = saltSheet(4.5, '4 M NaCl', 'mL');
    expect(errorOf(r.amount).error).toBe('#N/A');
    expect(errorOf(r.amount).message).toMatch(/4 M sodium chloride takes it only to \d\.\d+ mol\/L with as much as fits in the volume; reachable ionic strength 0\.1\d* to/);
  });
});

describe('no loop in the engine returns its last iterate', () => {
  const contents = buildContents([{ reagent: 'KH2PO4', amount: 3.4, unit: 'g', row: 1 }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g', row: 2 }], 1);
  const codeOf = (run: () => unknown): string => {
    try { run(); } catch (e) { if (e instanceof ProticError) return e.failure.code; throw e; }
    return 'no failure';
  };

  test('iterateActivity: an activity correction that alternates (175 mol, then 5.8e-25 mol, as the issue found) is no_convergence', () => {
    const spec = parseReagentSpec('sodium acetate trihydrate', 'titrant');
    const target = prepareTarget(contents, [spec.resolved.reagent], 25, 'davies');
    const vector = reagentVector(target, spec.resolved.reagent);
    let pass = 0;
    const solveLinear = () => ({ amountsMol: [pass++ % 2 === 0 ? 175.4 : 5.8e-25], volumeL: 1, vectors: [vector] });
    expect(codeOf(() => iterateActivity(target, 7, solveLinear))).toBe('no_convergence');
  });

  test('iterateActivity converges for a fixed amount, and returns that amount', () => {
    const spec = parseReagentSpec('NaOH', 'titrant');
    const target = prepareTarget(contents, [spec.resolved.reagent], 25, 'davies');
    const vector = reagentVector(target, spec.resolved.reagent);
    expect(iterateActivity(target, 7, () => ({ amountsMol: [0.01], volumeL: 1, vectors: [vector] })).amountsMol).toEqual([0.01]);
  });

  test('solveFixedActivity: a charge balance with no root between pH −4 and 23 is no_convergence, not the bracket\'s edge', () => {
    const problem = prepareProblem(buildContents([{ reagent: 'NaOH', amount: 1, unit: 'M', row: 1 }], undefined), 25, 'ideal');
    problem.ions[0].concentrationM = 1e30; // far past any solution: OH⁻ would need pH ≈ 44
    problem.strongChargeM = 1e30;
    const out = { derivative: 0, ionicStrengthM: 0, chargeScaleM: 0 };
    expect(codeOf(() => solveFixedActivity(problem, -10, out))).toBe('no_convergence');
    const fine = prepareProblem(buildContents([{ reagent: 'NaOH', amount: 0.01, unit: 'M', row: 1 }], undefined), 25, 'ideal');
    expect(Number.isFinite(solveFixedActivity(fine, -10, out))).toBe(true);
  });

  test('the solver\'s fixed-point loop on the ionic strength: coefficients that never agree are no_convergence', () => {
    const spy = jest.spyOn(activity, 'lnGammaPerZ2');
    let call = 0;
    spy.mockImplementation(() => (call++ % 2 === 0 ? -0.1 : -0.3));
    try {
      expect(codeOf(() => solve(prepareProblem(contents, 25, 'davies')))).toBe('no_convergence');
    } finally {
      spy.mockRestore();
    }
    expect(solve(prepareProblem(contents, 25, 'davies')).pH).toBeCloseTo(6.8758, 4);
  });

  test('the inverse root-finder: a forward value that jumps across the target is no_convergence, never the last iterate', () => {
    const step = (a: number): number => (a < 0.3 ? 5 : 9);
    expect(codeOf(() => solveInverse({ forward: step, limit: 1, target: 7, tolerance: 1e-6, quantity: 'pH', argument: 'targetPH' }))).toBe('no_convergence');
  });

  test('the inverse root-finder: a smooth target is found and its value is the forward value at the amount', () => {
    const f = (a: number): number => 3 + Math.log10(1 + a * 1e6);
    const r = solveInverse({ forward: f, limit: 10, target: 7.5, tolerance: 1e-6, quantity: 'pH', argument: 'targetPH' });
    expect(r.found).toBe(true);
    if (r.found) { expect(r.value).toBe(f(r.amount)); expect(Math.abs(r.value - 7.5)).toBeLessThan(1e-9); expect(r.evaluations).toBeLessThan(40); }
    const out = solveInverse({ forward: f, limit: 10, target: 12, tolerance: 1e-6, quantity: 'pH', argument: 'targetPH' });
    expect(out).toMatchObject({ found: false, lowest: 3, highest: f(10) });
  });

  test('a guess close to the root: secant probes beside it where it lies on zero\'s side, Brent between zero and it where they straddle; never a solve at the limit', () => {
    const f = (a: number): number => 3 + Math.log10(1 + a * 1e6);
    const root = (10 ** 4.5 - 1) / 1e6;
    for (const guess of [root * (1 - 1e-4), root * (1 + 1e-4), root * 1.2, root * 0.7]) {
      const seen: number[] = [];
      const r = solveInverse({ forward: (a) => { seen.push(a); return f(a); }, limit: 10, target: 7.5, tolerance: 1e-6, quantity: 'pH', argument: 'targetPH', guess, atZero: f(0) });
      expect(r.found).toBe(true);
      if (r.found) { expect(r.value).toBe(f(r.amount)); expect(Math.abs(r.value - 7.5)).toBeLessThan(1e-9); }
      // the limit (10) was never solved: every amount tried lies within a factor 2 of the root
      expect(seen.filter((a) => !(a > root / 2 && a < 2 * root))).toEqual([]);
      expect(seen.length).toBeLessThanOrEqual(5);
    }
  });

  test('where zero and the guess straddle the target, no probe: ammonium chloride into KH2PO4 at 34.5 °C gives the 4.62 g root (a probe once made it 279.75 g, a root further on)', () => {
    // the pH falls from 4.561 (1 g) to 4.484 (10 g), rises to 4.620 (150 g) and falls to 4.515 (280 g): three roots for 4.5153
    const grams = impl.titrant(4.5153, [['KH2PO4']], [[5.35]], [['g']], 1.087, 'ammonium chloride', 34.5, 'davies', 'g') as number;
    expect(grams).toBeGreaterThan(4.5);
    expect(grams).toBeLessThan(4.8);
    expect(Math.abs((impl.ph([['KH2PO4'], ['ammonium chloride']], [[5.35], [grams]], [['g'], ['g']], 1.087, 34.5, 'davies') as number) - 4.5153)).toBeLessThan(1e-6);
  });

  test('TITRANT of a weak titrant close to its linear guess takes 3 forward solves (5 when it bracketed out to the limit)', () => {
    const contents = buildContents([{ reagent: 'KH2PO4', amount: 3.4, unit: 'g', row: 1 }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g', row: 2 }], 1);
    const r = titrantForTarget(7.1, contents, parseReagentSpec('Na2HPO4·7H2O', 'titrant'), 25, 'davies');
    expect(r.forwardSolves).toBe(3);
    expect(Math.abs(withTitrant(contents, parseReagentSpec('Na2HPO4·7H2O', 'titrant'), r.moles, 25, 'davies').pH - 7.1)).toBeLessThan(1e-6);
  });

  test('static scan: every iteration loop in src/engine ends in a coded failure (or an explicit fallback), not a fall-through', () => {
    // iteration loops are the counted ones named iter, pass or attempt; any other counted loop with a constant bound must be a data loop listed here
    // PHTEMP's golden section only chooses where to take one more scan sample (whose pH is a forward solve, used as
    // such); no value it computes reaches a cell unverified, the crossing itself comes from solveInverse.
    const dataLoops = new Set(['inverse.ts: i < SCAN_POINTS', 'temperatureCrossing.ts: i < TURN_STEPS']);
    const dir = join(__dirname, '..', 'src', 'engine');
    const findings: string[] = [];
    let iterationLoops = 0;
    for (const file of readdirSync(dir).filter((f) => f.endsWith('.ts'))) {
      const text = readFileSync(join(dir, file), 'utf8');
      for (const m of text.matchAll(/for \(let (\w+) = [^;]+; ([^;]+);[^)]*\) \{/g)) {
        const [whole, counter, condition] = m;
        const constantBound = /<=? ([A-Z_]+|\d{2,})\b/.test(condition);
        if (!['iter', 'pass', 'attempt'].includes(counter)) {
          if (constantBound && !dataLoops.has(`${file}: ${condition}`)) findings.push(`${file}: an unnamed counted loop "${condition}"`);
          continue;
        }
        iterationLoops++;
        // the statement after the loop's closing brace
        let depth = 0, at = (m.index as number) + whole.length - 1;
        for (; at < text.length; at++) {
          if (text[at] === '{') depth++;
          else if (text[at] === '}' && --depth === 0) break;
        }
        const after = text.slice(at + 1).trimStart();
        if (!/^(return fail\(|throw |return undefined;)/.test(after)) findings.push(`${file}: the loop "${condition}" falls through to: ${after.slice(0, 60)}`);
      }
      if (/\bwhile \(/.test(text) && !['formula.ts'].includes(file)) findings.push(`${file}: a while loop`);
    }
    expect(findings).toEqual([]);
    expect(iterationLoops).toBeGreaterThanOrEqual(6);
  });
});

describe('the engine entry other modules call keeps its signature', () => {
  test('titrantForTarget(targetPH, contents, spec, temperatureC, model) and its trailing options', () => {
    const contents = buildContents([{ reagent: 'KH2PO4', amount: 3.4, unit: 'g', row: 1 }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g', row: 2 }], 1);
    const spec = parseReagentSpec('1 M NaOH', 'titrant');
    const plain = titrantForTarget(7.4, contents, spec, 25, 'davies');
    expect(Math.abs(withTitrant(contents, spec, plain.moles, 25, 'davies').pH - 7.4)).toBeLessThanOrEqual(1e-6);
    expect(plain.pH).toBe(withTitrant(contents, spec, plain.moles, 25, 'davies').pH);
    const made = titrantForTarget(7.4, contents, spec, 25, 'davies', { finalVolumeL: 1.5 });
    expect(Math.abs(withTitrant(contents, spec, made.moles, 25, 'davies', 1.5).pH - 7.4)).toBeLessThanOrEqual(1e-6);
  });
});

describe('hostile input: SALTDOSE in every argument, TITRANT in its finalVolume', () => {
  const outcome = (run: () => unknown): string => {
    try {
      const v = run();
      return typeof v === 'number' && Number.isFinite(v) ? 'number' : `not a finite number: ${String(v)}`;
    } catch (e) {
      return e instanceof ProticError ? 'coded' : `untyped: ${String(e)}`;
    }
  };
  test('each result is a finite number or a coded failure', () => {
    const valid: unknown[] = [0.2, 'NaCl', R, A, 'g', 1, 25, 'davies', 'g'];
    const bad: string[] = [];
    for (let at = 0; at < valid.length; at++) {
      for (const value of HOSTILE) {
        const args = [...valid];
        args[at] = value;
        const o = outcome(() => saltDose(...(args as Parameters<typeof saltDose>)));
        if (o !== 'number' && o !== 'coded') bad.push(`SALTDOSE argument ${at + 1} = ${String(value).slice(0, 30)}: ${o}`);
      }
    }
    for (const value of HOSTILE) {
      const o = outcome(() => impl.titrant(7.4, R, A, 'g', 1, '1 M NaOH', 25, 'davies', 'mL', value as never));
      if (o !== 'number' && o !== 'coded') bad.push(`TITRANT finalVolume = ${String(value).slice(0, 30)}: ${o}`);
    }
    expect(bad).toEqual([]);
  });
});
