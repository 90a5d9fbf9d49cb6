import type { Reagent } from '../catalogue';
import type { ActivityModel } from './activity';
import type { Contents } from './mixture';
import { STRONG_IONS } from '../catalogue';
import { fail, quote } from './failure';
import { allSystems } from './registry';

// A made solution as one cell of text: a line a reviewer reads at a glance (name, what went in,
// to what volume), then its exact composition per litre in brackets, versioned and checksummed,
// so that a handle edited by hand, cut short or made by a newer version is refused, never half-read.

export const HANDLE_VERSION = 1;
const OPEN = '⟦';
const CLOSE = '⟧';
/** Cells hold at most 32,767 characters (Excel's limit); a handle stays far below it. */
export const HANDLE_MAX_CHARS = 8000;

/** The exact content of a made solution: moles per litre of each acid system and strong ion. */
export interface StockComposition {
  name: string;
  /** the readable summary: what went in and to what volume */
  summary: string;
  systemsMPerL: Map<string, number>;
  ionsMPerL: Map<string, number>;
  /** the model warnings of how it was made (a 1 M stock adjusted outside the activity model's range), carried to every use */
  warning?: string;
  /** for a stock adjusted to a stated pH (adjustedStock.ts), how it was made; not written into a handle, which is an exact composition */
  adjusted?: AdjustedMaking;
}

/** How a pH-adjusted stock was made: one litre of it, the titrant that set its pH, and the conditions of the adjustment. */
export interface AdjustedMaking {
  /** what the stock is, however its text was spelled: its composition per litre, stated pH, temperature and model */
  identity: string;
  statedPH: number;
  /** half a unit of the last digit the stated pH was written to (pH 8.0: 0.05) */
  statedHalfDigit: number;
  /** one litre of the stock as made, the titrant included */
  contents: Contents;
  titrant: Reagent;
  /** the titrant the adjustment took, mol per litre of stock */
  titrantMPerL: number;
  /** the temperature its pH was set at, °C, and whether its text says so (else 25 °C was taken) */
  temperatureC: number;
  temperatureWritten: boolean;
  model: ActivityModel;
}

/** FNV-1a, 32 bit, as 8 hex digits: catches edits and truncation (not a security seal). */
function checksum(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h.toString(16).padStart(8, '0');
}

function cleanLabel(text: string): string {
  // eslint-disable-next-line no-control-regex -- control characters in a label would break the handle's one-line text
  return text.replace(/[⟦⟧\u0000-\u001f]/g, ' ').replace(/\s+/g, ' ').trim();
}

function entries(map: Map<string, number>): string {
  return [...map.entries()].filter(([, v]) => v !== 0).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([k, v]) => `${k}=${String(v)}`).join(',');
}

/**
 * Writes a handle.
 * @example encodeHandle({ name: '10× PBS', summary: 'NaCl 80 g, … to 1 L', systemsMPerL, ionsMPerL })
 *   → '10× PBS: NaCl 80 g, … to 1 L ⟦stock v1 s:phosphate=0.1 i:Cl-=1.4,Na+=1.5 #1a2b3c4d⟧'
 */
export function encodeHandle(c: StockComposition): string {
  const name = cleanLabel(c.name) || 'stock';
  const warned = c.warning ? ` w:${encodeURIComponent(c.warning)}` : '';
  const body = `${name}: ${cleanLabel(c.summary)} ${OPEN}stock v${HANDLE_VERSION} s:${entries(c.systemsMPerL)} i:${entries(c.ionsMPerL)}${warned}`;
  const text = `${body} #${checksum(body)}${CLOSE}`;
  if (text.length > HANDLE_MAX_CHARS) {
    fail({ code: 'bad_argument', argument: 'reagents', received: `a stock description of ${text.length} characters`, expected: `fewer rows or shorter names: a handle holds at most ${HANDLE_MAX_CHARS} characters` });
  }
  return text;
}

/** True when a reagent text carries a handle's exact part (so it must decode, or be refused). */
export function looksLikeHandle(text: string): boolean {
  return text.includes(`${OPEN}stock`);
}

function parseEntries(part: string, what: 'system' | 'ion', text: string, argument: string, row?: number): Map<string, number> {
  const map = new Map<string, number>();
  if (part === '') return map;
  for (const item of part.split(',')) {
    const eq = item.lastIndexOf('=');
    const key = item.slice(0, eq);
    const value = Number(item.slice(eq + 1));
    if (eq <= 0 || !Number.isFinite(value) || value < 0 || map.has(key)) tampered(text, argument, row, `its ${what} entry "${item}" is not readable`);
    map.set(key, value);
  }
  return map;
}

function tampered(text: string, argument: string, row: number | undefined, why: string): never {
  return fail({ code: 'bad_argument', argument, row, received: `the stock ${quote(text)}`,
    expected: `a stock cell exactly as PROTIC.STOCK wrote it (${why}); make the stock again with STOCK rather than editing its text` });
}

/**
 * Reads a handle back into its composition; refuses anything edited, cut short, newer, or naming a
 * system or ion this workbook does not have.
 * @example decodeHandle(encodeHandle(c)).systemsMPerL.get('phosphate') // → 0.1 (mol/L)
 */
export function decodeHandle(text: string, argument = 'reagents', row?: number): StockComposition {
  const t = text.trim();
  const open = t.indexOf(OPEN);
  if (!t.endsWith(CLOSE)) tampered(t, argument, row, 'it does not end where a handle ends: it may have been cut short');
  const exact = t.slice(open + 1, -1);
  const version = /^stock v(\d+) /.exec(exact);
  if (!version) tampered(t, argument, row, 'its version mark is missing');
  if (Number(version[1]) > HANDLE_VERSION) {
    fail({ code: 'bad_argument', argument, row, received: `a stock written by a newer version of Protic (handle v${version[1]})`, expected: `a handle of version ${HANDLE_VERSION} or older: update the add-in, or make the stock again here` });
  }
  const hash = t.lastIndexOf(' #');
  if (hash < open || checksum(t.slice(0, hash)) !== t.slice(hash + 2, -1)) tampered(t, argument, row, 'its check digits do not match its text: it was edited or cut short');
  const parts = /^stock v\d+ s:(\S*) i:(\S*)(?: w:(\S+))? #[0-9a-f]{8}$/.exec(exact);
  if (!parts) tampered(t, argument, row, 'its exact part is not readable');
  const colon = t.indexOf(': ');
  const name = colon > 0 && colon < open ? t.slice(0, colon) : 'stock';
  const systemsMPerL = parseEntries(parts[1], 'system', t, argument, row);
  const ionsMPerL = parseEntries(parts[2], 'ion', t, argument, row);
  const knownSystems = new Set(allSystems().map((s) => s.id));
  for (const id of systemsMPerL.keys()) {
    if (!knownSystems.has(id)) {
      fail({ code: 'unknown_system', argument, row, received: `a stock that holds the system "${id}"`, expected: 'a stock whose systems this workbook defines (a custom system must be defined here too)' });
    }
  }
  const knownIons = new Set(STRONG_IONS.map((i) => i.id));
  for (const id of ionsMPerL.keys()) if (!knownIons.has(id)) tampered(t, argument, row, `it names an ion "${id}" the catalogue does not have`);
  let warning: string | undefined;
  try {
    warning = parts[3] === undefined ? undefined : decodeURIComponent(parts[3]);
  } catch {
    tampered(t, argument, row, 'its warning part is not readable');
  }
  return { name, summary: t.slice(colon + 2, open).trim(), systemsMPerL, ionsMPerL, warning };
}

/** The made solution as a reagent dispensed by volume: one "formula unit" is one litre of it. */
export function handleReagent(c: StockComposition, text: string): Reagent {
  return {
    id: `stock:${checksum(text)}`,
    name: c.name,
    aliases: [],
    formula: '',
    hydrateWater: 0,
    systems: [...c.systemsMPerL.entries()].map(([systemId, count]) => ({ systemId, count })),
    ions: [...c.ionsMPerL.entries()].map(([ionId, count]) => ({ ionId, count })),
  };
}
