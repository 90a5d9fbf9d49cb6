import { readdirSync, readFileSync } from 'fs';
import { join } from 'path';

// The engine and the catalogue run in plain Node: no Office, no DOM, and imports flow one way.
const FORBIDDEN = /\b(Office|Excel|CustomFunctions|document|window|HTMLElement)\b\s*[.(]/;

function sources(dir: string): string[] {
  return readdirSync(dir).filter((f) => f.endsWith('.ts')).map((f) => join(dir, f));
}

describe('layers', () => {
  test.each([...sources('src/engine'), ...sources('src/catalogue')])('%s uses no Office or DOM', (file) => {
    const code = readFileSync(file, 'utf8').replace(/\/\/.*$/gm, '').replace(/\/\*[\s\S]*?\*\//g, '');
    expect(code).not.toMatch(FORBIDDEN);
  });
  test.each(sources('src/catalogue'))('%s imports nothing outside the catalogue', (file) => {
    for (const m of readFileSync(file, 'utf8').matchAll(/from '([^']+)'/g)) expect(m[1]).toMatch(/^\.\//);
  });
  test.each(sources('src/engine'))('%s imports only the engine and the catalogue', (file) => {
    for (const m of readFileSync(file, 'utf8').matchAll(/from '([^']+)'/g)) expect(m[1]).toMatch(/^(\.\/|\.\.\/catalogue)/);
  });
  test('the spreadsheet engine stays out of the add-in sources', () => {
    for (const file of [...sources('src/functions'), ...sources('src/taskpane'), ...sources('src/engine')]) {
      expect(readFileSync(file, 'utf8')).not.toMatch(/hyperformula/i);
    }
  });
});
