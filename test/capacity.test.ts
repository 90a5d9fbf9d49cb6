import { buildContents, pKaAt, pKw, prepareProblem, solve, updateIonSums, waterDensityKgPerL } from '../src/engine';
import { ACID_SYSTEMS } from '../src/catalogue';
import * as impl from '../src/functions/impl';
import { bufferCapacity } from '../src/engine';
import * as chargeBalanceModule from '../src/engine/chargeBalance';

const LN10 = Math.LN10;
// Constants and pH are molal; in mol/L, ideal: [H⁺] = 10^−pH·ρw and [OH⁻] = Kw·ρw²/[H⁺].
const RHO_25 = waterDensityKgPerL(25);

/** 2δ/ΔpH from adding δ mol/L NaOH and, separately, δ mol/L HCl. */
function centralDifference(reagents: string[], molar: number[], model: string): number {
  const delta = 1e-6;
  const pHWith = (naoh: number, hcl: number): number =>
    impl.ph([...reagents.map((r) => [r]), ['NaOH'], ['HCl']], [...molar.map((m) => [m]), [naoh], [hcl]], 'M', null, 25, model);
  return (2 * delta) / (pHWith(delta, 0) - pHWith(0, delta));
}

/**
 * 2δ/ΔpH with the solution's density held at the buffer's own: β is a property of the buffer, so the titrant's
 * effect on the kg of water per litre (which depends on which base or acid is added) is not part of it.
 */
function centralDifferenceAtFixedDensity(reagents: string[], molar: number[], model: 'davies' | 'ideal'): number {
  const delta = 1e-6;
  const contents = buildContents(reagents.map((reagent, i) => ({ reagent, amount: molar[i], unit: 'M', row: i + 1 })), undefined);
  for (const id of ['Na+', 'Cl-']) contents.ionMoles.set(id, contents.ionMoles.get(id) ?? 0);
  const base = prepareProblem(contents, 25, model);
  const pHWith = (naoh: number, hcl: number): number => {
    const ions = base.ions.map((ion) => ({ ...ion, concentrationM: ion.concentrationM + (ion.id === 'Na+' ? naoh : ion.id === 'Cl-' ? hcl : 0) }));
    const p = { ...base, ions, systems: base.systems.map((x) => ({ ...x, lnCumK: new Float64Array(x.lnCumK.length) })) };
    updateIonSums(p);
    return solve(p).pH;
  };
  return (2 * delta) / (pHWith(delta, 0) - pHWith(0, delta));
}

describe('buffer capacity β = dCb/dpH', () => {
  // Van Slyke: a monoprotic buffer has its greatest capacity at pH = pKa, ln10·C/4 ≈ 0.576·C, plus water's part.
  test('0.1 M acetate at pH = pKa, ideal: ln10·C/4 plus water (common practice)', () => {
    const beta = impl.capacity([['acetic acid'], ['sodium acetate']], [[0.1], [0.1]], 'M', null, 25, 'ideal');
    const pH = impl.ph([['acetic acid'], ['sodium acetate']], [[0.1], [0.1]], 'M', null, 25, 'ideal');
    const pKa = pKaAt(ACID_SYSTEMS.find((s) => s.id === 'acetate')!.steps[0], 25);
    // molal constants to mol/L with the solution's kg of water per litre, as CONSTANTS prints it
    const w = impl.constants([['acetic acid'], ['sodium acetate']], [[0.1], [0.1]], 'M', null, 25, 'ideal').find((r) => r[0] === 'water (kg per L of solution)')![2] as number;
    const h = 10 ** -pH * w, kw = 10 ** -pKw(25) * w ** 2, ka = 10 ** -pKa * w;
    const expected = LN10 * (0.2 * ka * h / (ka + h) ** 2 + h + kw / h); // C = 0.2 M total acetate
    expect(Math.abs(beta / expected - 1)).toBeLessThan(1e-9);
    expect(Math.abs(beta - LN10 * 0.2 / 4)).toBeLessThan(2e-4); // pH sits within 0.001 of pKa
  });

  test('pure water at 25 °C: ln10·(h + Kw/h) ≈ 4.6e-7 (common practice)', () => {
    const beta = impl.capacity([['NaCl']], [[1e-9]], 'M', null, 25, 'ideal');
    expect(Math.abs(beta / (LN10 * 2 * 10 ** (-pKw(25) / 2) * RHO_25) - 1)).toBeLessThan(1e-6);
  });

  // Numerical check of the analytic value: add a little strong base and a little strong acid.
  test.each([
    ['phosphate 3.40 g + 3.55 g in 1 L', ['KH2PO4', 'Na2HPO4'], [3.4 / 136.086, 3.55 / 141.959]],
    ['citrate 0.05 M + 0.05 M', ['citric acid', 'trisodium citrate'], [0.05, 0.05]],
    ['Tris 0.05 M + Tris HCl 0.05 M', ['Tris', 'Tris hydrochloride'], [0.05, 0.05]],
  ])('%s, ideal: β matches 2δ/ΔpH to 1e-6', (_, reagents, molar) => {
    const beta = impl.capacity(reagents.map((r) => [r]), molar.map((m) => [m]), 'M', null, 25, 'ideal');
    expect(Math.abs(centralDifference(reagents, molar, 'ideal') / beta - 1)).toBeLessThan(1e-6);
  });

  // Davies: the ionic strength moves as base goes in. Adding base (Na⁺) and acid (Cl⁻) each raise I by δ/2 through
  // the counter-ion, which cancels in the central difference, as it does in β.
  test.each([
    ['phosphate 0.025 + 0.025 M', ['KH2PO4', 'Na2HPO4'], [0.025, 0.025]],
    ['acetate 0.1 + 0.1 M', ['acetic acid', 'sodium acetate'], [0.1, 0.1]],
    ['Tris 0.05 + Tris HCl 0.05 M', ['Tris', 'Tris hydrochloride'], [0.05, 0.05]],
    ['citrate 0.05 + 0.05 M', ['citric acid', 'trisodium citrate'], [0.05, 0.05]],
  ])('%s, davies: β matches the central difference 2δ/ΔpH to 1e-6 at the buffer\'s density', (_, reagents, molar) => {
    const beta = impl.capacity(reagents.map((r) => [r]), molar.map((m) => [m]), 'M', null, 25, 'davies');
    expect(Math.abs(centralDifferenceAtFixedDensity(reagents, molar, 'davies') / beta - 1)).toBeLessThan(1e-6);
    // through the cells the density follows the added NaOH and HCl, which occupy different volumes: β leaves that
    // out, and it is under 2e-4 of β for these buffers
    expect(Math.abs(centralDifference(reagents, molar, 'davies') / beta - 1)).toBeLessThan(2e-4);
  });
});

describe('β from the solve\'s own last Jacobian', () => {
  // the joint Newton returns at a point it evaluated: its Jacobian there is the one β needs, so CAPACITY beside PHMIX
  // evaluates nothing; checked against the Jacobian evaluated again at the solution (the path the bracketed method takes)
  test.each([
    ['phosphate in 0.5 M NaCl, davies', [['KH2PO4'], ['Na2HPO4'], ['NaCl']], [[3.4], [3.55], [29.2]], 'davies'],
    ['citrate + NaOH, bates-guggenheim', [['citric acid'], ['NaOH']], [[9.6], [4]], 'bates-guggenheim'],
    ['EDTA with NaOH, davies', [['disodium EDTA dihydrate'], ['NaOH']], [[18.6], [2]], 'davies'],
  ])('%s', (_, reagents, grams, model) => {
    const rows = reagents.map(([reagent], i) => ({ reagent, amount: grams[i][0], unit: 'g', row: i + 1 }));
    const eq = solve(prepareProblem(buildContents(rows, 1), 25, model as 'davies'));
    expect(Number.isFinite(eq.lnActivityPerBase)).toBe(true);
    const spy = jest.spyOn(chargeBalanceModule, 'chargeBalanceJacobian');
    let beta: number;
    try {
      beta = bufferCapacity(eq);
      expect(spy).not.toHaveBeenCalled();
    } finally {
      spy.mockRestore();
    }
    expect(Math.abs(beta / bufferCapacity({ ...eq, lnActivityPerBase: NaN }) - 1)).toBeLessThan(1e-11);
    // and against full solves by the bracketed method with ± δ mol/L of strong-base charge (no counter-ion, as β has it)
    const delta = 1e-6 * eq.ionicStrengthM;
    const pHWith = (d: number): number => {
      const p = { ...eq.problem, strongChargeM: eq.problem.strongChargeM + d, systems: eq.problem.systems.map((x) => ({ ...x, lnCumK: new Float64Array(x.lnCumK.length) })) };
      return solve(p, eq.lnH, 'bracketed').pH;
    };
    expect(Math.abs((2 * delta) / (pHWith(delta) - pHWith(-delta)) / beta - 1)).toBeLessThan(1e-7);
  });
});
