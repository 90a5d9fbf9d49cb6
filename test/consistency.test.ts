import * as impl from '../src/functions/impl';

// Functions that answer the same question in different ways must agree.
const R = [['KH2PO4'], ['Na2HPO4'], ['NaCl']];
const A = [[3.4], [3.55], [5]];
const U = [['g'], ['g'], ['g']];
const row = (table: (string | number)[][], label: string): (string | number)[] => table.find((r) => r[0] === label)!;

describe('the cell functions agree with one another', () => {
  test.each([25, 4, 37])('CURVE points are the PH of the mixture with that much titrant, at %d °C', (t) => {
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
    const fractions = (impl.fractions('phosphate', row(table, 'pH')[1], t, row(table, 'ionic strength (mol/L)')[1]) as number[][])[0];
    fractions.forEach((f, i) => expect(Math.abs(f - forms[i] / total)).toBeLessThan(1e-14));
  });

  test.each([25, 37])('PKA at SPECIES\' ionic strength is pH − log10([HPO4²⁻]/[H2PO4⁻]), at %d °C', (t) => {
    const table = impl.species(R, A, U, 1, t) as (string | number)[][];
    const apparent = (row(table, 'pH')[1] as number) - Math.log10((row(table, 'HPO4²⁻')[2] as number) / (row(table, 'H2PO4⁻')[2] as number));
    expect(impl.pka('phosphate', 2, t, row(table, 'ionic strength (mol/L)')[1])).toBeCloseTo(apparent, 12);
  });

  test('IONICSTRENGTH is ½ Σ z² c over the SPECIES rows', () => {
    const table = impl.species(R, A, U, 1) as (string | number)[][];
    const half = table.slice(1).filter((r) => typeof r[1] === 'number' && typeof r[2] === 'number')
      .reduce((sum, r) => sum + 0.5 * (r[1] as number) ** 2 * (r[2] as number), 0);
    expect(impl.ionicStrength(R, A, U, 1)).toBeCloseTo(half, 14);
  });
});
