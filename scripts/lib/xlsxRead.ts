// Reads a saved .xlsx: cells, formulas and the values Excel saved (ExcelJS), plus the parts
// ExcelJS leaves out, read from the zip directly: dynamic-array metadata (cm="…" on a cell,
// xl/metadata.xml), defined names that are formulas, add-in settings (xl/webextensions/) and
// external links (xl/externalLinks/).
import { readFileSync, statSync } from 'fs';
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import { readFormula } from './xlsxFormula';
import type { ReadFormula } from './xlsxFormula';

/** The file cannot be read as a workbook: the CLI prints the message and exits 2. */
export class XlsxInputError extends Error {}

export const DEFAULT_MAX_MB = 50;
/** total unpacked size refused above this many times the file limit (a zip bomb) */
const UNPACKED_FACTOR = 20;

export type SavedValue = number | string | boolean | null | { error: string };

export interface SavedCell {
  row: number; // 0-based
  col: number;
  value: SavedValue;
  /** the formula as saved, without `=` */
  saved?: string;
  formula?: ReadFormula;
  /** an array formula's saved range (`<f t="array" ref="B5:F30">`): [rows, cols] */
  spill?: [number, number];
  /** the anchor carries dynamic-array cell metadata (cm="n" → XLDAPR fDynamic) */
  dynamic?: boolean;
}

export interface SavedSheet { name: string; cells: SavedCell[]; rows: number; cols: number }

export interface SavedWorkbook {
  sheets: SavedSheet[];
  names: { name: string; expression: string; scope?: number }[];
  /** add-in settings from xl/webextensions/webextension*.xml, by property name */
  settings: { part: string; addinId: string; name: string; value: string }[];
  externalLinks: string[];
  forms: string[];
}

export function columnLetters(col: number): string {
  let s = '';
  for (let c = col + 1; c > 0; c = Math.floor((c - 1) / 26)) s = String.fromCharCode(65 + ((c - 1) % 26)) + s;
  return s;
}

export function a1(row: number, col: number): string {
  return `${columnLetters(col)}${row + 1}`;
}

export function parseA1(ref: string): { row: number; col: number } {
  const m = /^\$?([A-Z]{1,3})\$?(\d+)$/i.exec(ref);
  if (!m) throw new XlsxInputError(`not a cell reference: ${ref}`);
  let col = 0;
  for (const ch of m[1].toUpperCase()) col = col * 26 + ch.charCodeAt(0) - 64;
  return { row: Number(m[2]) - 1, col: col - 1 };
}

function decodeXml(s: string): string {
  return s.replace(/&(lt|gt|quot|apos|amp|#x[0-9a-f]+|#\d+);/gi, (_m, e: string) => {
    const k = e.toLowerCase();
    if (k === 'lt') return '<';
    if (k === 'gt') return '>';
    if (k === 'quot') return '"';
    if (k === 'apos') return "'";
    if (k === 'amp') return '&';
    return String.fromCodePoint(k.startsWith('#x') ? parseInt(k.slice(2), 16) : Number(k.slice(1)));
  });
}

function attr(tag: string, name: string): string | undefined {
  const m = new RegExp(`(?:^|\\s)${name}="([^"]*)"`).exec(tag);
  return m ? decodeXml(m[1]) : undefined;
}

function utf16(text: string): Buffer {
  return Buffer.from(text, 'utf16le');
}

/** Refuses what is not an .xlsx, with a message that says what it is. */
function checkContainer(bytes: Buffer, maxBytes: number): void {
  if (bytes.length > maxBytes) throw new XlsxInputError(`the file is ${(bytes.length / 1048576).toFixed(1)} MB, over the ${(maxBytes / 1048576).toFixed(0)} MB limit (--max-size MB to raise it)`);
  if (bytes.length >= 8 && bytes.readUInt32BE(0) === 0xd0cf11e0 && bytes.readUInt32BE(4) === 0xa1b11ae1) {
    // an OLE compound file: a password-protected .xlsx is one (EncryptionInfo + EncryptedPackage streams), so is an .xls
    if (bytes.includes(utf16('EncryptedPackage')) || bytes.includes(utf16('EncryptionInfo'))) {
      throw new XlsxInputError('the workbook is password-protected (encrypted): open it in Excel, remove the password (File > Info > Protect Workbook), save and try again');
    }
    if (bytes.includes(utf16('Workbook')) || bytes.includes(utf16('Book'))) {
      throw new XlsxInputError('this is an old Excel 97–2003 .xls workbook: open it in Excel and save it as .xlsx');
    }
    throw new XlsxInputError('this is an OLE compound file, not an .xlsx workbook');
  }
  if (bytes.length < 4 || bytes.readUInt32LE(0) !== 0x04034b50) {
    throw new XlsxInputError('not an .xlsx workbook (an .xlsx is a zip file; this one does not start like one)');
  }
}

function dateSerial(d: Date): number {
  return (d.getTime() - Date.UTC(1899, 11, 30)) / 86400000;
}

function plainValue(v: unknown): SavedValue {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean') return v;
  if (v instanceof Date) return dateSerial(v);
  if (typeof v === 'object') {
    const o = v as { error?: string; richText?: { text: string }[]; text?: unknown; result?: unknown };
    if (typeof o.error === 'string') return { error: o.error };
    if (Array.isArray(o.richText)) return o.richText.map((r) => r.text).join('');
    if ('text' in o) return plainValue(o.text);
  }
  return String(v);
}

interface RawParts {
  sheetPaths: Map<string, string>;
  order: string[];
  names: { name: string; expression: string; scope?: number }[];
  dynamicCm: Set<string>;
}

function resolveTarget(base: string, target: string): string {
  if (target.startsWith('/')) return target.slice(1);
  const parts = base.split('/').slice(0, -1);
  for (const p of target.split('/')) {
    if (p === '..') parts.pop(); else if (p !== '.') parts.push(p);
  }
  return parts.join('/');
}

async function text(zip: JSZip, path: string): Promise<string | undefined> {
  const f = zip.file(path);
  return f ? f.async('string') : undefined;
}

async function rawParts(zip: JSZip): Promise<RawParts> {
  const workbook = await text(zip, 'xl/workbook.xml');
  if (workbook === undefined) {
    if (zip.file('xl/workbook.bin')) throw new XlsxInputError('this is a binary .xlsb workbook: save it as .xlsx');
    throw new XlsxInputError('a zip file, but not an Excel workbook (no xl/workbook.xml)');
  }
  const rels = (await text(zip, 'xl/_rels/workbook.xml.rels')) ?? '';
  const targets = new Map<string, string>();
  for (const m of rels.matchAll(/<Relationship\b([^>]*)\/?>/g)) {
    const id = attr(m[1], 'Id'), target = attr(m[1], 'Target');
    if (id && target) targets.set(id, resolveTarget('xl/workbook.xml', target));
  }
  const sheetPaths = new Map<string, string>();
  const order: string[] = [];
  for (const m of workbook.matchAll(/<(?:\w+:)?sheet\b([^>]*)\/?>/g)) {
    const name = attr(m[1], 'name');
    const rid = /\br:id="([^"]*)"|\bid="([^"]*)"/.exec(m[1]);
    const id = rid ? (rid[1] ?? rid[2]) : undefined;
    if (name === undefined) continue;
    order.push(name);
    if (id && targets.has(id)) sheetPaths.set(name, targets.get(id) as string);
  }
  const names: RawParts['names'] = [];
  for (const m of workbook.matchAll(/<(?:\w+:)?definedName\b([^>]*)>([\s\S]*?)<\/(?:\w+:)?definedName>/g)) {
    const name = attr(m[1], 'name');
    if (!name || name.startsWith('_xlnm.')) continue; // print areas and other built-in names
    const local = attr(m[1], 'localSheetId');
    names.push({ name, expression: decodeXml(m[2]), scope: local === undefined ? undefined : Number(local) });
  }
  // dynamic arrays: cm="n" points at cellMetadata block n (1-based); its rc names a metadata type
  // (t, 1-based) and a block of that type's futureMetadata (v, 0-based) holding fDynamic="1"
  const dynamicCm = new Set<string>();
  const metadata = await text(zip, 'xl/metadata.xml');
  if (metadata) {
    const types = [...metadata.matchAll(/<(?:\w+:)?metadataType\b([^>]*)\/?>/g)].map((m) => attr(m[1], 'name'));
    const future = new Map<string, boolean[]>();
    for (const m of metadata.matchAll(/<(?:\w+:)?futureMetadata\b([^>]*)>([\s\S]*?)<\/(?:\w+:)?futureMetadata>/g)) {
      const blocks = [...m[2].matchAll(/<(?:\w+:)?bk>([\s\S]*?)<\/(?:\w+:)?bk>/g)].map((b) => /fDynamic="(1|true)"/.test(b[1]));
      future.set(attr(m[1], 'name') ?? '', blocks);
    }
    const cell = /<(?:\w+:)?cellMetadata\b[^>]*>([\s\S]*?)<\/(?:\w+:)?cellMetadata>/.exec(metadata);
    if (cell) {
      [...cell[1].matchAll(/<(?:\w+:)?bk>([\s\S]*?)<\/(?:\w+:)?bk>/g)].forEach((b, i) => {
        const rc = /<(?:\w+:)?rc\b([^>]*)\/?>/.exec(b[1]);
        if (!rc) return;
        const type = types[Number(attr(rc[1], 't')) - 1];
        if (type === 'XLDAPR' && future.get('XLDAPR')?.[Number(attr(rc[1], 'v'))]) dynamicCm.add(String(i + 1));
      });
    }
  }
  return { sheetPaths, order, names, dynamicCm };
}

async function settingsOf(zip: JSZip): Promise<SavedWorkbook['settings']> {
  const out: SavedWorkbook['settings'] = [];
  for (const path of Object.keys(zip.files).filter((p) => /^xl\/webextensions\/webextension\d*\.xml$/i.test(p)).sort()) {
    const xml = (await text(zip, path)) ?? '';
    const ref = /<(?:\w+:)?reference\b([^>]*)\/?>/.exec(xml);
    const addinId = ref ? attr(ref[1], 'id') ?? '' : '';
    for (const m of xml.matchAll(/<(?:\w+:)?property\b([^>]*)\/?>/g)) {
      const name = attr(m[1], 'name'), value = attr(m[1], 'value');
      if (name !== undefined && value !== undefined) out.push({ part: path, addinId, name, value });
    }
  }
  return out;
}

async function externalLinksOf(zip: JSZip): Promise<string[]> {
  const out: string[] = [];
  for (const path of Object.keys(zip.files).filter((p) => /^xl\/externalLinks\/externalLink\d+\.xml$/i.test(p)).sort()) {
    const rels = (await text(zip, path.replace(/([^/]+)$/, '_rels/$1.rels'))) ?? '';
    const target = /Target="([^"]*)"/.exec(rels);
    out.push(target ? decodeXml(target[1]) : path);
  }
  return out;
}

/** The cells of one sheet part whose `<c>` carries a dynamic-array cm. */
function dynamicCells(xml: string, dynamicCm: Set<string>): Set<string> {
  const out = new Set<string>();
  if (dynamicCm.size === 0) return out;
  for (const m of xml.matchAll(/<c\b([^>]*?\bcm="(\d+)"[^>]*)>/g)) {
    if (!dynamicCm.has(m[2])) continue;
    const r = attr(m[1], 'r');
    if (r) out.add(r);
  }
  return out;
}

export interface ReadOptions { maxMB?: number; progress?: (message: string) => void }

/** Reads a workbook from bytes; every reason it cannot be read is an XlsxInputError. */
export async function readWorkbookBytes(bytes: Buffer, options: ReadOptions = {}): Promise<SavedWorkbook> {
  const maxBytes = (options.maxMB ?? DEFAULT_MAX_MB) * 1048576;
  checkContainer(bytes, maxBytes);
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(bytes);
  } catch (e) {
    throw new XlsxInputError(`not a readable .xlsx (the zip is damaged: ${(e as Error).message})`);
  }
  let unpacked = 0;
  for (const f of Object.values(zip.files)) unpacked += (f as unknown as { _data?: { uncompressedSize?: number } })._data?.uncompressedSize ?? 0;
  if (unpacked > maxBytes * UNPACKED_FACTOR) throw new XlsxInputError(`the workbook unpacks to ${(unpacked / 1048576).toFixed(0)} MB, over the ${(maxBytes * UNPACKED_FACTOR / 1048576).toFixed(0)} MB limit`);
  const parts = await rawParts(zip);
  const settings = await settingsOf(zip);
  const externalLinks = await externalLinksOf(zip);
  const book = new ExcelJS.Workbook();
  try {
    if (bytes.length > 1048576) options.progress?.('reading cells');
    await book.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch (e) {
    throw new XlsxInputError(`the workbook could not be read: ${(e as Error).message}`);
  }
  const forms = new Set<string>();
  const sheets: SavedSheet[] = [];
  const spillAnchors = new Map<string, string>(); // "sheet!A1" → "A1:B2"
  const pending: { sheet: SavedSheet; cell: SavedCell }[] = [];
  for (const name of parts.order) {
    const ws = book.getWorksheet(name);
    const sheet: SavedSheet = { name, cells: [], rows: 0, cols: 0 };
    sheets.push(sheet);
    if (!ws) continue;
    const path = parts.sheetPaths.get(name);
    const xml = path ? (await text(zip, path)) ?? '' : '';
    const dynamic = dynamicCells(xml, parts.dynamicCm);
    ws.eachRow({ includeEmpty: false }, (row) => {
      row.eachCell({ includeEmpty: false }, (c) => {
        const model = c.model as { shareType?: string; ref?: string; result?: unknown; value?: unknown };
        const cell: SavedCell = { row: Number(c.row) - 1, col: Number(c.col) - 1, value: null };
        const f = c.formula;
        if (f) {
          cell.saved = f;
          cell.value = plainValue(model.result);
          if (model.shareType === 'array' && model.ref) {
            const [s, e] = model.ref.split(':');
            const a = parseA1(s), b = parseA1(e ?? s);
            cell.spill = [b.row - a.row + 1, b.col - a.col + 1];
            cell.dynamic = dynamic.has(c.address);
            forms.add(cell.dynamic ? 'dynamic-array spill (cm + XLDAPR metadata, t="array" ref on the anchor)' : 'legacy array formula (t="array" ref, no cm)');
            spillAnchors.set(`${name}!${c.address}`, model.ref);
          }
          if (model.shareType === 'shared' || (c.model as { sharedFormula?: string }).sharedFormula) forms.add('shared formula (t="shared" si)');
          pending.push({ sheet, cell });
        } else {
          cell.value = plainValue(c.value);
        }
        if (cell.value === null && !cell.saved) return;
        sheet.cells.push(cell);
        sheet.rows = Math.max(sheet.rows, cell.row + 1);
        sheet.cols = Math.max(sheet.cols, cell.col + 1);
      });
    });
  }
  // formulas last: ANCHORARRAY needs every sheet's spill ranges
  for (const { sheet, cell } of pending) {
    const spillOf = (ref: string): string | undefined => {
      const bang = ref.lastIndexOf('!');
      const sheetName = bang >= 0 ? ref.slice(0, bang).replace(/^'|'$/g, '').replace(/''/g, "'") : sheet.name;
      const range = spillAnchors.get(`${sheetName}!${ref.slice(bang + 1)}`);
      return range && bang >= 0 ? `${ref.slice(0, bang + 1)}${range}` : range;
    };
    cell.formula = readFormula(cell.saved as string, spillOf);
    for (const f of cell.formula.forms) forms.add(f);
  }
  const names = parts.names.map((n) => ({ ...n, expression: readFormula(n.expression).engine }));
  return { sheets, names, settings, externalLinks, forms: [...forms] };
}

export async function readWorkbookFile(path: string, options: ReadOptions = {}): Promise<SavedWorkbook> {
  let bytes: Buffer;
  try {
    const size = statSync(path).size;
    const maxBytes = (options.maxMB ?? DEFAULT_MAX_MB) * 1048576;
    if (size > maxBytes) throw new XlsxInputError(`the file is ${(size / 1048576).toFixed(1)} MB, over the ${(maxBytes / 1048576).toFixed(0)} MB limit (--max-size MB to raise it)`);
    bytes = readFileSync(path);
  } catch (e) {
    if (e instanceof XlsxInputError) throw e;
    throw new XlsxInputError(`cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  return readWorkbookBytes(bytes, options);
}
