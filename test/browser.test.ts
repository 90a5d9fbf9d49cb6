import { mkdirSync, readFileSync } from 'fs';
import type { Server } from 'http';
import { join } from 'path';
import type { Browser, Page } from 'playwright-core';
import { buildAddin, closeAll, launchChromium, serveFolder } from './browser/harness';
import { ACTIVITY_MODELS } from '../src/engine';


// The built pane in headless Chromium, with a stand-in Office host.
let server: Server | undefined;
let browser: Browser;
let origin = '';

beforeAll(async () => {
  const out = buildAddin();
  ({ server, origin } = await serveFolder(out));
  browser = await launchChromium();
}, 120000);

afterAll(async () => {
  await closeAll(browser, server);
});

async function openPane(initialSettings: Record<string, string> = {}): Promise<{ page: Page; requests: string[]; dialogs: string[] }> {
  const page = await browser.newPage({ viewport: { width: 320, height: 1800 } });
  const requests: string[] = [];
  const dialogs: string[] = [];
  page.on('request', (r) => requests.push(r.url()));
  page.on('dialog', (d) => { dialogs.push(d.message()); void d.dismiss(); });
  await page.route('https://appsforoffice.microsoft.com/**', (route) => route.fulfill({
    contentType: 'text/javascript',
    body: `window.__initialSettings = ${JSON.stringify(initialSettings)};\n${readFileSync(join(__dirname, 'browser', 'standInOffice.js'), 'utf8')}`,
  }));
  await page.goto(`${origin}/taskpane.html`);
  await page.waitForSelector('#results li');
  return { page, requests, dialogs };
}

describe('the side pane in headless Chromium', () => {
  test('search, open a system, plot, insert a formula, define a custom system', async () => {
    const { page, requests } = await openPane();
    await page.fill('#search', 'phosph');
    await page.click('#results button[data-system="phosphate"] >> nth=0');
    await page.waitForSelector('#system-name');
    expect(await page.textContent('#system-name')).toBe('phosphate');
    expect(await page.locator('#fractions-chart path.series').count()).toBe(4);
    expect(await page.locator('#fractions-chart line.pka-mark').count()).toBe(3);
    expect(await page.locator('#steps tr').count()).toBe(4);

    await page.selectOption('#formula-kind', 'ph');
    await page.click('#insert');
    await page.waitForFunction(() => (window as unknown as { __writes: unknown[] }).__writes.length === 1);
    const writes = await page.evaluate(() => (window as unknown as { __writes: { at: number[]; formulas: unknown[][] }[] }).__writes);
    expect(writes[0].at).toEqual([1, 1, 8, 3]);
    expect(writes[0].formulas[0]).toEqual(['Reagent', 'Amount', 'Unit']);
    expect(writes[0].formulas[6][1]).toBe('=PROTIC.PHMIX(B3:B4,C3:C4,D3:D4,C5,C6,C7)');

    await page.selectOption('#formula-kind', 'titrant');
    await page.click('#preview');
    expect(await page.locator('#curve-chart path.curve').count()).toBe(1);

    await page.fill('#custom-name', 'Zorbate');
    await page.fill('#custom-pka', '5.5');
    await page.fill('#custom-form1-name', 'zorbic acid');
    await page.fill('#custom-form1-formula', 'C6H8O2');
    await page.fill('#custom-form2-name', 'sodium zorbate');
    await page.fill('#custom-form2-formula', 'C6H7NaO2');
    await page.click('#custom-save');
    await page.waitForFunction(() => /Saved Zorbate/.test(document.getElementById('status')?.textContent ?? ''));
    const fractions = await page.evaluate(() => (window as unknown as { __fns: Record<string, (...a: unknown[]) => number[][]> }).__fns.FRACTIONS('Zorbate', 5.5));
    expect(fractions[0][0]).toBeCloseTo(0.5, 10);
    const saved = await page.evaluate(() => (window as unknown as { __savedSettings: Record<string, string> }).__savedSettings['protic.customSystems']);
    expect(JSON.parse(saved).systems[0].name).toBe('Zorbate');

    await page.fill('#search', 'zorb');
    expect(await page.locator('#results button[data-system="custom:zorbate"]').count()).toBe(3);
    await page.fill('#search', 'phosphate');
    await page.click('#results button[data-system="phosphate"] >> nth=0');
    mkdirSync('test-output', { recursive: true });
    await page.screenshot({ path: 'test-output/pane.png', fullPage: true });
    expect(requests.every((u) => u.startsWith(origin) || u.startsWith('https://appsforoffice.microsoft.com/'))).toBe(true);
    await page.close();
  }, 60000);

  test('keyboard only: search, move to a result, open it; every input has a label', async () => {
    const { page } = await openPane();
    await page.focus('#search');
    await page.keyboard.type('trometamol');
    await page.keyboard.press('Tab'); // the pKa filter checkbox
    await page.keyboard.press('Tab'); // the first result
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-system'))).toBe('tris');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => document.getElementById('system-name')?.textContent === 'Tris');
    const unlabelled = await page.evaluate(() => Array.from(document.querySelectorAll('input, select, textarea'))
      .filter((e) => !document.querySelector(`label[for="${e.id}"]`) && !e.closest('label')).map((e) => e.outerHTML));
    expect(unlabelled).toEqual([]);
    await page.close();
  }, 60000);

  test('a result outside the model\'s range is shown with its warning, and the preview axis names the unit', async () => {
    const { page } = await openPane();
    await page.fill('#row1-reagent', 'borax decahydrate');
    await page.fill('#row1-amount', '4.77'); // 0.0125 mol in 1 L: 0.05 mol/L boron
    await page.fill('#row2-reagent', '');
    await page.selectOption('#formula-kind', 'curve');
    await page.fill('#titrant', '1 M HCl');
    await page.click('#preview');
    const status = await page.textContent('#status');
    expect(status).toMatch(/^Preview: pH 9\.\d\d to \d\.\d\d\.\nWarning: borate total 0\.0500 mol\/L is above 0\.025 mol\/L: polyborate/);
    expect(await page.getAttribute('#status', 'class')).toBe('status warning');
    expect(await page.textContent('#curve-chart')).toContain('titrant added (mL)');
    await page.close();
  }, 60000);

  test('the audit and temperature what-if blocks are written from the pane', async () => {
    const { page } = await openPane();
    type Writes = { __writes: { at: number[]; formulas: unknown[][] }[] };
    await page.selectOption('#formula-kind', 'species');
    await page.click('#insert');
    await page.waitForFunction(() => (window as unknown as Writes).__writes.length === 1);
    await page.selectOption('#formula-kind', 'temperatures');
    await page.click('#insert');
    // the second block lands on the first: the pane asks before replacing anything
    await page.waitForSelector('#insert-question [data-answer="yes"]');
    expect(await page.textContent('#insert-question')).toMatch(/^B2:D\d+ has \d+ cells with content\. Replace them/);
    await page.click('#insert-question [data-answer="yes"]');
    await page.waitForFunction(() => (window as unknown as Writes).__writes.length === 2);
    const writes = await page.evaluate(() => (window as unknown as Writes).__writes);
    expect(writes[0].formulas[6][0]).toBe('=PROTIC.SPECIES(B3:B4,C3:C4,D3:D4,C5,C6,C7)');
    expect(writes[0].at[3]).toBe(11); // CONSTANTS spills eleven columns (source, provenance and the alternative value among them)
    expect(writes[1].formulas[5]).toEqual(['Temperature (°C)', 'pH', 'Warnings']);
    expect(writes[1].formulas[6]).toEqual([4, '=PROTIC.PHMIX(B3:B4,C3:C4,D3:D4,C5,B8,C6)', '=PROTIC.WARNINGS(B3:B4,C3:C4,D3:D4,C5,B8,C6)']);
    expect(await page.textContent('#status')).toMatch(/^Wrote B2:D/);
    await page.close();
  }, 60000);

  test('the salt and review blocks are written from the pane; the model list is the engine\'s', async () => {
    const { page } = await openPane();
    type Writes = { __writes: { at: number[]; formulas: unknown[][] }[] };
    expect(await page.$$eval('#model option', (os) => os.map((o) => (o as HTMLOptionElement).value))).toEqual([...ACTIVITY_MODELS]);
    expect(await page.isVisible('#salt')).toBe(false);
    await page.selectOption('#formula-kind', 'salt');
    expect(await page.isVisible('#salt')).toBe(true);
    expect(await page.isVisible('#target-ionic-strength')).toBe(true);
    await page.fill('#salt', '');
    await page.click('#insert');
    expect(await page.textContent('#status')).toMatch(/Salt is blank/);
    await page.fill('#salt', '4 M NaCl');
    await page.fill('#target-ionic-strength', '0.3');
    await page.click('#insert');
    await page.waitForFunction(() => (window as unknown as Writes).__writes.length === 1);
    let writes = await page.evaluate(() => (window as unknown as Writes).__writes);
    expect(writes[0].formulas[3].slice(0, 3)).toEqual(['4 M NaCl', '=PROTIC.SALTDOSE(C9,B5,B3:B4,C3:C4,D3:D4,C6,C7,C8,D5)', 'mL']);
    expect(writes[0].formulas[8][1]).toBe('=PROTIC.IONICSTRENGTH(B3:B5,C3:C5,D3:D5,C6,C7,C8)');
    expect(await page.textContent('#status')).toMatch(/^Wrote B2:E12/);

    await page.selectOption('#formula-kind', 'review');
    expect(await page.isVisible('#salt')).toBe(false);
    await page.click('#insert');
    await page.waitForSelector('#insert-question [data-answer="yes"]');
    await page.click('#insert-question [data-answer="yes"]');
    await page.waitForFunction(() => (window as unknown as Writes).__writes.length === 2);
    writes = await page.evaluate(() => (window as unknown as Writes).__writes);
    const formulas = writes[1].formulas.map((r) => r[0]).filter((x) => typeof x === 'string' && x.startsWith('='));
    expect(formulas).toEqual([
      '=PROTIC.READBACK(B3:B4,C3:C4,D3:D4,C5,C6)', '=PROTIC.HANDCHECK(B3:B4,C3:C4,D3:D4,C5,C6)',
      '=PROTIC.UNCERTAINTY(B3:B4,C3:C4,D3:D4,C5,C6,C7,E3:E4,E5,E6)',
    ]);
    expect(writes[1].at[3]).toBe(9); // READBACK and UNCERTAINTY spill nine columns
    await page.close();
  }, 60000);

  test('a hostile custom system in the workbook is rejected and runs no script', async () => {
    const hostile = JSON.stringify({ systems: [{ name: '<img src=x onerror="window.__pwned=1;alert(1)">', pKa: [1e308], charge: 0 }] });
    const { page, dialogs } = await openPane({ 'protic.customSystems': hostile });
    const status = await page.textContent('#status');
    expect(status).toMatch(/rejected from the workbook: custom system 1 name: value not usable/);
    // still stored, shown as not in use with its reason, as text
    expect(await page.textContent('#custom-list')).toMatch(/Not in use: custom system 1 name: value not usable/);
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
    expect(await page.locator('img').count()).toBe(0);
    expect(dialogs).toEqual([]);
    await page.close();
  }, 60000);
});
