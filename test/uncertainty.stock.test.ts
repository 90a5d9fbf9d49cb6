import { ACID_SYSTEMS } from '../src/catalogue';
import type { AcidSystem } from '../src/catalogue';
import { applyCustomDefinitions, clearCustomDefinitions, parseReagentSpec } from '../src/engine';
import * as impl from '../src/functions/impl';
import { STATED_PH_METER_HALF_WIDTH, uncertaintyBudget } from '../src/functions/uncertainty';
import { evaluateSheet } from '../scripts/lib/sheetEngine';

// UNCERTAINTY with a stock written with a pH (`1 M … pH 8.0 with HCl`): the stock is at its stated pH, so a pKa that
// moves moves the stock's titrant with it. The budget's pKa line is the total derivative with the stock re-adjusted,
// and the stated pH is an input of its own. Both are checked against an independent evaluation: the catalogue
// constant itself moved (a custom system redefined at pKa ± d), the stock re-made by the production path (its own
// titrant solve) and the mixture re-solved by PHMIX, no code of the budget involved.

const BASE = 'plant test base';
const define = (pKa: number): void => {
  clearCustomDefinitions();
  expect(applyCustomDefinitions({ systems: [{ name: BASE, pKa: [pKa], charge: 1, forms: [{ name: `${BASE} form`, formula: 'C4H11NO3', protonsLost: 1 }] }] })).toEqual([]);
};
const reagents = (pH: string): string[][] => [[`1 M ${BASE} form pH ${pH} with HCl`], ['NaCl']];
const AMOUNTS = [[50], [8.77]], UNITS = [['mL'], ['g']];
const PKA = 8.07;

afterAll(() => clearCustomDefinitions());

describe.each(['davies', 'sit'])('a pH-adjusted stock diluted into saline (%s)', (model) => {
  const pHAt = (pKa: number, statedPH: string): number => {
    define(pKa);
    return impl.ph(reagents(statedPH), AMOUNTS, UNITS, 1, 25, model) as number;
  };

  test('the pKa line is the derivative with the stock re-made at the moved constant (independent, ± 0.002, central)', () => {
    define(PKA);
    const b = uncertaintyBudget(reagents('8.0'), AMOUNTS, UNITS, 1, 25, model, [[0.5], [0.01]]);
    const line = b.lines.find((l) => l.input === `pKa ${BASE} 1`);
    const d = 0.002;
    const independent = (pHAt(PKA + d, '8.0') - pHAt(PKA - d, '8.0')) / (2 * d);
    // about 0.04 (the stock's pH is pinned; what is left is the dilution's activity shift): the held-titrant partial was ≈ 1
    expect(independent).toBeGreaterThan(0.02);
    expect(independent).toBeLessThan(0.08);
    expect(Math.abs((line?.sensitivity ?? NaN) - independent)).toBeLessThan(1e-5);
    expect(line?.note).toMatch(/re-adjusted to its stated pH as it moves/);
  });

  test('the stated pH is an input: its sensitivity is the mixture re-made at the stated pH ± 0.005', () => {
    define(PKA);
    const b = uncertaintyBudget(reagents('8.0'), AMOUNTS, UNITS, 1, 25, model, [[0.5], [0.01]]);
    const line = b.lines.find((l) => l.input.startsWith('stated pH:'));
    const independent = (pHAt(PKA, '8.005') - pHAt(PKA, '7.995')) / 0.01;
    expect(Math.abs((line?.sensitivity ?? NaN) - independent)).toBeLessThan(1e-5);
    // written to one decimal: ± 0.05, half its last digit (wider than a meter's 0.02)
    expect([line?.value, line?.limit, line?.distribution]).toEqual([8, 0.05, 'rectangular']);
  });
});

describe('the stated pH line', () => {
  test('written to two decimals, the limit is a calibrated meter\'s 0.02, not the digit\'s 0.005', () => {
    define(PKA);
    const b = uncertaintyBudget(reagents('8.00'), AMOUNTS, UNITS, 1, 25, 'davies', [[0.5], [0.01]]);
    expect(b.lines.find((l) => l.input.startsWith('stated pH:'))?.limit).toBe(STATED_PH_METER_HALF_WIDTH);
  });

  test('a stock row at 0 mL puts in nothing: no stated pH line, and the pKa line is the mixture\'s own', () => {
    define(PKA);
    const b = uncertaintyBudget([[`1 M ${BASE} form pH 8.0 with HCl`], [`${BASE} form`], ['HCl']], [[0], [0.01], [0.005]], [['mL'], ['M'], ['M']], 1, 25, 'davies');
    expect(b.lines.some((l) => l.input.startsWith('stated pH:'))).toBe(false);
    expect(b.lines.find((l) => l.input === `pKa ${BASE} 1`)?.note).not.toMatch(/re-adjusted/);
  });

  test('through the sheet, as a batch record writes it: Tris-HCl stock and salt, the dominant line is the stock\'s pH', () => {
    const v = evaluateSheet([
      ['1 M Tris-HCl pH 8.0', 50, 'mL', 0.5], ['sodium chloride', 8.77, 'g', 0.01],
      ['=PROTIC.UNCERTAINTY(A1:A2,B1:B2,C1:C2,1,25,"davies",D1:D2)'],
    ]).slice(2);
    const line = (name: RegExp) => v.find((row) => name.test(String(row[0])));
    const stated = line(/^stated pH: 1 M Tris-HCl pH 8\.0$/), pKa = line(/^pKa Tris 1$/), u = line(/^combined standard uncertainty/);
    expect(stated?.[3]).toBe(0.05);
    // the stock's pH carries through almost one to one; the pKa only through the dilution's small activity shift
    expect(Number(stated?.[6])).toBeGreaterThan(0.9);
    expect(Math.abs(Number(pKa?.[6]))).toBeLessThan(0.1);
    expect(Math.abs(Number(u?.[1]) - Number(stated?.[7])) / Number(u?.[1])).toBeLessThan(0.01);
  });
});

// The catalogue constant itself moved, for catalogue systems: the step's 25 °C pKa changed in place (the system marked
// custom so its ln Ka is recomputed rather than read from the per-temperature cache), the parse caches dropped, every
// stock re-made by the production path; put back afterwards.
function withCatalogueStep<T>(systemId: string, step: number, pKa25: number, f: () => T): T {
  const s = ACID_SYSTEMS.find((x) => x.id === systemId) as AcidSystem;
  const old = s.steps[step].pKa, oldCustom = s.custom;
  const set = (pKa: number, custom: boolean | undefined): void => {
    (s.steps[step] as { pKa: number }).pKa = pKa;
    (s as { custom?: boolean }).custom = custom;
    clearCustomDefinitions(); // drops the parsed reagents and stocks
  };
  set(pKa25, true);
  try { return f(); } finally { set(old, oldCustom); }
}
const pKa25Of = (systemId: string, step: number): number => (ACID_SYSTEMS.find((x) => x.id === systemId) as AcidSystem).steps[step].pKa;

describe('catalogue stocks, against the catalogue constant moved in place (± 0.002, central)', () => {
  const cases: [string, string[][], number[][], string[][], number, string, string, number][] = [
    ['Tris-HCl stock made at 37 °C, mixture at 25 °C', [['1 M Tris-HCl pH 8.0 at 37 °C'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 25, 'davies', 'tris', 0],
    ['acetate stock brought up with NaOH, diluted', [['1 M acetic acid pH 4.8 with NaOH'], ['KCl']], [[100], [3.7]], [['mL'], ['g']], 25, 'davies', 'acetate', 0],
    ['a stock adjusted under sit, in a davies mixture at 30 °C', [['0.5 M Tris pH 7.5 with HCl under sit'], ['NaCl']], [[40], [5]], [['mL'], ['g']], 30, 'davies', 'tris', 0],
    ['two stocks of one system (Tris at pH 8.0 and 7.2), sit mixture', [['1 M Tris-HCl pH 8.0'], ['1 M Tris-HCl pH 7.2'], ['NaCl']], [[30], [20], [29.2]], [['mL'], ['mL'], ['g']], 25, 'sit', 'tris', 0],
  ];
  test.each(cases)('%s', (_, reagentsIn, amounts, units, temperatureC, model, systemId, step) => {
    const name = (ACID_SYSTEMS.find((x) => x.id === systemId) as AcidSystem).name;
    const line = uncertaintyBudget(reagentsIn, amounts, units, 1, temperatureC, model).lines.find((l) => l.input === `pKa ${name} ${step + 1}`);
    const at = (d: number): number => withCatalogueStep(systemId, step, pKa25Of(systemId, step) + d, () => impl.ph(reagentsIn, amounts, units, 1, temperatureC, model) as number);
    const independent = (at(0.002) - at(-0.002)) / 0.004;
    expect(Math.abs((line?.sensitivity ?? NaN) - independent)).toBeLessThan(1e-5);
  });

  test('two rows of one stock are one stated-pH input, as the same litres in one row', () => {
    const split = uncertaintyBudget([['1 M Tris-HCl pH 8.0'], ['1 M Tris-HCl pH 8.0'], ['NaCl']], [[20], [30], [8.77]], [['mL'], ['mL'], ['g']], 1, 25, 'davies');
    const one = uncertaintyBudget([['1 M Tris-HCl pH 8.0'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1, 25, 'davies');
    const stated = (b: typeof one) => b.lines.filter((l) => l.input.startsWith('stated pH:'));
    expect(stated(split)).toHaveLength(1);
    expect(stated(split)[0].note).toMatch(/rows 1, 2 draw on this one stock: one input/);
    expect(Math.abs(stated(split)[0].sensitivity - stated(one)[0].sensitivity)).toBeLessThan(1e-9);
    expect(Math.abs(split.combined - one.combined)).toBeLessThan(1e-9);
  });

  test('the same stock spelled two ways is still one bottle, one input', () => {
    const two = uncertaintyBudget([['1 M Tris-HCl pH 8.0'], ['1M Tris-HCl pH 8.0'], ['NaCl']], [[20], [30], [8.77]], [['mL'], ['mL'], ['g']], 1, 25, 'davies');
    const one = uncertaintyBudget([['1 M Tris-HCl pH 8.0'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1, 25, 'davies');
    expect(two.lines.filter((l) => l.input.startsWith('stated pH:'))).toHaveLength(1);
    expect(Math.abs(two.combined - one.combined)).toBeLessThan(1e-9);
  });

  test('one stock is one input whatever the order or spelling of its rows (pH 8.0 and 8.00; 0.7 M and 700 mM): the wider limit', () => {
    const u = (texts: string[]): number => uncertaintyBudget([...texts.map((t) => [t]), ['NaCl']], [[20], [30], [8.77]], [['mL'], ['mL'], ['g']], 1, 25, 'davies').combined;
    const a = u(['1 M Tris-HCl pH 8.0', '1 M Tris-HCl pH 8.00']), b = u(['1 M Tris-HCl pH 8.00', '1 M Tris-HCl pH 8.0']);
    expect(Math.abs(a - b)).toBeLessThan(1e-12);
    expect(Math.abs(a - u(['1 M Tris-HCl pH 8.0', '1 M Tris-HCl pH 8.0']))).toBeLessThan(1e-12);
    const molar = uncertaintyBudget([['0.7 M Tris-HCl pH 8.0'], ['700 mM Tris-HCl pH 8.0'], ['NaCl']], [[20], [30], [8.77]], [['mL'], ['mL'], ['g']], 1, 25, 'davies');
    expect(molar.lines.filter((l) => l.input.startsWith('stated pH:'))).toHaveLength(1);
  });

  test('a stock set at the edge of its data\'s temperature range (Tris at 0 °C): the one-sided slope, against a second-order re-make', () => {
    const at = (t: string): number => impl.ph([[`1 M Tris-HCl pH 8.0 at ${t} °C`], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1, 25, 'davies') as number;
    const line = uncertaintyBudget([['1 M Tris-HCl pH 8.0 at 0 °C'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1, 25, 'davies').lines.find((l) => l.input.startsWith('adjustment temperature:'));
    const f0 = at('0'), independent = (4 * ((at('0.05') - f0) / 0.05) - (at('0.1') - f0) / 0.1) / 3;
    expect(independent).toBeGreaterThan(0.02);
    expect(Math.abs((line?.sensitivity ?? NaN) - independent)).toBeLessThan(1e-5);
    // 1 °C cooler than 0 °C is outside the Tris data (0 to 60 °C in the catalogue): the note offers the warmer side only.
    // Set anywhere in [0, 1] °C with the pH still read at 0 °C, the error's root mean square is |dpH/dT| · √(0.5²/3 + 0.5²)
    // = |dpH/dT| / √3 (its spread about 0.5 °C, and that 0.5 °C offset)
    expect(ACID_SYSTEMS.find((s) => s.id === 'tris')?.temperatureRangeC).toEqual([0, 60]);
    const stated = Number(/set up to 1 °C warmer \(the data hold for 0 to 60 °C\) would add ([0-9.]+) pH in u/.exec(line?.note ?? '')?.[1]);
    expect(Math.abs(stated - Math.sqrt(0.5 ** 2 / 3 + 0.5 ** 2) * Math.abs(independent))).toBeLessThan(0.0006); // printed to 2 digits
    expect(line?.note).not.toMatch(/± 1 °C/);
  });

  test('the temperature the stock\'s pH was set at is a line of its own: its sensitivity is the stock re-made at ± 0.05 °C', () => {
    const at = (t: string): number => impl.ph([[`1 M Tris-HCl pH 8.0 at ${t} °C`], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1, 25, 'davies') as number;
    const line = uncertaintyBudget([['1 M Tris-HCl pH 8.0'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1, 25, 'davies').lines.find((l) => l.input.startsWith('adjustment temperature:'));
    const independent = (at('25.05') - at('24.95')) / 0.1;
    // about +0.027 pH/K: Tris's pKa falls as it warms, so a stock set warmer took less HCl to read 8.0, and reads higher at 25 °C
    expect(independent).toBeGreaterThan(0.02);
    expect(Math.abs((line?.sensitivity ?? NaN) - independent)).toBeLessThan(1e-5);
    expect([line?.value, line?.limit]).toEqual([25, 0]);
    expect(line?.note).toMatch(/none written.*± 1 °C would add 0\.01\d pH in u/);
  });

  test('a stock its titrant cannot take below its natural pH: the stated pH\'s lower end is refused, and the line says only the upper end is checked', () => {
    // 1 M acetic acid reads about 2.37 alone: at pH 2.4 − 0.05 it would need less than no NaOH
    const b = uncertaintyBudget([['1 M acetic acid pH 2.4 with NaOH'], ['NaCl']], [[100], [5]], [['mL'], ['g']], 1, 25, 'davies');
    expect(b.lines.find((l) => l.input.startsWith('stated pH:'))?.note).toMatch(/one end of the ± limit could not be solved, so only the other is checked \(even with none of its titrant it reads 2\.3/);
  });

  test('at an equivalence point the stock\'s stated pH and the pKa it follows are flagged as not linear, and so is u(pH)', () => {
    // 100 mL of an acetate stock at pH 4.76 and the NaOH that brings the whole to equivalence: ± 0.02 in the stock's pH
    // moves the mixture by about ± 2, first order says ± 31
    const stock = '1 M acetic acid pH 4.76 with NaOH';
    const na = parseReagentSpec(stock, 'reagents').made?.ionsMPerL.get('Na+') as number;
    const b = uncertaintyBudget([[stock], ['NaOH']], [[100], [0.1 - 0.1 * na]], [['mL'], ['mol']], 1, 25, 'davies');
    expect(b.nonlinear).toEqual([`stated pH: ${stock}`, 'pKa acetate 1']);
    expect(b.lines.find((l) => l.input.startsWith('stated pH:'))?.note).toMatch(/not linear over ± 0\.02/);
  });
});

describe('CONSTANTS: the alternative\'s shift with the stock re-made, against the catalogue constant set to the alternative', () => {
  test.each([
    ['formate stock diluted into saline', [['1 M sodium formate pH 3.75 with HCl'], ['NaCl']], [[100], [5]], [['mL'], ['g']], 25, 'formate', 0],
    ['formate stock made at 37 °C, used at 25 °C', [['1 M sodium formate pH 3.75 with HCl at 37 °C'], ['NaCl']], [[100], [5]], [['mL'], ['g']], 25, 'formate', 0],
    ['oxalate step 2, mixture at 37 °C', [['0.2 M sodium oxalate pH 4.0 with HCl'], ['KCl']], [[250], [2]], [['mL'], ['g']], 37, 'oxalate', 1],
  ] as const)('%s', (_, reagentsIn, amounts, units, temperatureC, systemId, step) => {
    const s = ACID_SYSTEMS.find((x) => x.id === systemId) as AcidSystem;
    const table = impl.constants(reagentsIn, amounts, units, 1, temperatureC, 'davies');
    const shift = table.find((r) => r[0] === `pKa ${s.name}` && r[1] === step + 1)?.[10] as number;
    const base = impl.ph(reagentsIn, amounts, units, 1, temperatureC, 'davies') as number;
    const atAlternative = withCatalogueStep(systemId, step, s.steps[step].alternative?.pKa as number, () => impl.ph(reagentsIn, amounts, units, 1, temperatureC, 'davies') as number);
    expect(Math.abs(shift - (atAlternative - base))).toBeLessThan(1e-9);
  });

  test('a stock its own titrant cannot bring to its pH at the alternative: that cell says why, the table stands', () => {
    // formic acid barely brought up with NaOH: at the alternative (a weaker acid) it would need less than none
    const table = impl.constants([['1 M formic acid pH 1.8708 with NaOH']], [[1]], [['L']], 1, 25, 'davies');
    const row = table.find((r) => r[0] === 'pKa formate');
    expect(row?.[10]).toMatch(/^not computed: .*even with none of its titrant it reads 1\.872/);
    expect(table.some((r) => r[0] === 'pKw')).toBe(true);
  });

  test('a stock just inside what its titrant can reach at the alternative is re-made, not refused (a secant step below none is taken to none)', () => {
    // the alternative's own formic acid reads 1.87229 with no NaOH: a stock at 1.87230 takes a trace of it
    const stock = '1 M formic acid pH 1.87230 with NaOH';
    const table = impl.constants([[stock]], [[1]], [['L']], 1, 25, 'davies');
    expect(Math.abs(table.find((r) => r[0] === 'pKa formate')?.[10] as number)).toBeLessThan(1e-9);
  });
});
