// Verifies a saved workbook: every cell holding a Protic formula is recomputed with the current
// catalogue and compared with the value Excel saved; spills over their whole range.
import { performance } from 'perf_hooks';
import { applyCustomDefinitions, clearCustomDefinitions } from '../../src/engine';
import { ADDIN_VERSION, CATALOGUE_VERSION } from '../../src/catalogue/version';
import type { SheetValue } from './sheetEngine';
import { loadSystemsFile } from './systemsFile';
import { cellKey, evaluateSaved } from './xlsxEvaluate';
import type { Problem } from './xlsxEvaluate';
import { a1, readWorkbookFile } from './xlsxRead';
import type { ReadOptions, SavedCell, SavedValue, SavedWorkbook } from './xlsxRead';

export const SETTINGS_KEY = 'protic.customSystems';

export type Status = 'agrees' | 'differs' | 'not saved' | 'stamp';

export interface CellReport {
  where: string;
  formula: string;
  saved: SavedValue;
  recomputed: SheetValue;
  /** recomputed − saved, for numbers */
  difference: number | null;
  status: Status;
  /** computed cells among the formula's inputs: a difference there may come from upstream */
  computedInputs: string[];
  /** the anchor, for a cell of a spilled range */
  spillOf?: string;
  note?: string;
}

export interface StampReport { where: string; saved: string; current: string; verdict: string; changed: boolean }

export interface VerifyResult {
  file: string;
  tolerance: number;
  cells: CellReport[];
  stamps: StampReport[];
  problems: Problem[];
  forms: string[];
  customSystems: string;
  sheets: number;
  formulas: number;
  spills: { where: string; saved: string; recomputed: string }[];
  seconds: Record<string, number>;
  exitCode: 0 | 1 | 2;
}

export function currentStamp(): string {
  return `Protic ${ADDIN_VERSION}; catalogue ${CATALOGUE_VERSION}`;
}

function compareVersions(a: string, b: string): number {
  const pa = a.split('.').map(Number), pb = b.split('.').map(Number);
  for (let i = 0; i < Math.max(pa.length, pb.length); i++) {
    const d = (pa[i] ?? 0) - (pb[i] ?? 0);
    if (d !== 0) return d;
  }
  return 0;
}

/** What a saved VERSION() stamp says against the current versions. */
export function stampVerdict(saved: SavedValue): { verdict: string; changed: boolean } {
  const text = typeof saved === 'string' ? saved : JSON.stringify(saved);
  const m = /^Protic ([0-9][0-9A-Za-z.+-]*); catalogue ([0-9.]+)$/.exec(text);
  if (!m) return { verdict: `not a Protic stamp as saved (${text}); current ${currentStamp()}`, changed: true };
  const catalogue = compareVersions(m[2], CATALOGUE_VERSION);
  const parts: string[] = [];
  if (catalogue < 0) parts.push(`the catalogue changed since the record was signed: signed with catalogue ${m[2]}, now ${CATALOGUE_VERSION}`);
  else if (catalogue > 0) parts.push(`signed with catalogue ${m[2]}, newer than this copy's ${CATALOGUE_VERSION}: update Protic before relying on this check`);
  if (m[1] !== ADDIN_VERSION) parts.push(`add-in ${m[1]} then, ${ADDIN_VERSION} now`);
  return parts.length === 0 ? { verdict: 'same add-in and catalogue', changed: false } : { verdict: parts.join('; '), changed: true };
}

const isBlank = (v: unknown): boolean => v === null || v === undefined || v === '';

function compare(saved: SavedValue, recomputed: SheetValue, tolerance: number, absolute: boolean): { status: Status; difference: number | null; note?: string } {
  if (isBlank(saved) && isBlank(recomputed)) return { status: 'agrees', difference: null };
  if (typeof saved === 'number' && typeof recomputed === 'number') {
    const difference = recomputed - saved;
    const scale = absolute ? 1 : Math.max(Math.abs(saved), Math.abs(recomputed));
    return { status: Math.abs(difference) <= tolerance * scale ? 'agrees' : 'differs', difference };
  }
  if (saved && typeof saved === 'object' && recomputed && typeof recomputed === 'object') {
    return saved.error === recomputed.error ? { status: 'agrees', difference: null, note: recomputed.message } : { status: 'differs', difference: null, note: recomputed.message };
  }
  if (recomputed && typeof recomputed === 'object') return { status: 'differs', difference: null, note: recomputed.message };
  if (saved && typeof saved === 'object' && saved.error === '#NAME?') return { status: 'differs', difference: null, note: 'saved as #NAME?: Excel did not have Protic loaded when the workbook was last calculated' };
  if (saved && typeof saved === 'object' && /^#(BUSY|GETTING_DATA)/.test(saved.error)) return { status: 'differs', difference: null, note: `saved as ${saved.error}: the workbook was saved before the cell finished calculating` };
  return { status: saved === recomputed ? 'agrees' : 'differs', difference: null };
}

export interface VerifyOptions extends ReadOptions {
  tolerance?: number;
  systemsFile?: string;
  /** a changed VERSION stamp counts as a difference */
  strictVersion?: boolean;
}

/** Loads the custom systems a workbook carries (or, without any, those of `systemsFile`); says where they came from. */
export function loadCustomSystems(book: SavedWorkbook, systemsFile: string | undefined, problems: Problem[]): string {
  clearCustomDefinitions();
  const setting = book.settings.find((s) => s.name === SETTINGS_KEY);
  if (setting) {
    let parsed: unknown;
    try {
      parsed = JSON.parse(setting.value);
      if (typeof parsed === 'string') parsed = JSON.parse(parsed); // Office.Settings stores each value as JSON; the pane's value is a JSON string
    } catch {
      problems.push({ kind: 'name', where: setting.part, message: `the workbook's custom systems (${SETTINGS_KEY}) are not readable JSON` });
      return `the workbook's custom systems (${setting.part}) could not be read`;
    }
    const rejected = applyCustomDefinitions(parsed);
    if (rejected.length > 0) {
      clearCustomDefinitions();
      for (const r of rejected) problems.push({ kind: 'name', where: setting.part, message: `custom system rejected: ${r}` });
      return `the workbook's custom systems (${setting.part}) were rejected`;
    }
    const count = (parsed as { systems?: unknown[] }).systems?.length ?? 0;
    return `${count} custom system(s) from the workbook (${setting.part}, property ${SETTINGS_KEY}, add-in ${setting.addinId || 'unnamed'})${systemsFile ? `; --systems ${systemsFile} not used` : ''}`;
  }
  if (systemsFile) {
    const rejected = loadSystemsFile(systemsFile);
    if (rejected.length > 0) {
      for (const r of rejected) problems.push({ kind: 'name', where: systemsFile, message: `custom system rejected: ${r}` });
      return `custom systems from ${systemsFile} were rejected`;
    }
    return `custom systems from ${systemsFile} (the workbook carries none)`;
  }
  return 'none (the workbook carries none; --systems FILE.json to supply them)';
}

/** Verifies a workbook already read. */
export function verifyBook(file: string, book: SavedWorkbook, options: VerifyOptions = {}, seconds: Record<string, number> = {}): VerifyResult {
  const tolerance = options.tolerance ?? 1e-9;
  const problems: Problem[] = [];
  for (const link of book.externalLinks) problems.push({ kind: 'external', where: 'workbook', message: `links to another workbook: ${link}` });
  const customSystems = loadCustomSystems(book, options.systemsFile, problems);
  const protic: { s: number; cell: SavedCell }[] = [];
  book.sheets.forEach((sheet, s) => { for (const cell of sheet.cells) if (cell.formula && cell.formula.protic.length > 0) protic.push({ s, cell }); });
  const total = protic.length;
  const progress = options.progress;
  let t0 = performance.now();
  const evaluated = evaluateSaved(book, {
    inputsFor: protic.map(({ s, cell }) => ({ sheet: s, row: cell.row, col: cell.col })),
    progress: progress && total >= 2000 ? (done) => progress(`recomputing: ${Math.min(done, total)} of ${total} Protic cells`) : undefined,
  });
  seconds.evaluate = (performance.now() - t0) / 1000;
  t0 = performance.now();
  problems.push(...evaluated.problems);
  const cells: CellReport[] = [];
  const stamps: StampReport[] = [];
  const spills: VerifyResult['spills'] = [];
  const unreadable = new Set(problems.map((p) => p.where));
  const savedBySheet = new Map<number, Map<string, SavedValue>>();
  for (const { s, cell } of protic) {
    const sheet = book.sheets[s];
    const anchor = `${sheet.name}!${a1(cell.row, cell.col)}`;
    const values = evaluated.values[s] ?? [];
    const formula = `=${cell.saved}`;
    const computedInputs = evaluated.computedInputs.get(cellKey(s, cell.row, cell.col)) ?? [];
    if (/^VERSION\s*\(\s*\)$/i.test(cell.formula!.engine.replace(/^PROTIC\./i, ''))) {
      const v = stampVerdict(cell.value);
      stamps.push({ where: anchor, saved: String(cell.value), current: currentStamp(), ...v });
      cells.push({ where: anchor, formula, saved: cell.value, recomputed: values[cell.row]?.[cell.col] ?? null, difference: null, status: v.changed && options.strictVersion ? 'differs' : 'stamp', computedInputs, note: v.verdict });
      continue;
    }
    const shape = evaluated.shapes.get(cellKey(s, cell.row, cell.col));
    if (!cell.spill && !shape) {
      const recomputed = values[cell.row]?.[cell.col] ?? null;
      const c = compare(cell.value, recomputed, tolerance, false);
      const saved = cell.value;
      cells.push({ where: anchor, formula, saved, recomputed, computedInputs, ...c, ...(unreadable.has(anchor) ? { status: 'differs' as Status } : {}), ...(cell.saved !== undefined && saved === null && !isBlank(recomputed) ? { status: 'not saved' as Status } : {}) });
      continue;
    }
    // the whole spilled range: the saved range and the recomputed one, whichever is larger
    const savedShape = cell.spill ?? [1, 1];
    const newShape = shape ?? savedShape;
    const legacyLarger = !cell.dynamic && savedShape[0] >= newShape[0] && savedShape[1] >= newShape[1];
    if ((savedShape[0] !== newShape[0] || savedShape[1] !== newShape[1]) && !legacyLarger) {
      spills.push({ where: anchor, saved: `${savedShape[0]}×${savedShape[1]}`, recomputed: `${newShape[0]}×${newShape[1]}` });
    }
    let savedAt = savedBySheet.get(s);
    if (!savedAt) {
      savedAt = new Map(sheet.cells.map((other) => [`${other.row}:${other.col}`, other.value] as [string, SavedValue]));
      savedBySheet.set(s, savedAt);
    }
    for (let r = 0; r < Math.max(savedShape[0], newShape[0]); r++) {
      const label = values[cell.row + r]?.[cell.col];
      // a residual is itself relative and near rounding noise: compared as an absolute number
      const absolute = typeof label === 'string' && /residual/i.test(label);
      for (let c = 0; c < Math.max(savedShape[1], newShape[1]); c++) {
        const inSaved = r < savedShape[0] && c < savedShape[1];
        const inNew = r < newShape[0] && c < newShape[1];
        const saved = inSaved ? savedAt.get(`${cell.row + r}:${cell.col + c}`) ?? null : null;
        const recomputed = inNew ? values[cell.row + r]?.[cell.col + c] ?? null : null;
        const where = `${sheet.name}!${a1(cell.row + r, cell.col + c)}`;
        const result = compare(saved, recomputed, tolerance, absolute && c > 0);
        // a legacy array formula fills the part of its range the result does not reach with #N/A
        const padding = inSaved && !inNew && !cell.dynamic && saved !== null && typeof saved === 'object' && saved.error === '#N/A';
        if (padding) {
          cells.push({ where, formula, saved, recomputed, computedInputs, status: 'agrees', difference: null, note: 'legacy array range beyond the result (#N/A)', spillOf: anchor });
          continue;
        }
        const note = !inSaved ? 'outside the saved spill' : !inNew ? 'outside the recomputed spill' : result.note;
        cells.push({ where, formula, saved, recomputed, computedInputs, ...result, ...(inSaved && inNew ? {} : { status: isBlank(saved) && isBlank(recomputed) ? 'agrees' : 'differs' }), note, ...(r || c ? { spillOf: anchor } : {}) });
      }
    }
  }
  // a difference whose inputs differ too may only be carried from upstream: say which
  const differing = new Set(cells.filter((c) => c.status === 'differs').map((c) => c.where));
  if (differing.size > 0) {
    for (const c of cells) {
      if (c.status !== 'differs' || c.computedInputs.length === 0) continue;
      const sheetName = c.where.slice(0, c.where.lastIndexOf('!'));
      const upstream = c.computedInputs.filter((ref) => {
        const bang = ref.lastIndexOf('!');
        const where = bang < 0 ? `${sheetName}!${ref}` : `${ref.slice(0, bang).replace(/^'|'$/g, '').replace(/''/g, "'")}!${ref.slice(bang + 1)}`;
        return differing.has(where);
      });
      if (upstream.length > 0) c.note = [c.note, `an input differs too (${upstream.slice(0, 5).join(', ')}): this difference may come from there`].filter(Boolean).join('; ');
    }
  }
  seconds.compare = (performance.now() - t0) / 1000;
  const differs = cells.some((c) => c.status === 'differs' || c.status === 'not saved');
  const exitCode = problems.length > 0 ? 2 : differs ? 1 : 0;
  const formulas = book.sheets.reduce((n, s) => n + s.cells.filter((c) => c.saved !== undefined).length, 0);
  return { file, tolerance, cells, stamps, problems, forms: book.forms, customSystems, sheets: book.sheets.length, formulas, spills, seconds, exitCode };
}

/** Reads and verifies a workbook file; a file that cannot be read throws XlsxInputError. */
export async function verifyFile(file: string, options: VerifyOptions = {}): Promise<VerifyResult> {
  const seconds: Record<string, number> = {};
  const t0 = performance.now();
  const book = await readWorkbookFile(file, options);
  seconds.read = (performance.now() - t0) / 1000;
  return verifyBook(file, book, options, seconds);
}
