import { applyCustomDefinitions } from '../engine';

// The workbook's custom systems (its document settings), read by the functions runtime itself so a
// reopened workbook's cells find them before the pane's code has started; the pane edits them here too.

export const SETTINGS_KEY = 'protic.customSystems';
/** The engine's ceiling on custom systems in one workbook. */
const MAX_SYSTEMS = 100;

/** The part of Office.Settings used here (so tests can hand in a mock). */
export interface SettingsLike {
  get(name: string): unknown;
  set(name: string, value: unknown): void;
  saveAsync(callback?: (result: { status: string; error?: { message: string } }) => void): void;
}

/** One stored definition exactly as the workbook holds it; `problem` says why it is not in use. */
export interface StoredSystem { definition: unknown; name: string; problem?: string }

/** Everything stored: each definition (valid or not), or why the setting could not be read at all. */
export interface StoredSystems { entries: StoredSystem[]; unreadable?: string }

function displayName(def: unknown, index: number): string {
  const name = (def as { name?: unknown } | null)?.name;
  return typeof name === 'string' && name.trim() !== '' ? name.trim() : `entry ${index + 1}`;
}

/**
 * Reads and checks every stored definition on its own, so one bad entry never hides the others.
 * Each is checked after the good ones before it (names must not repeat); messages name its place in the list.
 */
export function readStoredSystems(settings: SettingsLike): StoredSystems {
  const raw = settings.get(SETTINGS_KEY);
  if (raw === null || raw === undefined || raw === '') return { entries: [] };
  let parsed: unknown;
  try {
    parsed = typeof raw === 'string' ? JSON.parse(raw) : raw;
  } catch {
    return { entries: [], unreadable: 'the workbook\'s custom systems are not readable JSON; none were loaded' };
  }
  const list = (parsed as { systems?: unknown } | null)?.systems;
  if (!Array.isArray(list)) return { entries: [], unreadable: 'the workbook\'s custom systems are not a "systems" list; none were loaded' };
  const accepted: unknown[] = [];
  const entries = list.map((definition, i): StoredSystem => {
    const name = displayName(definition, i);
    if (accepted.length >= MAX_SYSTEMS) return { definition, name, problem: `custom system ${i + 1}: more than ${MAX_SYSTEMS} systems in one workbook` };
    const problems = applyCustomDefinitions({ systems: [...accepted, definition] });
    if (problems.length > 0) {
      // the trial list puts this entry at accepted.length + 1; say where it is in the workbook's list
      return { definition, name, problem: problems.map((p) => p.replace(/^custom system \d+/, `custom system ${i + 1}`)).join(' ') };
    }
    accepted.push(definition);
    return { definition, name };
  });
  return { entries };
}

/** Registers the valid entries with the engine (the invalid ones stay stored, unused). */
export function registerStoredSystems(stored: StoredSystems): void {
  applyCustomDefinitions({ systems: stored.entries.filter((e) => e.problem === undefined).map((e) => e.definition) });
}

let loaded = false;

/** Reads the workbook's definitions and registers the valid ones; returns what is stored. */
export function loadWorkbookSystems(settings: SettingsLike): StoredSystems {
  const stored = readStoredSystems(settings);
  registerStoredSystems(stored);
  loaded = true;
  return stored;
}

interface OfficeLike { context?: { document?: { settings?: SettingsLike } }; onReady?: () => Promise<unknown> }

function office(): OfficeLike | undefined {
  return (globalThis as { Office?: OfficeLike }).Office;
}

/**
 * True once the workbook's definitions are in the engine (or there is no Office host, as in Node):
 * a cell may then be answered. False while Office has not yet handed over the document.
 */
export function ensureWorkbookSystems(): boolean {
  if (loaded) return true;
  const host = office();
  if (host === undefined) return true;
  let settings: SettingsLike | undefined;
  try {
    settings = host.context?.document?.settings;
  } catch {
    settings = undefined;
  }
  if (settings === undefined || settings === null) return false;
  loadWorkbookSystems(settings);
  return true;
}

/** Resolves when Office is ready and the definitions are loaded (a host with no document has none to load). */
export async function workbookSystemsReady(): Promise<void> {
  const host = office();
  if (host?.onReady) await host.onReady();
  if (!ensureWorkbookSystems()) loaded = true;
}
