import type { Server } from 'http';
import { createServer } from 'http';
import { join } from 'path';
import type { Browser } from 'playwright-core';
import { buildAddin, closeAll, launchChromium, serveFolder } from './browser/harness';
import * as harness from './browser/harness';

// A machine without a system Chromium: CHROMIUM_PATH names nothing, so the harness must start the
// Chromium shipped inside @sparticuz/chromium. With it, the rendered help scrolls to a function's anchor.

let server: Server | undefined;
let browser: Browser | undefined;
let origin = '';
const saved = process.env.CHROMIUM_PATH;

beforeAll(async () => {
  process.env.CHROMIUM_PATH = join(__dirname, 'no-such-chromium');
  try {
    ({ server, origin } = await serveFolder(buildAddin()));
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

  test('closeAll returns at once when beforeAll opened nothing, or a server that never listened', async () => {
    const t0 = Date.now();
    await closeAll(undefined, undefined);
    await closeAll(undefined, createServer());
    expect(Date.now() - t0).toBeLessThan(1000);
  });
});
