import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { loadSystemsFile } from '../scripts/lib/systemsFile';
import { applyCustomDefinitions, clearCustomDefinitions } from '../src/engine';
import type { SheetValue } from '../scripts/lib/sheetEngine';
import { runSheet } from '../scripts/sheet';
import { ph } from '../src/functions/impl';
import { expectMissWithin } from './helpers';

// The cell functions through a real spreadsheet engine (HyperFormula), as the runner uses them.

const BATCH = [
  ['reagent', 'amount', 'unit'],
  ['KH2PO4', 3.40, 'g'],
  ['Na2HPO4', 3.55, 'g'],
  [null, null, null],
];

function sheet(extra: (string | number | null)[][]): SheetValue[][] {
  return evaluateSheet([...BATCH.map((r) => [...r]), ...extra]);
}

describe('cell functions in HyperFormula', () => {
  test('ranges, a single unit cell and a blank row', () => {
    const v = sheet([['=PROTIC.PHMIX(A2:A4,B2:B4,"g",1)'], ['=PROTIC.PHMIX(A2:A4,B2:B4,C2:C4,1)']]);
    expect(v[4][0]).toBeCloseTo(ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1), 12);
    expect(v[5][0]).toBe(v[4][0]);
    expect(Math.abs((v[4][0] as number) - 6.876)).toBeLessThan(0.01);
  });

  test('a 0 from an empty cell is a blank row, and "" too', () => {
    const v = evaluateSheet([['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'], ['', 0, ''], ['=PROTIC.PHMIX(A1:A3,B1:B3,C1:C3,1)']]);
    expect(typeof v[3][0]).toBe('number');
  });

  test('spills fill the cells beside them', () => {
    const v = sheet([['=PROTIC.FRACTIONS("phosphate",7.2)'], ['=PROTIC.RECIPE("NaH2PO4·H2O","Na2HPO4·7H2O",7.4,0.1,1)'], [null], ['=PROTIC.CURVE(A2:A3,B2:B3,"g",1,"1 M NaOH",20,5)']]);
    const fr = v[4].slice(0, 4) as number[];
    expect(fr.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    expect(v[5][0]).toBe('NaH2PO4·H2O');
    expect(v[6][0]).toBe('Na2HPO4·7H2O');
    expect(v[6][1] as number).toBeGreaterThan(0);
    const curve = v.slice(7, 12).map((r) => r.slice(0, 2));
    expect(curve.map((r) => r[0])).toEqual([0, 5, 10, 15, 20]);
    for (let i = 1; i < 5; i++) expect(curve[i][1] as number).toBeGreaterThan(curve[i - 1][1] as number);
  });

  test('SPECIES lays out a header, species rows and the audit rows', () => {
    const v = sheet([['=PROTIC.SPECIES(A2:A3,B2:B3,"g",1)']]);
    expect(v[4].slice(0, 5)).toEqual(['species', 'charge', 'concentration (mol/L)', 'activity coefficient', 'activity']);
    const labels = v.slice(5).map((r) => r[0]);
    for (const label of ['H⁺', 'OH⁻', 'K⁺', 'Na⁺', 'H2PO4⁻', 'HPO4²⁻', 'pH', 'ionic strength (mol/L)', 'charge-balance residual (relative)', 'model', 'warning']) expect(labels).toContain(label);
  });

  test('a reviewer reproduces the SPECIES activity column and the pH from the printed water density', () => {
    const v = sheet([['=PROTIC.SPECIES(A2:A3,B2:B3,"g",1)']]);
    const rows = v.slice(5);
    const modelText = rows.find((r) => r[0] === 'model')![1] as string;
    const rhoW = Number(/w ([0-9.]+) kg of water per L of solution/.exec(modelText)![1]);
    // a dilute buffer: just below water's 0.997047 kg/L at 25 °C (CRC Handbook, from memory), by the solutes' volume
    expect(rhoW).toBeLessThan(0.997047);
    expect(rhoW).toBeGreaterThan(0.997047 - 0.003);
    for (const r of rows.filter((row) => typeof row[1] === 'number' && typeof row[4] === 'number')) {
      const [, , c, gamma, activity] = r as [string, number, number, number, number];
      expect(Math.abs((gamma * c) / rhoW / activity - 1)).toBeLessThan(1e-6); // w printed to 6 decimals
    }
    const hydrogen = rows.find((r) => r[0] === 'H⁺')!;
    const pH = rows.find((r) => r[0] === 'pH')![1] as number;
    expect(-Math.log10(hydrogen[4] as number)).toBeCloseTo(pH, 10);
  });

  test.each([
    ['=PROTIC.PHMIX("unobtainium",1,"g",1)', '#VALUE!', /unknown reagent/],
    ['=PROTIC.PHMIX(A2:A3,B2:B5,"g",1)', '#VALUE!', /different shapes/],
    ['=PROTIC.PHMIX(A2:A3,B2:B3,"g")', '#VALUE!', /final volume needed/],
    ['=PROTIC.PHMIX(A2:A3,B2:B3,"g",1,25,"pitzer")', '#VALUE!', /unknown activity model/],
    ['=PROTIC.PHMIX(A2:A3,B2:B3,"g",1,99)', '#VALUE!', /outside the range/],
    ['=PROTIC.TITRANT(5,A2:A3,B2:B3,"g",1,"1 M NaOH")', '#N/A', /other side/],
    ['=PROTIC.RECIPE("NaH2PO4·H2O","Na2HPO4·7H2O",11,0.1,1)', '#N/A', /cannot bracket/],
    ['=PROTIC.MOLARMASS("Na2HPO4)")', '#VALUE!', /character 8/],
    ['=PROTIC.PKA("phosphate",4)', '#VALUE!', /step from 1 to 3/],
    ['=PROTIC.PHMIX(A2:A3,B2:B3,"gallons",1)', '#VALUE!', /unit not allowed here/],
    ['=PROTIC.PHMIX(A2:A3,{3.4;-1},"g",1)', '#VALUE!', /row 2: amount not usable\. Received -1/],
    ['=PROTIC.FRACTIONS("phosphate",40)', '#VALUE!', /pH between −1 and 15/],
    ['=PROTIC.CURVE(A2:A3,B2:B3,"g",1,"NaOH",5,11,25,"davies","mL")', '#VALUE!', /g mg kg or mol mmol µmol for a solid titrant/],
    ['=PROTIC.PHMIX(TRUE(),"x",1)', '#VALUE!', /logical value TRUE/],
    ['=PROTIC.SPECIES(1/0,1,"g")', '#DIV/0!', /.*/], // the sheet's own error passes through untouched
  ])('%s gives %s with its message', (formula, error, pattern) => {
    const v = sheet([[formula]]);
    const cell = v[4][0] as { error: string; message: string };
    expect(cell.error).toBe(error);
    expect(cell.message).toMatch(pattern);
  });

  test('a 50-row what-if table of added NaCl against pH and ionic strength', () => {
    const rows: (string | number | null)[][] = [['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'], ['NaCl', 0, 'mM']];
    for (let i = 0; i < 50; i++) {
      const r = i + 4;
      rows.push([i * 5, `=PROTIC.PHMIX({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;0}+{0;0;1}*A${r},{"g";"g";"mM"},1)`, `=PROTIC.IONICSTRENGTH(A$1:A$3,{3.4;3.55;0}+{0;0;1}*A${r},C$1:C$3,1)`]);
    }
    const v = evaluateSheet(rows);
    const table = v.slice(3, 53);
    for (let i = 1; i < 50; i++) {
      expect(table[i][1] as number).toBeLessThan(table[i - 1][1] as number); // salt lowers the phosphate pH up to about 0.3 mol/L under Davies
      expect(table[i][2] as number).toBeGreaterThan(table[i - 1][2] as number);
    }
    expect(Math.abs((table[10][2] as number) - (table[0][2] as number) - 0.05)).toBeLessThan(0.001);
  });

  test('a WARNINGS column beside PH flags the rows outside the model and only those', () => {
    const rows: (string | number | null)[][] = [];
    for (const nacl of [0, 100, 300, 700, 1000]) {
      const r = rows.length + 1;
      rows.push([nacl, `=PROTIC.PHMIX({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;0}+{0;0;1}*A${r},{"g";"g";"mM"},1)`, `=PROTIC.WARNINGS({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;0}+{0;0;1}*A${r},{"g";"g";"mM"},1)`]);
    }
    const v = evaluateSheet(rows);
    expect(v.map((row) => typeof row[1])).toEqual(['number', 'number', 'number', 'number', 'number']);
    // the buffer alone gives I = 0.10 mol/L, each row adds its NaCl; the Davies pH departs from the sit pH by more
    // than 0.02 from 100 mM NaCl on (0.038 there), so those rows are flagged (README, WARNINGS)
    expect(v.map((row) => (row[2] === 'none' ? 'none' : /the Davies pH departs from the SIT model's/.test(String(row[2])) ? 'departs' : row[2])))
      .toEqual(['none', 'departs', 'departs', 'departs', 'departs']);
  });

  test('the runner prints full precision and messages on request', () => {
    const out = runSheet('KH2PO4,3.4,g\nNa2HPO4,3.55,g\n"=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1)"\n"=PROTIC.PHMIX(""x"",1,""g"",1)"\n', true);
    const lines = out.trim().split('\n');
    expect(Number(lines[2])).toBeCloseTo(ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1), 14);
    expect(lines[3]).toMatch(/^"#VALUE! reagents, row 1: unknown reagent/);
  });
});

describe('the runner with --systems', () => {
  afterEach(() => clearCustomDefinitions());
  test('custom systems from a JSON file are used by the cells', () => {
    expect(loadSystemsFile('examples/custom-systems.json')).toEqual([]);
    const out = runSheet('zorbic acid,0.05,M\nsodium zorbate,0.05,M\n"=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,,25,""ideal"")"\n"=PROTIC.PKA(""Zorbate"",1)"\n', false);
    const lines = out.trim().split('\n');
    expect(Number(lines[2])).toBeCloseTo(5.5, 2);
    expect(Number(lines[3])).toBe(5.5);
  });
  test('a custom copy of acetate with its ΔrH° and ΔrCp° gives the catalogue\'s pH at 37 °C', () => {
    const acetate = { name: 'Acetoid', pKa: [4.756], charge: 0, dH: [-0.41], dCp: [-142],
      forms: [{ name: 'acetoid acid', formula: 'C2H4O2', protonsLost: 0 }, { name: 'sodium acetoidate', formula: 'C2H3NaO2', protonsLost: 1 }] };
    expect(applyCustomDefinitions({ systems: [acetate] })).toEqual([]);
    for (const t of [4, 25, 37]) {
      // the same constants; only the density differs: a custom system has no density fit, so its forms take the stated
      // estimate (0.6 L/kg at 150 g/mol) where acetate has its fits, and the pH is lower by 1.6e-4 (a known difference)
      expectMissWithin(ph([['acetoid acid'], ['sodium acetoidate']], [[0.05], [0.05]], 'M', null, t) - ph([['acetic acid'], ['sodium acetate']], [[0.05], [0.05]], 'M', null, t), -1.59e-4, 0.05e-4);
    }
    expect(applyCustomDefinitions({ systems: [{ ...acetate, dH: undefined }] })[0]).toMatch(/custom system 1 dCp: value not usable\. Received ΔrCp° without ΔrH°/);
    expect(applyCustomDefinitions({ systems: [{ ...acetate, dCp: [5000] }] })[0]).toMatch(/custom system 1 dCp/);
  });
  test('a bad file is refused with its problems', () => {
    const path = require('path').join(require('os').tmpdir(), 'protic-bad-systems.json');
    require('fs').writeFileSync(path, JSON.stringify({ systems: [{ name: 'x<y', pKa: [3], charge: 0 }] }));
    expect(loadSystemsFile(path)[0]).toMatch(/custom system 1 name: value not usable/);
  });
});
