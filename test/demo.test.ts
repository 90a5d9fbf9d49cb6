import { readFileSync, readdirSync } from 'fs';
import { renderWorkbook } from '../scripts/demo';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { parseCsv, typedCell } from '../scripts/lib/csv';
import { applyCustomDefinitions, clearCustomDefinitions } from '../src/engine';
import { species } from '../src/functions/impl';

describe('the bundled examples', () => {
  test.each(readdirSync('examples').filter((f) => f.endsWith('.csv')))('%s evaluates with no error cell', (file) => {
    const text = readFileSync(`examples/${file}`, 'utf8');
    const values = evaluateSheet(parseCsv(text).map((r) => r.map(typedCell)));
    const errors = values.flat().filter((v) => typeof v === 'object' && v !== null);
    expect(errors).toEqual([]);
    expect(renderWorkbook(text)).toMatch(/fictional scenario/);
  });
});

describe('model validity', () => {
  test.each([
    ['davies', 0.8, /^the Davies pH departs from the SIT model's \(6\.\d{3}\) by 0\.\d{3} at ionic strength 0\.900 mol\/L/],
    ['bates-guggenheim', 0.3, /^the Bates–Guggenheim pH departs from the SIT model's \(6\.\d{3}\) by 0\.\d{3} at ionic strength 0\.400 mol\/L/],
  ])('SPECIES warns where the %s pH departs from sit but still returns a number', (model, nacl, pattern) => {
    const table = species([['KH2PO4'], ['Na2HPO4'], ['NaCl']], [[0.025], [0.025], [nacl]], 'M', null, 25, model);
    const warning = table.find((r) => r[0] === 'warning') as (string | number)[];
    expect(warning[1]).toMatch(pattern);
    const pH = table.find((r) => r[0] === 'pH') as (string | number)[];
    expect(Number.isFinite(pH[1] as number)).toBe(true);
  });
  // a warning text that holds nothing but the Davies departure from sit (or none): no solubility or binding line
  const ONLY_DEPARTURE = /^(none|the Davies pH departs from the SIT model's [^;]*)$/;
  const warningOf = (reagents: string[], molar: number[]): string =>
    String((species(reagents.map((x) => [x]), molar.map((x) => [x]), 'M', null, 25, 'davies').find((r) => r[0] === 'warning') as string[])[1]);
  test.each([
    [['disodium EDTA dihydrate', 'MgCl2'], [0.001, 0.002], /EDTA with Mg²⁺: EDTA binds Ca²⁺ and Mg²⁺ strongly, releasing protons, which the model leaves out: the pH reads high/],
    [['citric acid', 'trisodium citrate dihydrate', 'calcium chloride dihydrate'], [0.01, 0.01, 0.001], /citrate with Ca²⁺: citrate binds/],
    [['KH2PO4', 'Na2HPO4', 'CaCl2', 'MgCl2'], [0.01, 0.01, 0.0009, 0.0005], /phosphate with Ca²⁺ and Mg²⁺: CaHPO4 and MgHPO4 ion pairs/],
  ])('SPECIES warns when %s meet a metal ion the model does not bind', (reagents, molar, pattern) => {
    expect(warningOf(reagents, molar)).toMatch(pattern);
  });
  test.each([
    // reagents, mol/L, the warning, or none
    [['NaHCO3', 'HCl'], [0.1, 0.1], /^CO2\(aq\) 0\.0997 mol\/L is above its solubility, about 0\.034 mol\/L at 25 °C: CO2 comes out as bubbles/],
    [['NaHCO3', 'Na2CO3'], [0.025, 0.025], /^none$/],
    [['disodium EDTA dihydrate', 'HCl'], [0.05, 0.1], /^H4Y 0\.0\d+ mol\/L is above its solubility, about 0\.0017 mol\/L at 25 °C: EDTA free acid may precipitate/],
    [['disodium EDTA dihydrate'], [0.05], ONLY_DEPARTURE],
    [['EDTA free acid', 'NaOH'], [0.05, 0.2], ONLY_DEPARTURE], // dissolved as the base goes in
    [['phthalic acid'], [0.1], /^H2Phth 0\.0\d+ mol\/L is above its solubility/],
    [['potassium hydrogen phthalate'], [0.05], /^none$/],
  ])('a form above its solubility: %s at %s mol/L', (reagents, molar, pattern) => {
    expect(warningOf(reagents as string[], molar as number[])).toMatch(pattern);
  });
  test('a step without ΔrH° used away from 25 °C says its pKa was kept', () => {
    const forms = [{ name: 'kelvic acid', formula: 'C5H8O2', protonsLost: 0 }, { name: 'sodium kelvate', formula: 'C5H7NaO2', protonsLost: 1 }];
    expect(applyCustomDefinitions({ systems: [{ name: 'Kelvate', pKa: [6.0], charge: 0, forms }, { name: 'Warmate', pKa: [6.0], charge: 0, dH: [20], forms: forms.map((f) => ({ ...f, name: f.name.replace('kelv', 'warm') })) }] })).toEqual([]);
    try {
      const at = (reagents: string[], t: number): string => String((species(reagents.map((x) => [x]), [[0.01], [0.01]], 'M', null, t, 'davies').find((r) => r[0] === 'warning') as string[])[1]);
      expect(at(['kelvic acid', 'sodium kelvate'], 37)).toMatch(/^Kelvate step 1 has no ΔrH°: its 25 °C pKa \(6\) is used unchanged at 37 °C$/);
      expect(at(['kelvic acid', 'sodium kelvate'], 25)).toBe('none');
      expect(at(['warmic acid', 'sodium warmate'], 37)).toBe('none');
    } finally {
      clearCustomDefinitions();
    }
  });
  test('warnings join: a binding warning and an ionic-strength warning together', () => {
    expect(warningOf(['disodium EDTA dihydrate', 'MgCl2', 'NaCl'], [0.001, 0.002, 0.8])).toMatch(/departs from the SIT model's .*; EDTA with Mg²⁺/);
  });
  test('no binding warning without the metal ion', () => {
    expect(warningOf(['disodium EDTA dihydrate', 'NaCl', 'KCl'], [0.001, 0.15, 0.003])).toMatch(ONLY_DEPARTURE);
  });
  test('no warning inside the range', () => {
    const table = species([['KH2PO4'], ['Na2HPO4']], [[0.025], [0.025]], 'M', null, 25, 'davies');
    expect((table.find((r) => r[0] === 'warning') as string[])[1]).toBe('none');
  });
});
