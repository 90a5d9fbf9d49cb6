import { FAILURE_CODES, ProticError, describeFailure } from '../src/engine';
import type { FailureCode } from '../src/engine';
import * as impl from '../src/functions/impl';
import { toCellFailure } from '../src/functions/outcome';
import { phTemp } from '../src/functions/phtemp';

function failureOf(run: () => unknown): { code: FailureCode; message: string; kind: string } {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(ProticError);
    const f = (error as ProticError).failure;
    expect((error as ProticError).message).toBe(describeFailure(f));
    return { code: f.code, message: (error as Error).message, kind: toCellFailure(error).kind };
  }
  throw new Error('expected a failure');
}

const P = ['KH2PO4', 'Na2HPO4'];
const G = [3.4, 3.55];

const CASES: [FailureCode, () => unknown, RegExp, string][] = [
  ['unknown_reagent', () => impl.ph([['unobtainium']], [[1]], 'g', 1), /reagents, row 1: unknown reagent\. Received "unobtainium"; expected a catalogue name/, '#VALUE!'],
  ['ambiguous_reagent', () => impl.ph([['Na2HPO4·7H2O'], ['sodium citrate']], [[1], [1]], 'g', 1),
    /reagents, row 2: the name does not say which form\. Received "sodium citrate"; expected one of trisodium citrate \(258\.07 g\/mol\), trisodium citrate dihydrate \(294\.10 g\/mol\), .*or a formula with its water such as Na3C6H5O7·2H2O/, '#VALUE!'],
  ['unknown_system', () => impl.fractions('zircon', 7), /system: unknown acid system\. Received "zircon"/, '#VALUE!'],
  ['bad_formula', () => impl.molarMass('Na2HPO4)'), /formula: not a chemical formula at character 8/, '#VALUE!'],
  ['bad_character', () => impl.ph([['\u0422ris base']], [[1]], 'g', 1),
    /reagents, row 1: a character that is not plain text at character 1\. Received "\u0422ris base"; expected .*U\+0422 CYRILLIC CAPITAL LETTER TE, which looks like Latin T/, '#VALUE!'],
  ['bad_unit', () => impl.ph([P], [G], 'gallons', 1), /units, row 1: unit not allowed here\. Received "gallons"; expected one of g mg kg µg/, '#VALUE!'],
  ['bad_model', () => impl.ph([P], [G], 'g', 1, 25, 'pitzer'), /model: unknown activity model\. Received "pitzer"; expected davies, bates-guggenheim, sit or ideal/, '#VALUE!'],
  ['bad_amount', () => impl.ph([P], [[3.4, -1]], 'g', 1), /amounts, row 2: amount not usable\. Received -1; expected a number zero or above/, '#VALUE!'],
  ['bad_argument', () => impl.curve([P], [G], 'g', 1, '1 M NaOH', 10, 2.5), /points: .*expected a whole number of points from 2 to 1001/, '#VALUE!'],
  ['shape_mismatch', () => impl.ph([P], [[1, 2, 3]], 'g', 1), /amounts: ranges of different shapes\. Received a 1×3 range; expected the same shape as reagents \(1×2\)/, '#VALUE!'],
  ['missing_volume', () => impl.ph([P], [G], 'g'), /volume, row 1: final volume needed\. .*because row 1 is a mass \(g\)/, '#VALUE!'],
  ['out_of_range', () => impl.ph([P], [G], 'g', 1, 90), /temperature: outside the range the data hold for\. Received 90 °C; expected 0 to 60 °C, the range the phosphate data hold for/, '#VALUE!'],
  // acetate's pKa has a minimum near 22 °C, so a 1:1 acetate buffer's pH falls then rises between 0 and 60 °C
  ['several_crossings', () => phTemp(4.68, [['acetic acid'], ['sodium acetate']], [[50], [50]], 'mM'), /limitPH: more than one answer: the pH crosses it 2 times, at [\d.]+ °C, [\d.]+ °C\. Received pH 4\.68; expected a fromC and toC that enclose one crossing/, '#N/A'],
  ['unreachable_target', () => impl.titrant(5, [P], [G], 'g', 1, '1 M NaOH'), /targetPH: target cannot be reached: the mixture starts at pH 6\.88 and 1 M sodium hydroxide raises it, but the target is on the other side/, '#N/A'],
];

describe('every failure code, with the message a user reads', () => {
  test('the table covers every code but no_convergence (which the solver never reaches; tested below)', () => {
    expect([...CASES.map((c) => c[0]), 'no_convergence'].sort()).toEqual([...FAILURE_CODES].sort());
  });
  test.each(CASES)('%s', (code, run, pattern, kind) => {
    const f = failureOf(run);
    expect(f.code).toBe(code);
    expect(f.message).toMatch(pattern);
    expect(f.kind).toBe(kind);
  });

  test.each([
    ['trisodium citrte dihydrate', /closest catalogue names: trisodium citrate dihydrate, /],
    ['glycin', /closest catalogue names: glycine/],
    ['Disodium hydrogen phosphate 7-hydrate', /closest catalogue names: .*disodium hydrogen phosphate heptahydrate/],
    ['unobtainium', /the pane lists the catalogue\.$/],
  ])('a misspelt reagent %s names the closest catalogue entries', (name, pattern) => {
    const f = failureOf(() => impl.ph([[name]], [[1]], 'g', 1));
    expect(f.code).toBe('unknown_reagent');
    expect(f.message).toMatch(pattern);
  });

  test('MOLARMASS: a name with more than one form, an unknown name and a liquid as sold each say why', () => {
    expect(failureOf(() => impl.molarMass('sodium phosphate')).message).toMatch(/formula: the name does not say which form.*disodium hydrogen phosphate heptahydrate \(268\.06 g\/mol\)/);
    expect(failureOf(() => impl.molarMass('sodium acetat')).message).toMatch(/unknown reagent.*closest catalogue names: sodium acetate/);
    expect(failureOf(() => impl.molarMass('phosphoric acid 85%')).message).toMatch(/a liquid as sold has no single molar mass \(its compound is H3PO4\)/);
    expect(impl.molarMass('trisodium citrate dihydrate')).toBeCloseTo(294.10, 2);
  });

  test('a final volume smaller than the volumes dispensed into it', () => {
    const f = failureOf(() => impl.ph([['1 M HCl'], ['NaCl']], [[500], [1]], [['mL'], ['g']], 0.1));
    expect(f.code).toBe('bad_argument');
    expect(f.message).toBe('volume: value not usable. Received 0.1 L; expected at least the 0.5 L of stocks and liquids the rows add, since the final volume includes them.');
    expect(impl.ph([['1 M HCl']], [[100]], 'mL', 0.1)).toBeCloseTo(impl.ph([['1 M HCl']], [[100]], 'mL'), 12); // equal is fine
  });

  test('no_convergence has a message too', () => {
    const message = describeFailure({ code: 'no_convergence', argument: 'reagents', received: 'x', expected: 'y' });
    expect(message).toBe('reagents: the equilibrium did not converge. Received x; expected y.');
  });

  test('beyond the titrant\'s own pH', () => {
    const f = failureOf(() => impl.titrant(12.5, [P], [G], 'g', 1, '0.01 M NaOH'));
    expect(f.code).toBe('unreachable_target');
    expect(f.message).toMatch(/beyond what 0\.01 M sodium hydroxide can reach with up to 1000 times the mixture's volume added: on its own it has pH 11\.9\d; reachable pH 6\.8758 to 11\.9\d+\./);
  });

  test('a recipe whose forms cannot bracket the target', () => {
    const f = failureOf(() => impl.recipe('NaH2PO4·H2O', 'Na2HPO4·7H2O', 10, 0.1, 1));
    expect(f.code).toBe('unreachable_target');
    expect(f.message).toMatch(/cannot bracket it at 0\.1 mol\/L: alone, .* gives pH 4\.\d+ and .* gives pH 9\.\d+/);
    expect(f.kind).toBe('#N/A');
  });

  test('an untyped error is shown as an internal error, not swallowed', () => {
    expect(toCellFailure(new TypeError('boom'))).toEqual({ kind: '#VALUE!', message: 'internal error (please report with the inputs): boom' });
  });
});
