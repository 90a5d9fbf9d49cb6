import { mkdirSync, mkdtempSync, writeFileSync } from 'fs';
import type { Server } from 'http';
import { tmpdir } from 'os';
import { join } from 'path';
import type { Browser } from 'playwright-core';
import { closeAll, launchChromium, serveFolder } from './browser/harness';
import { buildXlsx } from './xlsxFixtures';
import { main as verifyMain } from '../scripts/verify';
import { ph } from '../src/functions/impl';

// The verify report as a reviewer opens it: one self-contained page, readable with scripts off,
// asking for nothing beyond itself.
let server: Server | undefined;
let browser: Browser | undefined;
let origin = '';
const dir = mkdtempSync(join(tmpdir(), 'protic-report-'));

beforeAll(async () => {
  const value = ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1);
  const cells = [
    { ref: 'A1', value: 'KH2PO4' }, { ref: 'B1', value: 3.4 }, { ref: 'A2', value: 'Na2HPO4' }, { ref: 'B2', value: 3.55 },
    { ref: 'C1', f: '_xldudf_PROTIC_PHMIX(A1:A2,B1:B2,"g",1)', value: value + 0.01 },
    { ref: 'C2', f: '_xldudf_PROTIC_PHMIX(A1:A2,B1:B2,"g",1)', value },
    { ref: 'C3', f: '_xldudf_PROTIC_VERSION()', value: 'Protic 0.1.0; catalogue 2020.1.1' },
    { ref: 'C4', f: '_xldudf_PROTIC_MOLARMASS("<img src=\'https://example.invalid/x.png\'>")', value: { error: '#VALUE!' } },
  ];
  const path = join(dir, 'record.xlsx');
  writeFileSync(path, await buildXlsx({ sheets: [{ name: 'Batch <QA>', cells }] }));
  const code = await verifyMain([path, '--report', join(dir, 'report.html')], () => undefined, () => undefined);
  expect(code).toBe(1);
  ({ server, origin } = await serveFolder(dir));
  browser = await launchChromium();
}, 120000);

afterAll(async () => {
  await closeAll(browser, server);
});

test('the HTML report: the differing cell marked, the stamp flagged, no script, no request beyond the page', async () => {
  const context = await browser!.newContext({ javaScriptEnabled: false });
  const page = await context.newPage();
  const requests: string[] = [];
  page.on('request', (r) => requests.push(r.url()));
  await page.goto(`${origin}/report.html`);
  expect(await page.locator('script').count()).toBe(0);
  expect(await page.textContent('#verdict')).toMatch(/some Protic cells differ from their saved values \(exit 1\)/);
  const bad = page.locator('#cells tr.differs');
  expect(await bad.count()).toBe(1);
  expect(await bad.locator('td').first().textContent()).toBe('Batch <QA>!C1');
  expect(await page.locator('#cells tbody tr').count()).toBe(4);
  expect(await page.locator('img').count()).toBe(0); // text from the workbook is shown, never run as markup
  expect(await page.textContent('#stamps')).toMatch(/the catalogue changed since the record was signed/);
  // the differing row is painted differently from an agreeing one
  const colour = (sel: string): Promise<string> => page.locator(sel).first().evaluate((el) => getComputedStyle(el).backgroundColor);
  expect(await colour('#cells tr.differs td')).not.toBe(await colour('#cells tr.agrees td'));
  mkdirSync('test-output', { recursive: true });
  await page.screenshot({ path: 'test-output/verify-report.png', fullPage: true });
  expect(requests).toEqual([`${origin}/report.html`]);
  await context.close();
});
