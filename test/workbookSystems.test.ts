import { OfficeMockObject } from 'office-addin-mock';

// A reopened workbook: its custom systems are in the document settings, and Excel computes cells before
// the pane's code has run. The functions runtime must read them itself (office-addin-mock stands in for Office).
class StandInError extends Error {
  constructor(readonly code: string, message: string) { super(message); }
}
(global as unknown as { CustomFunctions: unknown }).CustomFunctions = {
  Error: StandInError, ErrorCode: { invalidValue: '#VALUE!', notAvailable: '#N/A' }, associate: () => undefined,
};

const STORED = JSON.stringify({ systems: [
  { name: 'Zorbate', pKa: [5.5], charge: 0, forms: [{ name: 'zorbic acid', formula: 'C6H8O2', protonsLost: 0 }, { name: 'sodium zorbate', formula: 'C6H7NaO2', protonsLost: 1 }] },
  { name: 'Broken', pKa: [99], charge: 0 },
] });

function officeWith(settingsStore: Record<string, unknown>, documentReady: boolean) {
  let release: () => void = () => undefined;
  const ready = new Promise<void>((resolve) => { release = resolve; });
  const settings = { get(name: string) { return settingsStore[name] ?? null; }, set(name: string, v: unknown) { settingsStore[name] = v; }, saveAsync() { /* not saved here */ } };
  const office = new OfficeMockObject({ context: { document: documentReady ? { settings } : undefined } }) as unknown as Record<string, unknown>;
  const context = office.context as { document?: unknown };
  office.onReady = () => ready.then(() => { context.document = { settings }; });
  return { office, release };
}

type Fns = typeof import('../src/functions/functions')['EXCEL_FUNCTIONS'];

function freshFunctions(office: unknown): Fns {
  jest.resetModules();
  (global as unknown as { Office: unknown }).Office = office;
  // a fresh engine registry too: it lives on globalThis so the pane and functions share it
  delete (globalThis as Record<string, unknown>).__proticCustomDefinitions;
  return (require('../src/functions/functions') as typeof import('../src/functions/functions')).EXCEL_FUNCTIONS;
}

afterEach(() => { delete (global as unknown as { Office?: unknown }).Office; });

describe('custom systems after reopening, before the pane starts', () => {
  test('the document is available: the first cell reads the settings and computes with the custom system', () => {
    const { office } = officeWith({ 'protic.customSystems': STORED }, true);
    const fns = freshFunctions(office);
    // no pane code has run: before, this was #VALUE! (unknown acid system)
    expect(fns.FRACTIONS('Zorbate', 5.5, null, null)[0][0]).toBeCloseTo(0.5, 12);
    expect(fns.PHMIX([['zorbic acid'], ['sodium zorbate']], [[0.1], [0.1]], [['M']], null, 25, 'ideal')).toBeCloseTo(5.5, 2);
    // the invalid entry is not loaded, and does not stop the valid one
    expect(() => fns.PKA('Broken', 1)).toThrow(/unknown/);
  });

  test('Office not ready yet: the cell waits for the document and then answers', async () => {
    const { office, release } = officeWith({ 'protic.customSystems': STORED }, false);
    const fns = freshFunctions(office);
    const pending = fns.FRACTIONS('Zorbate', 5.5, null, null) as unknown as Promise<number[][]>;
    expect(typeof (pending as { then?: unknown }).then).toBe('function');
    const catalogueOnly = fns.PHMIX([['KH2PO4']], [[1]], [['g']], 1) as unknown as Promise<number>;
    release();
    expect((await pending)[0][0]).toBeCloseTo(0.5, 12);
    expect(await catalogueOnly).toBeGreaterThan(4);
    // and after that, cells answer at once
    expect(fns.PKA('Zorbate', 1)).toBe(5.5);
  });

  test('a failure while waiting still arrives as #VALUE! with its message', async () => {
    const { office, release } = officeWith({}, false);
    const fns = freshFunctions(office);
    const pending = fns.FRACTIONS('Zorbate', 5.5, null, null) as unknown as Promise<number[][]>;
    release();
    await expect(pending).rejects.toMatchObject({ code: '#VALUE!', message: expect.stringMatching(/unknown/) });
  });

  test('without Office (the sheet runner, HyperFormula) nothing waits', () => {
    const fns = freshFunctions(undefined);
    expect(fns.PHMIX([['KH2PO4']], [[1]], [['g']], 1)).toBeGreaterThan(4);
  });
});
