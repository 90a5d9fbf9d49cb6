import { ACID_SYSTEMS } from '../src/catalogue';
import { readback } from '../src/functions/readback';
import * as impl from '../src/functions/impl';
import { evaluateSheet } from '../scripts/lib/sheetEngine';

// A reviewer's rebuild from the four spills beside each other, in plain arithmetic written here (no engine function):
// moles and concentrations from READBACK's molar mass, assay, density or stock; each system's species in SPECIES
// summing to READBACK's total; the charge balance of SPECIES; pH = −log10 of H⁺'s activity; activity = γ c / ρw with
// γ from the Davies equation at CONSTANTS' A and the ionic strength summed from SPECIES; and each step's ratio
// giving the apparent pKa that CONSTANTS lists.
type Mix = [string[], number[], string[], number | null, number];
const MIXES: Mix[] = [
  [['KH2PO4', 'Na2HPO4'], [3.4, 3.55], ['g', 'g'], 1, 25],
  [['acetic acid', 'sodium acetate trihydrate'], [3.0, 6.8], ['g', 'g'], 0.5, 25],
  [['Tris', '1 M HCl'], [6.06, 20], ['g', 'mL'], 0.5, 37],
  [['citric acid monohydrate', 'NaOH'], [21.01, 6.0], ['g', 'g'], 1, 25],
  [['HEPES', '0.5 M NaOH', 'NaCl'], [11.92, 40, 8.77], ['g', 'mL', 'g'], 1, 25],
  [['boric acid', 'NaOH'], [0.62, 0.2], ['g', 'g'], 1, 20],
  [['phosphoric acid 85%', 'NaOH'], [1, 0.8], ['mL', 'g'], 1, 25],
  [['sodium bicarbonate', 'sodium carbonate'], [20, 10], ['mM', 'mM'], null, 25],
  [['MES', 'NaOH'], [50, 20], ['mM', 'mM'], null, 10],
  [['glycine', 'hydrochloric acid 37%'], [7.5, 0.5], ['g', 'mL'], 1, 25],
];

const num = (v: unknown) => v as number;

describe('READBACK with PHMIX, SPECIES and CONSTANTS: every number rebuilt by hand', () => {
  test.each(MIXES)('%p', (reagents, amounts, units, volume, t) => {
    const R = reagents.map((r) => [r]), A = amounts.map((a) => [a]), U = units.map((u) => [u]);
    const rb = readback(R, A, U, volume, t) as (string | number)[][];
    const species = impl.species(R, A, U, volume, t) as (string | number)[][];
    const constants = impl.constants(R, A, U, volume, t) as (string | number)[][];
    const pH = impl.ph(R, A, U, volume, t);
    const V = num(rb.find((r) => r[0] === 'final volume (L)')![1]);
    const totals = new Map<string, number>();
    rb.slice(1, 1 + reagents.length).forEach((row, i) => {
      const mm = num(row[3]), moles = num(row[5]), basis = String(row[4]);
      const unit = units[i], amount = amounts[i];
      let expected: number;
      if (unit === 'g') expected = basis.startsWith('density') ? amount * Number(/assay ([\d.]+)/.exec(basis)![1]) / mm : amount / mm;
      else if (unit === 'mL') expected = basis.startsWith('stock')
        ? (amount / 1000) * Number(/stock ([\d.]+)/.exec(basis)![1])
        : (amount * Number(/density ([\d.]+)/.exec(basis)![1]) * Number(/assay ([\d.]+)/.exec(basis)![1])) / mm;
      else expected = (amount / 1000) * V; // mM in the final volume
      expect(moles).toBeCloseTo(expected, 12);
      expect(num(row[6])).toBeCloseTo(moles / V, 12);
      for (const part of String(row[7]).split('; ')) {
        const m = /^(\S+) ([\d.e+-]+) mol\/L$/.exec(part);
        if (m && !/[⁺⁻]$/.test(m[1])) totals.set(m[1], (totals.get(m[1]) ?? 0) + Number(m[2]));
      }
    });
    const sp = species.slice(1).filter((r) => typeof r[1] === 'number' && typeof r[2] === 'number') as [string, number, number, number, number][];
    // charge balance and ionic strength from SPECIES alone
    const charge = sp.reduce((s, r) => s + r[1] * r[2], 0);
    const scale = sp.reduce((s, r) => s + Math.abs(r[1]) * r[2], 0);
    expect(Math.abs(charge) / scale).toBeLessThan(1e-9);
    const ionic = sp.reduce((s, r) => s + r[1] * r[1] * r[2], 0) / 2;
    expect(ionic).toBeCloseTo(num(species.find((r) => r[0] === 'ionic strength (mol/L)')![1]), 12);
    // Davies at CONSTANTS' A on the molal scale, activity = γ c / w (w: CONSTANTS' kg of water per L)
    const aDH = num(constants.find((r) => String(r[0]).startsWith('Debye'))![2]);
    const rho = num(constants.find((r) => r[0] === 'water (kg per L of solution)')![2]);
    const Im = ionic / rho;
    const logGamma1 = -aDH * (Math.sqrt(Im) / (1 + Math.sqrt(Im)) - 0.3 * Im);
    for (const [, z, c, gamma, activity] of sp) {
      expect(gamma).toBeCloseTo(10 ** (logGamma1 * z * z), 10);
      expect(activity).toBeCloseTo((gamma * c) / rho, 14);
    }
    const h = sp.find((r) => r[0] === 'H⁺')!;
    expect(-Math.log10(h[4])).toBeCloseTo(pH, 10);
    // each step's apparent pKa in CONSTANTS: pH − log10([base]/[acid]) from consecutive forms in SPECIES
    for (const row of constants.filter((r) => String(r[0]).startsWith('pKa ') && typeof r[3] === 'number')) {
      const name = String(row[0]).slice(4), k = num(row[1]);
      const labels = formsOf(name);
      const forms = sp.filter((r) => labels.includes(r[0]));
      const acid = forms[k - 1][2], base = forms[k][2];
      if (acid > 1e-250 && base > 1e-250) expect(pH - Math.log10(base / acid)).toBeCloseTo(num(row[3]), 8);
    }
    // mass balance: each system's forms sum to READBACK's released total
    for (const [id, total] of totals) {
      const forms = formsOf(id);
      if (forms.length === 0) continue;
      const sum = sp.filter((r) => forms.includes(r[0])).reduce((s, r) => s + r[2], 0);
      expect(Math.abs(sum / total - 1)).toBeLessThan(1e-5); // READBACK prints 6 significant figures
    }
  });
});

/** The form labels of a system, by id or name, as SPECIES prints them. */
function formsOf(idOrName: string): string[] {
  const sys = ACID_SYSTEMS.find((s) => s.id === idOrName || s.name === idOrName);
  return sys ? sys.forms : [];
}

describe('READBACK through the sheet', () => {
  test('one row per input row, then the final volume and temperature', () => {
    const v = evaluateSheet([['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'], ['=PROTIC.READBACK(A1:A2,B1:B2,C1:C2,1,25)']]);
    expect(v[2][0]).toBe('as typed');
    expect(v[3][1]).toBe('potassium dihydrogen phosphate');
    expect(v[3][5] as number).toBeCloseTo(3.4 / 136.0841, 6); // CIAAW 2021 sum for KH2PO4
    expect(v[3][7]).toMatch(/^phosphate 0\.024984\d* mol\/L; K⁺ 0\.024984\d* mol\/L$/);
    expect(v[5][0]).toBe('final volume (L)');
  });
});
