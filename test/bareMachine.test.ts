import type { Server } from 'http';
import { createServer } from 'http';
import { createServer as createHttpsServer } from 'https';
import { mkdtempSync } from 'fs';
import { tmpdir } from 'os';
import { join } from 'path';
import type { Browser } from 'playwright-core';
import { buildAddin, closeAll, launchChromium, serveFolder } from './browser/harness';
import * as harness from './browser/harness';
import { certificate, listenLoopback, staticHandler } from '../scripts/start';

// A machine without a system Chromium: CHROMIUM_PATH names nothing, so the harness must start the
// Chromium shipped inside @sparticuz/chromium. With it, the rendered help scrolls to a function's anchor.

let server: Server | undefined;
let browser: Browser | undefined;
let origin = '';
let built = '';
const saved = process.env.CHROMIUM_PATH;

beforeAll(async () => {
  process.env.CHROMIUM_PATH = join(__dirname, 'no-such-chromium');
  try {
    built = buildAddin();
    ({ server, origin } = await serveFolder(built));
    browser = await launchChromium();
  } finally {
    if (saved === undefined) delete process.env.CHROMIUM_PATH; else process.env.CHROMIUM_PATH = saved;
  }
}, 180000);

afterAll(async () => {
  await closeAll(browser, server);
});

describe('tests on a machine without Debian chromium', () => {
  test('with no system Chromium the harness starts the one from @sparticuz/chromium', async () => {
    expect(harness.launchedChromium).not.toMatch(/no-such-chromium|^\/usr\/bin\//);
    expect(browser!.version()).toMatch(/^\d+\./);
    const page = await browser!.newPage();
    expect(await page.evaluate(() => 6 * 7)).toBe(42);
    await page.close();
  });

  test('help.html#titrant opens scrolled to the TITRANT entry, which is marked', async () => {
    const page = await browser!.newPage({ viewport: { width: 800, height: 600 } });
    await page.goto(`${origin}/help.html#titrant`);
    const where = await page.evaluate(() => {
      const anchor = document.getElementById('titrant')!;
      return { scrollY: window.scrollY, top: anchor.getBoundingClientRect().top, text: anchor.parentElement!.textContent!.slice(0, 8), marked: getComputedStyle(anchor.parentElement!).backgroundColor };
    });
    expect(where.scrollY).toBeGreaterThan(500);
    expect(Math.abs(where.top)).toBeLessThan(40);
    expect(where.text).toBe('TITRANT(');
    expect(where.marked).not.toBe('rgba(0, 0, 0, 0)');
    await page.goto(`${origin}/support.html`);
    expect(await page.textContent('h1')).toBe('Protic support');
    await page.close();
  });

  test('a page on another origin (as Excel on the web) can fetch functions.json from the dev server; with the old header it could not', async () => {
    const pems = await certificate(mkdtempSync(join(tmpdir(), 'protic-cors-')));
    const handler = staticHandler(built);
    const current = await listenLoopback(() => createHttpsServer(pems, handler), 0);
    // the header the dev server used to send
    const old = await listenLoopback(() => createHttpsServer(pems, (req, res) => {
      const writeHead = res.writeHead.bind(res) as (status: number, headers: Record<string, unknown>) => unknown;
      (res as unknown as { writeHead: unknown }).writeHead = (status: number, headers: Record<string, unknown>) => writeHead(status, { ...headers, 'access-control-allow-origin': 'https://localhost:3000' });
      handler(req, res);
    }), 0);
    const context = await browser!.newContext({ ignoreHTTPSErrors: true });
    // recent Chromium asks before a page reaches a loopback address (Local Network Access); the user allows it
    await context.grantPermissions(['local-network-access'], { origin });
    try {
      const page = await context.newPage();
      await page.route(`${origin}/__excel.html`, (route) => route.fulfill({ contentType: 'text/html', body: '<!doctype html><title>another origin</title>' }));
      await page.goto(`${origin}/__excel.html`);
      const fetchIds = (url: string): Promise<string> => page.evaluate((u) => fetch(u).then((r) => r.json()).then((j) => `${j.functions.length} functions`, (e) => `refused: ${e}`), url);
      expect(await fetchIds(`https://localhost:${current.port}/functions.json`)).toMatch(/^\d{2,} functions$/);
      expect(await fetchIds(`https://localhost:${old.port}/functions.json`)).toMatch(/^refused/);
    } finally {
      await context.close();
      for (const s of [...current.servers, ...old.servers]) { s.closeAllConnections(); await new Promise((done) => s.close(done)); }
    }
  }, 60000);

  test('closeAll returns at once when beforeAll opened nothing, or a server that never listened', async () => {
    const t0 = Date.now();
    await closeAll(undefined, undefined);
    await closeAll(undefined, createServer());
    expect(Date.now() - t0).toBeLessThan(1000);
  });
});
