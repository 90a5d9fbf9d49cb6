import { ProticError, fail } from './failure';

// One inverse mechanism for every "how much gives this target" function (TITRANT, RECIPE,
// SALTDOSE): the unknown amount is bracketed between zero and its physical limit, the root is
// found on the same forward solve the cell functions use, and the answer returned is one whose
// forward value has been computed and is within tolerance. There is no other exit with a number.

/** The question an inverse solve answers: the amount in [0, limit] at which forward(amount) = target. */
export interface InverseProblem {
  /** the forward value at an amount (pH, ionic strength), computed as the forward cell function does */
  forward: (amount: number) => number;
  /** the largest amount the physics allows: finite, above zero */
  limit: number;
  target: number;
  /** |forward − target| an answer may have, in the forward value's units */
  tolerance: number;
  /** the forward value at amount 0, when the caller has it already */
  atZero?: number;
  /** a first guess (the linear-at-target solution): taken when it verifies, else a bracket point */
  guess?: number;
  /** what the forward value is, for a failure message: `pH`, `ionic strength` */
  quantity: string;
  /** the argument a failure is about */
  argument: string;
}

export type InverseOutcome =
  | { found: true; amount: number; value: number; evaluations: number }
  /** no amount in [0, limit] reaches the target: the values seen, lowest and highest, with where they were */
  | { found: false; lowest: number; highest: number; atZero: number; atLimit: number; evaluations: number;
      /** the largest amount searched: below `limit` when the forward solve did not converge at the limit itself */
      searchedTo: number };

/** The contract of every pH an inverse solve returns: fed back, within this of the target. */
export const PH_TOLERANCE = 1e-6;

interface Point { amount: number; value: number }

// Interior samples taken only when neither end nor the guess brackets the target (a forward
// value that is not monotone, or a refusal whose reachable range must be stated).
const SCAN_POINTS = 24;
const MAX_ITERATIONS = 200;

/**
 * Solves forward(amount) = target for amount in [0, limit]. Returns the amount with its verified
 * forward value, or the reachable range when no amount reaches the target. Throws
 * `no_convergence` when a bracket collapses without reaching the tolerance (a discontinuity).
 * Example: solveInverse({ forward: (n) => pHWith(n), limit: 20, target: 7.4, tolerance: 1e-6, quantity: 'pH', argument: 'targetPH' }).
 */
export function solveInverse(p: InverseProblem): InverseOutcome {
  // aim well inside the tolerance; the tolerance itself is only the last word on a collapsed bracket
  const aim = p.tolerance * 1e-4;
  let evaluations = 0;
  const at = (amount: number): Point => { evaluations++; return { amount, value: p.forward(amount) }; };
  const miss = (q: Point): number => q.value - p.target;
  const done = (q: Point): InverseOutcome => ({ found: true, amount: q.amount, value: q.value, evaluations });

  if (!(p.limit > 0) || !Number.isFinite(p.limit)) throw new Error(`inverse limit must be finite and above zero, got ${p.limit}`);
  const points: Point[] = [];
  let g: Point | undefined;
  if (p.guess !== undefined && p.guess > 0 && p.guess <= p.limit) {
    // a guess where the forward solve does not converge is only dropped: the bracket does without it
    g = tryAt(p.guess, at);
    if (g && Math.abs(miss(g)) <= aim) return done(g);
    if (g) points.push(g);
  }
  const zero: Point = p.atZero !== undefined ? { amount: 0, value: p.atZero } : at(0);
  if (Math.abs(miss(zero)) <= aim) return done(zero);
  points.push(zero);
  // only where zero and the guess lie on one side (the bracket would go out to the limit): where they straddle the
  // target, a probe could make the bracket pass over a root between zero and the guess for one further on
  if (g && Math.sign(miss(g)) === Math.sign(miss(zero))) {
    const found = probeFromGuess(g, zero, p, at, miss, aim, points);
    if (found) return done(found);
  }
  points.sort((a, b) => a.amount - b.amount);
  // the guess and zero may bracket the target already: then the limit is never solved
  let bracket = bracketIn(points, miss);
  let limit = p.limit;
  if (!bracket) {
    const top = topPoint(p, at);
    limit = top.amount;
    if (Math.abs(miss(top)) <= aim) return done(top);
    points.push(top);
    points.sort((a, b) => a.amount - b.amount);
    bracket = bracketIn(points, miss);
  }
  if (!bracket) {
    // scan evenly in the solver's variable (asinh, log-like away from zero) for a sign change
    const scale = scaleFor(p.limit);
    const uTop = Math.asinh(limit / scale);
    for (let i = 1; i < SCAN_POINTS; i++) {
      const q = tryAt(scale * Math.sinh((uTop * i) / SCAN_POINTS), at);
      if (q) points.push(q);
    }
    points.sort((a, b) => a.amount - b.amount);
    bracket = bracketIn(points, miss);
  }
  if (!bracket) {
    const values = points.map((q) => q.value);
    // the last point is the largest amount searched (a probe may lie above a limit the top point backed off to)
    const last = points[points.length - 1];
    return { found: false, lowest: Math.min(...values), highest: Math.max(...values), atZero: zero.value, atLimit: last.value, evaluations, searchedTo: Math.max(limit, last.amount) };
  }
  const root = brent(bracket[0], bracket[1], at, miss, aim, p);
  return { ...done(root), evaluations };
}

// Secant probes from the guess before any bracket out to the limit (which first solves the mixture at the limit, the
// slowest solve of all or none).
const PROBES = 3;

/**
 * Secant steps from a guess on zero's side of the target, in the amount itself (the bracket's asinh scale suits
 * [0, limit], not a step beside the guess): from zero through the guess, then through the last two points (all on
 * that side), each doubled so as to straddle the target. Ends at a point within `aim` (returned), at a point across
 * the target (the tight bracket Brent then takes), or after PROBES; every point is added to `points`.
 */
function probeFromGuess(g: Point, zero: Point, p: InverseProblem, at: (amount: number) => Point, miss: (q: Point) => number, aim: number, points: Point[]): Point | undefined {
  let previous = zero, current = g;
  for (let attempt = 0; attempt < PROBES && current.value !== previous.value; attempt++) {
    const amount = current.amount + (2 * (p.target - current.value) * (current.amount - previous.amount)) / (current.value - previous.value);
    if (!(amount > 0 && amount < p.limit)) return undefined;
    const q = tryAt(amount, at);
    if (!q) return undefined;
    if (Math.abs(miss(q)) <= aim) return q;
    points.push(q);
    if (Math.sign(miss(q)) !== Math.sign(miss(current))) return undefined;
    previous = current;
    current = q;
  }
  return undefined;
}

// How far the limit is backed off when the forward solve refuses it (a model that does not converge at the cap).
const BACK_OFF_STEPS = 40;

/**
 * The forward value at the limit. Where the forward solve fails there (no convergence at the
 * component limit), the limit is halved until it solves; if none does, the first failure stands.
 */
function topPoint(p: InverseProblem, at: (amount: number) => Point): Point {
  let firstFailure: unknown;
  for (let attempt = 0, amount = p.limit; attempt < BACK_OFF_STEPS; attempt++, amount /= 2) {
    try {
      return at(amount);
    } catch (error) {
      if (!(error instanceof ProticError) || error.failure.code !== 'no_convergence') throw error;
      firstFailure ??= error;
    }
  }
  throw firstFailure;
}

/** A scan point, or undefined where the forward solve does not converge (the scan goes on around it). */
function tryAt(amount: number, at: (amount: number) => Point): Point | undefined {
  try {
    return at(amount);
  } catch (error) {
    if (error instanceof ProticError && error.failure.code === 'no_convergence') return undefined;
    throw error;
  }
}

/** The first adjacent pair whose misses differ in sign. */
function bracketIn(points: Point[], miss: (q: Point) => number): [Point, Point] | undefined {
  for (let i = 0; i + 1 < points.length; i++) {
    if (Math.sign(miss(points[i])) !== Math.sign(miss(points[i + 1]))) return [points[i], points[i + 1]];
  }
  return undefined;
}

/** Amounts are searched in u = asinh(amount/scale): linear near zero, logarithmic above the scale. */
function scaleFor(limit: number): number {
  return limit * 1e-16;
}

/**
 * Brent's method (inverse quadratic interpolation, secant, bisection) on the miss, in u.
 * Ends at a point whose miss is within `aim`, or on a collapsed bracket whose better end is
 * within the tolerance; anything else is a coded failure, never the last iterate.
 */
function brent(p0: Point, p1: Point, at: (amount: number) => Point, miss: (q: Point) => number, aim: number, p: InverseProblem): Point {
  const scale = scaleFor(p.limit);
  const toU = (amount: number): number => Math.asinh(amount / scale);
  const toAmount = (u: number): number => Math.min(p.limit, Math.max(0, scale * Math.sinh(u)));
  let a = toU(p0.amount), fa = miss(p0), pa = p0;
  let b = toU(p1.amount), fb = miss(p1), pb = p1;
  if (Math.abs(fa) < Math.abs(fb)) { [a, b] = [b, a]; [fa, fb] = [fb, fa]; [pa, pb] = [pb, pa]; }
  let c = a, fc = fa, pc = pa;
  let d = b - a, e = d;
  for (let iter = 0; iter < MAX_ITERATIONS; iter++) {
    if (Math.abs(fb) <= aim) return pb;
    // the bracket [b, c] as amounts: when no amount lies strictly between, the search is over
    const lo = Math.min(pb.amount, pc.amount), hi = Math.max(pb.amount, pc.amount);
    const width = Math.abs(c - b);
    if (width <= 4 * Number.EPSILON * Math.max(1, Math.abs(b)) || hi - lo <= 2 * Number.EPSILON * hi) {
      const best = Math.abs(fb) <= Math.abs(fc) ? pb : pc;
      if (Math.abs(miss(best)) <= p.tolerance) return best;
      return fail({ code: 'no_convergence', argument: p.argument, received: `a ${p.quantity} that jumps from ${pb.value} to ${pc.value} between two adjacent amounts`,
        expected: `a ${p.quantity} that changes continuously with the amount; please report this case` });
    }
    const m = 0.5 * (c - b);
    const tol = 2 * Number.EPSILON * Math.max(1, Math.abs(b));
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // interpolation: secant when two points, inverse quadratic when three distinct
      const s = fb / fa;
      let num: number, den: number;
      if (a === c) {
        num = 2 * m * s; den = 1 - s;
      } else {
        const q = fa / fc, r = fb / fc;
        num = s * (2 * m * q * (q - r) - (b - a) * (r - 1));
        den = (q - 1) * (r - 1) * (s - 1);
      }
      if (num > 0) den = -den; else num = -num;
      if (2 * num < Math.min(3 * m * den - Math.abs(tol * den), Math.abs(e * den))) { e = d; d = num / den; } else { d = m; e = m; }
    } else { d = m; e = m; }
    a = b; fa = fb; pa = pb;
    b += Math.abs(d) > tol ? d : (m > 0 ? tol : -tol);
    pb = at(toAmount(b));
    fb = miss(pb);
    if (Math.sign(fb) === Math.sign(fc)) { c = a; fc = fa; pc = pa; d = b - a; e = d; }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a; fa = fb; fb = fc; fc = fa; pa = pb; pb = pc; pc = pa;
    }
  }
  return fail({ code: 'no_convergence', argument: p.argument, received: `a ${p.quantity} search that did not settle in ${MAX_ITERATIONS} steps`,
    expected: 'a target the amount reaches; please report this case' });
}
