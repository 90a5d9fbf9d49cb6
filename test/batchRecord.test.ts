import { readFileSync } from 'fs';
import { parseCsv, typedCell } from '../scripts/lib/csv';
import { evaluateSheet } from '../scripts/lib/sheetEngine';

// The bundled batch record (a scenario of our own): each step's own check holds when the sheet is evaluated.
describe('examples/batch-record.csv', () => {
  const v = evaluateSheet(parseCsv(readFileSync('examples/batch-record.csv', 'utf8')).map((r) => r.map(typedCell)));
  const cell = (address: string): unknown => {
    const m = /^([A-Z])(\d+)$/.exec(address)!;
    return v[Number(m[2]) - 1][m[1].charCodeAt(0) - 65];
  };

  test('the 10× concentrate diluted 1:10 is the 1× weigh-out (PHMIX within 1e-9)', () => {
    expect(String(cell('B7'))).toMatch(/^10× saline-phosphate: NaCl 80 g, KCl 2 g, Na2HPO4·7H2O 26\.8 g, KH2PO4 2\.4 g, to 1 L ⟦stock v1 /);
    expect(Math.abs((cell('B12') as number) - (cell('B13') as number))).toBeLessThan(1e-9);
  });

  test('the Tris wash made from a 1 M Tris-HCl pH 8.0 stock carries the stock\'s own warning', () => {
    expect(typeof cell('B19')).toBe('number');
    expect(String(cell('B20'))).toMatch(/^the stock 1 M Tris pH 8 itself, as adjusted at 25 °C/);
  });

  test('adjust, then make up to volume: the HCl TITRANT returns, added and made up to 1 L, reads the target', () => {
    expect(cell('B29') as number).toBeGreaterThan(0);
    expect(Math.abs((cell('B30') as number) - (cell('B28') as number))).toBeLessThan(1e-6);
    expect(cell('B31')).toBe('none');
  });
});
