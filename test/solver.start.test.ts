import { buildContents, prepareProblem, solve } from '../src/engine';
import * as impl from '../src/functions/impl';
import type { MixtureRow } from '../src/engine';
import { startingIonicStrength } from '../src/engine/solver';

// The joint Newton's start: a first ionic strength from the proton condition, and a first ln h from the constants in
// use (under sit, with the specific-ion offsets a re-solve carries from its last root).

const r = (reagent: string, amount: number, unit: string, row: number): MixtureRow => ({ reagent, amount, unit, row });

describe('the first ionic strength counts the systems\' forms the proton condition gives', () => {
  // check values by hand from the stoichiometry, I = ½ Σ c z² (the forms that dominate at the pH, several pKa away)
  test.each([
    // NH₄⁺ 2.4 M, SO₄²⁻ 1.2 M: ½(2.4 + 1.2·4)
    ['1.2 M ammonium sulfate', [r('ammonium sulfate', 1.2, 'M', 1)], 3.6],
    // Na⁺ 0.15 M and HY³⁻ 0.05 M (H₂Y²⁻ + OH⁻): ½(0.15 + 0.05·9)
    ['50 mM disodium EDTA + 50 mM NaOH', [r('disodium EDTA dihydrate', 0.05, 'M', 1), r('NaOH', 0.05, 'M', 2)], 0.3],
    // TrisH⁺ 0.05 M, Cl⁻ 0.05 M: ½(0.05 + 0.05)
    ['0.1 M Tris + 0.05 M HCl', [r('Tris', 0.1, 'M', 1), r('HCl', 0.05, 'M', 2)], 0.05],
    // Na⁺ 0.3 M, citrate³⁻ 0.1 M: ½(0.3 + 0.1·9)
    ['0.1 M trisodium citrate', [r('trisodium citrate dihydrate', 0.1, 'M', 1)], 0.6],
  ] as [string, MixtureRow[], number][])('%s', (_, rows, byHand) => {
    for (const model of ['davies', 'sit'] as const) {
      const start = startingIonicStrength(prepareProblem(buildContents(rows, 1), 25, model));
      expect(Math.abs(start / byHand - 1)).toBeLessThan(0.005);
    }
  });

  test('a strong acid excess counts as free H⁺ (0.1 M acetic acid + 0.2 M HCl: ½(0.2 + 0.2))', () => {
    const start = startingIonicStrength(prepareProblem(buildContents([r('acetic acid', 0.1, 'M', 1), r('HCl', 0.2, 'M', 2)], 1), 25, 'davies'));
    expect(Math.abs(start / 0.2 - 1)).toBeLessThan(1e-9);
  });

  test('a strong base past the last step counts as free OH⁻ (0.1 M acetic acid + 0.3 M NaOH: ½(0.3 + 0.1 + 0.2))', () => {
    const start = startingIonicStrength(prepareProblem(buildContents([r('acetic acid', 0.1, 'M', 1), r('NaOH', 0.3, 'M', 2)], 1), 25, 'davies'));
    expect(Math.abs(start / 0.3 - 1)).toBeLessThan(1e-9);
  });
});

describe('a sit re-solve starts from the offsets it carries', () => {
  const MIXTURES: [string, MixtureRow[]][] = [
    ['50 mM phosphate', [r('NaH2PO4', 2.4, 'g', 1), r('Na2HPO4', 4.26, 'g', 2)]],
    ['50 mM phosphate + 0.5 M NaCl', [r('NaH2PO4', 2.4, 'g', 1), r('Na2HPO4', 4.26, 'g', 2), r('NaCl', 0.5, 'M', 3)]],
    ['50 mM phosphate + 2 M NaCl', [r('NaH2PO4', 2.4, 'g', 1), r('Na2HPO4', 4.26, 'g', 2), r('NaCl', 2, 'M', 3)]],
    ['phosphate, citrate, Tris, NaCl', [r('KH2PO4', 1.36, 'g', 1), r('trisodium citrate dihydrate', 2.94, 'g', 2), r('Tris', 1.21, 'g', 3), r('NaCl', 8.77, 'g', 4)]],
    ['EDTA with a strong base', [r('disodium EDTA dihydrate', 18.6, 'g', 1), r('NaOH', 2.0, 'g', 2)]],
  ];
  test.each(MIXTURES)('%s: the re-solve takes no more evaluations than the fresh solve, and the same root', (_, rows) => {
    const problem = prepareProblem(buildContents(rows, 1), 25, 'sit');
    const fresh = solve(problem);
    const again = solve(problem);
    expect(again.evaluations).toBeLessThanOrEqual(fresh.evaluations);
    expect(Math.abs(again.pH - fresh.pH)).toBeLessThan(1e-11);
  });

  test('50 mM phosphate + 0.5 M NaCl: a re-solve takes the 3 evaluations a Davies solve takes (5 when the start left the offsets out)', () => {
    const rows = MIXTURES[1][1];
    const problem = prepareProblem(buildContents(rows, 1), 25, 'sit');
    solve(problem);
    expect(solve(problem).evaluations).toBe(3);
    expect(solve(prepareProblem(buildContents(rows, 1), 25, 'davies')).evaluations).toBe(3);
  });
});

describe('what the start does not change', () => {
  test.each([
    ['trisodium citrate dihydrate', 3], ['tetrasodium EDTA', 2], ['trisodium phosphate', 5],
  ] as [string, number][])('the bracketed method\'s first guess stays the strong ions\' own: %s at %d mol/L under Davies, far past its range, answers with its warning', (reagent, mol) => {
    // (started from the proton condition's larger ionic strength, the first fixed-activity balance had no root: no_convergence)
    const args = [[[reagent]], [[mol]], [['mol']], 1, 25, 'davies'] as const;
    expect(typeof impl.ph(...args)).toBe('number');
    expect(impl.warnings(...args)).toMatch(/above the Davies model's range/);
  });

  test('a small Newton step counts as the root only with the residual solve accepts: 0.29 M ammonia solution 28 % at 39.1 °C in 6 evaluations (22 when the step alone counted and solve reran the bracketed method)', () => {
    const eq = solve(prepareProblem(buildContents([r('ammonia solution 28 %', 0.29, 'M', 1)], 1), 39.1, 'davies'));
    expect(eq.evaluations).toBeLessThanOrEqual(6);
    expect(eq.residualRelative).toBeLessThan(1e-12);
  });
});
