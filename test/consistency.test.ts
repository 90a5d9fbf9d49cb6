import * as impl from '../src/functions/impl';
import { apparentPKas, fractionsAtPH, resolveSystem } from '../src/engine';
import { expectMissWithin } from './helpers';

// Functions that answer the same question in different ways must agree.
const R = [['KH2PO4'], ['Na2HPO4'], ['NaCl']];
const A = [[3.4], [3.55], [5]];
const U = [['g'], ['g'], ['g']];
const row = (table: (string | number)[][], label: string): (string | number)[] => table.find((r) => r[0] === label)!;
// the mixture's kg of water per litre, as CONSTANTS prints it: the molal basis of its activity model
const waterOf = (t: number): number => row(impl.constants(R, A, U, 1, t) as (string | number)[][], 'water (kg per L of solution)')[2] as number;
const PHOSPHATE = resolveSystem('phosphate');

describe('the cell functions agree with one another', () => {
  test.each([25, 4, 37])('CURVE points are the PHMIX of the mixture with that much titrant, at %d °C', (t) => {
    const curve = impl.curve(R, A, U, 1, '1 M NaOH', 20, 5, t) as number[][];
    for (const [mL, pH] of curve) {
      expect(pH).toBeCloseTo(impl.ph([...R, ['1 M NaOH']], [...A, [mL]], [...U, ['mL']], 1 + mL / 1000, t), 12);
    }
  });

  test.each([25, 37])('TITRANT to a point of CURVE gives back its amount, at %d °C', (t) => {
    const [, [mL, pH]] = impl.curve(R, A, U, 1, '1 M NaOH', 20, 3, t) as number[][];
    expect(impl.titrant(pH, R, A, U, 1, '1 M NaOH', t)).toBeCloseTo(mL, 8);
  });

  test.each([25, 37])('FRACTIONS at SPECIES\' pH and ionic strength are SPECIES\' forms over their total, at %d °C', (t) => {
    const table = impl.species(R, A, U, 1, t) as (string | number)[][];
    const forms = ['H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'].map((f) => row(table, f)[2] as number);
    const total = forms.reduce((a, b) => a + b, 0);
    // at the mixture's own kg of water per litre; the cell FRACTIONS, which takes no composition, uses pure water's
    const fractions = fractionsAtPH(PHOSPHATE, row(table, 'pH')[1] as number, t, row(table, 'ionic strength (mol/L)')[1] as number, 'davies', waterOf(t));
    // the solver accepts an evaluated point whose next step in L is below 1e-12 (solver.ts), so the printed I gives an
    // L that may differ by that much: a share moves by α_j (⟨z²⟩ − z_j²) ΔL, here (H2PO4⁻ and HPO4²⁻, z² 1 and 4) at
    // most ¼ · 3 · 1e-12 ≈ 0.75e-12
    fractions.forEach((f, i) => expect(Math.abs(f - forms[i] / total)).toBeLessThan(1e-12));
    const cell = (impl.fractions('phosphate', row(table, 'pH')[1], t, row(table, 'ionic strength (mol/L)')[1]) as number[][])[0];
    // the density difference: about 1.2e-4 in the HPO4²⁻ and H2PO4⁻ shares here, where w is 0.17 % below ρw
    expectMissWithin(Math.max(...cell.map((f, i) => Math.abs(f - fractions[i]))), 1.2e-4, 0.2e-4);
  });

  test.each([25, 37])('PKA at SPECIES\' ionic strength is pH − log10([HPO4²⁻]/[H2PO4⁻]), at %d °C', (t) => {
    const table = impl.species(R, A, U, 1, t) as (string | number)[][];
    const apparent = (row(table, 'pH')[1] as number) - Math.log10((row(table, 'HPO4²⁻')[2] as number) / (row(table, 'H2PO4⁻')[2] as number));
    const I = row(table, 'ionic strength (mol/L)')[1] as number;
    expect(apparentPKas(PHOSPHATE, t, I, 'davies', waterOf(t))[1]).toBeCloseTo(apparent, 12);
    // the cell PKA converts I with pure water's density: about 2e-4 higher here (w is 0.17 % below ρw)
    expectMissWithin((impl.pka('phosphate', 2, t, I) as number) - apparent, 2.1e-4, 0.3e-4);
  });

  test.each([[7.2, 25], [6.8, 4], [7.4, 37]])('RECIPE\'s base form equals the solid NaOH TITRANT needs from the acid form alone (pH %d, %d °C)', (target, t) => {
    const recipe = impl.recipe('sodium dihydrogen phosphate', 'disodium hydrogen phosphate', target, 0.1, 1, t) as (string | number)[][];
    const baseMol = (recipe[1][1] as number) / impl.molarMass('disodium hydrogen phosphate');
    const naohMol = impl.titrant(target, [['sodium dihydrogen phosphate']], [[0.1]], 'mol', 1, 'NaOH', t, 'davies', 'mol');
    expect(Math.abs(naohMol / baseMol - 1)).toBeLessThan(1e-9); // same Na⁺ and phosphate in the same litre
  });

  test('IONICSTRENGTH is ½ Σ z² c over the SPECIES rows', () => {
    const table = impl.species(R, A, U, 1) as (string | number)[][];
    const half = table.slice(1).filter((r) => typeof r[1] === 'number' && typeof r[2] === 'number')
      .reduce((sum, r) => sum + 0.5 * (r[1] as number) ** 2 * (r[2] as number), 0);
    expect(impl.ionicStrength(R, A, U, 1)).toBeCloseTo(half, 14);
  });
});

describe('CONSTANTS: what the solve used, with sources', () => {
  test.each([25, 37])('each pKa at T, and at the mixture\'s own ionic strength as PKA gives it, at %d °C', (t) => {
    const table = impl.constants(R, A, U, 1, t) as (string | number)[][];
    expect(table[0]).toEqual(['constant', 'step', 'at this temperature, I = 0', 'at this ionic strength', 'source',
      'ΔrH° (kJ/mol)', 'ΔrCp° (J/(K·mol))', 'data range (°C)', 'provenance', 'alternative pKa (25 °C)', 'pH with the alternative − pH']);
    const I = impl.ionicStrength(R, A, U, 1, t);
    const phosphate = table.filter((r) => r[0] === 'pKa phosphate');
    expect(phosphate.map((r) => r[1])).toEqual([1, 2, 3]);
    phosphate.forEach((r) => {
      expect(r[2]).toBeCloseTo(impl.pka('phosphate', r[1], t), 12);
      expect(r[3] as number).toBeCloseTo(apparentPKas(PHOSPHATE, t, I, 'davies', waterOf(t))[(r[1] as number) - 1], 9); // both Davies at the same I/w
      expect(String(r[4])).toMatch(r[1] === 1 ? /^Bates 1951, J. Res. NBS 47, 127 \(checked/ : /Goldberg, Kishore & Lennen 2002/);
    });
    expect(row(table, 'pKw')[4]).toMatch(/IAPWS R11-07/);
    // pure water's density, which the dilute solution's kg of water per litre falls just below (CRC Handbook, from memory)
    const pure = Number(/pure water here: ([0-9.]+)/.exec(String(row(table, 'water (kg per L of solution)')[4]))![1]);
    expect(pure).toBeCloseTo(t === 25 ? 0.997047 : 0.99333, 4);
    expect(row(table, 'water (kg per L of solution)')[2] as number).toBeLessThan(t === 25 ? 0.997047 : 0.99333);
    expect(row(table, 'solution density (kg/L)')[4]).toMatch(/Laliberté/);
  });

  test('a reviewer reproduces the pH from CONSTANTS and SPECIES by hand: pH = pKa′ + log10([HPO4²⁻]/[H2PO4⁻])', () => {
    const species = impl.species(R, A, U, 1) as (string | number)[][];
    const pKa2 = (impl.constants(R, A, U, 1) as (string | number)[][]).filter((r) => r[0] === 'pKa phosphate')[1][3] as number;
    const handPH = pKa2 + Math.log10((row(species, 'HPO4²⁻')[2] as number) / (row(species, 'H2PO4⁻')[2] as number));
    expect(handPH).toBeCloseTo(row(species, 'pH')[1] as number, 10);
  });

  test('under bates-guggenheim the apparent values follow that model, not Davies', () => {
    const bg = (impl.constants(R, A, U, 1, 25, 'bates-guggenheim') as (string | number)[][]).filter((r) => r[0] === 'pKa phosphate')[1][3] as number;
    const davies = (impl.constants(R, A, U, 1, 25, 'davies') as (string | number)[][]).filter((r) => r[0] === 'pKa phosphate')[1][3] as number;
    expect(Math.abs(bg - davies)).toBeGreaterThan(0.005);
  });
});
