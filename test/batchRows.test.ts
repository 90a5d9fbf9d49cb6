import { readFileSync } from 'fs';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import type { SheetValue } from '../scripts/lib/sheetEngine';
import { applyCustomDefinitions, buildContents, clearCustomDefinitions, molarMassGPerMol, pKw, prepareProblem, solve } from '../src/engine';
import { expectMissWithin } from './helpers';

// Rows a bill of materials carries, through the spreadsheet engine: excipients, water, the new units and
// normality, formulation amino acids; and the silent wrong numbers of the audit, each now refused.

type Grid = (string | number | null)[][];
const one = (formula: string, rows: Grid = []): SheetValue => {
  const v = evaluateSheet([...rows, [formula]]);
  return v[rows.length][0];
};
const errorOf = (value: SheetValue): { error: string; message: string } => {
  expect(typeof value).toBe('object');
  return value as { error: string; message: string };
};

const BUFFER: Grid = [['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g']];
const WITH_EXCIPIENTS: Grid = [...BUFFER, ['sucrose', 85.6, 'g'], ['polysorbate 80', 0.2, 'g'], ['D-mannitol', 5, '% w/v'], ['glycerol', 10, 'mL'], ['trehalose dihydrate', 20, 'g/L']];

describe('excipients: accepted in every mixture function, with no acid–base effect', () => {
  const n = BUFFER.length, m = WITH_EXCIPIENTS.length;
  const contentsOf = (grid: Grid) => buildContents(grid.map((r, i) => ({ reagent: String(r[0]), amount: Number(r[1]), unit: String(r[2]), row: i + 1 })), 1);
  test('they release no system and no ion: the buffer\'s own equilibrium at the kg of water per litre they leave', () => {
    // 166 g/L of sugars, polyols and surfactant take the litre's water down by about 10 %: every molality rises by as
    // much, which moves the Davies pH by −0.010; at that same water content the buffer alone gives the same pH exactly
    const withExcipients = prepareProblem(contentsOf(WITH_EXCIPIENTS), 25, 'davies');
    const alone = prepareProblem(contentsOf(BUFFER), 25, 'davies');
    expect(alone.systems.map((s) => s.system.id)).toEqual(withExcipients.systems.map((s) => s.system.id));
    expect(Array.from(alone.totalsM)).toEqual(Array.from(withExcipients.totalsM));
    expect(alone.ions).toEqual(withExcipients.ions);
    const atSameWater = { ...alone, lnWaterDensity: withExcipients.lnWaterDensity };
    expect(solve(atSameWater).pH).toBeCloseTo(solve(withExcipients).pH, 12);
    expect(one(`=PROTIC.PHMIX(A1:A${m},B1:B${m},C1:C${m},1)`, WITH_EXCIPIENTS)).toBeCloseTo(solve(withExcipients).pH, 12);
    expectMissWithin((one(`=PROTIC.PHMIX(A1:A${m},B1:B${m},C1:C${m},1)`, WITH_EXCIPIENTS) as number) - (one(`=PROTIC.PHMIX(A1:A${n},B1:B${n},C1:C${n},1)`, BUFFER) as number), -0.0100, 0.0005);
  });
  test('WARNINGS says their volume is estimated (no density fit for polysorbate, mannitol, glycerol, trehalose)', () => {
    expect(one(`=PROTIC.WARNINGS(A1:A${m},B1:B${m},C1:C${m},1)`, WITH_EXCIPIENTS)).toMatch(/^density: no density data for polysorbate 80, D-mannitol, glycerol, trehalose dihydrate \(80\.9 g\/L\)/);
    expect(one(`=PROTIC.WARNINGS(A1:A${n},B1:B${n},C1:C${n},1)`, BUFFER)).toBe('none');
  });

  test('SPECIES, CONSTANTS, CURVE and RECIPE accept them too', () => {
    const v = evaluateSheet([...WITH_EXCIPIENTS, [`=PROTIC.SPECIES(A1:A${m},B1:B${m},C1:C${m},1)`]]);
    expect(v[m].some((c) => c === 'H⁺')).toBe(false); // the header row
    expect(v.slice(m).some((row) => row[0] === 'pH')).toBe(true);
    expect(typeof one(`=PROTIC.CONSTANTS(A1:A${m},B1:B${m},C1:C${m},1)`, WITH_EXCIPIENTS)).toBe('string');
    const curve = evaluateSheet([...WITH_EXCIPIENTS, [`=PROTIC.CURVE(A1:A${m},B1:B${m},C1:C${m},1,"1 M NaOH",10,3)`]]);
    expect(typeof curve[m][1]).toBe('number');
    const recipe = evaluateSheet([[`=PROTIC.RECIPE("NaH2PO4·H2O","Na2HPO4·7H2O",7.4,0.05,1,25,"davies",{"sucrose";"polysorbate 80"},{50;0.1},"g")`]]);
    expect(typeof recipe[0][1]).toBe('number');
  });

  test('a nominal molar mass refuses amounts in mol; a formula shared by isomers is refused with their names', () => {
    expect(errorOf(one('=PROTIC.PHMIX({"KH2PO4";"polysorbate 80"},{3.4;1},{"g";"mM"},1)')).message)
      .toMatch(/polysorbate 80: a mixture of molecules has only a nominal molar mass/);
    expect(errorOf(one('=PROTIC.PHMIX({"KH2PO4";"C12H22O11"},{3.4;10},"g",1)')).message).toMatch(/shared by sucrose, trehalose anhydrous/);
    // no equilibrium bounds an excipient, so its mass per litre is bounded itself
    expect(errorOf(one('=PROTIC.PHMIX({"KH2PO4";"sucrose"},{3.4;2000},"g",1)')).message).toMatch(/sucrose at 2000 g\/L; expected at most 1000 g per litre/);
  });
});

describe('water rows', () => {
  test('a 10× stock and water, with no final volume: the volumes add, as for any dispensed liquid', () => {
    const diluted = one('=PROTIC.PHMIX({"1 M Tris";"water"},{100;900},"mL")');
    expect(diluted).toBe(one('=PROTIC.PHMIX("0.1 M Tris",1,"L")'));
    expect(one('=PROTIC.PHMIX({"1 M Tris";"WFI"},{100;900},"mL",1)')).toBe(diluted);
  });

  test('pure water is a row that says water: pH = pKw/2 (charge balance of pure water, common practice)', () => {
    const value = one('=PROTIC.PHMIX("water",1,"L",1,25,"ideal")') as number;
    expect(Math.abs(value - pKw(25) / 2)).toBeLessThan(1e-9);
  });

  test('volume rules unchanged: water counts in the final volume; water is dispensed by volume only', () => {
    expect(errorOf(one('=PROTIC.PHMIX({"1 M Tris";"water"},{100;950},"mL",1)')).message).toMatch(/at least the 1\.05 L/);
    expect(errorOf(one('=PROTIC.PHMIX({"KH2PO4";"water"},{3.4;1000},"g",1)')).message).toMatch(/a volume \(L mL µL\) for water, the solvent/);
  });

  test('an empty mixture is an error, not pure water (it computed pH 6.9973, warnings none)', () => {
    const rows: Grid = [[null, null, null], [null, null, null], ['=PROTIC.PHMIX(A1:A2,B1:B2,"g",1)', '=PROTIC.WARNINGS(A1:A2,B1:B2,"g",1)', null]];
    const v = evaluateSheet(rows);
    expect(errorOf(v[2][0]).message).toMatch(/reagents: value not usable\. Received no reagent rows; expected at least one row; for pure water write a row water/);
    expect(errorOf(v[2][1]).error).toBe('#VALUE!');
  });
});

describe('units column and stocks as typed', () => {
  const M_NACL = molarMassGPerMol('NaCl');
  test.each([
    [`${M_NACL * 0.1}`, 'g/L'], [`${M_NACL * 0.01}`, '% w/v'], [`${M_NACL * 0.1}`, 'mg/mL'], [`${M_NACL * 100}`, 'mg/L'], ['100', 'mmol/l'], ['0.1', 'mol/L'], ['1e8', 'nM'],
  ])('NaCl %s %s in the buffer equals 0.1 M NaCl', (amount, unit) => {
    const reference = one('=PROTIC.PHMIX({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;0.1},{"g";"g";"M"},1)') as number;
    const value = one(`=PROTIC.PHMIX({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;${amount}},{"g";"g";"${unit}"},1)`) as number;
    expect(Math.abs(value - reference)).toBeLessThan(1e-12);
  });

  test('nmol is an amount; N is normality for strong acids and bases only', () => {
    expect(one('=PROTIC.PHMIX({"KH2PO4";"HCl"},{3.4;1e6},{"g";"nmol"},1)')).toBe(one('=PROTIC.PHMIX({"KH2PO4";"HCl"},{3.4;1},{"g";"mmol"},1)'));
    expect(one('=PROTIC.PHMIX({"KH2PO4";"H2SO4"},{3.4;0.02},{"g";"N"},1)')).toBe(one('=PROTIC.PHMIX({"KH2PO4";"H2SO4"},{3.4;0.01},{"g";"M"},1)'));
    expect(one('=PROTIC.TITRANT(7.2,A1:A2,B1:B2,C1:C2,1,"1 N NaOH")', BUFFER)).toBe(one('=PROTIC.TITRANT(7.2,A1:A2,B1:B2,C1:C2,1,"1 M NaOH")', BUFFER));
    expect(errorOf(one('=PROTIC.PHMIX({"KH2PO4";"acetic acid"},{3.4;0.1},{"g";"N"},1)')).message)
      .toMatch(/a molarity \(M\) for acetic acid: normality \(N\) is taken only for strong acids and bases/);
    expect(errorOf(one('=PROTIC.PHMIX("1 N Na2HPO4",10,"mL",1)')).message).toMatch(/normality \(N\) is taken only/);
  });

  test('SI case kept: Mg, MG, Mmol, ML refused with the unit meant', () => {
    for (const [unit, meant] of [['Mg', 'mg'], ['MG', 'mg'], ['Mmol', 'mmol'], ['ML', 'mL']]) {
      expect(errorOf(one(`=PROTIC.PHMIX("KH2PO4",3.4,"${unit}",1)`)).message).toMatch(new RegExp(`Received "${unit}"; expected ${meant} \\(prefixes keep their SI case; M is the SI prefix mega\\)`));
    }
  });

  test('model BG', () => {
    expect(one('=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1,25,"BG")', BUFFER)).toBe(one('=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1,25,"bates-guggenheim")', BUFFER));
  });

  test('impossible stocks are refused with a reason (1000 M HCl and 1000% w/v NaOH were accepted)', () => {
    expect(errorOf(one('=PROTIC.PHMIX("1000 M HCl",1,"mL",1)')).message).toMatch(/at most 20 mol\/L of any one component, and this is 1000 mol\/L of Cl-/);
    expect(errorOf(one('=PROTIC.PHMIX("1000% w/v NaOH",1,"mL",1)')).message).toMatch(/at most 1000 g\/L \(100% w\/v\)/);
    expect(errorOf(one('=PROTIC.PHMIX("15 M HCl",1,"mL",1)')).message).toMatch(/hydrogen chloride dissolves to at most about 14 mol\/L/);
    expect(errorOf(one('=PROTIC.PHMIX("20 M acetic acid",1,"mL",1)')).message).toMatch(/the pure compound \(glacial acetic acid\) is 17\.47 mol\/L/);
    expect(errorOf(one('=PROTIC.PHMIX("19 M H2SO4",1,"mL",1)')).message).toMatch(/sulfuric acid dissolves to at most about 18\.8 mol\/L/);
    expect(typeof one('=PROTIC.PHMIX("12 M HCl",1,"mL",1)')).toBe('number');
    expect(typeof one('=PROTIC.PHMIX("18 M H2SO4",1,"mL",1)')).toBe('number');
    expect(typeof one('=PROTIC.PHMIX("NaCl 5 M",10,"mL",1)')).toBe('number');
  });
});

describe('formulation amino acids', () => {
  test('constants as catalogued, and a reagent of one system resolves to it', () => {
    expect(one('=PROTIC.PKA("arginine",2)')).toBe(9.04);
    expect(one('=PROTIC.PKA("L-arginine monohydrochloride",3)')).toBe(13.8); // Fitch et al. 2015
    expect(one('=PROTIC.PKA("monosodium glutamate monohydrate",2)')).toBe(4.25);
    expect(one('=PROTIC.PKA("L-methionine",2)')).toBe(9.21);
  });

  // Half-neutralised weak acid, dilute, ideal: pH = pKa (Henderson–Hasselbalch, common practice); the other steps are
  // at least 4.7 units away and water's ions are below 0.3 % of the buffer, so the check holds to 0.01. (Lysine's
  // two amino steps are 1.5 apart, so it has no such simple check.)
  test.each([
    ['L-methionine', 'NaOH', 9.21], ['L-arginine monohydrochloride', 'NaOH', 9.04],
  ])('0.01 M %s with 0.005 M %s reads its amino pKa', (reagent, base, pKa) => {
    const value = one(`=PROTIC.PHMIX({"${reagent}";"${base}"},{0.01;0.005},"M",,25,"ideal")`) as number;
    expect(Math.abs(value - (pKa as number))).toBeLessThan(0.01);
  });

  test('a formulation buffer with arginine, sucrose and polysorbate 80 in WFI', () => {
    const v = one('=PROTIC.PHMIX({"L-arginine monohydrochloride";"L-histidine";"sucrose";"polysorbate 80";"WFI"},{10.5;1.55;80;0.2;900},{"g";"g";"g";"g";"mL"},1)');
    expect(v as number).toBeGreaterThan(6);
    expect(v as number).toBeLessThan(8);
  });
});

describe('a reagent with two systems, or a name of several forms, is refused with the choices', () => {
  test('PKA("ammonium acetate",1) answered for acetate', () => {
    expect(errorOf(one('=PROTIC.PKA("ammonium acetate",1)')).message).toMatch(/ammonium acetate releases 2, acetate and ammonium; write acetate or ammonium/);
    expect(errorOf(one('=PROTIC.FRACTIONS("L-lysine acetate",7)')).message).toMatch(/releases 2, lysine and acetate/);
  });
  test('FRACTIONS("sodium citrate",5) said "unknown acid system"', () => {
    expect(errorOf(one('=PROTIC.FRACTIONS("sodium citrate",5)')).message)
      .toMatch(/names trisodium citrate \(258\.07 g\/mol\), trisodium citrate dihydrate \(294\.10 g\/mol\).*forms of citrate: write citrate/);
    expect(errorOf(one('=PROTIC.PKA("NaCl",1)')).message).toMatch(/sodium chloride releases none/);
    expect(one('=PROTIC.PKA("Tris hydrochloride",1)')).toBe(one('=PROTIC.PKA("Tris",1)'));
  });
});

describe('custom systems: one hydrate grammar, and names that cannot pass for the catalogue', () => {
  afterEach(() => clearCustomDefinitions());
  const system = (name: string, formula = 'C4H3NaO4', extra: Record<string, unknown> = {}) => ({
    systems: [{ name, pKa: [3.5, 6.2], charge: 0, forms: [{ name: `${name} monosodium`, formula, protonsLost: 1 }], ...extra }],
  });

  test.each(['∙', '⋅', '·', '.', '*', ' '])('a form written with %p counts its water once', (dot) => {
    expect(applyCustomDefinitions(system('fumaric test acid', `C4H3NaO4${dot}2H2O`))).toEqual([]);
    const expected = molarMassGPerMol('C4H3NaO4') + 2 * molarMassGPerMol('H2O');
    expect(one('=PROTIC.MOLARMASS("fumaric test acid monosodium")') as number).toBeCloseTo(expected, 9);
  });

  test('a decimal hydrate in a custom form leaves every other formula lookup working', () => {
    expect(applyCustomDefinitions(system('sorbic test acid', 'C6H7NaO2·1.5H2O', { pKa: [4.76] }))).toEqual([]);
    expect(one('=PROTIC.MOLARMASS("sorbic test acid monosodium")') as number).toBeCloseTo(molarMassGPerMol('C6H7NaO2') + 1.5 * molarMassGPerMol('H2O'), 9);
    expect(typeof one('=PROTIC.PHMIX(A1:A2,B1:B2,C1:C2,1)', BUFFER)).toBe('number');
    expect(typeof one('=PROTIC.PHMIX("Na2HPO4·7H2O",1,"g",1)')).toBe('number');
  });

  test.each([
    ['\u0422ris base', /U\+0422 CYRILLIC CAPITAL LETTER TE, which looks like Latin T/],
    ['Tris base', /reads as "Tris base", a catalogue or custom name/],
    ['TRIS-BASE', /reads as "Tris base"/],
    ['Sodium  Chloride', /reads as "sodium chloride"/],
    ['phosphate', /reads as "phosphate"/],
    ['Tr\u200bis', /U\+200B ZERO WIDTH SPACE/],
  ])('the name %p is refused', (name, pattern) => {
    const problems = applyCustomDefinitions({ systems: [{ name, pKa: [7.1], charge: 0 }] });
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(pattern);
  });

  test('a name of its own is accepted', () => {
    expect(applyCustomDefinitions({ systems: [{ name: 'plant buffer X-17', pKa: [7.1], charge: 0 }] })).toEqual([]);
  });
});

describe('deep nesting is a coded failure', () => {
  test('4,000 nested parentheses overflowed the stack ("internal error")', () => {
    const deep = `${'('.repeat(4000)}H${')'.repeat(4000)}`;
    expect(errorOf(one(`=PROTIC.MOLARMASS("${deep}")`)).message).toMatch(/not a chemical formula at character 14\. .*at most 12 nested parentheses or brackets/);
    expect(errorOf(one(`=PROTIC.PHMIX("${deep}",1,"g",1)`)).error).toBe('#VALUE!');
    expect(one('=PROTIC.MOLARMASS("K4[Fe(CN)6]·3H2O")') as number).toBeCloseTo(422.39, 1); // CRC Handbook (from memory)
  });
});

describe('the README examples of units and rows print what the sheet gives', () => {
  const readme = readFileSync('README.md', 'utf8').replace(/\s*\n\s*/g, ' ');
  test.each([
    ['=PROTIC.TITRANT(7.4,{"KH2PO4";"Na2HPO4"},{3.4;3.55},"g",1,"1 N NaOH")', '13.914'],
    ['=PROTIC.PHMIX({"KH2PO4";"Na2HPO4";"NaCl"},{3.4;3.55;0.9},{"g";"g";"% w/v"},1)', '6.8013'],
    ['=PROTIC.PHMIX({"1 M Tris";"water"},{100;900},"mL")', '10.535'],
    ['=PROTIC.PHMIX({"L-arginine monohydrochloride";"L-histidine";"sucrose";"polysorbate 80";"WFI"},{10.5;1.55;80;0.2;900},{"g";"g";"g";"g";"mL"},1)', '7.2493'],
  ])('%s → %s', (formula, printed) => {
    expect(readme).toContain(`\`${formula}\` → ${printed}`);
    const decimals = printed.split('.')[1].length;
    expect(Math.abs((one(formula) as number) - Number(printed))).toBeLessThanOrEqual(0.5 * 10 ** -decimals * (1 + 1e-9));
  });
});

describe('MOLARMASS reads the trade spellings too', () => {
  test.each([
    ['Tris·HCl', 'Tris hydrochloride'], ['NACL', 'NaCl'], ['Na2HPO4 heptahydrate', 'Na2HPO4·7H2O'], ['citric acid, monohydrate', 'citric acid monohydrate'],
  ])('MOLARMASS(%p) = MOLARMASS(%p)', (typed, canonical) => {
    expect(one(`=PROTIC.MOLARMASS("${typed}")`)).toBe(one(`=PROTIC.MOLARMASS("${canonical}")`));
  });
  test('a liquid as sold has no single molar mass, however it is written', () => {
    expect(errorOf(one('=PROTIC.MOLARMASS("HCl 37%")')).message).toMatch(/a liquid as sold has no single molar mass/);
  });
});

describe('water and excipients are not titrants', () => {
  test.each(['water', 'sucrose'])('TITRANT and CURVE with %s are refused, not "it lowers the pH"', (titrant) => {
    expect(errorOf(one(`=PROTIC.TITRANT(7.4,A1:A2,B1:B2,C1:C2,1,"${titrant}")`, BUFFER)).message).toMatch(/moves no pH/);
    expect(errorOf(one(`=PROTIC.CURVE(A1:A2,B1:B2,C1:C2,1,"${titrant}",10,3)`, BUFFER)).message).toMatch(/moves no pH/);
  });
});
