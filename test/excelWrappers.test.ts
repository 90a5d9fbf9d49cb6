import { PROTIC_FUNCTIONS } from '../scripts/lib/sheetEngine';
// functions.ts as Excel runs it: a stand-in for the CustomFunctions runtime (Office itself is
// not available here), checking that failures become #VALUE! / #N/A with the engine's message.
class StandInError extends Error {
  constructor(readonly code: string, message: string) { super(message); }
}
(global as unknown as { CustomFunctions: unknown }).CustomFunctions = {
  Error: StandInError,
  ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A' },
  associate: () => undefined,
};

const { EXCEL_FUNCTIONS } = require('../src/functions/functions') as typeof import('../src/functions/functions');

const R = [['KH2PO4'], ['Na2HPO4']];
const A = [[3.4], [3.55]];
const U = [['g']];

function errorOf(run: () => unknown): StandInError {
  try { run(); } catch (e) { expect(e).toBeInstanceOf(StandInError); return e as StandInError; }
  throw new Error('expected an error');
}

describe('the Excel wrappers', () => {
  test('a value comes back as the engine computes it; omitted optionals arrive as null', () => {
    expect(EXCEL_FUNCTIONS.PHMIX(R, A, U, 1, null, null)).toBeCloseTo(6.8758, 4);
    expect(EXCEL_FUNCTIONS.VERSION()).toMatch(/^Protic \d+\.\d+\.\d+; catalogue /);
    expect(EXCEL_FUNCTIONS.FRACTIONS('phosphate', 7.2, null, null)[0]).toHaveLength(4);
  });
  test('bad input is #VALUE! with the message', () => {
    const e = errorOf(() => EXCEL_FUNCTIONS.PHMIX([['unobtainium']], [[1]], U, 1));
    expect(e.code).toBe('#VALUE!');
    expect(e.message).toMatch(/^reagents, row 1: unknown reagent/);
  });
  test('a result that does not exist is #N/A with the reason', () => {
    const e = errorOf(() => EXCEL_FUNCTIONS.TITRANT(5, R, A, U, 1, '1 M NaOH'));
    expect(e.code).toBe('#N/A');
    expect(e.message).toMatch(/other side/);
  });
  test('every contract function is exported for association', () => {
    // the wrappers Excel associates are exactly the functions the runner registers, and include the original contract
    expect(Object.keys(EXCEL_FUNCTIONS).sort()).toEqual(PROTIC_FUNCTIONS.map((f) => f.name).sort());
    for (const name of ['CAPACITY', 'CONSTANTS', 'CURVE', 'FRACTIONS', 'IONICSTRENGTH', 'MOLARMASS', 'PHMIX', 'PKA', 'RECIPE', 'SPECIES', 'TITRANT', 'VERSION', 'WARNINGS']) {
      expect(Object.keys(EXCEL_FUNCTIONS)).toContain(name);
    }
  });
});
