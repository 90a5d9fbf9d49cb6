import { OfficeMockObject } from 'office-addin-mock';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { clearCustomDefinitions } from '../src/engine';
import * as impl from '../src/functions/impl';
import { SPILL_SHAPES, WHAT_IF_TEMPERATURES_C, curveBlock, fractionsBlock, phBlock, recipeBlock, speciesBlock, temperatureTableBlock, titrantBlock } from '../src/taskpane/blocks';
import type { Block } from '../src/taskpane/blocks';
import { BLOCK_KINDS, MODEL_CHOICES, MODEL_LABELS, blockKind, modelChoices, titrantUnitSymbol } from '../src/taskpane/blockKinds';
import { ACTIVITY_MODELS, MODEL_LIMIT_MOLAL } from '../src/engine';
import type { BlockInputs } from '../src/taskpane/blockKinds';
import { SETTINGS_KEY, definitionFromInputs, deleteDefinition, loadFromSettings, saveDefinition } from '../src/taskpane/customStore';
import { readStoredSystems } from '../src/functions/workbookSystems';
import { parseNumberList, parseStrictNumber } from '../src/taskpane/numbers';
import { placeMarkLabels } from '../src/taskpane/chartLabels';
import { themeFromOffice } from '../src/taskpane/theme';
import type { SettingsLike } from '../src/taskpane/customStore';
import { writeBlockAtSelection } from '../src/taskpane/excelWriter';
import { saltBlock } from '../src/taskpane/saltBlock';
import { reviewBlock } from '../src/taskpane/reviewBlock';
import { saltDose } from '../src/functions/saltdose';
import { readback } from '../src/functions/readback';
import { handcheck } from '../src/functions/handcheck';
import { uncertainty } from '../src/functions/uncertainty';
import { searchCatalogue, suggestedForms, systemView } from '../src/taskpane/catalogueView';

const MIX = { rows: [{ reagent: 'KH2PO4', amount: 3.4, unit: 'g' }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g' }], volumeL: 1, temperatureC: 25 };

/**
 * A worksheet backed by a grid of cells ("row,col" → formula or value), behind office-addin-mock's
 * workbook: ranges read and write the grid as Excel does (null leaves a cell as it is, '' clears it).
 */
function mockExcel(rowIndex: number, columnIndex: number, initial: Record<string, string | number> = {}) {
  const grid = new Map<string, string | number>(Object.entries(initial));
  const writes: { at: number[]; formulas: unknown[][] }[] = [];
  const cellsWritten = new Set<string>();
  let clears = 0;
  const rangeAt = (r: number, c: number, h: number, w: number) => ({
    load() { /* values are read from the grid */ },
    get formulas(): unknown[][] {
      return Array.from({ length: h }, (_, i) => Array.from({ length: w }, (_, j) => grid.get(`${r + i},${c + j}`) ?? ''));
    },
    set formulas(v: unknown[][]) {
      writes.push({ at: [r, c, h, w], formulas: v });
      v.forEach((row, i) => row.forEach((x, j) => {
        const key = `${r + i},${c + j}`;
        if (x === null) return;
        cellsWritten.add(key);
        if (x === '') grid.delete(key); else grid.set(key, x as string | number);
      }));
    },
    clear() { clears++; for (let i = 0; i < h; i++) for (let j = 0; j < w; j++) grid.delete(`${r + i},${c + j}`); },
    format: { autofitColumns() { /* no layout in the mock */ } },
  });
  const data = {
    context: {
      workbook: {
        selected: { rowIndex, columnIndex, worksheet: { getRangeByIndexes: rangeAt } },
        getSelectedRange() { return this.selected; },
      },
    },
    run: async function (callback: (context: unknown) => Promise<unknown>) { return callback(this.context); },
  };
  const mock = new OfficeMockObject(data);
  (global as unknown as { Excel: unknown }).Excel = mock;
  /** The written sheet as rows × cols from A1, null for empty (as the spreadsheet engine takes it). */
  const sheet = (rows: number, cols: number) => Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_, j) => grid.get(`${i},${j}`) ?? null));
  return { grid, writes, sheet, cellsWritten, clears: () => clears };
}

const neverAsked = async (): Promise<boolean> => { throw new Error('asked, but every cell was empty'); };

describe('writing blocks into the sheet (office-addin-mock)', () => {
  test('a pH block at C3: exact values and the formula referencing them', async () => {
    const { writes } = mockExcel(2, 2);
    const written = await writeBlockAtSelection((t, l) => phBlock(MIX, t, l), neverAsked);
    expect(written).toEqual({ kind: 'written', range: 'C3:E10', replaced: 0 });
    expect(writes[0].at).toEqual([2, 2, 8, 3]);
    expect(writes[0].formulas).toEqual([
      ['Reagent', 'Amount', 'Unit'],
      ['KH2PO4', 3.4, 'g'],
      ['Na2HPO4', 3.55, 'g'],
      ['Volume (L)', 1, null],
      ['Temperature (°C)', 25, null],
      ['Activity model', 'davies', null],
      ['pH', '=PROTIC.PHMIX(C4:C5,D4:D5,E4:E5,D6,D7,D8)', null],
      ['Warnings', '=PROTIC.WARNINGS(C4:C5,D4:D5,E4:E5,D6,D7,D8)', null],
    ]);
  });

  test('titrant, recipe and fractions blocks reference their own cells', () => {
    expect(titrantBlock(MIX, '1 M NaOH', 7.4, 'mL', 0, 0).cells.slice(6)).toEqual([
      ['Titrant', '1 M NaOH', null], ['Target pH', 7.4, null], ['Titrant to add', '=PROTIC.TITRANT(B8,A2:A3,B2:B3,C2:C3,B4,B7,B5,B6,C9)', 'mL'],
      ['Warnings (before titrant)', '=PROTIC.WARNINGS(A2:A3,B2:B3,C2:C3,B4,B5,B6)', null],
    ]);
    expect(recipeBlock({ acidForm: 'NaH2PO4·H2O', baseForm: 'Na2HPO4·7H2O', targetPH: 7.4, concentrationM: 0.1, volumeL: 1, temperatureC: 25 }, 0, 0).cells[8][0])
      .toBe('=PROTIC.RECIPE(B1,B2,B3,B4,B5,B6,B7)');
    const fr = fractionsBlock({ system: 'phosphate', forms: ['H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'], fromPH: 2, toPH: 3, stepPH: 0.5, temperatureC: 25, ionicStrengthM: 0.1 }, 0, 0);
    expect(fr.cells).toEqual([
      ['pH', 'H3PO4', 'H2PO4⁻', 'HPO4²⁻', 'PO4³⁻'],
      [2, '=PROTIC.FRACTIONS("phosphate",A2,25,0.1)', null, null, null],
      [2.5, '=PROTIC.FRACTIONS("phosphate",A3,25,0.1)', null, null, null],
      [3, '=PROTIC.FRACTIONS("phosphate",A4,25,0.1)', null, null, null],
    ]);
  });

  test('the written blocks compute in a real spreadsheet engine', () => {
    // a block's unwritten (null) cells are empty in a fresh sheet: the engine spills into them
    const run = (b: Block) => evaluateSheet(b.cells);
    const ph = run(phBlock(MIX, 0, 0));
    expect(ph[6][1]).toBeCloseTo(impl.ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1), 12);
    expect(ph[7][1]).toBe('none');
    const ti = run(titrantBlock(MIX, '1 M NaOH', 7.4, 'mL', 0, 0));
    expect(ti[8][1]).toBeCloseTo(impl.titrant(7.4, [['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, '1 M NaOH'), 10);
    const re = run(recipeBlock({ acidForm: 'NaH2PO4·H2O', baseForm: 'Na2HPO4·7H2O', targetPH: 7.4, concentrationM: 0.1, volumeL: 1, temperatureC: 25 }, 0, 0));
    expect(re[8][0]).toBe('NaH2PO4·H2O');
    expect(re[9][1] as number).toBeGreaterThan(0);
    const cu = run(curveBlock(MIX, '1 M NaOH', 10, 11, 'mL', 0, 0));
    const curve = impl.curve([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, '1 M NaOH', 10, 11) as number[][];
    expect(cu.slice(10, 21).map((r) => r.slice(0, 3))).toEqual(curve);
  });

  test('the audit block reserves both spills and computes the same tables as SPECIES and CONSTANTS', () => {
    const table = impl.species([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25);
    const constants = impl.constants([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25);
    const block = speciesBlock(MIX, table.length, constants.length, 0, 0);
    expect(block.cells[6].slice(0, 5)).toEqual(['=PROTIC.SPECIES(A2:A3,B2:B3,C2:C3,B4,B5,B6)', null, null, null, null]);
    expect(block.cells[6 + table.length]).toEqual(['=PROTIC.CONSTANTS(A2:A3,B2:B3,C2:C3,B4,B5,B6)', ...Array(constants[0].length - 1).fill(null)]);
    expect(block.cells).toHaveLength(6 + table.length + constants.length);
    const v = evaluateSheet(block.cells);
    expect(v.slice(6, 6 + table.length).map((r) => r.slice(0, 5))).toEqual(table);
    expect(v.slice(6 + table.length).map((r) => r.slice(0, constants[0].length))).toEqual(constants);
  });

  test('the temperature what-if table: an editable temperature column, pH and warnings per row', () => {
    const block = temperatureTableBlock(MIX, WHAT_IF_TEMPERATURES_C, 0, 0);
    expect(block.cells.slice(0, 6)).toEqual([
      ['Reagent', 'Amount', 'Unit'], ['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'], ['Volume (L)', 1, null], ['Activity model', 'davies', null], ['Temperature (°C)', 'pH', 'Warnings'],
    ]);
    expect(block.cells[6]).toEqual([4, '=PROTIC.PHMIX(A2:A3,B2:B3,C2:C3,B4,A7,B5)', '=PROTIC.WARNINGS(A2:A3,B2:B3,C2:C3,B4,A7,B5)']);
    const v = evaluateSheet(block.cells);
    WHAT_IF_TEMPERATURES_C.forEach((t, i) => {
      expect(v[6 + i][1]).toBeCloseTo(impl.ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, t), 12);
      expect(v[6 + i][2]).toBe('none');
    });
    // phosphate pKa2 falls as it warms (ΔrH° > 0), so the pH does too
    for (let i = 1; i < WHAT_IF_TEMPERATURES_C.length; i++) expect(v[6 + i][1] as number).toBeLessThan(v[5 + i][1] as number);
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

function zorbate(name: string, pKa: string, form1 = 'zorbic acid', form2 = 'sodium zorbate') {
  return { name, pKa, charge: '0', dH: '10', forms: [{ name: form1, formula: 'C6H8O2', protonsLost: '0' }, { name: form2, formula: 'C6H7NaO2', protonsLost: '1' }] };
}

describe('custom systems in the workbook settings', () => {
  afterEach(() => clearCustomDefinitions());

  test('saved, read back, and used by the cell functions at once', async () => {
    const settings = mockSettings();
    const def = definitionFromInputs(zorbate('Zorbate', '5.5'));
    expect(await saveDefinition(settings, def)).toEqual({ kind: 'saved', problems: [] });
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

describe('nothing lost: the sheet (office-addin-mock worksheet, HyperFormula)', () => {
  test('a block over user cells asks first, names the range and the count, and writes nothing when the user declines', async () => {
    // 21 user cells under where a pH block (8 × 3) would go at B2; before, all 21 were replaced unasked
    const user: Record<string, string | number> = {};
    for (let r = 1; r <= 7; r++) for (let c = 1; c <= 3; c++) user[`${r},${c}`] = `lot ${r}-${c}`;
    const { grid, writes } = mockExcel(1, 1, user);
    const asked: [string, number][] = [];
    const outcome = await writeBlockAtSelection((t, l) => phBlock(MIX, t, l), async (range, count) => { asked.push([range, count]); return false; });
    expect(asked).toEqual([['B2:D9', 21]]);
    expect(outcome).toEqual({ kind: 'cancelled', range: 'B2:D9', count: 21 });
    expect(writes).toEqual([]);
    expect(Object.fromEntries(grid)).toEqual(user);
  });

  test('with the user\'s say-so the cells are replaced, and the status counts them', async () => {
    const { grid } = mockExcel(0, 0, { '0,0': 'old', '7,2': 42 });
    const outcome = await writeBlockAtSelection((t, l) => phBlock(MIX, t, l), async () => true);
    expect(outcome).toEqual({ kind: 'written', range: 'A1:C8', replaced: 2 });
    expect(grid.get('0,0')).toBe('Reagent');
    expect(grid.has('7,2')).toBe(false);
  });

  test('the audit block\'s reserved spill rows are never written: user data beside it and inside its room is kept when nothing is asked', async () => {
    const table = impl.species([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25).length;
    const constants = impl.constants([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25).length;
    const { cellsWritten, sheet } = mockExcel(0, 0, { '0,11': 'keep me', '200,0': 'far below' });
    await writeBlockAtSelection((t, l) => speciesBlock(MIX, table, constants, t, l), neverAsked);
    // before, the spills' rooms were written as '' (120 cells cleared); now only the block's own cells are
    const block = speciesBlock(MIX, table, constants, 0, 0).cells;
    const own = block.flatMap((row, i) => row.map((v, j) => (v === null ? '' : `${i},${j}`))).filter((k) => k !== '');
    expect([...cellsWritten].sort()).toEqual(own.sort());
    const values = evaluateSheet(sheet(6 + table + constants, 12));
    expect(values.slice(6, 6 + table).map((r) => r.slice(0, 5))).toEqual(impl.species([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25));
    expect(values[0][11]).toBe('keep me');
  });

  test('a user cell inside a spill\'s room counts: the pane asks, and a "no" leaves it', async () => {
    const table = impl.species([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25).length;
    const { grid } = mockExcel(0, 0, { '9,3': 'in the spill room' });
    const asked: [string, number][] = [];
    await writeBlockAtSelection((t, l) => speciesBlock(MIX, table, 5, t, l), async (range, count) => { asked.push([range, count]); return false; });
    // CONSTANTS spills 11 columns (A–K), so the block's room is that wide
    expect(asked).toEqual([[`A1:K${6 + table + 5}`, 1]]);
    expect(grid.get('9,3')).toBe('in the spill room');
  });

  test.each([
    ['step 0', 2, 12, 0, /step must be above 0/],
    ['from above to', 12, 2, 0.5, /“pH from” \(12\) must not be above “to” \(2\)/],
    ['too many rows', 0, 14, 0.001, /14001 rows is more than 1001/],
  ])('a fractions table with %s is refused before anything is written', async (_, fromPH, toPH, stepPH, message) => {
    const { writes } = mockExcel(0, 0);
    const inputs = fakeInputs({ fromPH, toPH, stepPH });
    expect(() => blockKind('fractions').prepare(inputs)).toThrow(message);
    expect(() => fractionsBlock({ system: 'phosphate', forms: ['a', 'b'], fromPH, toPH, stepPH, temperatureC: 25, ionicStrengthM: 0 }, 0, 0)).toThrow(message);
    expect(writes).toEqual([]);
  });

  test('a block larger than the writer\'s ceiling is refused unwritten', async () => {
    const { writes } = mockExcel(0, 0);
    const huge = { cells: Array.from({ length: 5000 }, () => ['x', 'y', 'z']) };
    await expect(writeBlockAtSelection(() => huge, neverAsked)).rejects.toThrow(/5000 × 3 cells, more than 12000; nothing was written/);
    expect(writes).toEqual([]);
  });

  test('cells that change while the pane is asking are not overwritten', async () => {
    const { grid, writes } = mockExcel(0, 0, { '1,1': 'first' });
    await expect(writeBlockAtSelection((t, l) => phBlock(MIX, t, l), async () => { grid.set('2,2', 'typed meanwhile'); return true; }))
      .rejects.toThrow(/A1:C8 changed while the pane was asking; nothing was written/);
    expect(writes).toEqual([]);
    expect(grid.get('2,2')).toBe('typed meanwhile');
  });

  test('the titrant block writes the unit the titrant takes: mL for a stock, g for a solid, and TITRANT reads that cell', () => {
    expect(titrantUnitSymbol('1 M NaOH')).toBe('mL');
    expect(titrantUnitSymbol('NaOH')).toBe('g');
    const b = blockKind('titrant').prepare(fakeInputs({ titrant: 'NaOH' }))(0, 0);
    expect(b.cells[8][2]).toBe('g');
    const v = evaluateSheet(b.cells);
    expect(v[8][1]).toBeCloseTo(impl.titrant(7.4, [['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 'NaOH', 25, 'davies', 'g'), 12);
  });
});

/** BlockInputs as the pane would read them, with overrides. */
function fakeInputs(over: Partial<Record<'fromPH' | 'toPH' | 'stepPH' | 'targetIonicStrengthM', number>> & { titrant?: string; salt?: string } = {}): BlockInputs {
  return {
    mixture: () => ({ ...MIX, model: 'davies' }), volumeL: () => 1, model: () => 'davies', titrant: () => over.titrant ?? '1 M NaOH', targetPH: () => 7.4,
    temperatureC: () => 25, ionicStrengthM: () => 0, curveEnd: () => 20, points: () => 21, acidForm: () => 'NaH2PO4·H2O', baseForm: () => 'Na2HPO4·7H2O',
    concentrationM: () => 0.1, fromPH: () => over.fromPH ?? 2, toPH: () => over.toPH ?? 12, stepPH: () => over.stepPH ?? 0.5, systemId: () => 'phosphate',
    salt: () => over.salt ?? 'NaCl', targetIonicStrengthM: () => over.targetIonicStrengthM ?? 0.15,
  };
}

describe('every block kind: its spill room comes from SPILL_SHAPES and its cells compute', () => {
  test.each(BLOCK_KINDS.map((k) => [k.id]))('%s', (id) => {
    const block = blockKind(id).prepare(fakeInputs())(0, 0);
    const width = block.cells[0].length;
    expect(block.cells.every((r) => r.length === width)).toBe(true);
    const values = evaluateSheet(block.cells);
    // no formula cell evaluates to an error, and no spill is blocked by a written cell
    const errors = values.flat().filter((v) => typeof v === 'string' && /^#/.test(v));
    expect(errors).toEqual([]);
  });

  test('the spill shapes are what the functions return', () => {
    const args = [[['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25] as const;
    expect(SPILL_SHAPES.SPECIES(impl.species(...args).length)).toEqual([impl.species(...args).length, impl.species(...args)[0].length]);
    expect(SPILL_SHAPES.CONSTANTS(impl.constants(...args).length)).toEqual([impl.constants(...args).length, impl.constants(...args)[0].length]);
    const recipe = impl.recipe('NaH2PO4·H2O', 'Na2HPO4·7H2O', 7.4, 0.1, 1) as unknown[][];
    expect(SPILL_SHAPES.RECIPE()).toEqual([recipe.length, recipe[0].length]);
    const curve = impl.curve(...args.slice(0, 4) as [string[][], number[][], string, number], '1 M NaOH', 10, 7) as unknown[][];
    expect(SPILL_SHAPES.CURVE(7)).toEqual([curve.length, curve[0].length]);
    expect(SPILL_SHAPES.FRACTIONS(4)).toEqual([1, impl.fractions('phosphate', 7)[0].length]);
    const rb = readback(...args), hc = handcheck(...args), un = uncertainty(...args, 'davies');
    expect(SPILL_SHAPES.READBACK(rb.length)).toEqual([rb.length, rb[0].length]);
    expect(SPILL_SHAPES.HANDCHECK(hc.length)).toEqual([hc.length, hc[0].length]);
    expect(SPILL_SHAPES.UNCERTAINTY(un.length)).toEqual([un.length, un[0].length]);
  });

  test('every model choice is one the functions take', () => {
    for (const m of MODEL_CHOICES) expect(impl.ph([['KH2PO4']], [[1]], 'g', 1, 25, m.id)).toBeGreaterThan(0);
  });

  test('every engine model is offered, in the engine order, each under its published name', () => {
    expect(MODEL_CHOICES.map((m) => m.id)).toEqual([...ACTIVITY_MODELS]);
    for (const id of ACTIVITY_MODELS) expect(Object.keys(MODEL_LABELS)).toContain(id);
    expect(MODEL_CHOICES.find((m) => m.id === 'davies')?.label).toBe(`Davies (to about ${MODEL_LIMIT_MOLAL.davies} mol/kg)`);
  });

  test('a model the engine adds appears with no pane edit: sit under its name, an unnamed one under its id', () => {
    const choices = modelChoices([...ACTIVITY_MODELS, 'sit', 'future'], { ...MODEL_LIMIT_MOLAL, sit: 3, future: 1 });
    expect(choices.find((m) => m.id === 'sit')?.label).toBe('SIT, specific ion interaction (to about 3 mol/kg)');
    expect(choices.find((m) => m.id === 'future')?.label).toBe('future (to about 1 mol/kg)');
    expect(choices.map((m) => m.id)).toEqual([...ACTIVITY_MODELS, 'sit', 'future']);
  });
});

describe('nothing lost: stored custom systems', () => {
  afterEach(() => clearCustomDefinitions());

  test('saving when one stored definition is invalid keeps all of them, the invalid one shown with its reason', async () => {
    const stored = { systems: [
      { name: 'Alpha', pKa: [4], charge: 0 }, { name: 'Broken', pKa: [99], charge: 0 }, { name: 'Gamma', pKa: [6], charge: 0 }, { name: 'Delta', pKa: [8], charge: 0 },
    ] };
    const settings = mockSettings({ [SETTINGS_KEY]: JSON.stringify(stored) });
    const problems = loadFromSettings(settings);
    expect(problems).toEqual([expect.stringMatching(/^rejected from the workbook: custom system 2 pKa 1: .*99/)]);
    // the valid ones are in use even though one is not
    expect(impl.pka('Gamma', 1)).toBe(6);
    expect(await saveDefinition(settings, definitionFromInputs(zorbate('Zorbate', '5.5')))).toEqual({ kind: 'saved', problems: [] });
    const after = JSON.parse(settings.store[SETTINGS_KEY] as string).systems;
    // before, 4 became 1
    expect(after.map((d: { name: string }) => d.name)).toEqual(['Alpha', 'Broken', 'Gamma', 'Delta', 'Zorbate']);
    expect(after[1]).toEqual(stored.systems[1]);
    const listed = readStoredSystems(settings).entries;
    expect(listed.map((e) => [e.name, e.problem === undefined])).toEqual([['Alpha', true], ['Broken', false], ['Gamma', true], ['Delta', true], ['Zorbate', true]]);
    expect(listed[1].problem).toMatch(/pKa 1: .*from -2 to 16/);
  });

  test('a same-name system (another case) is replaced only after the user confirms, in its place', async () => {
    const settings = mockSettings();
    await saveDefinition(settings, definitionFromInputs(zorbate('Zorbate', '5.5')));
    await saveDefinition(settings, definitionFromInputs({ name: 'Other', pKa: '3', charge: '0', dH: '', forms: [] }));
    const saves = settings.saves;
    const upper = definitionFromInputs(zorbate('ZORBATE', '5.9', 'zorbic acid B', 'sodium zorbate B'));
    expect(await saveDefinition(settings, upper)).toEqual({ kind: 'needs-confirmation', existing: 'Zorbate' });
    expect(settings.saves).toBe(saves);
    expect(JSON.parse(settings.store[SETTINGS_KEY] as string).systems.map((d: { name: string }) => d.name)).toEqual(['Zorbate', 'Other']);
    expect(impl.pka('Zorbate', 1)).toBe(5.5);
    expect(await saveDefinition(settings, upper, true)).toEqual({ kind: 'saved', replaced: 'Zorbate', problems: [] });
    expect(JSON.parse(settings.store[SETTINGS_KEY] as string).systems.map((d: { name: string }) => d.name)).toEqual(['ZORBATE', 'Other']);
    expect(impl.pka('zorbate', 1)).toBe(5.9);
  });

  test('an invalid new definition is refused and the stored ones stay as they were', async () => {
    const settings = mockSettings();
    await saveDefinition(settings, definitionFromInputs(zorbate('Zorbate', '5.5')));
    const before = settings.store[SETTINGS_KEY];
    const outcome = await saveDefinition(settings, definitionFromInputs({ name: 'Odd', pKa: '9; 4', charge: '0', dH: '', forms: [] }));
    expect(outcome).toEqual({ kind: 'invalid', problems: [expect.stringMatching(/^custom system “Odd” pKa: .*increasing order/)] });
    expect(settings.store[SETTINGS_KEY]).toBe(before);
    expect(impl.pka('Zorbate', 1)).toBe(5.5);
  });

  test('delete removes exactly one entry, invalid ones included', async () => {
    const settings = mockSettings({ [SETTINGS_KEY]: JSON.stringify({ systems: [{ name: 'Alpha', pKa: [4], charge: 0 }, { name: 'Broken', pKa: [99], charge: 0 }] }) });
    loadFromSettings(settings);
    expect(await deleteDefinition(settings, 1)).toEqual([]);
    expect(JSON.parse(settings.store[SETTINGS_KEY] as string).systems).toEqual([{ name: 'Alpha', pKa: [4], charge: 0 }]);
    expect(await deleteDefinition(settings, 0)).toEqual([]);
    expect(() => impl.pka('Alpha', 1)).toThrow(/unknown/);
  });

  test('an unreadable stored setting is overwritten only with the user\'s say-so', async () => {
    const settings = mockSettings({ [SETTINGS_KEY]: '{not json' });
    expect(await saveDefinition(settings, definitionFromInputs(zorbate('Zorbate', '5.5')))).toEqual({ kind: 'needs-overwrite', reason: expect.stringMatching(/not readable JSON/) });
    expect(settings.store[SETTINGS_KEY]).toBe('{not json');
  });
});

describe('nothing lost: numbers typed into the pane', () => {
  test('a blank box is refused with its label, never read as 0', () => {
    expect(() => parseStrictNumber('', 'Temperature (°C)')).toThrow('Temperature (°C) is blank: enter a number.');
    expect(() => parseStrictNumber('   ', 'Volume (L)')).toThrow(/blank/);
    expect(() => definitionFromInputs({ name: 'X', pKa: '4', charge: '', dH: '', forms: [] })).toThrow(/Charge of the most protonated form is blank/);
    expect(() => definitionFromInputs({ name: 'X', pKa: '', charge: '0', dH: '', forms: [] })).toThrow(/pKa values: blank/);
  });

  test('a decimal comma is a decimal: "4,76" is one pKa, and lists split on ";", spaces or ", "', () => {
    expect(definitionFromInputs({ name: 'X', pKa: '4,76', charge: '0', dH: '', forms: [] }).pKa).toEqual([4.76]);
    expect(parseNumberList('4,76; 9,2', 'pKa')).toEqual([4.76, 9.2]);
    expect(parseNumberList('6.1, 9.2', 'pKa')).toEqual([6.1, 9.2]);
    expect(parseNumberList('6.1,9.2', 'pKa')).toEqual([6.1, 9.2]);
    expect(parseNumberList('2.15 7.20 12.35', 'pKa')).toEqual([2.15, 7.2, 12.35]);
    expect(parseStrictNumber('3,40', 'Amount', ',')).toBe(3.4);
    expect(parseStrictNumber('3,4', 'Amount', '.')).toBe(3.4);
    expect(parseStrictNumber('-0.5', 'x')).toBe(-0.5);
  });

  test('ambiguous or malformed numbers are refused, not guessed', () => {
    expect(() => parseStrictNumber('1,000', 'Amount', '.')).toThrow(/could be a thousand or a decimal/);
    expect(parseStrictNumber('1,000', 'Amount', ',')).toBe(1);
    expect(() => parseStrictNumber('1.000,5', 'Amount')).toThrow(/mixes separators/);
    expect(() => parseStrictNumber('7.4x', 'Target pH')).toThrow(/Target pH: “7.4x” is not a number/);
    expect(() => parseStrictNumber('1e999', 'x')).toThrow(/not a finite number/);
  });
});

describe('the chart\'s mark labels never collide', () => {
  test('labels that would touch go on separate lines; far-apart ones share a line; one at the right edge turns left', () => {
    // phosphate at pH 7.4: pKa2 ≈ 7.2 sits beside the target, before they overlapped
    const placed = placeMarkLabels([{ x: 100, text: 'pKa1', cls: 'p' }, { x: 160, text: 'pKa2', cls: 'p' }, { x: 166, text: 'target', cls: 't' }, { x: 280, text: 'pKa3', cls: 'p' }], 288);
    const spans = placed.map((p) => {
      const w = p.text.length * 12 * 0.6 + 2;
      return { line: p.line, a: p.anchor === 'start' ? p.x + 3 : p.x - 3 - w, b: p.anchor === 'start' ? p.x + 3 + w : p.x - 3 };
    });
    for (let i = 0; i < spans.length; i++) for (let j = i + 1; j < spans.length; j++) {
      if (spans[i].line === spans[j].line) expect(spans[i].b <= spans[j].a || spans[j].b <= spans[i].a).toBe(true);
    }
    expect(placed.find((p) => p.text === 'pKa2')?.line).not.toBe(placed.find((p) => p.text === 'target')?.line);
    expect(placed.find((p) => p.text === 'pKa1')?.line).toBe(0);
    expect(placed.find((p) => p.text === 'pKa3')?.anchor).toBe('end');
  });
});

describe('theme', () => {
  test('the Office theme\'s body background decides light or dark', () => {
    expect(themeFromOffice({ bodyBackgroundColor: '#262626' })).toBe('dark');
    expect(themeFromOffice({ bodyBackgroundColor: '#FFFFFF' })).toBe('light');
    expect(themeFromOffice(undefined)).toBeUndefined();
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

const P_ARGS = [[['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1, 25] as const;

describe('the salt block: SALTDOSE of the rows, and IONICSTRENGTH of the rows with the salt as the check', () => {
  test('the salt is one more row whose amount is SALTDOSE of the rows above; the checks read every row', () => {
    const b = saltBlock(MIX, { salt: 'NaCl', targetIonicStrengthM: 0.15, saltUnitSymbol: 'g' }, 0, 0);
    expect(b.cells.map((r) => r.slice(0, 3))).toEqual([
      ['Reagent', 'Amount', 'Unit'], ['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'],
      ['NaCl', '=PROTIC.SALTDOSE(B8,A4,A2:A3,B2:B3,C2:C3,B5,B6,B7,C4)', 'g'],
      ['Volume (L), salt included', 1, null], ['Temperature (°C)', 25, null], ['Activity model', 'davies', null], ['Target ionic strength (mol/L)', 0.15, null],
      ['Ionic strength with the salt (mol/L)', '=PROTIC.IONICSTRENGTH(A2:A4,B2:B4,C2:C4,B5,B6,B7)', ''],
      ['pH with the salt', '=PROTIC.PHMIX(A2:A4,B2:B4,C2:C4,B5,B6,B7)', null],
      ['Warnings (with the salt)', '=PROTIC.WARNINGS(A2:A4,B2:B4,C2:C4,B5,B6,B7)', null],
    ]);
  });

  test.each([['NaCl', 0.15, 'g'], ['4 M NaCl', 0.5, 'mL'], ['(NH4)2SO4', 0.3, 'g']])('%s to %d mol/L: written from the pane, computed in a real sheet, the check within 1e-9 of the target', (salt, target, unit) => {
    const block = blockKind('salt').prepare(fakeInputs({ salt, targetIonicStrengthM: target }))(0, 0);
    expect(block.cells[3][2]).toBe(unit);
    const v = evaluateSheet(block.cells);
    expect(v[3][1]).toBeCloseTo(saltDose(target, salt, P_ARGS[0], P_ARGS[1], P_ARGS[2], 1, 25, 'davies', unit), 12);
    expect(v[3][1] as number).toBeGreaterThan(0);
    expect(Math.abs((v[8][1] as number) - target)).toBeLessThanOrEqual(1e-9 * target);
    expect(typeof v[9][1]).toBe('number');
  });

  test.each([
    ['a target below the mixture\'s own ionic strength', { targetIonicStrengthM: 0.05 }, /targetIonicStrength: target cannot be reached: the mixture's ionic strength is already 0\.1 mol\/L/],
    ['an unknown salt', { salt: 'unobtainium' }, /salt: unknown reagent/],
    ['a blank salt', { salt: '' }, /unknown reagent|blank/],
  ])('%s is refused before anything is written', async (_, over, message) => {
    const { writes } = mockExcel(0, 0);
    expect(() => blockKind('salt').prepare(fakeInputs(over))).toThrow(message);
    expect(writes).toEqual([]);
  });

  test('over user cells it asks first, and a "no" writes nothing', async () => {
    const { grid, writes } = mockExcel(0, 0, { '3,3': 'lot note', '9,1': 7 });
    const asked: [string, number][] = [];
    const build = blockKind('salt').prepare(fakeInputs());
    const outcome = await writeBlockAtSelection(build, async (range, count) => { asked.push([range, count]); return false; });
    expect(asked).toEqual([['A1:D11', 2]]);
    expect(outcome).toEqual({ kind: 'cancelled', range: 'A1:D11', count: 2 });
    expect(writes).toEqual([]);
    expect(grid.get('3,3')).toBe('lot note');
  });
});

describe('the review block: READBACK, HANDCHECK and UNCERTAINTY of the mixture, each spill\'s room reserved', () => {
  const spills = () => ({ readback: readback(...P_ARGS).length, handcheck: handcheck(...P_ARGS).length, uncertainty: uncertainty(...P_ARGS, 'davies').length });

  test('the spills compute the same tables as the functions, in the room left for them', () => {
    const block = blockKind('review').prepare(fakeInputs())(0, 0);
    const s = spills();
    expect(block.cells).toHaveLength(8 + 3 + s.readback + s.handcheck + s.uncertainty);
    expect(block.cells[0]).toEqual(['Reagent', 'Amount', 'Unit', '± tolerance (its unit)', null, null, null, null, null]);
    const v = evaluateSheet(block.cells);
    const rbAt = 9, hcAt = rbAt + s.readback + 1, unAt = hcAt + s.handcheck + 1;
    expect(block.cells[rbAt][0]).toBe('=PROTIC.READBACK(A2:A3,B2:B3,C2:C3,B4,B5)');
    expect(block.cells[hcAt][0]).toBe('=PROTIC.HANDCHECK(A2:A3,B2:B3,C2:C3,B4,B5)');
    expect(block.cells[unAt][0]).toBe('=PROTIC.UNCERTAINTY(A2:A3,B2:B3,C2:C3,B4,B5,B6,D2:D3,D4,D5)');
    expect(v.slice(rbAt, rbAt + s.readback)).toEqual(readback(...P_ARGS));
    expect(v.slice(hcAt, hcAt + s.handcheck).map((r) => r.slice(0, 4))).toEqual(handcheck(...P_ARGS));
    expect(v.slice(unAt, unAt + s.uncertainty)).toEqual(uncertainty(...P_ARGS, 'davies', [[0], [0]], 0, 0));
    expect(v[6][1]).toBeCloseTo(impl.ph(...P_ARGS), 12);
    expect(v.flat().filter((x) => typeof x === 'string' && /^#/.test(x))).toEqual([]);
  });

  test('tolerances typed into the block reach UNCERTAINTY: ±0.01 g, ±0.002 L, ±0.5 °C give the README\'s u(pH) 0.0116', () => {
    const block = reviewBlock(MIX, spills(), 0, 0);
    const cells = block.cells.map((r) => [...r]);
    cells[1][3] = 0.01; cells[2][3] = 0.01; cells[3][3] = 0.002; cells[4][3] = 0.5;
    const v = evaluateSheet(cells);
    const unAt = 9 + spills().readback + 1 + spills().handcheck + 1;
    const table = v.slice(unAt, unAt + spills().uncertainty);
    expect(table).toEqual(uncertainty(...P_ARGS, 'davies', [[0.01], [0.01]], 0.002, 0.5));
    const combined = table.find((r) => r[0] === 'combined standard uncertainty u(pH)')![1] as number;
    expect(Math.abs(combined - 0.0116)).toBeLessThanOrEqual(5e-5);
  });

  test('only the block\'s own cells are written; a user cell inside a spill\'s room makes the pane ask, and "no" keeps it', async () => {
    const build = blockKind('review').prepare(fakeInputs());
    const own = build(0, 0).cells.flatMap((row, i) => row.map((x, j) => (x === null ? '' : `${i},${j}`))).filter((k) => k !== '');
    const first = mockExcel(0, 0, { '0,9': 'beside' });
    await writeBlockAtSelection(build, neverAsked);
    expect([...first.cellsWritten].sort()).toEqual(own.sort());
    expect(first.grid.get('0,9')).toBe('beside');
    const second = mockExcel(0, 0, { '12,5': 'inside the READBACK room' });
    const asked: number[] = [];
    await writeBlockAtSelection(build, async (_, count) => { asked.push(count); return false; });
    expect(asked).toEqual([1]);
    expect(second.writes).toEqual([]);
    expect(second.grid.get('12,5')).toBe('inside the READBACK room');
  });
});
