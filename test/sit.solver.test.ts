import { evaluateSheet } from '../scripts/lib/sheetEngine';
import * as impl from '../src/functions/impl';
import { buildContents, prepareProblem, solve, updateIonSums } from '../src/engine';
import type { MixtureRow } from '../src/engine';

// The sit solve's two paths (joint Newton with the lagged specific-ion offsets, and the bracketed fixed point
// it falls back to) settle on the same root, and SPECIES under sit reproduces the pH it prints.

const r = (reagent: string, amount: number, unit: string, row: number): MixtureRow => ({ reagent, amount, unit, row });
const MIXTURES: [string, MixtureRow[]][] = [
  ['50 mM phosphate + 2 M NaCl', [r('NaH2PO4', 2.4, 'g', 1), r('Na2HPO4', 4.26, 'g', 2), r('NaCl', 2, 'M', 3)]],
  ['1 M ammonium sulfate', [r('ammonium sulfate', 1, 'M', 1)]],
  ['3 M HCl', [r('HCl', 3, 'M', 1)]],
  ['1 M NaOH', [r('NaOH', 1, 'M', 1)]],
  ['citrate half-neutralised in 1 M KCl', [r('citric acid', 0.1, 'M', 1), r('NaOH', 0.15, 'M', 2), r('KCl', 1, 'M', 3)]],
  ['EDTA, NaOH, 0.5 M CaCl2', [r('disodium EDTA dihydrate', 18.6, 'g', 1), r('NaOH', 2.0, 'g', 2), r('CaCl2', 0.5, 'M', 3)]],
];

describe('sit: joint Newton and the bracketed fixed point agree', () => {
  test.each(MIXTURES)('%s', (_, rows) => {
    const joint = solve(prepareProblem(buildContents(rows, 1), 25, 'sit'));
    const bracketed = solve(prepareProblem(buildContents(rows, 1), 25, 'sit'), undefined, 'bracketed');
    expect(Math.abs(joint.pH - bracketed.pH)).toBeLessThan(1e-11);
    expect(joint.residualRelative).toBeLessThan(1e-12);
  });
});

describe('sit: the strong ions\' share of the offsets follows their molalities', () => {
  // The refresh holds the strong ions' part of each offset (and of ln aw) while their molalities are unchanged; an
  // inverse solve moves them on the same problem (linearTarget.setAmounts). A problem solved, then moved, must
  // solve as one moved before its first solve, whose share is computed from the moved molalities.
  const rows = [r('acetic acid', 0.1, 'M', 1), r('sodium acetate', 0.05, 'M', 2), r('NaCl', 0.5, 'M', 3)];
  const moveSalt = (p: ReturnType<typeof prepareProblem>): void => {
    for (const ion of p.ions) ion.concentrationM *= ion.id === 'Na+' || ion.id === 'Cl-' ? 3 : 1;
    updateIonSums(p);
  };
  test('NaCl tripled after a solve: pH as if tripled before it, to 1e-12', () => {
    const solvedFirst = prepareProblem(buildContents(rows, 1), 25, 'sit');
    const before = solve(solvedFirst).pH;
    moveSalt(solvedFirst);
    const movedFirst = prepareProblem(buildContents(rows, 1), 25, 'sit');
    moveSalt(movedFirst);
    const reference = solve(movedFirst).pH;
    expect(Math.abs(reference - before)).toBeGreaterThan(0.05); // the move matters: ε(Na⁺, acetate) and ln aw at 1.5 mol/kg
    expect(Math.abs(solve(solvedFirst).pH - reference)).toBeLessThan(1e-12);
  });
});

describe('sit: a side solve leaves the cached solution as it was', () => {
  // CONSTANTS re-solves the mixture with a step's alternative pKa (maleate step 1); that copy shared the sit state of the
  // cached problem, so SPECIES afterwards printed γ and activities from the other constant's solution (1e-6 relative here)
  test('SPECIES after CONSTANTS (an alternative pKa re-solved) is SPECIES before it, every cell', () => {
    const args = [[['maleic acid'], ['NaOH'], ['NaCl']], [[0.05], [0.05], [1]], [['M'], ['M'], ['M']], 1, 25, 'sit'] as const;
    const before = impl.species(...args);
    const constants = impl.constants(...args);
    expect(constants.some((row) => row[0] === 'pKa maleate' && typeof row[10] === 'number' && Math.abs(row[10]) > 0.01)).toBe(true);
    expect(impl.species(...args)).toEqual(before);
  });
});

describe('SPECIES under sit reproduces its pH', () => {
  test('pH = −log10(γ(H⁺)·c(H⁺)/ρw) from the rows it prints', () => {
    const v = evaluateSheet([['NaH2PO4', 2.4, 'g'], ['Na2HPO4', 4.26, 'g'], ['NaCl', 1, 'M'], ['=PROTIC.SPECIES(A1:A3,B1:B3,C1:C3,1,25,"sit")']]).slice(3);
    const h = v.find((row) => row[0] === 'H⁺') as [string, number, number, number, number];
    const pH = v.find((row) => row[0] === 'pH')?.[1] as number;
    const rho = Number(/w (\d\.\d+) kg of water per L/.exec(v.find((row) => row[0] === 'model')?.[1] as string)?.[1]);
    expect(Math.abs(-Math.log10((h[3] * h[2]) / rho) - pH)).toBeLessThan(1e-6);
    expect(Math.abs(-Math.log10(h[4]) - pH)).toBeLessThan(1e-9);
  });
});

describe('sit: a custom system redefined with another charge gets its own ε table', () => {
  // The species table is shared by problems with the same species list; a custom system's form keys carry its charge,
  // so a redefinition under the same name cannot reuse the ε pairs (and charge-type estimates) of the old charges.
  const define = (engine: typeof import('../src/engine'), charge: number): void => {
    const formula = charge === 0 ? 'C4H3NaO4' : 'C4H4O4';
    expect(engine.applyCustomDefinitions({ systems: [{ name: 'plant test acid', pKa: [3.5, 6.2], charge, forms: [{ name: 'plant test acid form', formula, protonsLost: 1 }] }] })).toEqual([]);
  };
  const pHUnder = (engine: typeof import('../src/engine')): number =>
    engine.solve(engine.prepareProblem(engine.buildContents([r('plant test acid form', 0.05, 'M', 1), r('NaCl', 1, 'M', 2), r('HCl', 0.02, 'M', 3)], 1), 25, 'sit')).pH;

  test('after the charge-0 definition was solved, the charge +1 one solves as a fresh engine does', () => {
    const engine = jest.requireActual<typeof import('../src/engine')>('../src/engine');
    define(engine, 0);
    pHUnder(engine);
    define(engine, 1);
    const afterRedefinition = pHUnder(engine);
    let fresh = NaN;
    jest.isolateModules(() => {
      const clean = jest.requireActual<typeof import('../src/engine')>('../src/engine');
      define(clean, 1);
      fresh = pHUnder(clean);
    });
    engine.clearCustomDefinitions();
    expect(Math.abs(afterRedefinition - fresh)).toBeLessThan(1e-9);
  });
});
