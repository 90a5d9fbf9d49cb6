import fc from 'fast-check';
import { ProticError } from '../src/engine';
import * as impl from '../src/functions/impl';
import { toCellFailure } from '../src/functions/outcome';

// Every cell function, fed random and hostile arguments: each result is a finite number, a spill
// of finite numbers and labels, or a #VALUE! / #N/A with a message; nothing else escapes.

import { A, HOSTILE, R, VALID } from '../scripts/lib/hostileCases';

function check(name: string, result: unknown): void {
  if (typeof result === 'number') { expect(Number.isFinite(result)).toBe(true); return; }
  if (typeof result === 'string') {
    expect(['version', 'warnings']).toContain(name); // the text functions; a warning is plain text, never a number as text
    if (name === 'warnings') expect(result).not.toMatch(/NaN|Infinity|undefined|\[object/);
    return;
  }
  expect(Array.isArray(result)).toBe(true);
  for (const row of result as unknown[][]) {
    expect(Array.isArray(row)).toBe(true);
    for (const cell of row) {
      if (typeof cell === 'number') expect(Number.isFinite(cell)).toBe(true);
      else expect(typeof cell).toBe('string');
    }
  }
}

function callSafely(name: string, args: unknown[]): void {
  let result: unknown;
  try {
    result = (impl as unknown as Record<string, (...a: unknown[]) => unknown>)[name](...args);
  } catch (error) {
    if (!(error instanceof ProticError)) throw new Error(`${name}(${JSON.stringify(args).slice(0, 200)}) threw an untyped ${String(error)}`);
    const failure = toCellFailure(error);
    expect(['#VALUE!', '#N/A']).toContain(failure.kind);
    expect(failure.message.length).toBeGreaterThan(20);
    expect(failure.message).not.toMatch(/internal error|\[object Object\]/);
    return;
  }
  check(name, result);
}

describe('hostile input to every cell function', () => {
  test.each(Object.keys(VALID))('%s: the valid call works', (name) => {
    callSafely(name, VALID[name]);
  });

  test.each(Object.keys(VALID).filter((n) => VALID[n].length > 0))('%s: one or two arguments replaced by hostile values', (name) => {
    const valid = VALID[name];
    fc.assert(fc.property(
      fc.array(fc.record({ at: fc.integer({ min: 0, max: valid.length - 1 }), value: fc.oneof(fc.constantFrom(...HOSTILE), fc.double(), fc.string({ maxLength: 30 }), fc.integer()) }), { minLength: 1, maxLength: 2 }),
      (changes) => {
        const args = [...valid];
        for (const c of changes) args[c.at] = c.value;
        callSafely(name, args);
      },
    ), { numRuns: 250, seed: 42 });
  });

  test('every hostile value in every position, one at a time', () => {
    for (const [name, valid] of Object.entries(VALID)) {
      for (let at = 0; at < valid.length; at++) {
        for (const value of HOSTILE) {
          const args = [...valid];
          args[at] = value;
          callSafely(name, args);
        }
      }
    }
  });

  test.each([
    ['pH 40', () => impl.fractions('phosphate', 40)],
    ['temperature −40 °C', () => impl.ph(R, A, 'g', 1, -40)],
    ['temperature 300 °C', () => impl.ph(R, A, 'g', 1, 300)],
    ['zero points', () => impl.curve(R, A, 'g', 1, '1 M NaOH', 10, 0)],
    ['a 1e308 g weigh-out', () => impl.ph(R, [[1e308], [1]], 'g', 1)],
  ])('%s is a coded error', (_, run) => {
    expect(run).toThrow(ProticError);
  });

  test.each([1e-12, 1e-9, 1e-6, 1e-3, 0.1, 1, 5, 10])('totals of %d mol/L solve or fail with a code', (c) => {
    for (const reagent of ['HCl', 'NaOH', 'acetic acid', 'Tris', 'trisodium citrate dihydrate', 'disodium EDTA dihydrate']) {
      for (const t of [0, 25, 60, 100]) callSafely('ph', [[[reagent]], [[c]], 'M', null, t, 'davies']);
    }
  });
});

describe('a long range repeating one text is parsed once', () => {
  // 10,000 unit cells of "NaCl" cost 159 ms on a first call when each refused text built its own failure
  test.each([
    ['units', (rows: string[][]) => impl.ph(R, A, rows, 1, 25, 'davies'), 'parseUnit'],
    ['reagents', (rows: string[][]) => impl.ph(rows, [[1]], 'g', 1, 25, 'davies'), 'parseReagentSpec'],
  ] as const)('%s', (_, call, parser) => {
    const engine = require('../src/engine') as Record<string, (...a: unknown[]) => unknown>;
    const spy = jest.spyOn(engine, parser);
    const rows = Array.from({ length: 10000 }, () => ['sodium chlorate hexahydrate X']);
    const failure = (() => { try { call(rows); return undefined; } catch (e) { return e; } })();
    expect(failure).toBeInstanceOf(ProticError);
    expect(spy.mock.calls.length).toBeLessThan(10);
    spy.mockRestore();
  });
});
