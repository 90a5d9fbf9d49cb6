import {
  bufferCapacity, buildContents, contentsFromParsed, modelWarning, parseModel, parseReagentSpec, parseUnit, prepareProblem, registryGeneration, solve,
} from '../engine';
import type { ActivityModel, Contents, Equilibrium, MixtureRow, ParsedRow, ReagentSpec, Unit } from '../engine';
import { TEMPERATURE_RULE, VOLUME_RULE, isBlank, mixtureRows, optionalNumber } from './args';
import type { Cell } from './args';

// What a table of mixture cells shares, so that a cell costs little more than the solve it needs:
// - a reagent or unit column already seen (the same texts in the same order) is recognised by
//   comparing its texts, and its texts were parsed once, when it was first seen;
// - the solved mixture is found by one lookup, on a hash of the columns' ids and the amounts,
//   confirmed by comparing every value (no key string is built, so no text can collide with another);
// - IONICSTRENGTH, CAPACITY, WARNINGS and SPECIES beside PHMIX find the same entry.
// Every argument is still read and checked on every call; anything the fast reading does not
// accept (a blank amount, a number as a reagent, an unknown unit, a shape that differs) goes
// through the one general path, mixtureRows and buildContents, which raises the coded failure.

/** A mixture as the cell functions read it (the general path). */
export interface MixtureArgs {
  rows: MixtureRow[];
  volumeL: number | undefined;
  temperatureC: number;
  model: ActivityModel;
}

export function readMixture(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, temperature: Cell, model: Cell): MixtureArgs {
  return {
    rows: mixtureRows(reagents, amounts, units),
    volumeL: optionalNumber(volume, 'volume', undefined, VOLUME_RULE),
    temperatureC: optionalNumber(temperature, 'temperature', 25, TEMPERATURE_RULE),
    model: parseModel(model),
  };
}

/** A solved mixture and what the functions beside PHMIX derive from it, each worked out once. */
export interface MixtureEntry {
  pH: number;
  ionicStrengthM: number;
  capacity?: number;
  warning?: string;
}

/** The mixture's equilibrium: kept for the most recent mixtures, solved again (to the same bits) for an older one. */
export function equilibriumOf(entry: MixtureEntry): Equilibrium {
  return (entry as Entry).equilibrium();
}

export function capacityOf(entry: MixtureEntry): number {
  if (entry.capacity === undefined) entry.capacity = bufferCapacity(equilibriumOf(entry));
  return entry.capacity;
}

export function warningOf(entry: MixtureEntry): string {
  if (entry.warning === undefined) entry.warning = modelWarning(equilibriumOf(entry));
  return entry.warning;
}

const ENTRY_LIMIT = 5000;
const COLUMN_LIMIT = 1000;
const RECENT_COLUMNS = 8;

/** One reagent or unit range: its cells row by row, and what each parses to (undefined: blank or refused). */
interface Column<T> {
  id: number;
  rows: number;
  cols: number;
  cells: unknown[];
  blank: boolean[];
  parsed: (T | undefined)[];
}

interface ColumnStore<T> {
  recent: Column<T>[];
  byContent: Map<string, Column<T>>;
  parse: (text: string, index: number) => T;
  blankZero: boolean;
}

let nextColumnId = 1;
let generation = -1;

function store<T>(parse: (text: string, index: number) => T, blankZero: boolean): ColumnStore<T> {
  return { recent: [], byContent: new Map(), parse, blankZero };
}

// a reagent cell holding 0 is blank (some hosts pass empty cells as 0); a unit cell holding 0 is not
const reagentColumns = store<ReagentSpec>((text, index) => parseReagentSpec(text, 'reagents', index), true);
const unitColumns = store<Unit>((text, index) => parseUnit(text, 'units', index), false);

/** Rows and columns of a range as hosts pass it (a scalar is 1×1), or undefined when it is not a plain rectangle. */
function shapeOf(value: Cell): [number, number] | undefined {
  if (!Array.isArray(value)) return [1, 1];
  const rows = value.length;
  if (rows === 0 || !Array.isArray(value[0])) return undefined;
  const cols = (value[0] as unknown[]).length;
  for (let i = 1; i < rows; i++) if (!Array.isArray(value[i]) || (value[i] as unknown[]).length !== cols) return undefined;
  return cols === 0 ? undefined : [rows, cols];
}

function cellAt(value: Cell, cols: number, k: number): unknown {
  return Array.isArray(value) ? (value[Math.floor(k / cols)] as unknown[])[k % cols] : value;
}

function sameCells(column: Column<unknown>, value: Cell, rows: number, cols: number): boolean {
  if (column.rows !== rows || column.cols !== cols) return false;
  if (!Array.isArray(value)) return column.cells[0] === value;
  let k = 0;
  for (let i = 0; i < rows; i++) {
    const row = value[i] as unknown[];
    for (let j = 0; j < cols; j++) if (row[j] !== column.cells[k++]) return false;
  }
  return true;
}

/** Texts, nulls and zeros only: for those the JSON text is one-to-one (null and undefined are both blank). */
function contentKey(cells: unknown[], rows: number, cols: number): string | undefined {
  for (const c of cells) if (!(typeof c === 'string' || c === null || c === undefined || c === 0)) return undefined;
  return `${rows}×${cols}${JSON.stringify(cells)}`;
}

/** The column for a range: a recent one with the same cells, one seen before, or a new one parsed now. */
function columnFor<T>(s: ColumnStore<T>, value: Cell): Column<T> | undefined {
  const shape = shapeOf(value);
  if (!shape) return undefined;
  const [rows, cols] = shape;
  for (let i = 0; i < s.recent.length; i++) {
    const c = s.recent[i];
    if (sameCells(c as Column<unknown>, value, rows, cols)) {
      if (i > 0) { s.recent.splice(i, 1); s.recent.unshift(c); }
      return c;
    }
  }
  const cells: unknown[] = [];
  for (let k = 0; k < rows * cols; k++) cells.push(cellAt(value, cols, k));
  const key = contentKey(cells, rows, cols);
  if (key === undefined) return undefined;
  let column = s.byContent.get(key);
  if (!column) {
    const blank: boolean[] = [], parsed: (T | undefined)[] = [];
    // a text repeated down the range (a unit column of "g") is parsed once: a refused one costs its failure's message
    const byText = new Map<string, T | undefined>();
    cells.forEach((c, k) => {
      const isEmpty = isBlank(c) || (s.blankZero && c === 0);
      blank.push(isEmpty);
      let p: T | undefined;
      // a text that does not parse is left to the general path, which raises its failure with its row
      if (!isEmpty && typeof c === 'string') {
        if (byText.has(c)) p = byText.get(c);
        else {
          try { p = s.parse(c, k + 1); } catch { p = undefined; }
          byText.set(c, p);
        }
      }
      parsed.push(p);
    });
    column = { id: nextColumnId++, rows, cols, cells, blank, parsed };
    // full: start again (deleting the oldest one by one leaves holes a Map's iterator must skip on every call)
    if (s.byContent.size >= COLUMN_LIMIT) s.byContent.clear();
    s.byContent.set(key, column);
  }
  s.recent.unshift(column);
  if (s.recent.length > RECENT_COLUMNS) s.recent.pop();
  return column;
}

// Two direct-mapped tables, a slot per hash, a new mixture replacing the one in its slot (no Map bookkeeping,
// nothing to evict in order). The large one holds small entries: the key, pH, ionic strength and, once asked,
// capacity and warning, so a table's repeated mixtures are found without a solve. The small one holds the full
// equilibria of the latest mixtures, for SPECIES, CONSTANTS, CAPACITY and WARNINGS beside PHMIX in their row: few
// enough that they die young, since every solved problem still held when the collector runs is copied by it (512 held
// cost a distinct PHMIX call about 4 µs more than 64 did, npm run bench, 2026-12-02; a column computed after a long
// PHMIX column re-solves either way).
const SLOTS = 8192;
const SOLVED_SLOTS = 64;

abstract class Entry implements MixtureEntry {
  capacity?: number;
  warning?: string;
  constructor(public pH: number, public ionicStrengthM: number) {}
  abstract equilibrium(): Equilibrium;
}

/** A mixture read by the general path: not cached, its equilibrium kept with it. */
class SolvedEntry extends Entry {
  constructor(private readonly eq: Equilibrium) { super(eq.pH, eq.ionicStrengthM); }
  equilibrium(): Equilibrium { return this.eq; }
}

class CachedEntry extends Entry {
  constructor(eq: Equilibrium, readonly hash: number, readonly reagents: Column<ReagentSpec>, readonly units: Column<Unit>, readonly amounts: number[],
    readonly volumeL: number, readonly temperatureC: number, readonly model: ActivityModel) {
    super(eq.pH, eq.ionicStrengthM);
  }

  equilibrium(): Equilibrium {
    const slot = this.hash & (SOLVED_SLOTS - 1);
    const kept = solvedSlots[slot];
    if (kept !== undefined && kept.entry === this) return kept.eq;
    const eq = solveRows(this.reagents, this.units, this.amounts, this.volumeL < 0 ? undefined : this.volumeL, this.temperatureC, this.model);
    solvedSlots[slot] = { entry: this, eq };
    return eq;
  }
}

let slots: (CachedEntry | undefined)[] = new Array(SLOTS).fill(undefined);
let solvedSlots: ({ entry: CachedEntry; eq: Equilibrium } | undefined)[] = new Array(SOLVED_SLOTS).fill(undefined);

/** Solves the rows of a reagent column, a unit column and amounts (−1: a blank row), all accepted by the fast reading. */
function solveRows(rc: Column<ReagentSpec>, uc: Column<Unit>, amounts: ArrayLike<number>, volumeL: number | undefined, temperatureC: number, model: ActivityModel): Equilibrium {
  const oneUnit = uc.rows === 1 && uc.cols === 1;
  const parsed: ParsedRow[] = [];
  for (let k = 0; k < rc.rows * rc.cols; k++) {
    if (amounts[k] < 0) continue;
    const u = oneUnit ? 0 : k;
    parsed.push({ row: { reagent: rc.cells[k] as string, amount: amounts[k], unit: uc.cells[u] as string, row: k + 1 }, spec: rc.parsed[k] as ReagentSpec, unit: uc.parsed[u] as Unit });
  }
  return solve(prepareProblem(contentsFromParsed(parsed, volumeL), temperatureC, model));
}

let amountScratch = new Float64Array(16);
const hashScratch = new Float64Array(1);
const hashWords = new Uint32Array(hashScratch.buffer);

function mix(h: number, x: number): number {
  hashScratch[0] = x;
  h = Math.imul(h ^ hashWords[0], 0x9e3779b1);
  h = Math.imul(h ^ hashWords[1], 0x85ebca77);
  return h ^ (h >>> 15);
}

function textHash(h: number, text: string): number {
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return h;
}

let lastModelCell: Cell = null;
let lastModel: ActivityModel = 'davies';

function modelOf(model: Cell): ActivityModel {
  if (model === lastModelCell && typeof model === 'string') return lastModel;
  const parsed = parseModel(model);
  if (typeof model === 'string') { lastModelCell = model; lastModel = parsed; }
  return parsed;
}

function clearIfCatalogueChanged(): void {
  if (generation === registryGeneration()) return;
  generation = registryGeneration();
  clearMixtureCache();
  generation = registryGeneration();
}

/** Forgets every column and solved mixture (a catalogue change does this itself). */
export function clearMixtureCache(): void {
  slots = new Array(SLOTS).fill(undefined);
  solvedSlots = new Array(SOLVED_SLOTS).fill(undefined);
  contentsCache.clear();
  for (const s of [reagentColumns, unitColumns] as ColumnStore<unknown>[]) { s.recent.length = 0; s.byContent.clear(); }
  generation = -1;
}

/**
 * The solved mixture of PHMIX's arguments, from the cache or solved now. Throws the coded failure
 * of the first argument that is wrong, exactly as the general path (mixtureRows, buildContents) does.
 */
export function mixtureEntry(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, temperature: Cell, model: Cell): MixtureEntry {
  clearIfCatalogueChanged();
  const rc = columnFor(reagentColumns, reagents);
  const uc = rc && columnFor(unitColumns, units);
  const n = rc ? rc.rows * rc.cols : 0;
  const oneUnit = uc !== undefined && uc.rows === 1 && uc.cols === 1;
  const amountShape = rc && shapeOf(amounts);
  if (!rc || !uc || !amountShape || amountShape[0] !== rc.rows || amountShape[1] !== rc.cols || !(oneUnit || (uc.rows === rc.rows && uc.cols === rc.cols))) {
    return generalPath(reagents, amounts, units, volume, temperature, model);
  }
  if (amountScratch.length < n) amountScratch = new Float64Array(2 * n);
  const scratch = amountScratch;
  let h = mix(mix(0x811c9dc5, rc.id), uc.id);
  for (let k = 0; k < n; k++) {
    const amount = cellAt(amounts, rc.cols, k);
    const reagentBlank = rc.blank[k];
    if (reagentBlank && (isBlank(amount) || amount === 0)) { scratch[k] = -1; h = mix(h, -1); continue; }
    // anything the general path would refuse is left to it, so the failure is the one it raises
    if (reagentBlank || rc.parsed[k] === undefined || typeof amount !== 'number' || !(amount >= 0 && amount < Infinity) || uc.parsed[oneUnit ? 0 : k] === undefined) {
      return generalPath(reagents, amounts, units, volume, temperature, model);
    }
    scratch[k] = amount;
    h = mix(h, amount);
  }
  const volumeL = optionalNumber(volume, 'volume', undefined, VOLUME_RULE);
  const temperatureC = optionalNumber(temperature, 'temperature', 25, TEMPERATURE_RULE);
  const activityModel = modelOf(model);
  h = textHash(mix(mix(h, volumeL ?? -1), temperatureC), activityModel);
  const slot = h & (SLOTS - 1);
  const e = slots[slot];
  const v = volumeL ?? -1;
  if (e !== undefined && e.reagents === rc && e.units === uc && e.volumeL === v && e.temperatureC === temperatureC && e.model === activityModel
    && e.amounts.length === n && sameAmounts(e.amounts, scratch, n)) return e;
  const eq = solveRows(rc, uc, scratch, volumeL, temperatureC, activityModel);
  const kept: number[] = [];
  for (let k = 0; k < n; k++) kept.push(scratch[k]);
  const entry = new CachedEntry(eq, h, rc, uc, kept, v, temperatureC, activityModel);
  slots[slot] = entry;
  solvedSlots[h & (SOLVED_SLOTS - 1)] = { entry, eq };
  return entry;
}

function sameAmounts(a: number[], b: Float64Array, n: number): boolean {
  for (let k = 0; k < n; k++) if (a[k] !== b[k]) return false;
  return true;
}

/** Whatever the fast reading leaves: read, checked and solved the general way (not cached; it raises the failures). */
function generalPath(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, temperature: Cell, model: Cell): MixtureEntry {
  const m = readMixture(reagents, amounts, units, volume, temperature, model);
  return new SolvedEntry(solve(prepareProblem(contentsOf(m.rows, m.volumeL), m.temperatureC, m.model)));
}

// Contents of a mixture for TITRANT, CURVE and RECIPE, keyed on its rows: each text is written
// with its length in front, so no text (a NUL in it included) can run into the next field.
const contentsCache = new Map<string, Contents>();

function rowsKey(rows: MixtureRow[], volumeL: number | undefined): string {
  let key = `${registryGeneration()}|${volumeL}`;
  for (const r of rows) key += `|${r.reagent.length}:${r.reagent}${r.amount}|${r.unit.length}:${r.unit}${r.row}`;
  return key;
}

export function contentsOf(rows: MixtureRow[], volumeL: number | undefined): Contents {
  const key = rowsKey(rows, volumeL);
  const hit = contentsCache.get(key);
  if (hit !== undefined) return hit;
  const value = buildContents(rows, volumeL);
  if (contentsCache.size >= ENTRY_LIMIT) contentsCache.clear();
  contentsCache.set(key, value);
  return value;
}
