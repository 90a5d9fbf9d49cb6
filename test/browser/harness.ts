import { execFileSync } from 'child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'fs';
import { createServer } from 'http';
import type { Server } from 'http';
import { tmpdir } from 'os';
import { dirname, extname, join, relative, isAbsolute } from 'path';
import { brotliDecompressSync } from 'zlib';
import { chromium } from 'playwright-core';
import type { Browser } from 'playwright-core';

// Shared by every browser test: one production build, a static server on loopback, one Chromium.

const TYPES: Record<string, string> = {
  '.html': 'text/html', '.js': 'text/javascript', '.css': 'text/css', '.png': 'image/png', '.json': 'application/json', '.md': 'text/markdown',
};

/** Builds the add-in (production) into a fresh temporary folder and returns it. */
export function buildAddin(): string {
  const out = mkdtempSync(join(tmpdir(), 'protic-pane-'));
  execFileSync(process.execPath, [require.resolve('webpack-cli/bin/cli.js'), '--mode', 'production', '--output-path', out], { stdio: 'pipe' });
  return out;
}

/** Serves `dir` on 127.0.0.1 at a free port; `taskpane.html` for `/`. */
export async function serveFolder(dir: string): Promise<{ server: Server; origin: string }> {
  const server = createServer((req, res) => {
    const file = join(dir, (req.url ?? '/').split('?')[0].replace(/^\/+/, '') || 'taskpane.html');
    const rel = relative(dir, file);
    if (rel.startsWith('..') || isAbsolute(rel) || !existsSync(file)) { res.writeHead(404); res.end(); return; }
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' });
    res.end(readFileSync(file));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  return { server, origin: `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}` };
}

export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** The executable the last successful launchChromium started (for reports and tests). */
export let launchedChromium = '';

/** Where a system Chromium may be: $CHROMIUM_PATH alone when set, else the usual places on Linux, macOS and Windows. */
function systemChromiumPaths(): string[] {
  if (process.env.CHROMIUM_PATH) return [process.env.CHROMIUM_PATH];
  return [
    '/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome', '/usr/bin/google-chrome-stable',
    '/Applications/Chromium.app/Contents/MacOS/Chromium', '/Applications/Google Chrome.app/Contents/MacOS/Google Chrome',
    'C:\\Program Files\\Google\\Chrome\\Application\\chrome.exe', 'C:\\Program Files (x86)\\Microsoft\\Edge\\Application\\msedge.exe',
  ];
}

/** Unpacks a plain (ustar) tar archive into `dir`: regular files only, names kept inside `dir`. */
function untar(tar: Buffer, dir: string): void {
  for (let at = 0; at + 512 <= tar.length;) {
    const header = tar.subarray(at, at + 512);
    const name = header.subarray(0, 100).toString('utf8').replace(/\0.*$/s, '');
    if (!name) break;
    const size = parseInt(header.subarray(124, 136).toString('utf8').replace(/\0.*$/s, '').trim() || '0', 8);
    const type = String.fromCharCode(header[156] || 48);
    const target = join(dir, name);
    if ((type === '0' || type === '\0') && !relative(dir, target).startsWith('..')) {
      mkdirSync(dirname(target), { recursive: true });
      writeFileSync(target, tar.subarray(at + 512, at + 512 + size));
    }
    at += 512 + Math.ceil(size / 512) * 512;
  }
}

/**
 * The libraries @sparticuz/chromium ships for hosts without them (libnss3, libnspr4, libexpat: its
 * al2023.tar.br), unpacked once into the temporary folder; null when the package has none.
 */
function bundledChromiumLibraries(): string | null {
  const archive = join(dirname(require.resolve('@sparticuz/chromium')), '..', '..', 'bin', 'al2023.tar.br');
  if (!existsSync(archive)) return null;
  const dir = join(tmpdir(), 'protic-chromium-libs');
  if (!existsSync(join(dir, 'lib', 'libnss3.so'))) {
    // unpacked beside and renamed into place, so a parallel worker never sees half a folder
    const scratch = mkdtempSync(join(tmpdir(), 'protic-chromium-libs-'));
    untar(brotliDecompressSync(readFileSync(archive)), scratch);
    try { renameSync(scratch, dir); } catch { rmSync(scratch, { recursive: true, force: true }); }
  }
  return join(dir, 'lib');
}

/**
 * Runs `work` holding a lock directory in the temporary folder, so parallel test workers do not unpack the
 * bundled Chromium over each other (one unpacks, the others wait, bounded; a lock older than 5 minutes is stale).
 */
async function withUnpackLock<T>(work: () => Promise<T>): Promise<T> {
  const lock = join(tmpdir(), 'protic-chromium-unpack.lock');
  const deadline = Date.now() + 180000;
  for (;;) {
    try { mkdirSync(lock); break; } catch {
      try { if (Date.now() - statSync(lock).mtimeMs > 300000) rmSync(lock, { recursive: true, force: true }); } catch { /* gone meanwhile */ }
      if (Date.now() > deadline) throw new Error(`timed out waiting for ${lock}`);
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
  }
  try { return await work(); } finally { rmSync(lock, { recursive: true, force: true }); }
}

function firstLine(error: unknown): string {
  return String((error as Error)?.message ?? error).split('\n').find((l) => l.trim()) ?? 'failed';
}

/**
 * Launches headless Chromium: a system one ($CHROMIUM_PATH, else Debian's /usr/bin/chromium and the usual
 * places), or, when none is found or none starts, the Chromium inside the npm package @sparticuz/chromium
 * (its tarball carries the binary, unpacked to the temporary folder on first use), with the libraries it
 * ships if the host lacks them. PROTIC_BUNDLED_CHROMIUM=1 skips the system one. Throws with every attempt
 * when nothing starts.
 */
export async function launchChromium(): Promise<Browser> {
  const attempts: string[] = [];
  const launch = async (path: string, options: { env?: Record<string, string>; timeout: number }): Promise<Browser> => {
    const browser = await chromium.launch({ executablePath: path, args: CHROMIUM_ARGS, ...options });
    launchedChromium = path;
    return browser;
  };
  if (process.env.PROTIC_BUNDLED_CHROMIUM !== '1') {
    for (const path of systemChromiumPaths()) {
      if (!existsSync(path)) { attempts.push(`${path}: not found`); continue; }
      try { return await launch(path, { timeout: 30000 }); } catch (error) { attempts.push(`${path}: ${firstLine(error)}`); }
    }
  }
  let bundled: string;
  try {
    const { default: Sparticuz } = await import('@sparticuz/chromium');
    bundled = await withUnpackLock(() => Sparticuz.executablePath());
  } catch (error) {
    throw new Error(`No Chromium could start:\n  ${[...attempts, `@sparticuz/chromium: ${firstLine(error)}`].join('\n  ')}`);
  }
  try { return await launch(bundled, { timeout: 60000 }); } catch (error) { attempts.push(`${bundled}: ${firstLine(error)}`); }
  const libs = bundledChromiumLibraries();
  if (libs) {
    const env = { ...process.env, LD_LIBRARY_PATH: [libs, process.env.LD_LIBRARY_PATH].filter(Boolean).join(':') } as Record<string, string>;
    try { return await launch(bundled, { env, timeout: 60000 }); } catch (error) { attempts.push(`${bundled} with ${libs}: ${firstLine(error)}`); }
  }
  throw new Error(`No Chromium could start:\n  ${attempts.join('\n  ')}`);
}

/** Closes what beforeAll managed to open, without hanging when it opened nothing. */
export async function closeAll(browser: Browser | undefined, server: Server | undefined): Promise<void> {
  await browser?.close();
  if (server?.listening) {
    server.closeAllConnections?.(); // keep-alive sockets would hold close() open
    await new Promise((resolve) => server.close(resolve));
  }
}
