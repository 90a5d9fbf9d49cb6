import { buildContents } from '../src/engine';
import * as impl from '../src/functions/impl';
import { ph, species } from '../src/functions/impl';

function concentrationOf(table: (string | number)[][], name: string): number {
  return (table.find((r) => r[0] === name) as (string | number)[])[2] as number;
}

describe('turning batch-record rows into a solution', () => {
  test('stock volumes with no final volume are added (additive volumes)', () => {
    const t = species([['1 M HCl'], ['1 M NaOH']], [[10], [5]], 'mL');
    expect(concentrationOf(t, 'Cl⁻')).toBeCloseTo(0.01 / 0.015, 12);
    expect(concentrationOf(t, 'Na⁺')).toBeCloseTo(0.005 / 0.015, 12);
  });

  test('a liquid with a catalogue density, dispensed by volume', () => {
    const c = buildContents([{ reagent: 'phosphoric acid 85%', amount: 1, unit: 'mL', row: 1 }], 1);
    // 1 mL × 1.685 g/mL × 0.85 / 97.995 g/mol (density and assay: CRC Handbook, from memory)
    expect(c.systemMoles.get('phosphate')).toBeCloseTo((1.685 * 0.85) / 97.995, 6);
  });

  test('a liquid as sold, weighed: only its assay is the compound, and its volume counts toward the final volume', () => {
    const c = buildContents([{ reagent: 'phosphoric acid 85%', amount: 1.685, unit: 'g', row: 1 }], 1);
    expect(c.systemMoles.get('phosphate')).toBeCloseTo((1.685 * 0.85) / 97.995, 6); // the same 1 mL as above
    expect(c.rows[0].volumeL).toBeCloseTo(0.001, 12);
    const byMass = ph([['phosphoric acid 85%']], [[1.1529]], 'g', 1);
    expect(byMass).toBeCloseTo(ph([['phosphoric acid 85%']], [[1.1529 / 1.685]], 'mL', 1), 10);
    expect(byMass).toBeCloseTo(ph([['H3PO4']], [[1.1529 * 0.85]], 'g', 1), 10);
    expect(() => ph([['hydrochloric acid 37%']], [[150]], 'g', 0.1)).toThrow(/at least the 0\.1267 L of stocks and liquids the rows add/);
  });

  test('final concentrations need no volume; u, µ and the Greek mu are the same prefix; litres take any case', () => {
    const a = ph([['Tris'], ['Tris HCl']], [[25000], [25000]], 'µM');
    expect(ph([['Tris'], ['Tris HCl']], [[25000], [25000]], 'uM')).toBe(a);
    expect(ph([['Tris'], ['Tris HCl']], [[25000], [25000]], 'μM')).toBe(a);
    expect(ph([['Tris'], ['Tris HCl']], [[25], [25]], 'mM')).toBeCloseTo(a, 12);
    expect(ph([['1 M HCl']], [[1]], 'ml', 0.1)).toBe(ph([['1 M HCl']], [[1]], 'mL', 0.1));
  });

  test('a hydrate mix-up changes the moles weighed: 7H2O against 12H2O', () => {
    const hepta = buildContents([{ reagent: 'Na2HPO4·7H2O', amount: 10, unit: 'g', row: 1 }], 1).systemMoles.get('phosphate') as number;
    const dodeca = buildContents([{ reagent: 'Na2HPO4·12H2O', amount: 10, unit: 'g', row: 1 }], 1).systemMoles.get('phosphate') as number;
    expect(hepta / dodeca).toBeCloseTo(358.14 / 268.07, 3); // handbook molar masses, CRC (from memory)
  });

  test('the three spellings of the hydrate dot are the same reagent', () => {
    const a = ph([['Na2HPO4·7H2O'], ['NaH2PO4·H2O']], [[2], [1]], 'g', 1);
    expect(ph([['Na2HPO4.7H2O'], ['NaH2PO4.H2O']], [[2], [1]], 'g', 1)).toBe(a);
    expect(ph([['Na2HPO4*7H2O'], ['NaH2PO4*H2O']], [[2], [1]], 'g', 1)).toBe(a);
  });

  test('a row of a 2-D range counts in row-major order, for messages', () => {
    expect(() => ph([['KH2PO4', 'nonsense']], [[1, 1]], 'g', 1)).toThrow(/reagents, row 2: unknown reagent/);
  });
});

describe('one amount, every way of writing it, one pH', () => {
  const BUFFER = [['KH2PO4'], ['Na2HPO4']];
  const BUFFER_M = [[0.025], [0.025]];
  const HCL_G_PER_MOL = 1.008 + 35.45; // CIAAW conventional values
  const reference = ph([...BUFFER, ['HCl']], [...BUFFER_M, [0.01]], 'M', 1);
  // 0.01 mol HCl into 1 L; density and assay of the 37 % acid: CRC Handbook (from memory), as in the catalogue
  test.each([
    ['HCl', 10, 'mmol'], ['HCl', 0.01 * HCL_G_PER_MOL, 'g'], ['HCl', 10, 'mM'],
    ['1 M HCl', 10, 'mL'], ['1 M HCl', 0.01, 'L'], ['1 M HCl', 0.01, 'mol'], ['1 M HCl', 10, 'mM'], ['1000 mM HCl', 10000, 'µL'],
    ['hydrochloric acid 37%', (0.01 * HCL_G_PER_MOL) / 0.37, 'g'], ['hydrochloric acid 37%', (0.01 * HCL_G_PER_MOL) / 0.37 / 1.184, 'mL'],
    ['hydrochloric acid 37%', 0.01, 'mol'], ['hydrochloric acid 37%', 10, 'mM'],
    [`${HCL_G_PER_MOL} g/L HCl`, 10, 'mL'], [`${HCL_G_PER_MOL / 10} mg/mL HCl`, 100, 'mL'], [`${HCL_G_PER_MOL / 100}% w/v HCl`, 100, 'mL'],
    [`${HCL_G_PER_MOL * 1000} mg/L HCl`, 0.01, 'L'],
  ] as [string, number, string][])('%s, %d %s', (reagent, amount, unit) => {
    expect(ph([...BUFFER, [reagent]], [...BUFFER_M, [amount]], [['M'], ['M'], [unit]], 1)).toBeCloseTo(reference, 10);
  });

  test('a stock by mass takes the molar mass of the form written, hydrate included', () => {
    expect(ph([['5 mg/mL Na2HPO4·7H2O']], [[20]], 'mL', 0.1)).toBeCloseTo(ph([['Na2HPO4·7H2O']], [[0.1]], 'g', 0.1), 12);
    expect(ph([['5 mg/mL Na2HPO4']], [[20]], 'mL', 0.1)).toBeCloseTo(ph([['Na2HPO4']], [[0.1]], 'g', 0.1), 12);
    expect(impl.titrant(7.4, BUFFER, BUFFER_M, 'M', 1, '4% w/v NaOH')).toBeCloseTo(impl.titrant(7.4, BUFFER, BUFFER_M, 'M', 1, `${40 / impl.molarMass('NaOH')} M NaOH`), 9);
    expect(() => ph([['10% w/v hydrochloric acid 37%']], [[1]], 'mL', 0.1)).toThrow(/a solid or a formula before a mass concentration; hydrochloric acid 37% is a liquid as sold/);
  });

  test('a liquid titrant: grams are millilitres times its density, moles are the assay', () => {
    const args = [6.5, BUFFER, BUFFER_M, 'M', 1, 'hydrochloric acid 37%', 25, 'davies'] as const;
    const mL = impl.titrant(...args, 'mL');
    expect(impl.titrant(...args, 'g')).toBeCloseTo(mL * 1.184, 8);
    expect(impl.titrant(...args, 'mmol')).toBeCloseTo((mL * 1.184 * 0.37 * 1000) / HCL_G_PER_MOL, 6);
  });
});
