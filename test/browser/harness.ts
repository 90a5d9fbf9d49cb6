import { execFileSync } from 'child_process';
import { existsSync, mkdtempSync, readFileSync } from 'fs';
import { createServer } from 'http';
import type { Server } from 'http';
import { tmpdir } from 'os';
import { extname, join, relative, isAbsolute } from 'path';
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

/** Launches headless Chromium: $CHROMIUM_PATH, else Debian's /usr/bin/chromium. */
export async function launchChromium(): Promise<Browser> {
  const path = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (!existsSync(path)) throw new Error(`Chromium not found at ${path}`);
  return chromium.launch({ executablePath: path, args: CHROMIUM_ARGS });
}

/** Closes what beforeAll managed to open, without hanging when it opened nothing. */
export async function closeAll(browser: Browser | undefined, server: Server | undefined): Promise<void> {
  await browser?.close();
  if (server?.listening) await new Promise((resolve) => server.close(resolve));
}
