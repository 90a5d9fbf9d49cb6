import { handcheck } from '../src/functions/handcheck';
import * as impl from '../src/functions/impl';
import { evaluateSheet } from '../scripts/lib/sheetEngine';

const col = (t: (string | number)[][], label: string, c = 1) => t.find((r) => r[0] === label)![c] as number;

describe('HANDCHECK: the textbook estimate and the ladder of neglected effects', () => {
  test('equimolar acetic acid and sodium acetate: the estimate is the pKa exactly', () => {
    const t = handcheck([['acetic acid'], ['sodium acetate']], [[0.1], [0.1]], 'M');
    expect(col(t, 'textbook estimate')).toBe(4.756); // catalogue pKa, log10(1) = 0
  });

  test('phosphate buffer with HCl: the estimate is the stoichiometric (ICE) result', () => {
    // 0.05 M KH2PO4 + 0.05 M Na2HPO4 + 0.01 M HCl: HCl turns 0.01 HPO4²⁻ into H2PO4⁻: 0.04 base, 0.06 acid
    const t = handcheck([['KH2PO4'], ['Na2HPO4'], ['HCl']], [[0.05], [0.05], [0.01]], 'M');
    expect(col(t, 'textbook estimate')).toBeCloseTo(7.198 + Math.log10(0.04 / 0.06), 12);
  });

  test.each([
    [['acetic acid', 'sodium acetate'], [0.1, 0.05], 37],
    [['KH2PO4', 'Na2HPO4', 'HCl'], [0.05, 0.05, 0.01], 10],
    [['Tris', 'HCl'], [0.1, 0.04], 4],
    [['citric acid', 'NaOH'], [0.1, 0.15], 25],
    [['HEPES', 'NaOH', 'NaCl'], [0.05, 0.02, 0.15], 37],
  ])('%p: the shifts sum to exact − estimate within 1e-9', (reagents, amounts, t) => {
    const table = handcheck(reagents.map((r) => [r]), amounts.map((a) => [a]), 'M', null, t);
    const shifts = table.filter((r) => String(r[0]).startsWith('shift: ')).map((r) => r[2] as number);
    expect(shifts).toHaveLength(6);
    const exact = col(table, 'exact pH');
    expect(exact).toBeCloseTo(impl.ph(reagents.map((r) => [r]), amounts.map((a) => [a]), 'M', null, t), 12);
    expect(Math.abs(shifts.reduce((a, b) => a + b, 0) - (exact - col(table, 'textbook estimate')))).toBeLessThan(1e-9);
  });

  test('a hand value computed with activity ignored is attributed to activity', () => {
    const args = [[['acetic acid'], ['sodium acetate']], [[0.1], [0.2]], 'M', null, 25] as const;
    const idealPH = impl.ph(...args, 'ideal'); // the colleague's number: exact equilibrium, activity ignored
    const t = handcheck(...args, idealPH);
    const closest = t.find((r) => r[0] === 'closest step')!;
    expect(closest[3]).toMatch(/it neglected activity$/);
    expect(Math.abs(closest[2] as number)).toBeLessThan(1e-9);
  });

  test('through the sheet', () => {
    const v = evaluateSheet([['acetic acid', 0.1, 'M'], ['sodium acetate', 0.1, 'M'], ['=PROTIC.HANDCHECK(A1:A2,B1:B2,C1:C2,,25)']]);
    expect(v[2][0]).toBe('step');
    expect(v[3][1]).toBe(4.756);
  });
});
