import { OfficeMockObject } from 'office-addin-mock';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { clearCustomDefinitions } from '../src/engine';
import * as impl from '../src/functions/impl';
import { WHAT_IF_TEMPERATURES_C, fractionsBlock, phBlock, recipeBlock, speciesBlock, temperatureTableBlock, titrantBlock } from '../src/taskpane/blocks';
import type { Block } from '../src/taskpane/blocks';
import { SETTINGS_KEY, definitionFromInputs, loadFromSettings, saveDefinition } from '../src/taskpane/customStore';
import type { SettingsLike } from '../src/taskpane/customStore';
import { writeBlockAtSelection } from '../src/taskpane/excelWriter';
import { searchCatalogue, suggestedForms, systemView } from '../src/taskpane/catalogueView';

const MIX = { rows: [{ reagent: 'KH2PO4', amount: 3.4, unit: 'g' }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g' }], volumeL: 1, temperatureC: 25 };

function mockExcel(rowIndex: number, columnIndex: number) {
  const writes: { at: number[]; formulas: unknown }[] = [];
  const data = {
    context: {
      workbook: {
        selected: {
          rowIndex, columnIndex,
          worksheet: {
            target: { formulas: [] as unknown, format: { autofitColumns() { /* recorded by the mock */ } } },
            getRangeByIndexes(r: number, c: number, h: number, w: number) { writes.push({ at: [r, c, h, w], formulas: undefined }); return this.target; },
          },
        },
        getSelectedRange() { return this.selected; },
      },
    },
    run: async function (callback: (context: unknown) => Promise<unknown>) { return callback(this.context); },
  };
  const mock = new OfficeMockObject(data);
  return { mock, writes, target: () => (mock as unknown as { context: { workbook: { selected: { worksheet: { target: { formulas: unknown } } } } } }).context.workbook.selected.worksheet.target.formulas };
}

describe('writing blocks into the sheet (office-addin-mock)', () => {
  test('a pH block at C3: exact values and the formula referencing them', async () => {
    const { mock, writes, target } = mockExcel(2, 2);
    (global as unknown as { Excel: unknown }).Excel = mock;
    const written = await writeBlockAtSelection((t, l) => phBlock(MIX, t, l));
    expect(written).toBe('C3:E9');
    expect(writes[0].at).toEqual([2, 2, 7, 3]);
    expect(target()).toEqual([
      ['Reagent', 'Amount', 'Unit'],
      ['KH2PO4', 3.4, 'g'],
      ['Na2HPO4', 3.55, 'g'],
      ['Volume (L)', 1, ''],
      ['Temperature (°C)', 25, ''],
      ['pH', '=PROTIC.PHMIX(C4:C5,D4:D5,E4:E5,D6,D7)', ''],
      ['Warnings', '=PROTIC.WARNINGS(C4:C5,D4:D5,E4:E5,D6,D7)', ''],
    ]);
  });

  test('titrant, recipe and fractions blocks reference their own cells', () => {
    expect(titrantBlock(MIX, '1 M NaOH', 7.4, 0, 0).cells.slice(5)).toEqual([
      ['Titrant', '1 M NaOH', ''], ['Target pH', 7.4, ''], ['Titrant to add', '=PROTIC.TITRANT(B7,A2:A3,B2:B3,C2:C3,B4,B6,B5)', 'mL or g'],
      ['Warnings (before titrant)', '=PROTIC.WARNINGS(A2:A3,B2:B3,C2:C3,B4,B5)', ''],
    ]);
    expect(recipeBlock({ acidForm: 'NaH2PO4·H2O', baseForm: 'Na2HPO4·7H2O', targetPH: 7.4, concentrationM: 0.1, volumeL: 1, temperatureC: 25 }, 0, 0).cells[7][0])
      .toBe('=PROTIC.RECIPE(B1,B2,B3,B4,B5,B6)');
    const fr = fractionsBlock({ system: 'phosphate', forms: ['H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'], fromPH: 2, toPH: 3, stepPH: 0.5, temperatureC: 25, ionicStrengthM: 0.1 }, 0, 0);
    expect(fr.cells).toEqual([
      ['pH', 'H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'],
      [2, '=PROTIC.FRACTIONS("phosphate",A2,25,0.1)', '', '', ''],
      [2.5, '=PROTIC.FRACTIONS("phosphate",A3,25,0.1)', '', '', ''],
      [3, '=PROTIC.FRACTIONS("phosphate",A4,25,0.1)', '', '', ''],
    ]);
  });

  test('the written blocks compute in a real spreadsheet engine', () => {
    // Excel clears a cell written with ''; the engine needs it empty (null) to spill into
    const run = (b: Block) => evaluateSheet(b.cells.map((r) => r.map((c) => (c === '' ? null : c))));
    const ph = run(phBlock(MIX, 0, 0));
    expect(ph[5][1]).toBeCloseTo(impl.ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1), 12);
    expect(ph[6][1]).toBe('none');
    const ti = run(titrantBlock(MIX, '1 M NaOH', 7.4, 0, 0));
    expect(ti[7][1]).toBeCloseTo(impl.titrant(7.4, [['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, '1 M NaOH'), 10);
    const re = run(recipeBlock({ acidForm: 'NaH2PO4·H2O', baseForm: 'Na2HPO4·7H2O', targetPH: 7.4, concentrationM: 0.1, volumeL: 1, temperatureC: 25 }, 0, 0));
    expect(re[7][0]).toBe('NaH2PO4·H2O');
    expect(re[8][1] as number).toBeGreaterThan(0);
  });

  test('the audit block reserves both spills and computes the same tables as SPECIES and CONSTANTS', () => {
    const table = impl.species([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25);
    const constants = impl.constants([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25);
    const block = speciesBlock(MIX, table.length, constants.length, 0, 0);
    expect(block.cells[5]).toEqual(['=PROTIC.SPECIES(A2:A3,B2:B3,C2:C3,B4,B5)', '', '', '', '']);
    expect(block.cells[5 + table.length]).toEqual(['=PROTIC.CONSTANTS(A2:A3,B2:B3,C2:C3,B4,B5)', '', '', '', '']);
    expect(block.cells).toHaveLength(5 + table.length + constants.length);
    const v = evaluateSheet(block.cells.map((r) => r.map((c) => (c === '' ? null : c))));
    expect(v.slice(5, 5 + table.length).map((r) => r.slice(0, 5))).toEqual(table);
    expect(v.slice(5 + table.length).map((r) => r.slice(0, 5))).toEqual(constants.map((r) => r.slice(0, 5))); // the block reserves CONSTANTS' first five columns
  });

  test('the temperature what-if table: an editable temperature column, pH and warnings per row', () => {
    const block = temperatureTableBlock(MIX, WHAT_IF_TEMPERATURES_C, 0, 0);
    expect(block.cells.slice(0, 5)).toEqual([
      ['Reagent', 'Amount', 'Unit'], ['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'], ['Volume (L)', 1, ''], ['Temperature (°C)', 'pH', 'Warnings'],
    ]);
    expect(block.cells[5]).toEqual([4, '=PROTIC.PHMIX(A2:A3,B2:B3,C2:C3,B4,A6)', '=PROTIC.WARNINGS(A2:A3,B2:B3,C2:C3,B4,A6)']);
    const v = evaluateSheet(block.cells.map((r) => r.map((c) => (c === '' ? null : c))));
    WHAT_IF_TEMPERATURES_C.forEach((t, i) => {
      expect(v[5 + i][1]).toBeCloseTo(impl.ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, t), 12);
      expect(v[5 + i][2]).toBe('none');
    });
    // phosphate pKa2 falls as it warms (ΔrH° > 0), so the pH does too
    for (let i = 1; i < WHAT_IF_TEMPERATURES_C.length; i++) expect(v[5 + i][1] as number).toBeLessThan(v[4 + i][1] as number);
  });

  test('text that Excel would read as a formula is written as text', () => {
    const b = phBlock({ ...MIX, rows: [{ reagent: '=HYPERLINK("x")', amount: 1, unit: 'g' }] }, 0, 0);
    expect(b.cells[1][0]).toBe('\'=HYPERLINK("x")');
  });
});

/** Office.context.document.settings, mocked with office-addin-mock; the store is kept outside the mock to read back. */
function mockSettings(initial: Record<string, unknown> = {}): SettingsLike & { store: Record<string, unknown>; saves: number } {
  const store: Record<string, unknown> = { ...initial };
  let saves = 0;
  const data = {
    context: { document: { settings: {
      get(name: string) { return store[name] ?? null; },
      set(name: string, value: unknown) { store[name] = value; },
      saveAsync(cb?: (r: { status: string }) => void) { saves++; cb?.({ status: 'succeeded' }); },
    } } },
  };
  const office = new OfficeMockObject(data) as unknown as { context: { document: { settings: SettingsLike } } };
  const settings = office.context.document.settings;
  return {
    get: (name: string) => settings.get(name), set: (name: string, value: unknown) => settings.set(name, value),
    saveAsync: (cb?: (r: { status: string; error?: { message: string } }) => void) => settings.saveAsync(cb),
    store, get saves() { return saves; },
  };
}

describe('custom systems in the workbook settings', () => {
  afterEach(() => clearCustomDefinitions());

  test('saved, read back, and used by the cell functions at once', async () => {
    const settings = mockSettings();
    const def = definitionFromInputs('Zorbate', '5.5', '0', '10', [
      { name: 'zorbic acid', formula: 'C6H8O2', protonsLost: '0' }, { name: 'sodium zorbate', formula: 'C6H7NaO2', protonsLost: '1' },
    ]);
    expect(await saveDefinition(settings, def)).toEqual([]);
    expect(settings.saves).toBe(1);
    expect(JSON.parse(settings.store[SETTINGS_KEY] as string)).toEqual({ systems: [{ name: 'Zorbate', pKa: [5.5], charge: 0, dH: [10], forms: [{ name: 'zorbic acid', formula: 'C6H8O2', protonsLost: 0 }, { name: 'sodium zorbate', formula: 'C6H7NaO2', protonsLost: 1 }] }] });
    expect(impl.fractions('Zorbate', 5.5)[0][0]).toBeCloseTo(0.5, 12);
    expect(impl.pka('zorbate', 1)).toBe(5.5);
    const ph = impl.ph([['zorbic acid'], ['sodium zorbate']], [[0.1], [0.1]], 'M', null, 25, 'ideal');
    expect(ph).toBeCloseTo(5.5, 2);

    clearCustomDefinitions();
    expect(() => impl.fractions('Zorbate', 5)).toThrow(/unknown acid system/);
    expect(loadFromSettings(settings)).toEqual([]);
    expect(impl.fractions('Zorbate', 5.5)[0][1]).toBeCloseTo(0.5, 12);
    expect(searchCatalogue('zorb').map((h) => h.label)).toEqual(['Zorbate', 'zorbic acid', 'sodium zorbate']);
  });

  test.each([
    ['script in its name', { systems: [{ name: '<img src=x onerror=alert(1)>', pKa: [7], charge: 0 }] }, /custom system 1 name: value not usable/],
    ['absurd pKa values', { systems: [{ name: 'Odd', pKa: [1e308], charge: 0 }] }, /custom system 1 pKa 1: outside the range .* from -2 to 16/],
    ['pKa out of order', { systems: [{ name: 'Odd', pKa: [9, 4], charge: 0 }] }, /increasing order/],
    ['a charge that is not whole', { systems: [{ name: 'Odd', pKa: [4], charge: 0.5 }] }, /charge/],
    ['a form that does not balance its charge', { systems: [{ name: 'Odd', pKa: [4], charge: 0, forms: [{ name: 'odd salt', formula: 'C2H3O2', protonsLost: 1 }] }] }, /net charge -1/],
    ['a name taken by the catalogue', { systems: [{ name: 'phosphate', pKa: [4], charge: 0 }] }, /not already used/],
  ])('a hostile workbook setting (%s) is rejected with a message', (_, value, pattern) => {
    const settings = mockSettings({ [SETTINGS_KEY]: JSON.stringify(value) });
    const problems = loadFromSettings(settings);
    expect(problems.length).toBe(1);
    expect(problems[0]).toMatch(/^rejected from the workbook: /);
    expect(problems[0]).toMatch(pattern);
    expect(searchCatalogue('odd').filter((h) => h.kind === 'system')).toEqual([]);
  });

  test('unreadable JSON is rejected', () => {
    expect(loadFromSettings(mockSettings({ [SETTINGS_KEY]: '{not json' }))).toEqual(['the workbook\'s custom systems are not readable JSON; none were loaded']);
  });
});

describe('catalogue view', () => {
  test('search by name, alias or formula, and the pKa filter', () => {
    expect(searchCatalogue('Na2HPO4').some((h) => h.label === 'disodium hydrogen phosphate heptahydrate')).toBe(true);
    expect(searchCatalogue('trometamol').some((h) => h.systemId === 'tris')).toBe(true);
    const near = searchCatalogue('', 7.4).filter((h) => h.kind === 'system').map((h) => h.systemId);
    expect(near).toEqual(expect.arrayContaining(['phosphate', 'hepes', 'mops', 'tris', 'imidazole']));
    expect(near).not.toContain('acetate');
  });
  test.each([
    ['phosphate', 7.4, 'sodium dihydrogen phosphate', 'disodium hydrogen phosphate'],
    // One counter-ion for both forms: sodium dihydrogen citrate, not the potassium salt listed first.
    ['citrate', 5, 'sodium dihydrogen citrate', 'disodium hydrogen citrate sesquihydrate'],
    ['citrate', 3, 'citric acid', 'potassium dihydrogen citrate'],
    ['tris', 8, 'Tris hydrochloride', 'Tris'],
    ['acetate', 4.7, 'acetic acid', 'sodium acetate'],
  ])('suggested forms for %s at pH %d', (id, pH, acid, base) => {
    expect(suggestedForms(id, pH, 25)).toEqual({ acid, base });
  });

  test('a system view states what its model leaves out, in the words the cell warnings use', () => {
    expect(systemView('borate', 25, 0).notes).toBe('Monomeric borate only. Above 0.025 mol/L: polyborate ions form, which this monomeric model leaves out; the further below pH 9, the higher the computed pH reads. B(OH)3 above about 0.92 mol/L (25 °C): boric acid may crystallise out.');
    expect(systemView('edta', 25, 0).notes).toMatch(/^H4Y above about 0\.0017 mol\/L \(25 °C\): EDTA free acid may precipitate.*With Ca²⁺ or Mg²⁺: EDTA binds Ca²⁺ and Mg²⁺ strongly/);
    expect(systemView('hepes', 25, 0).notes).toBe('Only the step in the working range is modelled; a carboxyl or sulfonate step below pH 3 is not.');
  });

  test('a system view gives pKa at T and I, dpKa/dT, forms with molar masses and sources', () => {
    const v = systemView('phosphate', 37, 0.15);
    expect(v.steps[1].pKa).toBeLessThan(7.198);
    expect(v.steps[1].apparentPKa).toBeLessThan(v.steps[1].pKa);
    expect(v.forms.map((f) => f.label)).toEqual(['H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻']);
    expect(v.forms[0].molarMassGPerMol).toBeCloseTo(97.995, 2);
    expect(v.steps[0].source).toMatch(/^Bates 1951.*checked/); // step 1 checked in its primary source
    expect(v.steps[1].source).toMatch(/Goldberg/);
  });
});
