import { buildContents } from '../src/engine';
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
