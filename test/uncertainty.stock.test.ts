import { applyCustomDefinitions, clearCustomDefinitions } from '../src/engine';
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
