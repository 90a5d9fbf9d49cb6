// The cell layer's cost against the solve it needs (npm run bench, one run). A what-if table:
// KH2PO4 3.4 g, Na2HPO4 3.55 g and NaCl varying row by row, in 1 L. Two layouts:
//   shared  — reagent and unit ranges shared by every row ($E$1:$G$1, $E$2:$G$2), amounts per row;
//   per-row — every argument a range of its own row (reagents, amounts and units all per row).
// From Node: µs per PHMIX call with distinct inputs and with a repeated one (a cache hit), against
// prepare+solve of the same mixtures; allocation per call; the five mixture functions of one row.
// In the headless runner: each layout's table against a built-in formula with the same references.
// Times are CPU time of the process (see cpuMs), so that other work on a shared machine does not enter them.
import { execFileSync } from 'child_process';
import { PerformanceObserver } from 'perf_hooks';
import { buildContents, prepareProblem, sitDeparture, solve } from '../../src/engine';
import type { Contents, MixtureRow } from '../../src/engine';
import * as impl from '../../src/functions/impl';
import { equilibriumOf, mixtureEntry } from '../../src/functions/mixtureCache';
import { evaluateSheet } from '../lib/sheetEngine';

type Layout = 'shared' | 'per-row';
type Args = [unknown, unknown, unknown, number];

const NAMES = ['KH2PO4', 'Na2HPO4', 'NaCl'];
const UNITS = ['g', 'g', 'mM'];
const SHARED_REAGENTS = [NAMES];
const SHARED_UNITS = [UNITS];

/** A fresh copy of a text, as a host hands each call its own strings (not the interned literal). */
function fresh(text: string): string {
  return text.split('').join('');
}

function saltMM(index: number): number {
  return 0.001 * (index + 1);
}

/** The arguments of row `index` as a host hands them: shared ranges are one array; per-row ranges are each row's own. */
function argsFor(layout: Layout, index: number): Args {
  const amounts = [[3.4, 3.55, saltMM(index)]];
  if (layout === 'shared') return [SHARED_REAGENTS, amounts, SHARED_UNITS, 1];
  return [[NAMES.map(fresh)], amounts, [UNITS.map(fresh)], 1];
}

function rowsFor(index: number): MixtureRow[] {
  return NAMES.map((reagent, i) => ({ reagent, amount: [3.4, 3.55, saltMM(index)][i], unit: UNITS[i], row: i + 1 }));
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/**
 * CPU time of this process, ms (user + system, collector threads included): on a loaded machine wall time counts
 * the time other work holds the cores, CPU time only what this work costs.
 */
function cpuMs(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

// 31 rounds: the five-together row's ratio moved by ± 0.15 between runs of 15 on this 2-core machine
const ROUNDS = 31;
const PER_BATCH = 2000;
let sink = 0;
let nextIndex = 1_000_000;

/** µs per item of one batch over inputs never seen before (or over one repeated input). */
function batchUs<T>(prepare: (index: number) => T, run: (input: T) => void, repeated = false): number {
  const base = nextIndex;
  nextIndex += PER_BATCH + 1;
  const inputs = Array.from({ length: PER_BATCH }, (_, i) => prepare(repeated ? base : base + i));
  if (repeated) run(inputs[0]);
  // start from an empty young generation (a minor collection only), so the garbage of building the inputs is not
  // collected on this batch's time, while what the cache retains still costs where it falls
  (globalThis as unknown as { gc?: (o: { type: string }) => void }).gc?.({ type: 'minor' });
  const t0 = cpuMs();
  for (const input of inputs) run(input);
  return ((cpuMs() - t0) * 1000) / PER_BATCH;
}

export interface NodeFigures {
  prepareSolveUs: number;
  distinctUs: Record<Layout, number>;
  hitUs: Record<Layout, number>;
  distinctOverPrepareSolve: Record<Layout, number>;
  fiveTogether: {
    phAloneUs: number; fourScalarUs: number; fiveUs: number; fourOverPh: number; fiveAsideSpillOverPh: number;
    /** SPECIES's spill building on its own row's mixture (five − the four with SPECIES's lookup of its solved mixture), and on a repeated input */
    speciesSpillBuildingUs: number; speciesSpillBuildingRepeatedUs: number; fiveAsideRepeatedSpillOverPh: number;
    /** the sit solve WARNINGS runs for its departure check (a second model, not a second solve of PHMIX's), over PHMIX alone */
    departureOverPh: number; fiveAsideSpillAndDepartureOverPh: number;
  };
}

/**
 * Every figure is measured once per round, the rounds interleaved, so that load from elsewhere on the
 * machine falls on all of them alike; each figure is the median over rounds, each ratio the median of
 * the rounds' own ratios.
 */
function nodeFigures(): NodeFigures {
  // arguments passed as a host passes them, one by one (a spread call in a long expression costs the harness itself)
  const ph = (a: Args): void => { sink += impl.ph(a[0], a[1], a[2], a[3]); };
  const four = (a: Args): void => {
    const pH = impl.ph(a[0], a[1], a[2], a[3]);
    const ionic = impl.ionicStrength(a[0], a[1], a[2], a[3]);
    const beta = impl.capacity(a[0], a[1], a[2], a[3]);
    const warning = impl.warnings(a[0], a[1], a[2], a[3]);
    sink += pH + ionic + beta + warning.length;
  };
  const species = (a: Args): void => { sink += impl.species(a[0], a[1], a[2], a[3]).length; };
  const five = (a: Args): void => { four(a); species(a); };
  // the four, then what SPECIES needs before it builds its spill: its solved mixture, found from its arguments
  const fourAndLookup = (a: Args): void => { four(a); sink += equilibriumOf(mixtureEntry(a[0], a[1], a[2], a[3], null, null)).pH; };
  // PHMIX, then the sit solve of its mixture that WARNINGS's departure check runs, on the solved entry PHMIX left
  const departure = (a: Args): void => { ph(a); sink += sitDeparture(equilibriumOf(mixtureEntry(a[0], a[1], a[2], a[3], null, null)))?.pH ?? 0; };
  const shared = (i: number): Args => argsFor('shared', i), perRow = (i: number): Args => argsFor('per-row', i);
  // warm up every path once
  for (let i = 0; i < 2000; i++) { five(shared(i)); ph(perRow(i)); solve(prepareProblem(buildContents(rowsFor(i), 1), 25, 'davies')); }
  const series: Record<string, number[]> = {};
  const put = (name: string, value: number): number => { (series[name] ??= []).push(value); return value; };
  const tasks: [string, () => number][] = [
    ['prepareSolve', () => batchUs<Contents>((i) => buildContents(rowsFor(i), 1), (c) => { sink += solve(prepareProblem(c, 25, 'davies')).pH; })],
    ['distinctShared', () => batchUs(shared, ph)],
    ['distinctPerRow', () => batchUs(perRow, ph)],
    ['hitShared', () => batchUs(shared, ph, true)],
    ['hitPerRow', () => batchUs(perRow, ph, true)],
    ['phAlone', () => batchUs(shared, ph)],
    ['four', () => batchUs(shared, four)],
    ['five', () => batchUs(shared, five)],
    ['fourAndLookup', () => batchUs(shared, fourAndLookup)],
    ['departure', () => batchUs(shared, departure)],
    // SPECIES on one mixture, repeated: its cost beyond a cache hit is the spill it builds, with every datum already in cache
    ['spillRepeated', () => Math.max(0, batchUs(shared, species, true) - batchUs(shared, ph, true))],
  ];
  for (let round = 0; round < ROUNDS; round++) {
    // the order turns each round, so the collection one batch leaves behind does not always fall on the same next one
    const got: Record<string, number> = {};
    for (let t = 0; t < tasks.length; t++) {
      const [name, task] = tasks[(t + round) % tasks.length];
      got[name] = put(name, task());
    }
    put('distinctShared/ps', got.distinctShared / got.prepareSolve);
    put('distinctPerRow/ps', got.distinctPerRow / got.prepareSolve);
    put('four/ph', got.four / got.phAlone);
    // SPECIES's spill building on each row's own new mixture: the table, its texts and the collections they cause
    put('spill', Math.max(0, got.five - got.fourAndLookup));
    put('fiveAside/ph', got.fourAndLookup / got.phAlone);
    // as the bench reckoned it up to 2026-12-03: the spill's cost taken from a repeated input
    put('fiveAsideRepeated/ph', (got.five - got.spillRepeated) / got.phAlone);
    put('departure/ph', (got.departure - got.phAlone) / got.phAlone);
    put('fiveAsideDeparture/ph', (got.fourAndLookup - (got.departure - got.phAlone)) / got.phAlone);
  }
  if (!Number.isFinite(sink)) throw new Error('benchmark sink not finite');
  const m = (name: string): number => median(series[name]);
  return {
    prepareSolveUs: m('prepareSolve'),
    distinctUs: { shared: m('distinctShared'), 'per-row': m('distinctPerRow') },
    hitUs: { shared: m('hitShared'), 'per-row': m('hitPerRow') },
    distinctOverPrepareSolve: { shared: m('distinctShared/ps'), 'per-row': m('distinctPerRow/ps') },
    fiveTogether: { phAloneUs: m('phAlone'), fourScalarUs: m('four'), fiveUs: m('five'), speciesSpillBuildingUs: m('spill'), speciesSpillBuildingRepeatedUs: m('spillRepeated'),
      fourOverPh: m('four/ph'), fiveAsideSpillOverPh: m('fiveAside/ph'), fiveAsideRepeatedSpillOverPh: m('fiveAsideRepeated/ph'),
      departureOverPh: m('departure/ph'), fiveAsideSpillAndDepartureOverPh: m('fiveAsideDeparture/ph') },
  };
}

/** Bytes allocated per call (run in a child with a young generation large enough that no collection interrupts). */
function allocationChild(): Record<string, number | boolean> {
  const gc = (globalThis as unknown as { gc: () => void }).gc;
  let collections = 0;
  const observer = new PerformanceObserver((list) => { collections += list.getEntries().length; });
  observer.observe({ entryTypes: ['gc'] });
  const n = 2000;
  let base = 0;
  // the least of three measurements, each over inputs not seen before, so compilation on a first call does not count
  const measure = (layout: Layout, repeated: boolean): number => {
    let least = Infinity;
    for (let attempt = 0; attempt < 3; attempt++) {
      const start = (base += n + 1);
      const inputs = Array.from({ length: n }, (_, i) => argsFor(layout, repeated ? start : start + i));
      gc();
      const before = process.memoryUsage().heapUsed;
      for (const a of inputs) sink += impl.ph(a[0], a[1], a[2], a[3]);
      least = Math.min(least, (process.memoryUsage().heapUsed - before) / n);
    }
    return least;
  };
  for (let i = 0; i < 500; i++) { impl.ph(...argsFor('shared', 900_000 + i)); impl.ph(...argsFor('per-row', 900_000 + i)); }
  const out: Record<string, number | boolean> = {
    sharedDistinctBytes: measure('shared', false),
    perRowDistinctBytes: measure('per-row', false),
    sharedHitBytes: measure('shared', true),
    perRowHitBytes: measure('per-row', true),
  };
  observer.disconnect();
  out.collectionsDuringMeasurement = collections;
  return out;
}

const TABLE_ROWS = Number(process.env.PROTIC_BENCH_CELL_ROWS ?? 20000);

/** The runner's table in one layout, either PHMIX or the built-in with exactly the same references. */
function table(layout: Layout, kind: 'ph' | 'ln', rows: number): (string | number | null)[][] {
  const cells: (string | number | null)[][] = [];
  if (layout === 'shared') {
    cells.push([null, null, null, null, ...NAMES]);
    cells.push([null, null, null, null, ...UNITS]);
    for (let i = 0; i < rows; i++) {
      const r = i + 3;
      cells.push([3.4, 3.55, saltMM(i), kind === 'ph' ? `=PROTIC.PHMIX($E$1:$G$1,A${r}:C${r},$E$2:$G$2,1)` : `=LN(1+SUM(A${r}:C${r})+COUNTA($E$1:$G$1)+COUNTA($E$2:$G$2))`]);
    }
  } else {
    for (let i = 0; i < rows; i++) {
      const r = i + 1;
      cells.push([...NAMES, 3.4, 3.55, saltMM(i), ...UNITS,
        kind === 'ph' ? `=PROTIC.PHMIX(A${r}:C${r},D${r}:F${r},G${r}:I${r},1)` : `=LN(1+SUM(D${r}:F${r})+COUNTA(A${r}:C${r})+COUNTA(G${r}:I${r}))`]);
    }
  }
  return cells;
}

function tableChild(layout: Layout, kind: 'ph' | 'ln'): { seconds: number; errors: number } {
  const cells = table(layout, kind, TABLE_ROWS);
  const col = layout === 'shared' ? 3 : 9;
  const t0 = cpuMs();
  const values = evaluateSheet(cells);
  const seconds = (cpuMs() - t0) / 1000;
  let errors = 0;
  for (let i = layout === 'shared' ? 2 : 0; i < values.length; i++) if (typeof values[i][col] !== 'number') errors++;
  return { seconds, errors };
}

function child(args: string[], flags: string[] = []): unknown {
  const json = execFileSync(process.execPath, [...flags, '-r', 'ts-node/register/transpile-only', __filename, ...args], { encoding: 'utf8', maxBuffer: 1 << 20 });
  return JSON.parse(json.trim().split('\n').pop() as string);
}

export interface RunnerFigure { phSeconds: number; lnSeconds: number; phOverLn: number; phUsPerRow: number; lnUsPerRow: number; errors: number }

/** The cell-layer section of `npm run bench`: lines to print and the figures for bench/results.json. */
export function cellsBench(): { lines: string[]; results: Record<string, unknown> } {
  const node = child(['--cells-node'], ['--expose-gc']) as NodeFigures;
  const allocation = child(['--cells-allocation'], ['--expose-gc', '--max-semi-space-size=256']) as Record<string, number>;
  const runner = {} as Record<Layout, RunnerFigure>;
  for (const layout of ['shared', 'per-row'] as Layout[]) {
    const ln = child(['--cells-table', layout, 'ln']) as { seconds: number };
    const ph = child(['--cells-table', layout, 'ph']) as { seconds: number; errors: number };
    runner[layout] = { phSeconds: ph.seconds, lnSeconds: ln.seconds, phOverLn: ph.seconds / ln.seconds, phUsPerRow: (ph.seconds * 1e6) / TABLE_ROWS, lnUsPerRow: (ln.seconds * 1e6) / TABLE_ROWS, errors: ph.errors };
  }
  const targets = {
    distinctWithin2xPrepareSolve: node.distinctOverPrepareSolve.shared <= 2 && node.distinctOverPrepareSolve['per-row'] <= 2,
    cacheHitAtMost1_5us: node.hitUs.shared <= 1.5 && node.hitUs['per-row'] <= 1.5,
    sharedRunnerTableWithin1_5xBuiltIn: runner.shared.phOverLn <= 1.5,
    fiveFunctionsWithin2xPhmix: node.fiveTogether.fiveAsideSpillOverPh <= 2,
  };
  const f = (x: number, d = 2): string => x.toFixed(d);
  const lines = [
    `cell layer: PHMIX from Node (KH2PO4 + Na2HPO4 + NaCl varying, 1 L, davies, 25 °C), CPU time, median of ${ROUNDS} interleaved rounds of 2000 calls (ratios: median of each round’s own)`,
    `  prepare+solve of the same mixtures (engine alone)        ${f(node.prepareSolveUs)} µs`,
    ...(['shared', 'per-row'] as Layout[]).map((l) => `  PHMIX, ${l.padEnd(7)} layout: distinct ${f(node.distinctUs[l])} µs (${f(node.distinctOverPrepareSolve[l])}× prepare+solve, target ≤ 2), repeated input ${f(node.hitUs[l])} µs (target ≤ 1.5)`),
    `  allocation per call: distinct ${f(allocation.sharedDistinctBytes, 0)} B shared, ${f(allocation.perRowDistinctBytes, 0)} B per-row; repeated ${f(allocation.sharedHitBytes, 0)} B shared, ${f(allocation.perRowHitBytes, 0)} B per-row (collections during measurement: ${allocation.collectionsDuringMeasurement})`,
    `  one row of PHMIX, IONICSTRENGTH, CAPACITY, WARNINGS: ${f(node.fiveTogether.fourScalarUs)} µs (${f(node.fiveTogether.fourOverPh)}× PHMIX alone); with SPECIES ${f(node.fiveTogether.fiveUs)} µs, of which SPECIES's spill building ${f(node.fiveTogether.speciesSpillBuildingUs)} µs on the row's own mixture (${f(node.fiveTogether.speciesSpillBuildingRepeatedUs)} µs on a repeated input, where every datum is in cache)`,
    `  the five together, spill building aside, over PHMIX alone (${f(node.fiveTogether.phAloneUs)} µs): ${f(node.fiveTogether.fiveAsideSpillOverPh)} (target ≤ 2); ${f(node.fiveTogether.fiveAsideRepeatedSpillOverPh)} with the spill's cost taken from a repeated input, as reckoned before 2026-12-03`,
    `    of which WARNINGS's departure check, a solve of the mixture under sit: ${f(node.fiveTogether.departureOverPh)}× PHMIX; the five with it also aside: ${f(node.fiveTogether.fiveAsideSpillAndDepartureOverPh)}`,
    `cell layer: ${TABLE_ROWS}-row table in the headless runner against a built-in formula with the same references`,
    ...(['shared', 'per-row'] as Layout[]).map((l) => `  ${l.padEnd(7)} layout: PHMIX ${f(runner[l].phSeconds)} s (${f(runner[l].phUsPerRow, 1)} µs/row), built-in ${f(runner[l].lnSeconds)} s (${f(runner[l].lnUsPerRow, 1)} µs/row), ratio ${f(runner[l].phOverLn)}${l === 'shared' ? ' (target ≤ 1.5)' : ''}, non-numeric cells ${runner[l].errors}`),
    `  cell-layer targets met: ${Object.entries(targets).map(([k, v]) => `${k} ${v ? 'yes' : 'NO'}`).join(', ')}`,
  ];
  return { lines, results: { node, allocation, runner, tableRows: TABLE_ROWS, targets } };
}

if (require.main === module) {
  if (process.argv[2] === '--cells-allocation') process.stdout.write(JSON.stringify(allocationChild()) + '\n');
  else if (process.argv[2] === '--cells-node') process.stdout.write(JSON.stringify(nodeFigures()) + '\n');
  else if (process.argv[2] === '--cells-table') process.stdout.write(JSON.stringify(tableChild(process.argv[3] as Layout, process.argv[4] as 'ph' | 'ln')) + '\n');
  else process.stdout.write(cellsBench().lines.join('\n') + '\n');
}
