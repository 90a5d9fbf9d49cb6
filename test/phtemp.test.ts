import { evaluateSheet } from '../scripts/lib/sheetEngine';
import type { SheetValue } from '../scripts/lib/sheetEngine';
import { ProticError } from '../src/engine';
import { phTemp } from '../src/functions/phtemp';

// PHTEMP through a real spreadsheet engine (HyperFormula): the temperature at which a mixture's pH crosses a
// limit, fed back through PHMIX at that temperature, and against published temperature data for Tris.

const TRIS: (string | number)[][] = [['Tris', 50, 'mM'], ['Tris hydrochloride', 50, 'mM']];
const ACETATE: (string | number)[][] = [['acetic acid', 50, 'mM'], ['sodium acetate', 50, 'mM']];

/** Evaluates formulas written below a mixture in A1:C2; returns their first cells. */
function cells(mixture: (string | number)[][], formulas: string[]): SheetValue[] {
  const v = evaluateSheet([...mixture.map((r) => [...r]), ...formulas.map((f) => [f])]);
  return v.slice(mixture.length).map((r) => r[0]);
}

const MIX = 'A1:A2,B1:B2,C1:C2';

describe('PHTEMP: verified by PHMIX at the temperature it returns', () => {
  test('1:1 Tris/Tris-HCl (50 mM each) crossing pH 8.3: PHMIX there is 8.3 within 1e-6', () => {
    const [t, pH] = cells(TRIS, [`=PROTIC.PHTEMP(8.3,${MIX})`, `=PROTIC.PHMIX(${MIX},,A3)`]);
    expect(typeof t).toBe('number');
    expect(Math.abs((pH as number) - 8.3)).toBeLessThanOrEqual(1e-6);
    // Tris's pKa falls as it warms, so pH 8.3 (above the 25 °C pH) is reached on cooling
    expect(t as number).toBeLessThan(25);
  });

  test.each([[7.6, 'davies'], [8.6, 'bates-guggenheim'], [8.0, 'ideal']])('limit %d under %s, fed back', (limit, model) => {
    const [t, pH] = cells(TRIS, [`=PROTIC.PHTEMP(${limit},${MIX},,"${model}")`, `=PROTIC.PHMIX(${MIX},,A3,"${model}")`]);
    expect(Math.abs((pH as number) - limit)).toBeLessThanOrEqual(1e-6);
    expect(t as number).toBeGreaterThanOrEqual(0);
    expect(t as number).toBeLessThanOrEqual(60);
  });

  test('a mass-and-volume mixture, with fromC and toC', () => {
    const sheet = [['Tris', 6.057, 'g'], ['Tris hydrochloride', 7.88, 'g']];
    const [t, pH] = cells(sheet, [`=PROTIC.PHTEMP(8,${MIX},1,,20,45)`, `=PROTIC.PHMIX(${MIX},1,A3)`]);
    expect(Math.abs((pH as number) - 8)).toBeLessThanOrEqual(1e-6);
    expect(t as number).toBeGreaterThan(20);
    expect(t as number).toBeLessThan(45);
  });
});

describe('PHTEMP against published temperature data for Tris (outside checks)', () => {
  // Check 1. Bates & Hetzer 1961 (J. Phys. Chem. 65, 667) fit pK(T) = 2981.4/T − 3.5888 + 0.005571·T (from memory, the
  // same recollection test/reference.pka.test.ts holds), with the Davies activity term of TrisH⁺, + A(T)·F(I), F(I) =
  // √I/(1 + √I) − 0.3 I at I = 0.05 mol/kg, and A(T) the Debye–Hückel A of Robinson & Stokes, Electrolyte Solutions,
  // appendix (from memory): 0.4960 at 10 °C, 0.5002 at 15, 0.5046 at 20, 0.5091 at 25 °C, interpolated linearly.
  // Equal Tris and TrisH⁺ make log10(ratio) 0 (hydrolysis moves it by about 2e-5 at pH 8, left out).
  // Tolerance 0.1 °C: the fit reproduces its own data to about 0.002 pK, which at −0.029 pK/K is 0.07 °C;
  // A from memory to ±0.0005 moves the crossing by under 0.003 °C; the molal/molar difference of I (0.2 %) by less.
  const A_C: [number, number][] = [[10, 0.496], [15, 0.5002], [20, 0.5046], [25, 0.5091]];
  const aAt = (tC: number): number => {
    const i = Math.min(A_C.length - 2, Math.max(0, A_C.findIndex(([t]) => t > tC) - 1));
    const [[t0, a0], [t1, a1]] = [A_C[i], A_C[i + 1]];
    return a0 + ((a1 - a0) * (tC - t0)) / (t1 - t0);
  };
  const F = ((s) => s / (1 + s) - 0.3 * 0.05)(Math.sqrt(0.05));
  const handPH = (tC: number): number => { const T = tC + 273.15; return 2981.4 / T - 3.5888 + 0.005571 * T + aAt(tC) * F; };
  /** the hand model's crossing by bisection over 10–25 °C (it falls monotonically there) */
  const handCrossing = (limit: number): number => {
    let lo = 10, hi = 25;
    for (let i = 0; i < 60; i++) { const mid = (lo + hi) / 2; if (handPH(mid) > limit) lo = mid; else hi = mid; }
    return (lo + hi) / 2;
  };

  test.each([8.2, 8.3, 8.4])('crossing pH %d: within 0.1 °C of the Bates & Hetzer fit with the Davies term', (limit) => {
    const [t] = cells(TRIS, [`=PROTIC.PHTEMP(${limit},${MIX})`]);
    expect(Math.abs((t as number) - handCrossing(limit))).toBeLessThan(0.1);
  });

  // Check 2. The published temperature coefficient dpKa/dT = −0.028 per K (Bates & Hetzer 1961, common practice) from
  // the 25 °C pH: T = 25 − (8.3 − pH(25 °C))/0.028. Tolerance 0.2 °C: the coefficient is given to two figures
  // (±0.0005/K, ±0.09 °C over this 5 °C), and the linear form leaves out the curvature of pKa(T) (about 2.2e-4 per K²,
  // 0.003 pH or 0.1 °C over 5 °C).
  test('crossing pH 8.3: within 0.2 °C of the linear prediction from dpKa/dT = −0.028/K', () => {
    const [t, pH25] = cells(TRIS, [`=PROTIC.PHTEMP(8.3,${MIX})`, `=PROTIC.PHMIX(${MIX},,25)`]);
    const predicted = 25 - (8.3 - (pH25 as number)) / 0.028;
    expect(Math.abs((t as number) - predicted)).toBeLessThan(0.2);
  });
});

describe('PHTEMP refusals', () => {
  test('a limit the pH never reaches is #N/A with the pH range over the temperatures, the ends as PHMIX computes them', () => {
    const [na, at0, at60] = cells(TRIS, [`=PROTIC.PHTEMP(9.5,${MIX})`, `=PROTIC.PHMIX(${MIX},,0)`, `=PROTIC.PHMIX(${MIX},,60)`]);
    const e = na as { error: string; message: string };
    expect(e.error).toBe('#N/A');
    const n = (x: number): string => String(Number(x.toPrecision(5)));
    expect(e.message).toContain(`from 0 to 60 °C the pH stays between ${Number((at60 as number).toFixed(4))} and ${Number((at0 as number).toFixed(4))}`);
    expect(e.message).toContain(`reachable pH ${n(at60 as number)} to ${n(at0 as number)}`);
  });

  test('outside the data\'s temperature range, or from above to, is refused (#VALUE!)', () => {
    const [below, reversed] = cells(TRIS, [`=PROTIC.PHTEMP(8.3,${MIX},,,-5)`, `=PROTIC.PHTEMP(8.3,${MIX},,,30,20)`]);
    expect(below).toEqual({ error: '#VALUE!', message: expect.stringMatching(/^fromC: outside the range the data hold for\. Received -5 °C; expected 0 to 60 °C/) });
    expect(reversed).toEqual({ error: '#VALUE!', message: expect.stringMatching(/^toC: value not usable\. Received 20 °C; expected a temperature above fromC \(30 °C\)/) });
  });

  // Acetic acid's pKa has a minimum near 22 °C (its ΔrH° changes sign; Harned & Ehlers 1933, from memory), so a 1:1
  // acetate buffer's pH passes through a minimum and a limit just above it is crossed twice.
  /** the buffer's pH minimum over 0–60 °C by a dense PHMIX scan in the sheet (0.05 °C steps) */
  function acetateMinimum(): { t: number; pH: number } {
    const temps = Array.from({ length: 1201 }, (_, i) => i * 0.05);
    const v = cells(ACETATE, temps.map((t) => `=PROTIC.PHMIX(${MIX},,${t})`)) as number[];
    const i = v.indexOf(Math.min(...v));
    return { t: temps[i], pH: v[i] };
  }

  test('a limit crossed twice is #N/A naming both crossings, each verified by PHMIX', () => {
    const min = acetateMinimum();
    expect(min.t).toBeGreaterThan(15);
    expect(min.t).toBeLessThan(35);
    const limit = min.pH + 0.002;
    let crossings: number[] = [];
    try {
      phTemp(limit, ACETATE.map((r) => [r[0]]), ACETATE.map((r) => [r[1]]), 'mM');
      throw new Error('expected a failure');
    } catch (error) {
      expect(error).toBeInstanceOf(ProticError);
      const f = (error as ProticError).failure;
      expect(f.code).toBe('several_crossings');
      if (f.code === 'several_crossings') crossings = f.crossings;
    }
    expect(crossings).toHaveLength(2);
    expect(crossings[0]).toBeLessThan(min.t);
    expect(crossings[1]).toBeGreaterThan(min.t);
    const [cell, ...fed] = cells(ACETATE, [`=PROTIC.PHTEMP(${limit},${MIX})`, ...crossings.map((t) => `=PROTIC.PHMIX(${MIX},,${t})`)]);
    expect(cell).toEqual({ error: '#N/A', message: expect.stringContaining(`the pH crosses it 2 times, at ${crossings.map((t) => `${Number(t.toPrecision(5))} °C`).join(', ')}`) });
    for (const pH of fed) expect(Math.abs((pH as number) - limit)).toBeLessThanOrEqual(1e-6);
    // a range that encloses one crossing returns it
    const [one, back] = cells(ACETATE, [`=PROTIC.PHTEMP(${limit},${MIX},,,0,${min.t})`, `=PROTIC.PHMIX(${MIX},,A3)`]);
    expect(Math.abs((one as number) - crossings[0])).toBeLessThan(0.01);
    expect(Math.abs((back as number) - limit)).toBeLessThanOrEqual(1e-6);
  });

  test('a limit reached only between two scan samples, around the turn, is still found (the turn is located)', () => {
    const min = acetateMinimum();
    // scan samples at the turn ± 0.5 °C (8 intervals of 1 °C): both above the minimum, neither below the limit
    const [from, to] = [min.t - 4.5, min.t + 3.5];
    const [nearLeft, nearRight] = cells(ACETATE, [`=PROTIC.PHMIX(${MIX},,${min.t - 0.5})`, `=PROTIC.PHMIX(${MIX},,${min.t + 0.5})`]) as number[];
    const limit = min.pH + 0.3 * (Math.min(nearLeft, nearRight) - min.pH);
    expect(limit).toBeGreaterThan(min.pH);
    const [cell] = cells(ACETATE, [`=PROTIC.PHTEMP(${limit},${MIX},,,${from},${to})`]);
    expect(cell).toEqual({ error: '#N/A', message: expect.stringContaining('the pH crosses it 2 times') });
  });

  test('a turn inside the first scan interval is found by the probe just inside the end', () => {
    const min = acetateMinimum();
    // the turn 0.5 °C above fromC, in the first of 8 intervals of 1 °C: the samples rise from fromC on
    const [from, to] = [min.t - 0.5, min.t + 7.5];
    const [atFrom, atNext] = cells(ACETATE, [`=PROTIC.PHMIX(${MIX},,${from})`, `=PROTIC.PHMIX(${MIX},,${from + 1})`]) as number[];
    const limit = min.pH + 0.3 * (Math.min(atFrom, atNext) - min.pH);
    const [cell, ...fed] = cells(ACETATE, [`=PROTIC.PHTEMP(${limit},${MIX},,,${from},${to})`]);
    expect(fed).toEqual([]);
    expect(cell).toEqual({ error: '#N/A', message: expect.stringContaining('the pH crosses it 2 times') });
    // and at the far end: the turn 0.5 °C below toC
    const [from2, to2] = [min.t - 7.5, min.t + 0.5];
    const [atTo, atBefore] = cells(ACETATE, [`=PROTIC.PHMIX(${MIX},,${to2})`, `=PROTIC.PHMIX(${MIX},,${to2 - 1})`]) as number[];
    const limit2 = min.pH + 0.3 * (Math.min(atTo, atBefore) - min.pH);
    const [cell2] = cells(ACETATE, [`=PROTIC.PHTEMP(${limit2},${MIX},,,${from2},${to2})`]);
    expect(cell2).toEqual({ error: '#N/A', message: expect.stringContaining('the pH crosses it 2 times') });
  });
});
