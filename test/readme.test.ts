import { readFileSync } from 'fs';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import type { SheetValue } from '../scripts/lib/sheetEngine';

// The README's function reference promises each example result came from the sheet runner on this
// version: every example is evaluated here and compared at the precision the README prints.
const README = readFileSync('README.md', 'utf8').replace(/\s*\n\s*/g, ' ');
const SHEET: (string | number)[][] = [['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g']];

/** The cells a formula fills, written below the two reagent rows. */
function evaluate(formula: string): SheetValue[][] {
  return evaluateSheet([...SHEET.map((r) => [...r]), [formula]]).slice(2);
}

/** Half a unit in the last printed place: 6.8758 → 5e-5, 4.43e-6 → 5e-9. */
function halfUlp(printed: string): number {
  const [mantissa, exponent] = printed.toLowerCase().split('e');
  const decimals = (mantissa.split('.')[1] ?? '').length;
  return 0.5 * 10 ** (-decimals + Number(exponent ?? 0));
}

const NUMERIC: [string, string, (v: SheetValue[][]) => SheetValue[]][] = [
  ['=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1)', '6.8758', (v) => [v[0][0]]],
  ['=PROTIC.TITRANT(7.4,A1:A2,B1:B2,C1:C2,1,"1 M NaOH")', '13.914', (v) => [v[0][0]]],
  ['=PROTIC.TITRANT(7.4,A1:A2,B1:B2,C1:C2,0.8,"1 M NaOH",25,"davies","mL",1)', '13.940', (v) => [v[0][0]]],
  ['=PROTIC.SALTDOSE(0.15,"NaCl",A1:A2,B1:B2,C1:C2,1)', '2.9215', (v) => [v[0][0]]],
  ['=PROTIC.CURVE(A1:A2,B1:B2,C1:C2,1,"1 M NaOH",20,3)', '0, 6.8758 / 10, 7.2279 / 20, 7.8016', (v) => v.slice(0, 3).flatMap((r) => r.slice(0, 2))],
  ['=PROTIC.FRACTIONS("phosphate",7.2)', '4.43e-6, 0.49884, 0.50115, 3.55e-6', (v) => v[0].slice(0, 4)],
  ['=PROTIC.IONICSTRENGTH(A1:A2,B1:B2,C1:C2,1)', '0.10001', (v) => [v[0][0]]],
  ['=PROTIC.CAPACITY(A1:A2,B1:B2,C1:C2,1)', '0.029996', (v) => [v[0][0]]],
  ['=PROTIC.PKA("Tris",1,37)', '7.7527', (v) => [v[0][0]]],
  ['=PROTIC.PKA("phosphate",2,25,0.15)', '6.8389', (v) => [v[0][0]]],
  ['=PROTIC.PKA("phosphate",2,25,0.15,"bates-guggenheim")', '6.8222', (v) => [v[0][0]]],
  ['=PROTIC.PKA("phosphate",2,25,1,"sit")', '6.5145', (v) => [v[0][0]]],
  ['=PROTIC.FRACTIONS("phosphate",7.2,25,0.1,"bates-guggenheim")', '2.19e-6, 0.31817, 0.68181, 1.71e-5', (v) => v[0].slice(0, 4)],
  ['=PROTIC.MOLARMASS("Na2HPO4·7H2O")', '268.06', (v) => [v[0][0]]],
  ['=PROTIC.PHMIX("1 M Tris-HCl pH 8.0",50,"mL",1)', '7.9445', (v) => [v[0][0]]],
  ['=PROTIC.PHTEMP(8.3,{"Tris";"Tris hydrochloride"},{50;50},"mM")', '19.983', (v) => [v[0][0]]],
];

describe('README examples evaluate to what the README prints', () => {
  test.each(NUMERIC)('%s → %s', (formula, printed, pick) => {
    expect(README).toContain(`\`${formula}\` → ${printed}`);
    const expected = printed.split(/\s*[,/]\s*/);
    const got = pick(evaluate(formula));
    expect(got).toHaveLength(expected.length);
    got.forEach((value, i) => expect(Math.abs((value as number) - Number(expected[i]))).toBeLessThanOrEqual(halfUlp(expected[i]) * (1 + 1e-9)));
  });

  test.each([
    ['=PROTIC.RECIPE("Tris hydrochloride","Tris",8,0.05,0.5)', [['Tris hydrochloride', '2.2893', 'g'], ['Tris', '1.2687', 'g']]],
    ['=PROTIC.RECIPE("hydrochloric acid 37%","Tris",8,0.05,1)', [['hydrochloric acid 37%', '2.4179', 'mL'], ['Tris', '6.0568', 'g']]],
  ])('RECIPE %s: the forms, their amounts and units', (formula, rows) => {
    expect(README).toContain(`\`${formula}\` → ${rows.map((r) => r.join(' ')).join(', ')}`);
    const v = evaluate(formula);
    rows.forEach(([form, amount, unit], i) => {
      expect([v[i][0], v[i][2]]).toEqual([form, unit]);
      expect(Math.abs((v[i][1] as number) - Number(amount))).toBeLessThanOrEqual(halfUlp(amount));
    });
  });

  test('TITRANT: a target beyond the titrant is #N/A with the reachable range the README prints', () => {
    const formula = '=PROTIC.TITRANT(12.5,A1:A2,B1:B2,C1:C2,1,"0.01 M NaOH")';
    expect(README).toContain(`\`${formula}\` → \`#N/A\` … reachable pH 6.8758 to 11.948.`);
    const v = evaluate(formula)[0][0] as { error: string; message: string };
    expect(v.error).toBe('#N/A');
    expect(v.message).toContain('reachable pH 6.8758 to 11.948.');
  });

  test('SPECIES: pH, ionic strength and warning rows', () => {
    const formula = '=PROTIC.SPECIES("0.1 M HCl",10,"mL",0.1)';
    expect(README).toContain(`\`${formula}\` → … pH 2.0436, ionic strength 0.0100`);
    const v = evaluate(formula);
    const row = (label: string): SheetValue => v.find((r) => r[0] === label)![1];
    expect(Math.abs((row('pH') as number) - 2.0436)).toBeLessThanOrEqual(halfUlp('2.0436'));
    expect(Math.abs((row('ionic strength (mol/L)') as number) - 0.01)).toBeLessThanOrEqual(halfUlp('0.0100'));
    expect(row('charge-balance residual (relative)') as number).toBeLessThan(1e-12);
    expect(row('warning')).toBe('none');
  });

  test('CONSTANTS: the phosphate step 2 row', () => {
    const formula = '=PROTIC.CONSTANTS(A1:A2,B1:B2,C1:C2,1)';
    expect(README).toContain(`\`${formula}\` → … pKa phosphate, 2, 7.198, 6.8754, Goldberg, Kishore & Lennen 2002 …`);
    const step2 = evaluate(formula).find((r) => r[0] === 'pKa phosphate' && r[1] === 2)!;
    expect(step2[2]).toBe(7.198);
    expect(Math.abs((step2[3] as number) - 6.8754)).toBeLessThanOrEqual(halfUlp('6.8754'));
    expect(String(step2[4])).toMatch(/^Goldberg, Kishore & Lennen 2002/);
  });

  test('READBACK, HANDCHECK and UNCERTAINTY: the values printed', () => {
    const rb = '=PROTIC.READBACK(A1:A2,B1:B2,C1:C2,1)';
    expect(README).toContain(`\`${rb}\` → 3.4 g KH2PO4, potassium dihydrogen phosphate, KH2PO4, 136.084, 0.024985 mol, phosphate 0.0249846 mol/L; K⁺ 0.0249846 mol/L …`);
    const r = evaluate(rb)[1];
    expect(r.slice(0, 3)).toEqual(['3.4 g KH2PO4', 'potassium dihydrogen phosphate', 'KH2PO4']);
    expect(Math.abs((r[3] as number) - 136.084)).toBeLessThanOrEqual(halfUlp('136.084'));
    expect(Math.abs((r[5] as number) - 0.024985)).toBeLessThanOrEqual(halfUlp('0.024985'));
    expect(r[7]).toBe('phosphate 0.0249846 mol/L; K⁺ 0.0249846 mol/L');
    const hc = '=PROTIC.HANDCHECK(A1:A2,B1:B2,C1:C2,1,25,6.86)';
    expect(README).toContain(`\`${hc}\` → textbook estimate 7.1984, exact pH 6.8758, shift: activity −0.3226 …`);
    const h = evaluate(hc), row = (label: string) => h.find((x) => x[0] === label)!;
    expect(Math.abs((row('textbook estimate')[1] as number) - 7.1984)).toBeLessThanOrEqual(halfUlp('7.1984'));
    expect(Math.abs((row('exact pH')[1] as number) - 6.8758)).toBeLessThanOrEqual(halfUlp('6.8758'));
    expect(Math.abs((row('shift: activity')[2] as number) + 0.3226)).toBeLessThanOrEqual(halfUlp('0.3226'));
    const un = '=PROTIC.UNCERTAINTY(A1:A2,B1:B2,C1:C2,1,25,,0.01,0.002,0.5)';
    expect(README).toContain(`\`${un}\` → … combined standard uncertainty u(pH) 0.0116, expanded uncertainty U (k = 2) 0.0232`);
    const u = evaluate(un), urow = (label: string) => u.find((x) => x[0] === label)![1] as number;
    expect(Math.abs(urow('combined standard uncertainty u(pH)') - 0.0116)).toBeLessThanOrEqual(halfUlp('0.0116'));
    expect(Math.abs(urow('expanded uncertainty U (k = 2)') - 0.0232)).toBeLessThanOrEqual(halfUlp('0.0232'));
  });

  test.each([
    ['=PROTIC.WARNINGS({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;700},{"g";"g";"mM"},1)'],
    ['=PROTIC.VERSION()'],
  ])('%s: the text printed', (formula) => {
    const text = evaluate(formula)[0][0] as string;
    expect(README).toContain(`\`${formula}\` → \`${text}\``);
  });
});
