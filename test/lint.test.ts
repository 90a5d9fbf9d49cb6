import { spawnSync } from 'child_process';
import { mkdirSync, writeFileSync } from 'fs';
import { join, resolve } from 'path';

// npm run lint's configuration (eslint.config.mjs) carries the Office add-in rules and typescript-eslint:
// a snippet that reads a range's values before loading them is refused; the same code done right passes.
// ESLint runs once, in a child process: the flat config is an ES module, which jest's CommonJS sandbox cannot import.

const PROBES: Record<string, string> = {
  'readBeforeLoad.ts': [
    'export async function probe(): Promise<unknown> {',
    '  return Excel.run(async (context) => {',
    '    const range = context.workbook.getSelectedRange();',
    '    return range.values;',
    '  });',
    '}',
    '',
  ].join('\n'),
  'loadThenSync.ts': [
    'export async function probe(): Promise<unknown> {',
    '  return Excel.run(async (context) => {',
    '    const range = context.workbook.getSelectedRange();',
    "    range.load('values');",
    '    await context.sync();',
    '    return range.values;',
    '  });',
    '}',
    '',
  ].join('\n'),
  'unusedLocal.ts': 'export function f(): void { const unused = 1; }\n',
};

let hits: Record<string, string[]> = {};

beforeAll(() => {
  const dir = resolve('test-output', 'lint-probe');
  mkdirSync(dir, { recursive: true });
  for (const [name, code] of Object.entries(PROBES)) writeFileSync(join(dir, name), code);
  const run = spawnSync(process.execPath, [join('node_modules', 'eslint', 'bin', 'eslint.js'), '--no-ignore', '--format', 'json', ...Object.keys(PROBES).map((n) => join(dir, n))],
    { encoding: 'utf8', timeout: 90000 });
  const results = JSON.parse(run.stdout) as { filePath: string; messages: { severity: number; ruleId: string }[] }[];
  hits = Object.fromEntries(results.map((r) => [r.filePath.split(/[\\/]/).pop()!, r.messages.map((m) => `${m.severity === 2 ? 'error' : 'warning'} ${m.ruleId}`)]));
}, 120000);

describe('npm run lint', () => {
  test('refuses reading an Office object before load and sync', () => {
    expect(hits['readBeforeLoad.ts']).toContain('error office-addins/load-object-before-read');
  });

  test('passes the same code with load and sync, and applies typescript-eslint', () => {
    expect(hits['loadThenSync.ts']).toEqual([]);
    expect(hits['unusedLocal.ts']).toContain('error @typescript-eslint/no-unused-vars');
  });
});
