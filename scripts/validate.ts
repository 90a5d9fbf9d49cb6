// npm run validate: offline checks of the add-in as Excel would load it. Builds for production into a
// temporary folder, then checks the source manifest, the built manifest (with every file it points at)
// and functions.json (metadata schema and naming rules). Exits 1 with the list when anything fails.
import { execFileSync } from 'child_process';
import { existsSync, mkdtempSync, readFileSync } from 'fs';
import { tmpdir } from 'os';
import { join } from 'path';
import { functionsJsonProblems, manifestProblems } from './lib/addinChecks';

/** Maps a URL under `origin` to a file in `dir`, for checking that what the manifest names exists. */
export function readerFor(origin: string, dir: string): (url: string) => Uint8Array | null {
  return (url: string) => {
    if (!url.startsWith(origin + '/')) return null;
    const file = join(dir, decodeURIComponent(new URL(url).pathname));
    return existsSync(file) ? readFileSync(file) : null;
  };
}

function main(): void {
  const out = mkdtempSync(join(tmpdir(), 'protic-validate-'));
  const origin = 'https://validate.protic.invalid';
  execFileSync(process.execPath, [require.resolve('webpack-cli/bin/cli.js'), '--mode', 'production', '--output-path', out], {
    stdio: 'pipe', env: { ...process.env, PROTIC_ORIGIN: origin },
  });
  const results: [string, string[]][] = [
    ['manifest/manifest.xml', manifestProblems(readFileSync('manifest/manifest.xml', 'utf8'))],
    ['built manifest.xml and the files it names', manifestProblems(readFileSync(join(out, 'manifest.xml'), 'utf8'), { readUrl: readerFor(origin, out) })],
    ['built functions.json', functionsJsonProblems(JSON.parse(readFileSync(join(out, 'functions.json'), 'utf8')))],
  ];
  let failed = 0;
  for (const [what, problems] of results) {
    process.stdout.write(`${problems.length ? 'FAIL' : 'ok  '} ${what}\n`);
    for (const p of problems) process.stdout.write(`       ${p}\n`);
    failed += problems.length;
  }
  if (failed) { process.stdout.write(`${failed} problem(s)\n`); process.exit(1); }
}

if (require.main === module) main();
