import { spawnSync } from 'child_process';
import { join } from 'path';

// npm run lint's configuration (eslint.config.mjs) carries the Office add-in rules and typescript-eslint:
// a snippet that reads a range's values before loading them is refused; the same code done right passes.

// ESLint runs in a child process: the flat config is an ES module, which jest's CommonJS sandbox cannot import.
async function rulesHit(code: string): Promise<string[]> {
  const run = spawnSync(process.execPath, [join('node_modules', 'eslint', 'bin', 'eslint.js'), '--stdin', '--stdin-filename', 'src/taskpane/lintProbe.ts', '--format', 'json'],
    { input: code, encoding: 'utf8', timeout: 60000 });
  const [result] = JSON.parse(run.stdout) as { messages: { severity: number; ruleId: string }[] }[];
  return result.messages.map((m) => `${m.severity === 2 ? 'error' : 'warning'} ${m.ruleId}`);
}

describe('npm run lint', () => {
  test('refuses reading an Office object before load and sync', async () => {
    const hits = await rulesHit([
      'export async function probe(): Promise<unknown> {',
      '  return Excel.run(async (context) => {',
      '    const range = context.workbook.getSelectedRange();',
      '    return range.values;',
      '  });',
      '}',
      '',
    ].join('\n'));
    expect(hits).toContain('error office-addins/load-object-before-read');
  }, 30000);

  test('passes the same code with load and sync, and applies typescript-eslint', async () => {
    expect(await rulesHit([
      'export async function probe(): Promise<unknown> {',
      '  return Excel.run(async (context) => {',
      '    const range = context.workbook.getSelectedRange();',
      "    range.load('values');",
      '    await context.sync();',
      '    return range.values;',
      '  });',
      '}',
      '',
    ].join('\n'))).toEqual([]);
    expect(await rulesHit('export function f(): void { const unused = 1; }\n')).toContain('error @typescript-eslint/no-unused-vars');
  }, 30000);
});
