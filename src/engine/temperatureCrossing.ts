import type { ActivityModel } from './activity';
import { fail } from './failure';
import { PH_TOLERANCE, solveInverse } from './inverse';
import type { Contents } from './mixture';
import { prepareProblem } from './problem';
import { systemFor } from './registry';
import { solve } from './solver';
import { WATER_RANGE_C } from './water';

// The temperature at which a mixture's pH crosses a limit (PHTEMP): the pH is sampled across the
// temperature range, each sign change of pH − limit is a bracket, and the crossing is found on the
// inverse mechanism TITRANT and SALTDOSE use, so the temperature returned is one whose forward pH
// has been computed and is within PH_TOLERANCE of the limit.

/** Widest spacing, °C, of the scan that finds where the pH crosses the limit. */
export const CROSSING_SCAN_STEP_C = 1;
/** Fewest scan intervals, so a narrow range typed by the user is still sampled inside. */
const MIN_SCAN_INTERVALS = 8;
/** Where the end intervals are probed for a turn, as a fraction of the interval from the end. */
const END_PROBE = 0.01;
/** Golden-section steps that locate a turn of the pH between samples: 0.618^40 of 2 °C is far below any pH effect. */
const TURN_STEPS = 40;

/** The temperatures, °C, every system of the mixture and water hold data for (intersection). */
export function temperatureRangeOf(contents: Contents): [number, number] {
  let [lo, hi] = WATER_RANGE_C;
  for (const id of contents.systemMoles.keys()) {
    const [a, b] = systemFor(id).temperatureRangeC;
    lo = Math.max(lo, a);
    hi = Math.min(hi, b);
  }
  return [lo, hi];
}

export interface PHCrossing {
  /** the temperature, °C, at which the forward pH is within PH_TOLERANCE of the limit */
  temperatureC: number;
  /** that forward pH: the verification */
  pH: number;
  /** the range searched, °C */
  fromC: number;
  toC: number;
  /** forward solves made */
  evaluations: number;
}

interface Sample { t: number; pH: number }

/**
 * Temperature, °C, in [fromC, toC] (default: the range the mixture's data hold for) at which the
 * mixture's pH equals `limitPH`, verified by a forward solve within PH_TOLERANCE. No crossing is
 * `unreachable_target` with the pH range over the temperatures; more than one is `several_crossings`
 * naming each. The scan steps at most CROSSING_SCAN_STEP_C and locates every turn of the pH it sees (three samples
 * out of order, or a probe 1 % of a step inside an end); it assumes at most one turn between neighbouring samples.
 * Example: temperatureForPH(8.3, buildContents(rows, 1), 'davies').temperatureC → about 19.6 for 50 mM Tris + 50 mM Tris-HCl.
 */
export function temperatureForPH(limitPH: number, contents: Contents, model: ActivityModel, fromC?: number, toC?: number): PHCrossing {
  const [lo, hi] = temperatureRangeOf(contents);
  const from = fromC ?? lo, to = toC ?? hi;
  const within = `${lo} to ${hi} °C, the range the mixture's data hold for`;
  if (!(from >= lo && from <= hi)) fail({ code: 'out_of_range', argument: 'fromC', received: `${from} °C`, expected: within });
  if (!(to >= lo && to <= hi)) fail({ code: 'out_of_range', argument: 'toC', received: `${to} °C`, expected: within });
  if (!(to > from)) fail({ code: 'bad_argument', argument: 'toC', received: `${to} °C`, expected: `a temperature above fromC (${from} °C)` });

  let evaluations = 0;
  const pHAt = (t: number): number => { evaluations++; return solve(prepareProblem(contents, t, model)).pH; };
  const aim = PH_TOLERANCE * 1e-4;
  const intervals = Math.max(MIN_SCAN_INTERVALS, Math.ceil((to - from) / CROSSING_SCAN_STEP_C));
  const samples: Sample[] = [];
  for (let i = 0; i <= intervals; i++) {
    const t = i === intervals ? to : from + ((to - from) * i) / intervals;
    samples.push({ t, pH: pHAt(t) });
  }
  // a turn seen in the samples is located, so a limit the pH reaches only between two samples is bracketed
  const turns: Sample[] = [];
  const turnIn = (a: Sample, b: Sample, c: Sample): void => {
    if ((b.pH - a.pH) * (c.pH - b.pH) < 0) turns.push(turnBetween(a.t, c.t, b.pH > a.pH, pHAt));
  };
  for (let i = 1; i < intervals; i++) turnIn(samples[i - 1], samples[i], samples[i + 1]);
  // a turn inside the first or last interval shows as a probe just inside the end going the other way
  const probe = (t: number): Sample => { const q = { t, pH: pHAt(t) }; turns.push(q); return q; };
  const [s0, s1, sm, sn] = [samples[0], samples[1], samples[intervals - 1], samples[intervals]];
  turnIn(s0, probe(s0.t + END_PROBE * (s1.t - s0.t)), s1);
  turnIn(sm, probe(sn.t - END_PROBE * (sn.t - sm.t)), sn);
  const all = [...samples, ...turns].sort((x, y) => x.t - y.t);
  const miss = (s: Sample): number => s.pH - limitPH;

  const crossings: (Sample | [Sample, Sample])[] = [];
  all.forEach((s, i) => {
    if (Math.abs(miss(s)) <= aim) crossings.push(s);
    else if (i + 1 < all.length && Math.abs(miss(all[i + 1])) > aim && Math.sign(miss(s)) !== Math.sign(miss(all[i + 1]))) crossings.push([s, all[i + 1]]);
  });
  const pHs = all.map((s) => s.pH);
  const low = Math.min(...pHs), high = Math.max(...pHs);
  if (crossings.length === 0) {
    const n = (x: number): string => String(Number(x.toFixed(4)));
    return fail({
      code: 'unreachable_target', argument: 'limitPH', received: `pH ${limitPH}`,
      reason: `from ${from} to ${to} °C the pH stays between ${n(low)} and ${n(high)}`,
      reachable: { quantity: 'pH', low, high },
      expected: 'a limit inside that pH range, or a wider temperature range',
    });
  }
  const located = crossings.map((c) => (Array.isArray(c) ? crossingIn(c[0], c[1], limitPH, pHAt) : c));
  if (located.length > 1) {
    return fail({
      code: 'several_crossings', argument: 'limitPH', received: `pH ${limitPH}`, quantity: 'pH', crossings: located.map((s) => s.t), crossingUnit: ' °C',
      expected: 'a fromC and toC that enclose one crossing',
    });
  }
  return { temperatureC: located[0].t, pH: located[0].pH, fromC: from, toC: to, evaluations };
}

/** The crossing between two samples on either side of the limit, on the inverse mechanism (in degrees above `a`). */
function crossingIn(a: Sample, b: Sample, limitPH: number, pHAt: (t: number) => number): Sample {
  const width = b.t - a.t;
  const guess = (width * (limitPH - a.pH)) / (b.pH - a.pH);
  const outcome = solveInverse({
    forward: (x) => pHAt(a.t + x), limit: width, target: limitPH, tolerance: PH_TOLERANCE, atZero: a.pH, guess,
    quantity: 'pH', argument: 'limitPH',
  });
  if (!outcome.found) {
    // the ends bracket the limit, so a search that does not find it met a pH that is not continuous
    return fail({ code: 'no_convergence', argument: 'limitPH', received: `a pH from ${a.pH} at ${a.t} °C to ${b.pH} at ${b.t} °C with no crossing found between`,
      expected: 'a pH that changes continuously with temperature; please report this case' });
  }
  return { t: a.t + outcome.amount, pH: outcome.value };
}

/** The turn (highest pH when `isMax`, else lowest) of a pH that turns once between `lo` and `hi`, by golden section. */
function turnBetween(lo: number, hi: number, isMax: boolean, pHAt: (t: number) => number): Sample {
  const r = (Math.sqrt(5) - 1) / 2;
  const better = (x: number, y: number): boolean => (isMax ? x > y : x < y);
  let a = lo, b = hi;
  let c = b - r * (b - a), d = a + r * (b - a);
  let fc = pHAt(c), fd = pHAt(d);
  for (let i = 0; i < TURN_STEPS; i++) {
    if (better(fc, fd)) { b = d; d = c; fd = fc; c = b - r * (b - a); fc = pHAt(c); } else { a = c; c = d; fc = fd; d = a + r * (b - a); fd = pHAt(d); }
  }
  return better(fc, fd) ? { t: c, pH: fc } : { t: d, pH: fd };
}
