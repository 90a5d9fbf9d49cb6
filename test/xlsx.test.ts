import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'fs';
import JSZip from 'jszip';
import { tmpdir } from 'os';
import { join } from 'path';
import { buildXlsx, colName, spillCells } from './xlsxFixtures';
import type { RawBook, RawCell } from './xlsxFixtures';
import { main as sheetMain, runSheet } from '../scripts/sheet';
import { main as verifyMain } from '../scripts/verify';
import { readFormula, savedFormula } from '../scripts/lib/xlsxFormula';
import { verifyFile } from '../scripts/lib/xlsxVerify';
import { writeExampleWorkbooks } from '../scripts/lib/xlsxExamples';
import { clearCustomDefinitions } from '../src/engine';
import { molarMass, ph, pka, recipe, species, fractions, version } from '../src/functions/impl';

// Saved workbooks as Excel lays them out, built from raw XML parts (test/xlsxFixtures.ts); the
// saved values are the cell functions' own results called directly, not through the sheet path.

const dir = mkdtempSync(join(tmpdir(), 'protic-xlsx-'));
afterEach(() => clearCustomDefinitions());

const REAGENTS = [['KH2PO4'], ['Na2HPO4']], AMOUNTS = [[3.4], [3.55]], UNITS = [['g'], ['g']];
const PH = ph(REAGENTS, AMOUNTS, UNITS, 1);
const SPECIES = species(REAGENTS, AMOUNTS, UNITS, 1);
const RECIPE = recipe('NaH2PO4·H2O', 'Na2HPO4·7H2O', 7.4, 0.1, 1);
const FRACTIONS = fractions('phosphate', 7.2);
const SPECIES_F = '_xldudf_PROTIC_SPECIES(A2:A3,B2:B3,C2:C3,1)';

function batchSheet(over: { ph?: number; species?: RawCell[] } = {}): RawCell[] {
  return [
    { ref: 'A1', value: 'reagent' }, { ref: 'B1', value: 'amount' }, { ref: 'C1', value: 'unit' },
    { ref: 'A2', value: 'KH2PO4' }, { ref: 'B2', value: 3.4 }, { ref: 'C2', value: 'g' },
    { ref: 'A3', value: 'Na2HPO4' }, { ref: 'B3', value: 3.55 }, { ref: 'C3', value: 'g' },
    { ref: 'A5', value: 'volume (L)' }, { ref: 'B5', value: 1 },
    { ref: 'A7', value: 'pH' }, { ref: 'B7', f: '_xldudf_PROTIC_PHMIX(A2:A3,B2:B3,C2:C3,Volume)', value: over.ph ?? PH },
    ...(over.species ?? spillCells(9, 0, SPECIES_F, SPECIES)),
  ];
}

function reviewSheet(stamp = version()): RawCell[] {
  return [
    { ref: 'A1', value: 'pKa2' }, { ref: 'B1', f: '_xldudf_protic_pka("phosphate",2)', value: pka('phosphate', 2) },
    { ref: 'C1', value: 'NaCl' }, { ref: 'C2', value: 'KCl' }, { ref: 'C3', value: 'Na2HPO4' },
    { ref: 'D1', f: '_xldudf_PROTIC_MOLARMASS(C1)', fAttrs: { t: 'shared', ref: 'D1:D3', si: '0' }, value: molarMass('NaCl') },
    { ref: 'D2', f: '', fAttrs: { t: 'shared', si: '0' }, value: molarMass('KCl') },
    { ref: 'D3', f: '', fAttrs: { t: 'shared', si: '0' }, value: molarMass('Na2HPO4') },
    { ref: 'B2', f: 'Batch!B7+0', value: PH },
    { ref: 'B3', f: '_xlfn.SINGLE(Batch!B7)', value: PH },
    ...spillCells(3, 1, '_xldudf_PROTIC_RECIPE("NaH2PO4·H2O","Na2HPO4·7H2O",TargetPH,0.1,1)', RECIPE),
    { ref: 'B12', f: 'ROWS(_xlfn.ANCHORARRAY(B4))', value: RECIPE.length },
    { ref: 'B13', f: '[2]!_xldudf_PROTIC_MOLARMASS("NaCl")', value: molarMass('NaCl') },
    { ref: 'B14', f: 'PROTIC.VERSION()', value: stamp },
    ...spillCells(14, 1, '_xldudf_PROTIC_FRACTIONS("phosphate",7.2)', FRACTIONS, false),
    { ref: 'B17', f: '_xlfn.IFS(Batch!B7>7,"high",TRUE,"low")', value: PH > 7 ? 'high' : 'low' },
    { ref: 'B18', f: '_xldudf_PROTIC_PKA("phosphate",2,25,B19)', value: pka('phosphate', 2, 25, 0.1) },
    { ref: 'B19', f: 'Batch!B5*0.1', value: 0.1 },
    { ref: 'B20', f: '_xldudf_PROTIC_PHMIX(Batch!A2:A3,Batch!B2:B3,Batch!C2:C3,SheetVolume)', value: PH },
    { ref: 'B21', f: '_xldudf_PROTIC_PKA("phosphate",2,25,\'Review sheet\'!B19)', value: pka('phosphate', 2, 25, 0.1) },
    // a spill whose argument is computed on another sheet: its size is the one saved
    ...spillCells(22, 1, '_xldudf_PROTIC_FRACTIONS("phosphate",Batch!B7)', fractions('phosphate', PH)),
  ];
}

function book(over: { ph?: number; species?: RawCell[]; stamp?: string } = {}): RawBook {
  return {
    sheets: [{ name: 'Batch', cells: batchSheet(over) }, { name: 'Review sheet', cells: reviewSheet(over.stamp) }],
    names: [{ name: 'Volume', text: 'Batch!$B$5' }, { name: 'TargetPH', text: '7.4' }, { name: 'SheetVolume', text: 'Batch!$B$5', localSheetId: 1 }],
    dynamicMetadata: true,
  };
}

async function file(name: string, raw: RawBook): Promise<string> {
  const path = join(dir, name);
  writeFileSync(path, await buildXlsx(raw));
  return path;
}

async function cli(run: typeof verifyMain, args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '', err = '';
  const code = await run(args, (s) => { out += s; }, (s) => { err += s; });
  return { code, out, err };
}

describe('saved-formula forms', () => {
  test.each([
    ['_xldudf_PROTIC_PHMIX(A1:A2,B1:B2,"g",1)', 'PROTIC.PHMIX(A1:A2,B1:B2,"g",1)', ['PHMIX']],
    ['_xldudf_protic_pka("acetate",1)', 'PROTIC.PKA("acetate",1)', ['PKA']],
    ['[2]!_xldudf_PROTIC_VERSION()', 'PROTIC.VERSION()', ['VERSION']],
    ['PROTIC.MolarMass("NaCl")', 'PROTIC.MOLARMASS("NaCl")', ['MOLARMASS']],
    ['_xlfn.IFS(A1>1,"a",TRUE,"_xldudf_PROTIC_PKA(")', 'IFS(A1>1,"a",TRUE(),"_xldudf_PROTIC_PKA(")', []],
    ['_xlfn._xlws.SORT(A1:A3)', 'SORT(A1:A3)', []],
    ['_xlfn.SINGLE(A1:A3)*2', '(A1:A3)*2', []],
    ['IF(TRUE,FALSE,"TRUE")', 'IF(TRUE(),FALSE(),"TRUE")', []],
  ])('%s reads as %s', (saved, engine, protic) => {
    const f = readFormula(saved);
    expect(f.engine).toBe(engine);
    expect(f.protic).toEqual(protic);
    expect(f.external).toBe(false);
  });
  test('a spill reference reads as the saved spill range; an external reference is flagged', () => {
    expect(readFormula('SUM(_xlfn.ANCHORARRAY(C4))', (ref) => (ref === 'C4' ? 'C4:E9' : undefined)).engine).toBe('SUM(C4:E9)');
    expect(readFormula("ROWS(_xlfn.ANCHORARRAY('Other sheet'!B2))", (ref) => (ref === "'Other sheet'!B2" ? "'Other sheet'!B2:C3" : undefined)).engine).toBe("ROWS('Other sheet'!B2:C3)");
    expect(readFormula('[1]Sheet1!$A$1*2').external).toBe(true);
    expect(readFormula('_xldudf_96323233322223(A1)').foreign).toEqual(['_xldudf_96323233322223']);
  });
  test('written back in the form Excel saves', () => {
    expect(savedFormula('=PROTIC.PHMIX(A1,"PROTIC.PKA(",1)')).toBe('_xldudf_PROTIC_PHMIX(A1,"PROTIC.PKA(",1)');
  });
});

describe('verify', () => {
  test('a workbook as Excel saves it: every form read, every Protic cell and spill agrees (exit 0)', async () => {
    const path = await file('forms.xlsx', book());
    const r = await verifyFile(path);
    expect(r.problems).toEqual([]);
    expect(r.cells.filter((c) => c.status === 'differs' || c.status === 'not saved')).toEqual([]);
    expect(r.exitCode).toBe(0);
    for (const form of ['_xldudf_PROTIC_NAME', '[n]!_xldudf_PROTIC_NAME (add-in behind a link index)', 'PROTIC.NAME as typed', 'shared formula (t="shared" si)',
      'dynamic-array spill (cm + XLDAPR metadata, t="array" ref on the anchor)', 'legacy array formula (t="array" ref, no cm)',
      '_xlfn.ANCHORARRAY (spill reference B5#)', '_xlfn.SINGLE (implicit intersection @)', '_xlfn. / _xlws. prefixes']) expect(r.forms).toContain(form);
    // spills are compared over their whole range, however large the result is today
    const speciesCells = r.cells.filter((c) => c.where === 'Batch!A10' || c.spillOf === 'Batch!A10');
    expect(speciesCells.length).toBe(SPECIES.length * Math.max(...SPECIES.map((row) => row.length)));
    const recipeCells = r.cells.filter((c) => c.where === "Review sheet!B4" || c.spillOf === 'Review sheet!B4');
    expect(recipeCells.length).toBe(RECIPE.length * Math.max(...RECIPE.map((row) => row.length)));
    expect(recipeCells.every((c) => c.status === 'agrees')).toBe(true);
    expect(r.cells.filter((c) => c.spillOf === 'Review sheet!B15').length).toBe(FRACTIONS[0].length - 1);
    // inputs that are themselves computed are marked
    expect(r.cells.find((c) => c.where === 'Review sheet!B18')!.computedInputs).toEqual(['B19']);
    expect(r.cells.find((c) => c.where === 'Batch!B7')!.computedInputs).toEqual([]);
    expect(r.cells.find((c) => c.where === 'Review sheet!B20')!.status).toBe('agrees'); // a name scoped to its sheet
    expect(r.cells.find((c) => c.where === 'Review sheet!B21')!.computedInputs).toEqual(['B19']);
    const crossSheet = r.cells.filter((c) => c.where === 'Review sheet!B23' || c.spillOf === 'Review sheet!B23');
    expect(crossSheet.map((c) => c.status)).toEqual(fractions('phosphate', PH)[0].map(() => 'agrees'));
    expect(crossSheet[0].computedInputs).toEqual(['Batch!B7']);
    expect(r.stamps).toEqual([expect.objectContaining({ where: 'Review sheet!B14', changed: false })]);
  });

  test('a one-cell result saved as Excel saves it (a 1×1 dynamic array), and a call saved before the add-in loaded', async () => {
    const cells: RawCell[] = [
      { ref: 'A1', f: '_xldudf_PROTIC_PKA("phosphate",2)', fAttrs: { t: 'array', ref: 'A1' }, cm: 1, value: pka('phosphate', 2) },
      { ref: 'B1', f: '_xldudf_PROTIC_VERSION()', fAttrs: { t: 'array', ref: 'B1' }, cm: 1, value: version() },
    ];
    const ok = await verifyFile(await file('one-cell.xlsx', { sheets: [{ name: 'S', cells }], dynamicMetadata: true }));
    expect(ok.exitCode).toBe(0);
    expect(ok.cells.map((c) => [c.where, c.status])).toEqual([['S!A1', 'agrees'], ['S!B1', 'stamp']]);
    // typed while Protic was not loaded: Excel keeps the name as typed and saves #NAME?
    const stuck = await verifyFile(await file('stuck.xlsx', { sheets: [{ name: 'S', cells: [{ ref: 'A1', f: 'PROTIC.PKA("phosphate",2)', fAttrs: { t: 'array', aca: '1', ref: 'A1', ca: '1' }, cm: 1, value: { error: '#NAME?' } }] }], dynamicMetadata: true }));
    expect(stuck.exitCode).toBe(1);
    expect(stuck.cells[0].note).toMatch(/Excel did not have Protic loaded/);
  });

  test('the evaluated grid: cross-sheet references, defined names, ANCHORARRAY, SINGLE and IFS', async () => {
    const path = await file('forms-sheet.xlsx', book());
    const r = await cli(sheetMain, [path, '--sheet', 'Review sheet']);
    expect(r.code).toBe(0);
    const rows = r.out.trim().split('\n').map((l) => l.split(','));
    expect(Number(rows[1][1])).toBe(PH);
    expect(Number(rows[2][1])).toBe(PH);
    expect(Number(rows[11][1])).toBe(RECIPE.length);
    expect(rows[16][1]).toBe(PH > 7 ? 'high' : 'low');
    expect(Number(rows[0][3])).toBe(molarMass('NaCl'));
    expect(Number(rows[2][3])).toBe(molarMass('Na2HPO4'));
  });

  test('one PROTIC value altered by 0.01: exit 1, naming exactly that cell', async () => {
    const path = await file('altered.xlsx', book({ ph: PH + 0.01 }));
    const r = await cli(verifyMain, [path]);
    expect(r.code).toBe(1);
    const result = await verifyFile(path);
    expect(result.cells.filter((c) => c.status !== 'agrees' && c.status !== 'stamp').map((c) => c.where)).toEqual(['Batch!B7']);
    expect(result.cells.find((c) => c.where === 'Batch!B7')!.difference).toBeCloseTo(-0.01, 12);
    expect(r.out).toMatch(/Batch!B7 +=_xldudf_PROTIC_PHMIX\(A2:A3,B2:B3,C2:C3,Volume\) +saved [0-9.]+ +recomputed [0-9.]+ +-1\.000e-2/);
    // the tolerance is relative: 0.01 in a pH near 6.9 is 0.0015 of it
    expect((await cli(verifyMain, [path, '--tolerance', '0.002'])).code).toBe(0);
    expect((await cli(verifyMain, [path, '--tolerance', '0.001'])).code).toBe(1);
  });

  test('a difference carried from an altered input says so', async () => {
    const cells: RawCell[] = [
      { ref: 'A1', f: '_xldudf_PROTIC_PKA("phosphate",2)', value: pka('phosphate', 2) + 0.01 },
      { ref: 'A2', f: '_xldudf_PROTIC_FRACTIONS("phosphate",A1)', fAttrs: { t: 'array', ref: 'A2' }, value: 0 },
      { ref: 'A3', f: '_xldudf_PROTIC_PKA("phosphate",1)', value: pka('phosphate', 1) + 0.01 },
    ];
    const r = await verifyFile(await file('upstream.xlsx', { sheets: [{ name: 'S', cells }] }));
    const byWhere = new Map(r.cells.map((c) => [c.where, c]));
    expect(byWhere.get('S!A2')!.note).toMatch(/an input differs too \(A1\): this difference may come from there/);
    expect(byWhere.get('S!A1')!.note ?? '').not.toMatch(/input differs/);
    expect(byWhere.get('S!A3')!.note ?? '').not.toMatch(/input differs/);
  });

  test('one cell inside a spilled SPECIES altered: exactly that cell, as part of its spill', async () => {
    const altered = SPECIES.map((row) => [...row]);
    const r0 = altered.findIndex((row) => row[0] === 'H⁺');
    altered[r0][2] = (altered[r0][2] as number) * (1 + 1e-6);
    const path = await file('altered-spill.xlsx', book({ species: spillCells(9, 0, SPECIES_F, altered) }));
    const result = await verifyFile(path);
    expect(result.exitCode).toBe(1);
    const bad = result.cells.filter((c) => c.status === 'differs');
    expect(bad.map((c) => [c.where, c.spillOf])).toEqual([[`Batch!C${10 + r0}`, 'Batch!A10']]);
  });

  test('a spill saved one row shorter than the result is now: the shape and the missing cells are reported', async () => {
    const shorter = spillCells(9, 0, SPECIES_F, SPECIES.slice(0, -1));
    const path = await file('short-spill.xlsx', book({ species: shorter }));
    const result = await verifyFile(path);
    expect(result.exitCode).toBe(1);
    const cols = Math.max(...SPECIES.map((row) => row.length));
    expect(result.spills).toEqual([{ where: 'Batch!A10', saved: `${SPECIES.length - 1}×${cols}`, recomputed: `${SPECIES.length}×${cols}` }]);
  });

  test('a legacy array formula selected larger than its result: the #N/A padding Excel saves agrees', async () => {
    const padded = [[...FRACTIONS[0], { error: '#N/A' }, { error: '#N/A' }]];
    const cells = spillCells(0, 0, '_xldudf_PROTIC_FRACTIONS("phosphate",7.2)', padded, false);
    const result = await verifyFile(await file('legacy-padded.xlsx', { sheets: [{ name: 'S', cells }] }));
    expect(result.exitCode).toBe(0);
    expect(result.cells.length).toBe(FRACTIONS[0].length + 2);
    expect(result.spills).toEqual([]);
    // the same padding on a dynamic array is not Excel's doing: it differs
    const dynamic = await verifyFile(await file('dynamic-padded.xlsx', { sheets: [{ name: 'S', cells: spillCells(0, 0, '_xldudf_PROTIC_FRACTIONS("phosphate",7.2)', padded) }], dynamicMetadata: true }));
    expect(dynamic.exitCode).toBe(1);
  });

  test('a VERSION stamp naming an older catalogue is reported as such', async () => {
    const path = await file('old-stamp.xlsx', book({ stamp: 'Protic 0.1.0; catalogue 2020.1.1' }));
    const r = await cli(verifyMain, [path]);
    expect(r.out).toMatch(/VERSION stamp Review sheet!B14: saved "Protic 0\.1\.0; catalogue 2020\.1\.1": the catalogue changed since the record was signed: signed with catalogue 2020\.1\.1, now \d/);
    expect(r.code).toBe(0); // the numbers still hold under the current catalogue
    expect((await cli(verifyMain, [path, '--strict-version'])).code).toBe(1);
  });

  test('reports: Markdown and HTML list every cell; the HTML has no script and no external reference', async () => {
    const path = await file('report.xlsx', book({ ph: PH + 0.01 }));
    const md = join(dir, 'r.md'), html = join(dir, 'r.html');
    expect((await cli(verifyMain, [path, '--report', md])).code).toBe(1);
    expect((await cli(verifyMain, [path, '--report', html])).code).toBe(1);
    const mdText = readFileSync(md, 'utf8'), htmlText = readFileSync(html, 'utf8');
    expect(mdText).toMatch(/\| Batch!B7 \| `=_xldudf_PROTIC_PHMIX\(A2:A3,B2:B3,C2:C3,Volume\)` \| [0-9.]+ \| [0-9.]+ \| -1\.000e-2 \| \*\*differs\*\*/);
    expect(mdText).toMatch(/\| Review sheet!B18 \|.*\| B19 \|$/m);
    expect(htmlText).not.toMatch(/<script|src=|href=|url\(|@import/i);
    expect(htmlText).toMatch(/<tr class="differs"><td>Batch!B7<\/td>/);
  });

  test('custom systems stored in the workbook\'s add-in settings are used; --systems when the workbook has none', async () => {
    const systems = readFileSync('examples/custom-systems.json', 'utf8');
    const cells: RawCell[] = [{ ref: 'A1', f: '_xldudf_PROTIC_PKA("Zorbate",1)', value: 5.5 }];
    // Office.Settings keeps each value JSON-encoded; the pane saves its definitions as a JSON string
    const inBook = await file('custom.xlsx', { sheets: [{ name: 'S', cells }], webProperties: { 'protic.customSystems': JSON.stringify(JSON.stringify(JSON.parse(systems))) } });
    const r = await cli(verifyMain, [inBook]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/custom systems: 1 custom system\(s\) from the workbook \(xl\/webextensions\/webextension1\.xml, property protic\.customSystems, add-in 5f0c2a7e/);
    clearCustomDefinitions();
    const bare = await file('custom-bare.xlsx', { sheets: [{ name: 'S', cells }] });
    expect((await cli(verifyMain, [bare])).code).toBe(1);
    const unloaded = await file('custom-name.xlsx', { sheets: [{ name: 'S', cells: [{ ...cells[0], value: { error: '#NAME?' } }] }] });
    expect((await cli(verifyMain, [unloaded, '--systems', 'examples/custom-systems.json'])).out).toMatch(/saved #NAME\? +recomputed 5\.5 .*Excel did not have Protic loaded/);
    clearCustomDefinitions();
    clearCustomDefinitions();
    expect((await cli(verifyMain, [bare, '--systems', 'examples/custom-systems.json'])).code).toBe(0);
    // sheet --systems --out writes them into the workbook's add-in settings, where verify (and the pane) find them
    clearCustomDefinitions();
    const carried = join(dir, 'carried.xlsx');
    expect((await cli(sheetMain, [bare, '--systems', 'examples/custom-systems.json', '--out', carried])).code).toBe(0);
    clearCustomDefinitions();
    const v = await cli(verifyMain, [carried]);
    expect(v.out).toMatch(/1 custom system\(s\) from the workbook/);
    expect(v.code).toBe(0);
  });

  test('a workbook without Protic formulas says nothing was verified', async () => {
    const r = await cli(verifyMain, [await file('plain.xlsx', { sheets: [{ name: 'S', cells: [{ ref: 'A1', value: 1 }, { ref: 'A2', f: 'A1*2', value: 2 }] }] })]);
    expect(r.out).toMatch(/result: the workbook holds no Protic formula: nothing was verified \(exit 0\)/);
  });

  test('progress on stderr for a long workbook', async () => {
    const cells: RawCell[] = [];
    for (let i = 0; i < 2000; i++) cells.push({ ref: `A${i + 1}`, f: '_xldudf_PROTIC_MOLARMASS("NaCl")', value: molarMass('NaCl') });
    const r = await cli(verifyMain, [await file('long.xlsx', { sheets: [{ name: 'S', cells }] })]);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/recomputing: 1000 of 2000 Protic cells/);
  });
});

describe('bad input: a clear message and exit 2, never a stack trace', () => {
  const cfb = (streams: string[]): Buffer => Buffer.concat([Buffer.from('d0cf11e0a1b11ae1', 'hex'), Buffer.alloc(504), ...streams.map((s) => Buffer.from(s, 'utf16le'))]);
  const phCell: RawCell = { ref: 'B1', f: '_xldudf_PROTIC_PHMIX("KH2PO4",3.4,"g",1)', value: ph('KH2PO4', 3.4, 'g', 1) };
  test.each([
    ['not a zip', async () => { const p = join(dir, 'text.xlsx'); writeFileSync(p, 'reagent,amount\n'); return [p]; }, /not an \.xlsx workbook/],
    ['a damaged zip', async () => { const p = join(dir, 'damaged.xlsx'); writeFileSync(p, Buffer.concat([Buffer.from('504b0304', 'hex'), Buffer.alloc(200, 7)])); return [p]; }, /damaged/],
    // the stream names an OLE container lists in its directory (MS-CFB): an .xls holds "Workbook", an encrypted .xlsx "EncryptionInfo" and "EncryptedPackage" (MS-OFFCRYPTO)
    ['an old .xls', async () => { const p = join(dir, 'old.xls'); writeFileSync(p, cfb(['Root Entry', 'Workbook', 'SummaryInformation'])); return [p]; }, /old Excel 97–2003 \.xls/],
    ['a password-protected workbook', async () => { const p = join(dir, 'locked.xlsx'); writeFileSync(p, cfb(['Root Entry', 'EncryptionInfo', 'EncryptedPackage'])); return [p]; }, /password-protected/],
    ['over the size limit', async () => [await file('big.xlsx', { sheets: [{ name: 'S', cells: [phCell] }] }), '--max-size', '0.0001'], /over the 0 MB limit|over the .* MB limit/],
    ['a missing file', async () => [join(dir, 'nowhere.xlsx')], /cannot be read \(ENOENT\)/],
  ])('%s', async (_label, make, pattern) => {
    const args = await (make as () => Promise<string[]>)();
    for (const run of [verifyMain, sheetMain]) {
      const r = await cli(run, args);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(pattern);
      expect(r.err).not.toMatch(/\n\s+at /);
    }
  });

  test.each([
    ['an unparseable formula', { ref: 'A1', f: 'SUM(B2:B3', value: 0 }, /cannot verify S!A1: the formula cannot be parsed here: =SUM\(B2:B3/],
    ['a circular reference', { ref: 'A1', f: 'A2+1', value: 0 }, /cannot verify S!A[12]: circular reference/],
    ['a function the engine does not know', { ref: 'A1', f: '_xlfn.CONCAT("a","b")', value: 'ab' }, /cannot verify S!A1: .*CONCAT.*: =_xlfn\.CONCAT/],
    ['an external link', { ref: 'A1', f: '[1]Sheet1!$A$1*2', value: 4 }, /cannot verify S!A1: refers to another workbook.*\n.*|links to another workbook: file:\/\/\/C:\/records\/other\.xlsx/],
  ])('%s: that cell is reported, the rest still verified', async (_label, bad, pattern) => {
    const cells: RawCell[] = [bad as RawCell, phCell];
    if (_label === 'a circular reference') cells.push({ ref: 'A2', f: 'A1+1', value: 0 });
    const path = await file(`bad-${colName(cells.length)}-${_label.length}.xlsx`, { sheets: [{ name: 'S', cells }], externalLink: _label === 'an external link' ? 'file:///C:/records/other.xlsx' : undefined });
    const r = await cli(verifyMain, [path]);
    expect(r.code).toBe(2);
    expect(r.out).toMatch(pattern);
    expect(r.out).toMatch(/agree 1, differ 0/);
    expect(r.err + r.out).not.toMatch(/\n\s+at /);
    const s = await cli(sheetMain, [path]);
    expect(s.code).toBe(2);
    expect(s.err).toMatch(/^cannot evaluate /m);
    expect(Number(s.out.trim().split('\n')[0].split(',')[1])).toBe(phCell.value); // the rest of the grid is still there
  });
});

describe('the examples as .xlsx', () => {
  let written: string[] = [];
  beforeAll(async () => { written = await writeExampleWorkbooks('examples', join(dir, 'examples')); });
  test.each(readdirSync('examples').filter((f) => f.endsWith('.csv')))('%s → .xlsx → sheet gives the CSV run\'s grid, and verify passes', async (name) => {
    const out = join(dir, 'examples', name.replace(/\.csv$/, '.xlsx'));
    expect(written).toContain(out);
    const fromXlsx = await cli(sheetMain, [out]);
    expect(fromXlsx.code).toBe(0);
    expect(fromXlsx.out).toBe(runSheet(readFileSync(join('examples', name), 'utf8'), false));
    const v = await cli(verifyMain, [out]);
    expect(v.out).toMatch(/agree [1-9]\d*, differ 0, no saved value 0/);
    expect(v.code).toBe(0);
  });
});

describe('sheet --out', () => {
  test('a CSV written as .xlsx, and a workbook as CSV by sheet name', async () => {
    const out = join(dir, 'wash.xlsx');
    expect((await cli(sheetMain, ['examples/wash-buffer.csv', '--out', out])).code).toBe(0);
    const expected = runSheet(readFileSync('examples/wash-buffer.csv', 'utf8'), false);
    expect((await cli(sheetMain, [out])).out).toBe(expected);
    const csv = join(dir, 'wash.csv');
    expect((await cli(sheetMain, [out, '--sheet', 'wash-buffer', '--out', csv])).code).toBe(0);
    expect(readFileSync(csv, 'utf8')).toBe(expected);
    const two = await file('two.xlsx', book());
    const r = await cli(sheetMain, [two, '--out', join(dir, 'two.csv')]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/a CSV holds one sheet; name it with --sheet \(sheets: Batch, Review sheet\)/);
    expect((await cli(sheetMain, [two, '--sheet', 'Nope'])).err).toMatch(/no sheet named "Nope"/);
  });
  test('written as Excel saves it: _xldudf_ names, one-cell and spilled dynamic arrays, the XLDAPR part', async () => {
    const out = join(dir, 'elution.xlsx');
    expect((await cli(sheetMain, ['examples/elution-buffer.csv', '--out', out])).code).toBe(0);
    const zip = await JSZip.loadAsync(readFileSync(out));
    const xml = await zip.file('xl/worksheets/sheet1.xml')!.async('string');
    expect(xml).toMatch(/<c r="B8" cm="1"[^>]*><f t="array" ref="B8">_xldudf_PROTIC_PHMIX\(A6:A7,B6:B7,C6:C7,2\)<\/f><v>[0-9.]+<\/v><\/c>/);
    expect(xml).toMatch(/<c r="A15" cm="1"[^>]*><f t="array" ref="A15:[A-Z]+\d+">_xldudf_PROTIC_SPECIES\(/);
    expect(xml).not.toMatch(/PROTIC\./);
    expect(await zip.file('xl/metadata.xml')!.async('string')).toMatch(/<metadataType name="XLDAPR"[\s\S]*fDynamic="1"[\s\S]*<rc t="1" v="0"\/>/);
    expect(await zip.file('[Content_Types].xml')!.async('string')).toMatch(/PartName="\/xl\/metadata\.xml" ContentType="application\/vnd\.openxmlformats-officedocument\.spreadsheetml\.sheetMetadata\+xml"/);
  });

  test('several sheets print each under its name', async () => {
    const r = await cli(sheetMain, [await file('print.xlsx', book())]);
    expect(r.code).toBe(0);
    expect(r.out.split('\n').filter((l) => l.startsWith('# sheet '))).toEqual(['# sheet Batch', '# sheet Review sheet']);
  });

  test('a workbook written back keeps its forms and verifies', async () => {
    const out = join(dir, 'forms-out.xlsx');
    expect((await cli(sheetMain, [await file('forms-in.xlsx', book()), '--out', out])).code).toBe(0);
    const r = await verifyFile(out);
    expect(r.exitCode).toBe(0);
    expect(r.forms).toContain('legacy array formula (t="array" ref, no cm)');
    expect(r.cells.filter((c) => c.spillOf === 'Batch!A10').length + 1).toBe(SPECIES.length * Math.max(...SPECIES.map((row) => row.length)));
  });
});

describe('the README worked example', () => {
  test('is what verify prints for the wash buffer with one saved pH changed by 0.01', async () => {
    const [wash] = (await writeExampleWorkbooks('examples', join(dir, 'readme'))).filter((p) => p.endsWith('wash-buffer.xlsx'));
    const zip = await JSZip.loadAsync(readFileSync(wash));
    const xml = await zip.file('xl/worksheets/sheet1.xml')!.async('string');
    zip.file('xl/worksheets/sheet1.xml', xml.replace(/(<c r="B10"[^>]*><f[^>]*>[^<]*<\/f><v>)([^<]*)(<\/v>)/, (_m, a: string, v: string, b: string) => `${a}${Number(v) + 0.01}${b}`));
    const signed = join(dir, 'readme', 'wash-buffer-signed.xlsx');
    writeFileSync(signed, await zip.generateAsync({ type: 'nodebuffer' }));
    const r = await cli(verifyMain, [signed]);
    expect(r.code).toBe(1);
    const block = /```text\n\$ npm run verify -- wash-buffer-signed\.xlsx\n([\s\S]*?)```/.exec(readFileSync('README.md', 'utf8'))![1];
    // numbers and versions follow the catalogue; the wording, the cells and the layout must match
    const mask = (s: string): string => s.replace(/\d+(\.\d+)*(e-?\d+)?/g, '#');
    expect(mask(r.out.replace(signed, 'wash-buffer-signed.xlsx'))).toBe(mask(block));
  });
});
