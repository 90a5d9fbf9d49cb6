// The functions bundle in the real runtime's engine: the production build loaded in headless Chromium
// with a stand-in CustomFunctions (as Excel's shared runtime provides it), then 100,000 PHMIX calls with
// distinct inputs, each passed the way Excel passes a range: a fresh 2-D array per argument. (The global
// performance is used, not perf_hooks': the page functions below are serialised into the browser.)
import { mkdtempSync } from 'fs';
import { tmpdir } from 'os';
import { join } from 'path';
import { execFileSync } from 'child_process';
import type { Server } from 'http';
import type { Browser } from 'playwright-core';
import { closeAll, launchChromium, launchedChromium, serveFolder } from '../../test/browser/harness';
import * as impl from '../../src/functions/impl';

const CALLS = Number(process.env.PROTIC_BENCH_BROWSER_CALLS ?? 100000);
const BATCH = 10000;
const LOADS = 5;

export interface BrowserFigures {
  chromium: string; calls: number; usPerCall: number; fastestBatchUsPerCall: number; slowestBatchUsPerCall: number;
  loadToFirstResultMs: number; fastestLoadToFirstResultMs: number; coldBrowserLoadToFirstResultMs: number; scriptsLoadedMs: number; navigationToFirstResultMs: number; nonNumeric: number; worstDifferenceFromNode: number;
  nodeUsPerCall: number; browserOverNode: number;
  targets: { usPerCallAtMost10: boolean; loadToFirstResultAtMost150ms: boolean };
}

/** NaCl added in row i (mM) and KH2PO4 (g): distinct for every call, so no cache can answer twice. */
function inputs(i: number): { nacl: number; kh2po4: number } {
  return { nacl: (i % 50000) * 0.01, kh2po4: 3.4 + Math.floor(i / 50000) * 0.001 };
}

const PAGE = `<!doctype html><html><head><meta charset="utf-8"><title>bench</title></head><body><script>
  window.__fns = {};
  class CustomFunctionsError extends Error { constructor(code, message) { super(message); this.code = code; } }
  window.CustomFunctions = { associate(id, fn) { window.__fns[id] = fn; }, Error: CustomFunctionsError,
    ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A' } };
</script></body></html>`;

/** Loads runtime, shared chunk and functions bundle in order, then computes the first PHMIX; returns both times. */
async function loadAndFirstResult(): Promise<{ loadToFirst: number; scriptsMs: number; navigationToFirst: number; value: unknown }> {
  const load = (src: string): Promise<void> => new Promise((resolve, reject) => {
    const s = document.createElement('script');
    s.src = src; s.onload = () => resolve(); s.onerror = () => reject(new Error(`could not load ${src}`));
    document.head.appendChild(s);
  });
  const t0 = performance.now();
  for (const src of ['runtime.js', 'shared.js', 'functions.js']) await load(src);
  const scriptsMs = performance.now() - t0;
  const fns = (window as unknown as { __fns: Record<string, (...a: unknown[]) => unknown> }).__fns;
  const value = fns.PHMIX([['KH2PO4'], ['Na2HPO4'], ['NaCl']], [[3.4], [3.55], [0]], [['g'], ['g'], ['mM']], 1, null, null);
  const t1 = performance.now();
  return { loadToFirst: t1 - t0, scriptsMs, navigationToFirst: t1, value };
}

/** The timed loop, in the page: `calls` PHMIX calls in batches; fresh arrays per call as Excel passes them. */
function timedCalls(args: { calls: number; batch: number }): { batchMs: number[]; nonNumeric: number; samples: [number, number][] } {
  const fns = (window as unknown as { __fns: Record<string, (...a: unknown[]) => unknown> }).__fns;
  const batchMs: number[] = [];
  const samples: [number, number][] = [];
  let nonNumeric = 0;
  for (let start = 0; start < args.calls; start += args.batch) {
    const t0 = performance.now();
    for (let i = start; i < Math.min(args.calls, start + args.batch); i++) {
      const nacl = (i % 50000) * 0.01, kh2po4 = 3.4 + Math.floor(i / 50000) * 0.001;
      const pH = fns.PHMIX([['KH2PO4'], ['Na2HPO4'], ['NaCl']], [[kh2po4], [3.55], [nacl]], [['g'], ['g'], ['mM']], 1, null, null);
      if (typeof pH !== 'number' || !Number.isFinite(pH)) nonNumeric++;
      if (i % 9973 === 0) samples.push([i, pH as number]);
    }
    batchMs.push(performance.now() - t0);
  }
  return { batchMs, nonNumeric, samples };
}

/** Runs the browser figure; returns lines to print and the figures for bench/results.json. */
export async function browserBench(): Promise<{ lines: string[]; figures: BrowserFigures }> {
  const out = mkdtempSync(join(tmpdir(), 'protic-bench-browser-'));
  execFileSync(process.execPath, [require.resolve('webpack-cli/bin/cli.js'), '--mode', 'production', '--output-path', out], { stdio: 'pipe' });
  let server: Server | undefined;
  let browser: Browser | undefined;
  try {
    let origin: string;
    ({ server, origin } = await serveFolder(out));
    browser = await launchChromium();
    // load to first result: the median of LOADS fresh pages (each with an empty cache), the last page kept for the loop
    const loads: { loadToFirst: number; scriptsMs: number; navigationToFirst: number; value: unknown }[] = [];
    let page = await browser.newPage();
    for (let k = 0; k < LOADS; k++) {
      if (k > 0) { await page.close(); page = await (await browser.newContext()).newPage(); }
      await page.route(`${origin}/__bench.html`, (route) => route.fulfill({ contentType: 'text/html', body: PAGE }));
      await page.goto(`${origin}/__bench.html`);
      const one = await page.evaluate(loadAndFirstResult);
      if (typeof one.value !== 'number') throw new Error(`first PHMIX in the browser gave ${JSON.stringify(one.value)}`);
      loads.push(one);
    }
    const first = [...loads].sort((a, b) => a.loadToFirst - b.loadToFirst)[Math.floor(LOADS / 2)];
    const fastestLoad = Math.min(...loads.map((l) => l.loadToFirst));
    const run = await page.evaluate(timedCalls, { calls: CALLS, batch: BATCH });
    await page.close();
    // the browser's answers against the same engine in Node, for a sample of the calls
    let worst = 0;
    for (const [i, pH] of run.samples) {
      const { nacl, kh2po4 } = inputs(i);
      const node = impl.ph([['KH2PO4'], ['Na2HPO4'], ['NaCl']], [[kh2po4], [3.55], [nacl]], [['g'], ['g'], ['mM']], 1, null, null) as number;
      worst = Math.max(worst, Math.abs(node - pH));
    }
    // the same calls through the cell layer in Node, in this run, for the ratio
    const tNode = performance.now();
    for (let i = 0; i < CALLS; i++) {
      const { nacl, kh2po4 } = inputs(i);
      impl.ph([['KH2PO4'], ['Na2HPO4'], ['NaCl']], [[kh2po4], [3.55], [nacl]], [['g'], ['g'], ['mM']], 1, null, null);
    }
    const nodeUsPerCall = ((performance.now() - tNode) * 1000) / CALLS;
    const totalMs = run.batchMs.reduce((s, x) => s + x, 0);
    const perBatch = run.batchMs.map((ms, k) => (ms * 1000) / Math.min(BATCH, CALLS - k * BATCH));
    const figures: BrowserFigures = {
      chromium: `${browser.version()} (${launchedChromium})`,
      calls: CALLS,
      usPerCall: (totalMs * 1000) / CALLS,
      fastestBatchUsPerCall: Math.min(...perBatch),
      slowestBatchUsPerCall: Math.max(...perBatch),
      loadToFirstResultMs: first.loadToFirst,
      fastestLoadToFirstResultMs: fastestLoad,
      coldBrowserLoadToFirstResultMs: loads[0].loadToFirst,
      scriptsLoadedMs: first.scriptsMs,
      navigationToFirstResultMs: first.navigationToFirst,
      nonNumeric: run.nonNumeric,
      worstDifferenceFromNode: worst,
      nodeUsPerCall,
      browserOverNode: (totalMs * 1000) / CALLS / nodeUsPerCall,
      targets: { usPerCallAtMost10: (totalMs * 1000) / CALLS <= 10, loadToFirstResultAtMost150ms: first.loadToFirst <= 150 },
    };
    const lines = [
      `browser: the production functions bundle in headless Chromium ${figures.chromium}, stand-in CustomFunctions`,
      `  ${CALLS} PHMIX calls, distinct inputs as 2-D arrays: ${figures.usPerCall.toFixed(2)} µs per call (batches of ${BATCH}: ${figures.fastestBatchUsPerCall.toFixed(2)}–${figures.slowestBatchUsPerCall.toFixed(2)} µs) (target ≤ 10)`,
      `  load to first result (runtime, shared chunk, functions, first PHMIX), median of ${LOADS} fresh pages: ${figures.loadToFirstResultMs.toFixed(1)} ms, fastest ${fastestLoad.toFixed(1)} ms, first page of a cold browser ${loads[0].loadToFirst.toFixed(1)} ms (target ≤ 150; in the median page scripts loaded and run at ${figures.scriptsLoadedMs.toFixed(1)} ms, the rest is the first call); from navigation ${figures.navigationToFirstResultMs.toFixed(1)} ms`,
      `  the same calls through impl.ph in Node: ${nodeUsPerCall.toFixed(2)} µs per call; browser / Node ${figures.browserOverNode.toFixed(2)}`,
      `  non-numeric results ${figures.nonNumeric}; worst difference from the same call in Node over ${run.samples.length} samples ${figures.worstDifferenceFromNode.toExponential(1)}`,
    ];
    return { lines, figures };
  } finally {
    await closeAll(browser, server);
  }
}
