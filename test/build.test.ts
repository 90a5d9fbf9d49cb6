import { execFileSync } from 'child_process';
import { mkdtempSync, readFileSync, statSync } from 'fs';
import { tmpdir } from 'os';
import { join } from 'path';
import { DOMParser } from '@xmldom/xmldom';

// Builds the add-in once (production) and checks what Excel will load.
const out = mkdtempSync(join(tmpdir(), 'protic-build-'));
execFileSync(process.execPath, [require.resolve('webpack-cli/bin/cli.js'), '--mode', 'production', '--output-path', out], { stdio: 'pipe' });

const CONTRACT: Record<string, string[]> = {
  PHMIX: ['reagents', 'amounts', 'units', 'volume', 'temperature', 'model'],
  TITRANT: ['targetPH', 'reagents', 'amounts', 'units', 'volume', 'titrant', 'temperature', 'model', 'resultUnit'],
  CURVE: ['reagents', 'amounts', 'units', 'volume', 'titrant', 'maxAmount', 'points', 'temperature', 'model', 'resultUnit'],
  FRACTIONS: ['system', 'pH', 'temperature', 'ionicStrength', 'model'],
  SPECIES: ['reagents', 'amounts', 'units', 'volume', 'temperature', 'model'],
  CONSTANTS: ['reagents', 'amounts', 'units', 'volume', 'temperature', 'model'],
  WARNINGS: ['reagents', 'amounts', 'units', 'volume', 'temperature', 'model'],
  IONICSTRENGTH: ['reagents', 'amounts', 'units', 'volume', 'temperature', 'model'],
  CAPACITY: ['reagents', 'amounts', 'units', 'volume', 'temperature', 'model'],
  PKA: ['system', 'step', 'temperature', 'ionicStrength', 'model'],
  RECIPE: ['acidForm', 'baseForm', 'targetPH', 'concentration', 'volume', 'temperature', 'model', 'otherReagents', 'otherAmounts', 'otherUnits'],
  MOLARMASS: ['formula'],
  VERSION: [],
};

interface Meta { functions: { id: string; name: string; description?: string; helpUrl?: string; parameters: { name: string; description?: string }[] }[] }

describe('the built add-in', () => {
  const meta = JSON.parse(readFileSync(join(out, 'functions.json'), 'utf8')) as Meta;
  test.each(Object.entries(CONTRACT))('functions.json has %s with its parameters, in order, described', (name, params) => {
    const f = meta.functions.find((x) => x.name === name);
    expect(f).toBeDefined();
    expect(f!.description!.length).toBeGreaterThan(10);
    expect(f!.helpUrl).toMatch(/README\.md#/);
    // the help link lands on the function's own entry in the README
    expect(readFileSync('README.md', 'utf8')).toContain(`<a id="${f!.helpUrl!.split('#')[1]}"></a>**${name}(`);
    expect(f!.parameters.map((p) => p.name)).toEqual(params);
    for (const p of f!.parameters) expect((p.description ?? '').length).toBeGreaterThan(3);
  });

  test('the functions bundle is at most 150 KB minified', () => {
    expect(statSync(join(out, 'functions.js')).size).toBeLessThanOrEqual(150 * 1024);
  });

  test('the bundle carries neither the spreadsheet engine nor a test library', () => {
    const js = readFileSync(join(out, 'functions.js'), 'utf8') + readFileSync(join(out, 'taskpane.js'), 'utf8');
    expect(js).not.toMatch(/HyperFormula/);
    expect(js).not.toMatch(/fast-check/);
  });

  test('the production manifest has no development URL left', () => {
    expect(readFileSync(join(out, 'manifest.xml'), 'utf8')).not.toMatch(/localhost/);
    expect(readFileSync(join(out, 'functions.json'), 'utf8')).not.toMatch(/localhost/);
  });

  test('taskpane.html carries a Content-Security-Policy and loads both bundles', () => {
    const html = readFileSync(join(out, 'taskpane.html'), 'utf8');
    expect(html).toMatch(/Content-Security-Policy/);
    expect(html).toMatch(/functions\.js/);
    expect(html).toMatch(/taskpane\.js/);
  });
});

describe('manifest/manifest.xml', () => {
  const text = readFileSync('manifest/manifest.xml', 'utf8');
  const errors: string[] = [];
  const doc = new DOMParser({ onError: (level: string, msg: string) => { if (level !== 'warning') errors.push(msg); } }).parseFromString(text, 'text/xml');

  test('is well-formed XML', () => {
    expect(errors).toEqual([]);
    expect(doc.documentElement!.nodeName).toBe('OfficeApp');
  });

  test('every resid it uses is defined in Resources', () => {
    const defined = new Set<string>();
    const all = doc.getElementsByTagName('*');
    for (let i = 0; i < all.length; i++) {
      const node = all[i];
      if (/^bt:(Image|Url|String)$/.test(node.nodeName) && node.getAttribute('id')) defined.add(node.getAttribute('id')!);
    }
    const used: string[] = [];
    for (let i = 0; i < all.length; i++) {
      const resid = all[i].getAttribute('resid');
      if (resid) used.push(resid);
    }
    expect(used.length).toBeGreaterThan(10);
    for (const resid of used) expect(defined.has(resid)).toBe(true);
  });

  test('declares the shared runtime and the PROTIC namespace', () => {
    expect(text).toMatch(/<Set Name="SharedRuntime" MinVersion="1.1"\/>/);
    expect(text).toMatch(/<bt:String id="Functions.Namespace" DefaultValue="PROTIC"\/>/);
    expect(text).toMatch(/xsi:type="CustomFunctions"/);
  });

  test('its icons exist', () => {
    for (const m of text.matchAll(/localhost:3000\/(icon-\d+\.png)/g)) expect(statSync(join('assets', m[1])).size).toBeGreaterThan(50);
  });
});
