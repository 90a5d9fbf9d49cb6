import { ACID_SYSTEMS } from '../src/catalogue';
import { pKaAt } from '../src/engine';
import { expectMissWithin } from './helpers';

const step = (id: string, k = 0) => ACID_SYSTEMS.find((s) => s.id === id)!.steps[k];

// Published fits of pK2 against temperature from Harned-cell measurements (Roy et al. 1997,
// J. Chem. Eng. Data 42, 41): standard deviations 0.0006 (ACES) and 0.001 (CHES); the
// constant-ΔrCp° van 't Hoff form here may differ from the fits' curvature by a few 0.001.
const ROY_1997 = 'Roy et al. 1997, J. Chem. Eng. Data 42, 41, fitted pK2(T)';
const acesFit = (t: number): number => { const T = t + 273.15; return 2548.6 / T - 20.03159 + 3.2172 * Math.log(T); };
const chesFit = (t: number): number => { const T = t + 273.15; return 1917.66 / T + 5.794 - 0.4971 * Math.log(T); };
// Phthalic acid, Harned-cell fits 0–60 °C (from memory): pK1 from Hamer, Pinching & Acree 1945,
// pK2 from Hamer & Acree 1945. Their 25 °C values differ from Goldberg's by 0.0004 and 0.0036.
const HPA_1945 = 'Hamer, Pinching & Acree 1945, J. Res. NBS 35, 539, fitted pK1(T) (from memory)';
const HA_1945 = 'Hamer & Acree 1945, J. Res. NBS 35, 381, fitted pK2(T) (from memory)';
const phthalate1Fit = (t: number): number => { const T = t + 273.15; return 561.57 / T - 1.2843 + 0.0078833 * T; };
const phthalate2Fit = (t: number): number => { const T = t + 273.15; return 2175.88 / T - 9.55424 + 0.025694 * T; };

describe('pKa against temperature, within 0.005', () => {
  test.each([5, 15, 25, 37, 45, 55].flatMap((t) => [
    ['aces', t, acesFit(t), ROY_1997],
    ['ches', t, chesFit(t), ROY_1997],
  ]) as [string, number, number, string][])('%s at %d °C: %d (%s)', (id, t, ref) => {
    expect(Math.abs(pKaAt(step(id), t) - ref)).toBeLessThan(0.005);
  });
  test.each([0, 10, 25, 40, 50, 60].flatMap((t) => [
    [1, t, phthalate1Fit(t), HPA_1945],
    [2, t, phthalate2Fit(t), HA_1945],
  ]) as [number, number, number, string][])('phthalate pK%d at %d °C: %d (%s)', (k, t, ref) => {
    expect(Math.abs(pKaAt(step('phthalate', k - 1), t) - ref)).toBeLessThan(0.005);
  });
});

// Harned-cell fits of the form pK = A/T − B + C·T from the NBS and Yale measurements of the 1930s–60s, all
// from memory; each reproduces the catalogue's 25 °C pKa within 0.003, which is how the recollection was checked.
// Bound 0.01 over 0–50 °C: it keeps the temperature error well inside the 0.015 (25 °C) and 0.03 (0–50 °C) pH
// bounds on the standards; the fits reproduce their own data to about 0.002.
const HR: [string, number, number, number, number, string][] = [
  // system, step, A, B, C, source
  ['phosphate', 1, 799.31, 4.5535, 0.013486, 'Bates 1951, J. Res. NBS 47, 127 (from memory)'],
  ['phosphate', 2, 2073.0, 5.9884, 0.020912, 'Bates & Acree 1943, J. Res. NBS 30, 129 (from memory)'],
  ['citrate', 1, 1255.6, 4.5635, 0.011673, 'Bates & Pinching 1949, J. Am. Chem. Soc. 71, 1274 (from memory)'],
  ['citrate', 2, 1585.2, 5.4460, 0.016399, 'Bates & Pinching 1949 (from memory)'],
  ['citrate', 3, 1814.9, 6.3664, 0.022389, 'Bates & Pinching 1949 (from memory)'],
  ['acetate', 1, 1170.48, 3.1649, 0.013399, 'Harned & Ehlers 1933, J. Am. Chem. Soc. 55, 652 (from memory)'],
  ['formate', 1, 1342.85, 5.2743, 0.015168, 'Harned & Embree 1934, J. Am. Chem. Soc. 56, 1042 (from memory)'],
  ['lactate', 1, 1286.49, 4.8607, 0.014776, 'Martin & Tartar 1937, J. Am. Chem. Soc. 59, 2672 (from memory)'],
  ['carbonate', 1, 3404.71, 14.8435, 0.032786, 'Harned & Davis 1943, J. Am. Chem. Soc. 65, 2030 (from memory)'],
  ['carbonate', 2, 2902.39, 6.4980, 0.02379, 'Harned & Scholes 1941, J. Am. Chem. Soc. 63, 1706 (from memory)'],
  ['succinate', 1, 1206.25, 3.3266, 0.011697, 'Pinching & Bates 1948, J. Res. NBS 40, 405 (from memory)'],
  ['succinate', 2, 1679.13, 5.7043, 0.019153, 'Pinching & Bates 1948 (from memory)'],
  ['tartrate', 1, 1525.59, 6.6558, 0.015336, 'Bates & Canham 1951, J. Res. NBS 47, 343 (from memory)'],
  ['tartrate', 2, 1765.35, 7.3015, 0.019276, 'Bates & Canham 1951 (from memory)'],
  ['ammonium', 1, 2835.76, 0.6322, 0.001225, 'Bates & Pinching 1949, J. Res. NBS 42, 419 (from memory)'],
  ['tris', 1, 2981.4, 3.5888, 0.005571, 'Bates & Hetzer 1961, J. Phys. Chem. 65, 667 (from memory)'],
  ['oxalate', 2, 1423.8, 6.5007, 0.020095, 'Pinching & Bates 1948, J. Res. NBS 40, 405 (from memory)'],
  ['borate', 1, 2237.94, 3.305, 0.016883, 'Manov, DeLollis & Acree 1944, J. Res. NBS 33, 287 (from memory)'],
];
const hrFit = (a: number, b: number, c: number, t: number): number => { const T = t + 273.15; return a / T - b + c * T; };
// Finding: borate's catalogue ΔrCp° (−240) curves more than its fit does (−193): 0.013 at 50 °C.
const HR_MISSES = ['borate 1 50'];
// measured miss (catalogue − fit) and its margin, for each known miss
const HR_MEASURED: Record<string, [number, number]> = { 'borate 1 50': [0.0134, 0.002] };
const hrPoints = (miss: boolean) => HR.flatMap(([id, k, a, b, c, src]) => [0, 10, 25, 37, 50]
  .filter((t) => HR_MISSES.includes(`${id} ${k} ${t}`) === miss)
  .map((t) => [id, k, t, hrFit(a, b, c, t), src] as const));

describe('pKa against Harned-cell fits, 0–50 °C, within 0.01', () => {
  test.each(hrPoints(false))('%s pK%d at %d °C: %d (%s)', (id, k, t, ref) => {
    expect(Math.abs(pKaAt(step(id, k - 1), t) - ref)).toBeLessThan(0.01);
  });
  test('every fit reproduces the catalogue at 25 °C within 0.003 (the check on the recollection)', () => {
    for (const [id, k, a, b, c] of HR) expect(Math.abs(hrFit(a, b, c, 25) - step(id, k - 1).pKa)).toBeLessThan(0.003);
  });
  test.each(hrPoints(true))('known miss: %s pK%d at %d °C: %d (%s)', (id, k, t, ref) => {
    const [measured, margin] = HR_MEASURED[`${id} ${k} ${t}`];
    expect(Math.abs(measured) - margin).toBeGreaterThan(0.01);
    expectMissWithin(pKaAt(step(id, k - 1), t) - ref, measured, margin);
  });
  test('every known miss is a point of a fit', () => expect(hrPoints(true)).toHaveLength(HR_MISSES.length));
});

describe('pKa at 25 °C, within 0.002', () => {
  test.each([
    ['mes', 6.27, 'Vega & Bates 1976, Anal. Chem. 48, 1293, pK2 at 25 °C'],
    ['tes', 7.55, 'Vega & Bates 1976, Anal. Chem. 48, 1293, pK2 at 25 °C'],
    ['hepes', 7.565, 'Vega & Bates 1976, Anal. Chem. 48, 1293, pK2 at 25 °C'],
  ])('%s: %d (%s)', (id, ref) => {
    expect(Math.abs(pKaAt(step(id), 25) - ref)).toBeLessThan(0.002);
  });
});
