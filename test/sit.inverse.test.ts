import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { drawCases, runCase } from './inverseBattery';
import type { Kind } from './inverseBattery';

// The inverse functions under sit: a seeded battery of TITRANT, RECIPE and SALTDOSE problems (0–4 M added salt,
// 0–50 °C), every answer fed back through PHMIX or IONICSTRENGTH under sit (test/inverseBattery.ts): each is a
// coded refusal or reaches its target (pH within 1e-6, ionic strength within 1e-9 relative).

const COUNTS: Record<Kind, number> = { titrant: 400, recipe: 250, saltdose: 250 };
const cases = drawCases({ seed: 20261202, counts: COUNTS, finalVolume: true, models: ['sit'] });

describe('inverse functions under sit: exact or refused', () => {
  const outcomes = cases.map((c) => [c, runCase(c)] as const);
  test.each(Object.keys(COUNTS) as Kind[])('%s: no wrong or silent answer, most problems answered', (kind) => {
    const mine = outcomes.filter(([c]) => c.kind === kind);
    expect(mine.every(([c]) => c.model === 'sit')).toBe(true);
    expect(mine.filter(([, o]) => o.verdict === 'wrong' || o.verdict === 'internal').map(([c, o]) => `${c.label}: ${o.detail}`).slice(0, 10)).toEqual([]);
    expect(mine.filter(([, o]) => o.verdict === 'ok').length).toBeGreaterThan(COUNTS[kind] * 0.4);
  });
});

describe('through the spreadsheet: the answer cell read back by the forward function', () => {
  test('TITRANT of 1 M NaOH into 50 mM phosphate in 1 M NaCl to pH 7.0, fed back through PHMIX under sit', () => {
    const v = evaluateSheet([
      ['NaH2PO4', 6.0, 'g'], ['NaCl', 58.44, 'g'],
      ['1 M NaOH', '=PROTIC.TITRANT(7,A1:A2,B1:B2,C1:C2,1,"1 M NaOH",25,"sit","mL")', 'mL'],
      ['=PROTIC.PHMIX(A1:A3,B1:B3,C1:C3,1+B3/1000,25,"sit")'],
    ]);
    expect(typeof v[2][1]).toBe('number');
    expect(Math.abs((v[3][0] as number) - 7)).toBeLessThan(1e-6);
  });

  test('SALTDOSE of NaCl to I = 1.5 mol/L in 50 mM Tris-HCl, fed back through IONICSTRENGTH under sit', () => {
    const v = evaluateSheet([
      ['Tris hydrochloride', 7.88, 'g'], ['Tris', 0, 'g'],
      ['NaCl', '=PROTIC.SALTDOSE(1.5,"NaCl",A1:A2,B1:B2,C1:C2,1,25,"sit","g")', 'g'],
      ['=PROTIC.IONICSTRENGTH(A1:A3,B1:B3,C1:C3,1,25,"sit")'],
    ]);
    expect(typeof v[2][1]).toBe('number');
    expect(Math.abs((v[3][0] as number) - 1.5)).toBeLessThanOrEqual(1.5e-9);
  });
});
