// Valid calls of every cell function and hostile values to put in their places; shared by the
// hostile-input test and the benchmark that times the slowest cell.

export const R = [['KH2PO4'], ['Na2HPO4']];
export const A = [[3.4], [3.55]];
export const VALID: Record<string, unknown[]> = {
  ph: [R, A, 'g', 1, 25, 'davies'],
  titrant: [7.4, R, A, 'g', 1, '1 M NaOH', 25, 'davies', 'mL'],
  curve: [R, A, 'g', 1, '1 M NaOH', 20, 11, 25, 'davies', 'mL'],
  fractions: ['phosphate', 7, 25, 0.1],
  species: [R, A, 'g', 1, 25, 'davies'],
  warnings: [R, A, 'g', 1, 25, 'davies'],
  constants: [R, A, 'g', 1, 25, 'davies'],
  ionicStrength: [R, A, 'g', 1, 25, 'davies'],
  capacity: [R, A, 'g', 1, 25, 'bates-guggenheim'],
  pka: ['phosphate', 2, 25, 0.1],
  recipe: ['NaH2PO4·H2O', 'Na2HPO4·7H2O', 7.4, 0.1, 1, 25, 'davies', [['NaCl']], [[0.15]], 'M'],
  molarMass: ['Na2HPO4·7H2O'],
  version: [],
};

const longText = 'Na'.repeat(5000);
const manyRows = Array.from({ length: 10000 }, () => ['NaCl']);
const manyAmounts = Array.from({ length: 10000 }, () => [1e-6]);
export const HOSTILE: unknown[] = [
  null, undefined, '', ' ', 0, -1, -0, 1e308, -1e308, 1e-300, NaN, Infinity, -Infinity, true, false, {}, [], [[]], [[null]],
  longText, '💧🧪', '<script>alert(1)</script>', '=1+1', 'NaN', '1e400', '\u0000', 'ø', 40, -40, 300, 101, 2.5, 1001, 1002,
  [[1, 2, 3]], [['a', 'b'], ['c', 'd']], manyRows, manyAmounts, [[1e308], [1e308]], [[-1], [2]], [['1 M HCl'], ['NaOH']],
  '1e-12 M NaCl', '10 M NaOH', '1000 M HCl', 'Na2HPO4·99H2O', 'H', 'C60', 'X', '(((', 'ideal', 'pitzer', 'mL', 'kg', 'µmol', 'uM',
];

