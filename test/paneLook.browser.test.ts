import { mkdirSync, readFileSync } from 'fs';
import type { Server } from 'http';
import { join } from 'path';
import type { Browser, Page } from 'playwright-core';
import { buildAddin, closeAll, launchChromium, serveFolder } from './browser/harness';

// The built pane in headless Chromium (stand-in Office host): its look at 320 and 450 px, light and dark,
// and the never-lose-work rules as a user meets them. Screenshots go to test-output/ for a person to look at.

let server: Server | undefined;
let browser: Browser | undefined;
let origin = '';

beforeAll(async () => {
  const out = buildAddin();
  ({ server, origin } = await serveFolder(out));
  browser = await launchChromium();
  mkdirSync('test-output', { recursive: true });
}, 120000);

afterAll(async () => {
  await closeAll(browser, server);
});

interface Options { width?: number; settings?: Record<string, string>; sheet?: Record<string, string | number>; officeTheme?: Record<string, string>; holdReady?: boolean; colorScheme?: 'light' | 'dark' }

async function openPane(o: Options = {}): Promise<Page> {
  const page = await (browser as Browser).newPage({ viewport: { width: o.width ?? 320, height: 900 }, colorScheme: o.colorScheme ?? 'light' });
  page.on('dialog', (d) => { void d.dismiss(); throw new Error(`a browser dialog opened: ${d.message()}`); });
  const prelude = `window.__initialSettings = ${JSON.stringify(o.settings ?? {})}; window.__initialSheet = ${JSON.stringify(o.sheet ?? {})};`
    + `window.__officeTheme = ${JSON.stringify(o.officeTheme ?? null)}; window.__holdReady = ${o.holdReady ? 'true' : 'false'};\n`;
  await page.route('https://appsforoffice.microsoft.com/**', (route) => route.fulfill({
    contentType: 'text/javascript', body: prelude + readFileSync(join(__dirname, 'browser', 'standInOffice.js'), 'utf8'),
  }));
  await page.goto(`${origin}/taskpane.html`);
  if (!o.holdReady) await page.waitForSelector('#results li');
  return page;
}

type Win = { __writes: { at: number[]; formulas: unknown[][] }[]; __sheet: Record<string, unknown>; __fns: Record<string, (...a: unknown[]) => unknown>; __releaseReady: () => void; __savedSettings?: Record<string, string> };

/** Overlapping pairs among the boxes of the given elements (by text), as "a / b". */
async function overlaps(page: Page, selector: string): Promise<string[]> {
  return page.evaluate((sel) => {
    const boxes = Array.from(document.querySelectorAll(sel)).map((e) => ({ t: e.textContent ?? '', r: e.getBoundingClientRect() }));
    const out: string[] = [];
    boxes.forEach((a, i) => boxes.slice(i + 1).forEach((b) => {
      if (a.r.left < b.r.right && b.r.left < a.r.right && a.r.top < b.r.bottom && b.r.top < a.r.bottom) out.push(`${a.t} / ${b.t}`);
    }));
    return out;
  }, selector);
}

describe('the pane\'s look', () => {
  for (const width of [320, 450]) {
    for (const scheme of ['light', 'dark'] as const) {
      test(`${width} px, ${scheme}: nothing truncates or overlaps, text on the ramp, a screenshot`, async () => {
        const page = await openPane({ width, colorScheme: scheme });
        await page.fill('#search', 'phosphate');
        await page.click('#results button[data-system="phosphate"] >> nth=0');
        // nothing wider than the pane
        expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
        // the suggested reagent names fit their boxes (before: "sodium dihyc")
        // the longest catalogue name shows whole: the box wraps and grows instead of scrolling sideways
        await page.fill('#row3-reagent', 'disodium hydrogen phosphate dodecahydrate');
        for (const id of ['row1-reagent', 'row2-reagent', 'row3-reagent']) {
          const fit = await page.evaluate((i) => {
            const e = document.getElementById(i) as HTMLTextAreaElement;
            return [e.value, e.scrollWidth <= e.clientWidth && e.scrollHeight <= e.clientHeight + 1];
          }, id);
          expect(fit).toEqual([expect.stringMatching(/phosphate/), true]);
        }
        await page.fill('#row3-reagent', '');
        // chart mark labels (pKa1..3, target) never collide, and chart text is at least 12 px on screen
        expect(await overlaps(page, '#fractions-chart text.pka-mark-label, #fractions-chart text.target-mark-label')).toEqual([]);
        expect(await page.locator('#fractions-chart text.target-mark-label').count()).toBe(1);
        const smallest = await page.evaluate(() => Math.min(...Array.from(document.querySelectorAll('#fractions-chart text')).map((t) => t.getBoundingClientRect().height)));
        expect(smallest).toBeGreaterThanOrEqual(12);
        // body 14 px; no visible text under 12 px; spacing on the 4 px grid
        const type = await page.evaluate(() => {
          const sizes = new Set<string>();
          const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
          for (let n = walker.nextNode(); n; n = walker.nextNode()) {
            const parent = n.parentElement as HTMLElement;
            if (n.textContent?.trim() && parent.offsetParent !== null) sizes.add(getComputedStyle(parent).fontSize);
          }
          const main = getComputedStyle(document.querySelector('main') as HTMLElement);
          return { body: getComputedStyle(document.body).fontSize, sizes: [...sizes].sort(), padding: [main.paddingLeft, main.paddingTop] };
        });
        expect(type.body).toBe('14px');
        expect(type.sizes.every((s) => parseFloat(s) >= 12)).toBe(true);
        expect(type.padding.every((p) => parseFloat(p) % 4 === 0)).toBe(true);
        // labels of a row sit in line: the three condition boxes share a bottom edge
        const bottoms = await page.evaluate(() => ['temperature', 'ionic-strength', 'target-ph'].map((id) => Math.round((document.getElementById(id) as HTMLElement).getBoundingClientRect().bottom)));
        expect(new Set(bottoms).size).toBe(1);
        // the theme: dark follows the system when the host reports no Office theme
        const bg = await page.evaluate(() => getComputedStyle(document.body).backgroundColor);
        expect(bg).toBe(scheme === 'dark' ? 'rgb(31, 31, 31)' : 'rgb(255, 255, 255)');
        await page.screenshot({ path: `test-output/pane-${width}-${scheme}.png`, fullPage: true });
        await page.close();
      }, 60000);
    }
  }

  test('input boundaries have at least 3:1 contrast against the pane, in light and dark', async () => {
    for (const scheme of ['light', 'dark'] as const) {
      const page = await openPane({ colorScheme: scheme });
      const ratio = await page.evaluate(() => {
        const rgb = (c: string) => (c.match(/\d+/g) ?? []).slice(0, 3).map(Number);
        const lum = ([r, g, b]: number[]) => [r, g, b].map((v) => { const s = v / 255; return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4; })
          .reduce((sum, v, i) => sum + v * [0.2126, 0.7152, 0.0722][i], 0);
        const a = lum(rgb(getComputedStyle(document.getElementById('search') as HTMLElement).borderTopColor));
        const b = lum(rgb(getComputedStyle(document.body).backgroundColor));
        return (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
      });
      expect(ratio).toBeGreaterThanOrEqual(3);
      await page.close();
    }
  }, 60000);

  test('the Office theme wins over the system preference when the host reports one', async () => {
    const page = await openPane({ colorScheme: 'light', officeTheme: { bodyBackgroundColor: '#262626', bodyForegroundColor: '#FFFFFF' } });
    expect(await page.evaluate(() => document.documentElement.className)).toContain('theme-dark');
    expect(await page.evaluate(() => getComputedStyle(document.body).backgroundColor)).toBe('rgb(31, 31, 31)');
    await page.screenshot({ path: 'test-output/pane-320-office-dark.png' });
    await page.close();
  }, 60000);

  test('forced colours: the buttons keep an outline', async () => {
    const page = await openPane();
    await page.emulateMedia({ forcedColors: 'active' });
    for (const id of ['insert', 'custom-save']) {
      const border = await page.evaluate((i) => { const s = getComputedStyle(document.getElementById(i) as HTMLElement); return [s.borderTopStyle, parseFloat(s.borderTopWidth)]; }, id);
      expect(border[0]).toBe('solid');
      expect(border[1]).toBeGreaterThanOrEqual(1);
    }
    await page.screenshot({ path: 'test-output/pane-320-forced-colours.png' });
    await page.close();
  }, 60000);

  test('one live region, for status only; the chosen search result is marked', async () => {
    const page = await openPane();
    expect(await page.evaluate(() => Array.from(document.querySelectorAll('[aria-live]')).map((e) => e.id))).toEqual(['status']);
    expect(await page.getAttribute('main', 'aria-live')).toBeNull();
    await page.fill('#search', 'citr');
    await page.click('#results button[data-system="citrate"] >> nth=0');
    const selected = page.locator('#results [aria-selected="true"]');
    expect(await selected.count()).toBe(1);
    expect(await selected.getAttribute('data-system')).toBe('citrate');
    const [on, off] = await page.evaluate(() => {
      const s = document.querySelector('#results [aria-selected="true"]') as HTMLElement;
      const o = document.querySelector('#results [aria-selected="false"]') as HTMLElement;
      return [getComputedStyle(s).backgroundColor, getComputedStyle(o).backgroundColor];
    });
    expect(on).not.toBe(off);
    await page.close();
  }, 60000);

  test('only the chosen block\'s fields show; labels say what they are for', async () => {
    const page = await openPane();
    const visible = (id: string) => page.isVisible(`#${id}`);
    await page.selectOption('#formula-kind', 'ph');
    expect([await visible('row1-reagent'), await visible('from-ph'), await visible('acid-form'), await visible('titrant'), await visible('max-amount')]).toEqual([true, false, false, false, false]);
    await page.selectOption('#formula-kind', 'fractions');
    expect([await visible('row1-reagent'), await visible('from-ph'), await visible('model')]).toEqual([false, true, false]);
    await page.selectOption('#formula-kind', 'recipe');
    expect([await visible('acid-form'), await visible('concentration'), await visible('row1-reagent')]).toEqual([true, true, false]);
    expect(await page.textContent('#concentration-label')).toBe('Buffer concentration, both forms together (mol/L)');
    await page.selectOption('#formula-kind', 'curve');
    expect(await page.textContent('#max-amount-label')).toBe('Curve ends at (mL of titrant)');
    await page.fill('#titrant', 'NaOH');
    expect(await page.textContent('#max-amount-label')).toBe('Curve ends at (g of titrant)');
    await page.fill('#ionic-strength', '0.1');
    await page.dispatchEvent('#ionic-strength', 'change');
    const headers = await page.locator('#steps th').allTextContents();
    expect(headers).toEqual(['Step', 'pKa at 25 °C', 'pKa′ at I = 0.1 mol/L', 'dpKa/dT (K⁻¹)']);
    await page.close();
  }, 60000);
});

describe('the pane never loses work', () => {
  test('Insert over user cells asks in the pane, naming the range and the count; "keep" writes nothing', async () => {
    const sheet: Record<string, string> = {};
    for (let r = 1; r <= 8; r++) for (let c = 1; c <= 3; c++) sheet[`${r},${c}`] = `user ${r},${c}`;
    const page = await openPane({ sheet });
    await page.selectOption('#formula-kind', 'ph');
    await page.click('#insert');
    await page.waitForSelector('#insert-question [role="alertdialog"]');
    expect(await page.textContent('#insert-question p')).toBe('B2:D9 has 24 cells with content. Replace them with the “pH of the mixture” block?');
    await page.click('#insert-question [data-answer="no"]');
    await page.waitForFunction(() => /^Nothing written/.test(document.getElementById('status')?.textContent ?? ''));
    const w = await page.evaluate(() => (window as unknown as Win).__writes.length);
    expect(w).toBe(0);
    expect(await page.evaluate(() => (window as unknown as Win).__sheet['1,1'])).toBe('user 1,1');
    await page.close();
  }, 60000);

  test('a second Insert while the pane is asking answers the first "no": one question, one write', async () => {
    const page = await openPane({ sheet: { '1,1': 'mine' } });
    await page.click('#insert');
    await page.waitForSelector('#insert-question [role="alertdialog"]');
    await page.click('#insert');
    await page.waitForFunction(() => document.querySelectorAll('#insert-question [role="alertdialog"]').length === 1);
    await page.click('#insert-question [data-answer="yes"]');
    await page.waitForFunction(() => /^Wrote B2:D9 \(replaced 1 cell, as you agreed\)/.test(document.getElementById('status')?.textContent ?? ''));
    expect(await page.evaluate(() => (window as unknown as Win).__writes.length)).toBe(1);
    await page.close();
  }, 60000);

  test('"use suggested forms" for the recipe changes its form lists, not the hidden reagent rows', async () => {
    const page = await openPane();
    await page.fill('#row1-reagent', 'citric acid monohydrate');
    await page.selectOption('#formula-kind', 'recipe');
    await page.selectOption('#acid-form', 'phosphoric acid');
    await page.click('#use-suggested');
    expect(await page.inputValue('#acid-form')).toBe('sodium dihydrogen phosphate');
    expect(await page.inputValue('#row1-reagent')).toBe('citric acid monohydrate');
    await page.close();
  }, 60000);

  test('a blank number box is refused with a message and nothing is written', async () => {
    const page = await openPane();
    await page.fill('#temperature', '');
    await page.click('#insert');
    expect(await page.textContent('#status')).toBe('Temperature (°C) is blank: enter a number.');
    expect(await page.getAttribute('#status', 'class')).toBe('status error');
    expect(await page.evaluate(() => (window as unknown as Win).__writes.length)).toBe(0);
    await page.close();
  }, 60000);

  test('a fractions table with step 0, or from above to, is refused', async () => {
    const page = await openPane();
    await page.selectOption('#formula-kind', 'fractions');
    await page.fill('#step-ph', '0');
    await page.click('#insert');
    expect(await page.textContent('#status')).toMatch(/step must be above 0.*Nothing was written/);
    await page.fill('#step-ph', '0.5');
    await page.fill('#from-ph', '12');
    await page.fill('#to-ph', '2');
    await page.click('#insert');
    expect(await page.textContent('#status')).toMatch(/must not be above “to”/);
    expect(await page.evaluate(() => (window as unknown as Win).__writes.length)).toBe(0);
    await page.close();
  }, 60000);

  test('typed reagents survive a change of conditions and a search hit; "use suggested forms" replaces them on request', async () => {
    const page = await openPane();
    await page.fill('#row1-reagent', 'citric acid monohydrate');
    await page.fill('#row2-reagent', '');
    await page.fill('#temperature', '37');
    await page.dispatchEvent('#temperature', 'change');
    await page.fill('#target-ph', '5');
    await page.dispatchEvent('#target-ph', 'change');
    await page.fill('#search', 'tris');
    await page.click('#results button[data-system="tris"] >> nth=0');
    expect(await page.inputValue('#row1-reagent')).toBe('citric acid monohydrate');
    expect(await page.inputValue('#row2-reagent')).toBe('');
    await page.click('#use-suggested');
    expect(await page.inputValue('#row1-reagent')).toBe('Tris hydrochloride');
    await page.close();
  }, 60000);

  test('"ZORBATE" does not silently replace "Zorbate"; delete asks first; a decimal comma pKa is one value', async () => {
    const stored = JSON.stringify({ systems: [{ name: 'Zorbate', pKa: [5.5], charge: 0 }, { name: 'Broken', pKa: [99], charge: 0 }] });
    const page = await openPane({ settings: { 'protic.customSystems': stored } });
    expect(await page.locator('#custom-list .stored').count()).toBe(2);
    expect(await page.textContent('#custom-list .stored.invalid')).toMatch(/Broken.*Not in use: custom system 2 pKa 1/);
    expect(await page.isVisible('#custom-name')).toBe(false); // the form starts closed when systems are stored
    await page.click('#custom-define > summary');
    await page.fill('#custom-name', 'ZORBATE');
    await page.fill('#custom-pka', '4,76');
    await page.click('#custom-save');
    await page.waitForSelector('#custom-question [role="alertdialog"]');
    expect(await page.textContent('#custom-question p')).toBe('This workbook already stores “Zorbate”. Replace it with this “ZORBATE”?');
    await page.screenshot({ path: 'test-output/pane-320-confirm-replace.png' });
    await page.click('#custom-question [data-answer="no"]');
    expect(await page.textContent('#status')).toBe('Nothing saved: “Zorbate” kept as it was.');
    expect(await page.evaluate(() => (window as unknown as Win).__savedSettings)).toBeUndefined();
    await page.click('#custom-save');
    await page.click('#custom-question [data-answer="yes"]');
    await page.waitForFunction(() => /^Replaced Zorbate with ZORBATE/.test(document.getElementById('status')?.textContent ?? ''));
    const saved = JSON.parse(await page.evaluate(() => (window as unknown as Win).__savedSettings?.['protic.customSystems'] ?? '{}'));
    expect(saved.systems).toEqual([{ name: 'ZORBATE', pKa: [4.76], charge: 0 }, { name: 'Broken', pKa: [99], charge: 0 }]);
    expect(await page.evaluate(() => (window as unknown as { __recalculated?: number }).__recalculated)).toBe(1);
    await page.click('#custom-list [data-delete="1"]');
    expect(await page.textContent('#custom-question p')).toMatch(/^Delete “Broken” from this workbook\?/);
    await page.click('#custom-question [data-answer="yes"]');
    await page.waitForFunction(() => /^Deleted Broken/.test(document.getElementById('status')?.textContent ?? ''));
    expect(await page.locator('#custom-list .stored').count()).toBe(1);
    await page.close();
  }, 60000);
});

describe('custom systems after a workbook is reopened', () => {
  test('the functions answer from the workbook\'s definitions before the pane has started', async () => {
    const stored = JSON.stringify({ systems: [{ name: 'Zorbate', pKa: [5.5], charge: 0 }] });
    const page = await openPane({ settings: { 'protic.customSystems': stored }, holdReady: true });
    await page.waitForFunction(() => typeof (window as unknown as Win).__fns.FRACTIONS === 'function');
    // Excel calls a cell while Office is still starting: the pane has built nothing yet
    const before = await page.evaluate(() => {
      const w = window as unknown as Win & { __pending?: Promise<number[][]> };
      w.__pending = w.__fns.FRACTIONS([['Zorbate']], [[5.5]], null, null) as Promise<number[][]>;
      return { pane: document.getElementById('app')?.children.length, promise: typeof (w.__pending as { then?: unknown }).then };
    });
    expect(before).toEqual({ pane: 0, promise: 'function' });
    await page.evaluate(() => (window as unknown as Win).__releaseReady());
    const fractions = await page.evaluate(() => (window as unknown as { __pending: Promise<number[][]> }).__pending);
    expect(fractions[0][0]).toBeCloseTo(0.5, 10);
    await page.close();
  }, 60000);
});
