import { ionicStrengthFactorSlope, lnGammaPerZ2 } from './activity';
import { chargeBalance, chargeBalanceJacobian } from './chargeBalance';
import type { BalanceOut, JacobianOut } from './chargeBalance';
import { fail } from './failure';
import { fixedPointStart, fixedPointStep } from './fixedPoint';
import type { Problem } from './problem';
import { setActivity } from './problem';
import { SIT_TOLERANCE, sitApply, sitRefresh } from './sit';

export interface Equilibrium {
  problem: Problem;
  /** ln [H⁺], [H⁺] in mol/L */
  lnH: number;
  pH: number;
  ionicStrengthM: number;
  /** |charge balance| / Σ |z| c at the solution */
  residualRelative: number;
  /** charge-balance evaluations this solve took */
  evaluations: number;
  /**
   * d(ln h + L)/dCb per mol/L of strong-base charge at the solution, from the joint Newton's Jacobian at the point it
   * returned (that point's own evaluation); NaN where the bracketed method solved it, and under sit (whose offsets move
   * with the base added, which this Jacobian holds fixed). bufferCapacity reads it.
   */
  lnActivityPerBase: number;
}

// ln [H⁺] bracket: pH about −4 to 23, wider than any aqueous solution the catalogue can make.
const LN_H_MIN = -23 * Math.LN10;
const LN_H_MAX = 4 * Math.LN10;
const MAX_STEP_LN = 3 * Math.LN10;
const Y_TOLERANCE = 1e-13;
const LN_GAMMA_TOLERANCE = 1e-14;
/** |charge balance| / Σ |z| c at which solve accepts the joint Newton's root (else the bracketed method). */
const RESIDUAL_TOLERANCE = 1e-12;

const scratch: BalanceOut = { derivative: 0, ionicStrengthM: 0, chargeScaleM: 0 };

/**
 * Root of the charge balance at fixed activity coefficients: Newton in ln h, safeguarded by a
 * bracket that the function's monotonicity keeps valid (bisection when Newton leaves it).
 */
export function solveFixedActivity(problem: Problem, yStart: number, out: BalanceOut): number {
  let lo = LN_H_MIN, hi = LN_H_MAX;
  // the bracket holds a root only once each end has been evaluated with the sign it stands for
  let loSeen = false, hiSeen = false;
  let y = Math.min(Math.max(yStart, lo), hi);
  for (let iter = 0; iter < 200; iter++) {
    const f = chargeBalance(problem, y, out);
    if (f === 0) return y;
    const step = -f / out.derivative;
    // converged: `out` already holds this point's derivative and ionic strength
    if (Math.abs(step) < Y_TOLERANCE * Math.max(1, Math.abs(y))) return y;
    if (f > 0) { hi = y; hiSeen = true; } else { lo = y; loSeen = true; }
    let next = Math.abs(step) <= MAX_STEP_LN ? y + step : y + Math.sign(step) * MAX_STEP_LN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (hi - lo < Y_TOLERANCE) {
      if (loSeen && hiSeen) return next;
      // collapsed on an edge of the pH range: the root lies outside it
      break;
    }
    y = next;
  }
  return fail({ code: 'no_convergence', argument: 'reagents', received: 'a mixture whose charge balance has no root between pH −4 and 23 or did not converge', expected: 'a mixture within the catalogue ranges; please report this case' });
}

/** Where the proton condition's charge runs out, as startingLnH and startingIonicStrength read it (module scratch). */
const handout = { remaining: 0, anySystem: false, stop: -1, fraction: 0, previous: -1, systemsZ2M: 0 };
type Handout = typeof handout;

/**
 * The proton condition: the charge the systems must carry (strong ions and their most protonated charges) is handed
 * out to the steps in order of pKa, strongest acid first. Records the step where it runs out (`stop`, an index into
 * stepOrder; order.length past the last), the fraction of that step handed out, the last step before it, what
 * remains (minus a strong acid excess, or a strong base excess past the last step), and Σ C z² of the systems' forms
 * so handed out (mol/L). Independent of the activity correction, which moves the constants, not their order.
 */
function handOut(problem: Problem): Handout {
  let remaining = problem.strongChargeM, z2 = 0;
  let anySystem = false;
  const systems = problem.systems, totals = problem.totalsM, order = problem.stepOrder;
  for (let i = 0; i < systems.length; i++) {
    remaining += totals[i] * systems[i].z0;
    z2 += totals[i] * systems[i].z0 * systems[i].z0;
    if (totals[i] > 0) anySystem = true;
  }
  handout.anySystem = anySystem;
  handout.stop = -1;
  handout.fraction = 0;
  handout.previous = -1;
  if (anySystem && remaining > 0) {
    let k = 0;
    for (; k < order.length; k++) {
      const c = totals[order[k] >> 3];
      if (c <= 0) continue;
      // the step takes the system's form from charge z to z − 1
      const z = systems[order[k] >> 3].z0 - (order[k] & 7), stepZ2 = c * ((z - 1) * (z - 1) - z * z);
      if (remaining < c) {
        handout.fraction = remaining / c;
        z2 += handout.fraction * stepZ2;
        break;
      }
      remaining -= c;
      z2 += stepZ2;
      handout.previous = order[k];
    }
    handout.stop = k;
  }
  handout.remaining = remaining;
  handout.systemsZ2M = Math.max(0, z2);
  return handout;
}

/**
 * A first ionic strength, mol/L: the strong ions, the systems' forms as the proton condition hands out their charge
 * (see startingLnH), and a strong acid or base excess as free H⁺ or OH⁻.
 * @example startingIonicStrength(prepareProblem(contents, 25, 'sit')) // 3.6 for 1.2 M ammonium sulfate (NH₄⁺, SO₄²⁻)
 */
export function startingIonicStrength(problem: Problem, p: Handout = handOut(problem)): number {
  const free = p.stop >= 0 && p.stop < problem.stepOrder.length ? 0 : Math.abs(p.remaining);
  return (problem.strongZ2M + p.systemsZ2M + free) / 2;
}

/**
 * A starting ln h from the proton condition (handOut): the step where the charge runs out sets
 * pH ≈ pKa + log10(lost/kept) (Henderson–Hasselbalch), or the mean of two pKa between steps; a strong acid or base
 * excess sets h or OH directly.
 */
export function startingLnH(problem: Problem, lnGammaZ2 = 0, p: Handout = handOut(problem)): number {
  const order = problem.stepOrder, remaining = p.remaining;
  // conditional constant of a step: ln Ka + ln ρw + 2 L z(after), and under sit the offsets in use, as setActivity has
  // them (a re-solve's offsets are its last root's: leaving them out starts it that far from the root)
  const sit = problem.sit;
  // Kw at that L too, as setActivity has it (problem.lnKwc holds the last evaluation's: a first solve's is at L = 0)
  const lnKwc = problem.lnKw + 2 * problem.lnWaterDensity - 2 * lnGammaZ2 + (sit ? sit.lnWaterActivity - sit.offset[0] - sit.offset[1] : 0);
  const lnKaOf = (code: number): number => {
    const i = code >> 3, s = problem.systems[i], k = (code & 7) + 1;
    const lnKa = s.lnKa[k - 1] + problem.lnWaterDensity + 2 * lnGammaZ2 * (s.z0 - k);
    return sit ? lnKa + sit.offset[sit.formStart[i] + k - 1] - sit.offset[0] - sit.offset[sit.formStart[i] + k] : lnKa;
  };
  // stop −1: nothing handed out (no system, or a strong acid excess from the start)
  if (p.stop < 0) {
    if (remaining < -1e-7) return Math.log(-remaining);
    if (!p.anySystem) return remaining > 1e-7 ? lnKwc - Math.log(remaining) : lnKwc / 2;
    return Math.max(lnKwc / 2, lnKaOf(order[0]));
  }
  const previous = p.previous >= 0 ? lnKaOf(p.previous) : NaN;
  if (p.stop < order.length) {
    const k = p.stop, lnKa = lnKaOf(order[k]), fraction = p.fraction;
    if (fraction < 0.02 && !Number.isNaN(previous)) return (previous + lnKa) / 2;
    if (fraction > 0.98) {
      for (let m = k + 1; m < order.length; m++) if (problem.totalsM[order[m] >> 3] > 0) return (lnKa + lnKaOf(order[m])) / 2;
    }
    const f = Math.min(Math.max(fraction, 1e-3), 1 - 1e-3);
    return lnKa - Math.log(f / (1 - f));
  }
  // past the last step: the rest is strong base
  return remaining > 1e-7 ? lnKwc - Math.log(remaining) : (previous + lnKwc / 2) / 2;
}

export function lnGammaZ2For(problem: Problem, ionicStrengthM: number): number {
  return lnGammaPerZ2(problem.model, ionicStrengthM / Math.exp(problem.lnWaterDensity), problem.debyeHuckelA);
}

/** pH on the molal activity scale, −log10(γ m) with m = c/ρw, from ln [H⁺] (mol/L). */
export function pHFromLnH(problem: Problem, lnH: number): number {
  return -(lnH + problem.lnGammaZ2 + (problem.sit ? problem.sit.offset[0] : 0) - problem.lnWaterDensity) / Math.LN10;
}

export function lnHFromPH(problem: Problem, pH: number): number {
  return -pH * Math.LN10 - problem.lnGammaZ2 - (problem.sit ? problem.sit.offset[0] : 0) + problem.lnWaterDensity;
}

const jac: JacobianOut = { f: 0, dfdy: 0, dfdL: 0, ionicStrengthM: 0, dIdy: 0, dIdL: 0, chargeScaleM: 0 };

/** The joint system at (y, L): the charge balance f, the activity consistency F2 = L − g(I), and their Jacobian. */
export interface JointJacobian { f: number; F2: number; j11: number; j12: number; j21: number; j22: number; scale: number; ionicStrengthM: number }

/** Evaluates the joint system (the solver's Newton matrix; also the implicit derivatives behind β). */
export function jointJacobian(problem: Problem, y: number, L: number, out: JointJacobian): void {
  setActivity(problem, L);
  chargeBalanceJacobian(problem, y, jac);
  const rho = Math.exp(problem.lnWaterDensity);
  const ionicMolal = jac.ionicStrengthM / rho;
  // dg/dI (per mol/L); near I = 0 the Davies slope is unbounded, so hold L there for one step
  const dg = ionicMolal > 1e-12 ? (-problem.debyeHuckelA * Math.LN10 * ionicStrengthFactorSlope(problem.model, ionicMolal)) / rho : 0;
  out.f = jac.f;
  out.F2 = L - lnGammaZ2For(problem, jac.ionicStrengthM);
  out.j11 = jac.dfdy;
  out.j12 = jac.dfdL;
  out.j21 = -dg * jac.dIdy;
  out.j22 = 1 - dg * jac.dIdL;
  out.scale = jac.chargeScaleM;
  out.ionicStrengthM = jac.ionicStrengthM;
}

const joint: JointJacobian = { f: 0, F2: 0, j11: 0, j12: 0, j21: 0, j22: 0, scale: 0, ionicStrengthM: 0 };

/**
 * Joint Newton in (ln h, L) on the charge balance f(y, L) = 0 and the activity consistency
 * L − g(I(y, L)) = 0, with analytic derivatives; converges in a few evaluations from a fair start.
 * Returns undefined when it does not settle, and the caller falls back to the bracketed method.
 * `stepTolerance`: the Newton step in ln h (and a tenth of it in L) below which an evaluated point is the root, if its
 * |charge balance| / Σ |z| c is also below `residualTolerance` (the one solve accepts; pHWithin asks none).
 */
function solveJoint(problem: Problem, yStart: number | undefined, sitTolerance: number, stepTolerance = 1e-11, residualTolerance = RESIDUAL_TOLERANCE): { y: number; f: number; scale: number; ionic: number; perBase: number } | undefined {
  // one walk of the proton condition for both (it does not depend on L)
  const start = handOut(problem);
  let L = lnGammaZ2For(problem, startingIonicStrength(problem, start));
  let y = yStart ?? startingLnH(problem, L, start);
  // first offsets from the starting guess (no shift: the guess is no root to move)
  // (no first refresh: the offsets in use, from a previous solve of this problem or zero, serve until the first evaluation)
  for (let iter = 0; iter < 40; iter++) {
    jointJacobian(problem, y, L, joint);
    const { f, F2, j11, j12, j21, j22 } = joint;
    const det = j11 * j22 - j12 * j21;
    if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return undefined;
    let dy = (-f * j22 + F2 * j12) / det;
    let dL = (-F2 * j11 + f * j21) / det;
    if (!Number.isFinite(dy) || !Number.isFinite(dL)) return undefined;
    // quadratic convergence: a step this small puts this point within about the step itself of the root (under 1e-11
    // in ln h; pHWithin states its own), and the values in `joint` are this point's own, so no further evaluation
    // (a small step counts only with the residual solve accepts: otherwise one more step, not the bracketed method's rerun)
    const converged = (Math.abs(f) <= 1e-15 * joint.scale && Math.abs(F2) <= LN_GAMMA_TOLERANCE)
      || (Math.abs(dy) < stepTolerance && Math.abs(dL) < 0.1 * stepTolerance && Math.abs(f) < residualTolerance * joint.scale);
    // the specific-ion offsets follow the speciation, lagged one step; a root counts only once they have settled
    if (problem.sit) {
      const moved = sitRefresh(problem, y, true);
      // (no β from here: this Jacobian holds the offsets fixed, which β under sit must not; sitBufferCapacity solves for it)
      if (converged && moved <= sitTolerance) return { y, f, scale: joint.scale, ionic: joint.ionicStrengthM, perBase: NaN };
      // the Newton step below is still taken: it is this point's own, and the new offsets' shift is added to it
      y += sitApply(problem, j11);
    } else if (converged) {
      // d(ln h, L)/dCb = −J⁻¹ (1, 0), for bufferCapacity without a further evaluation
      return { y, f, scale: joint.scale, ionic: joint.ionicStrengthM, perBase: (j21 - j22) / det };
    }
    if (Math.abs(dy) > MAX_STEP_LN) { const k = MAX_STEP_LN / Math.abs(dy); dy *= k; dL *= k; }
    if (Math.abs(dL) > 0.5) dL = Math.sign(dL) * 0.5;
    y += dy;
    L += dL;
    if (y < LN_H_MIN || y > LN_H_MAX) return undefined;
  }
  return undefined;
}

/**
 * The fixed-point loop of the bracketed method: the charge balance solved at fixed activity
 * coefficients, the ionic strength it gives sets the next coefficients, until they agree to
 * LN_GAMMA_TOLERANCE; otherwise `no_convergence`. Returns ln h with the problem's activity set.
 */
function settleActivity(problem: Problem, yStart: number | undefined): number {
  setActivity(problem, 0);
  let y = yStart ?? startingLnH(problem);
  if (problem.model === 'ideal') return solveFixedActivity(problem, y, scratch);
  // first guess of the activity correction from the strong ions alone: this is the fallback, and a larger first ionic
  // strength (the proton condition's forms) can put Davies, far past its range, where the first fixed-activity
  // balance has no root in pH −4 to 23 (3 M trisodium citrate, 2 M tetrasodium EDTA)
  let lnGamma = lnGammaZ2For(problem, problem.strongZ2M / 2);
  setActivity(problem, lnGamma);
  let previous = NaN;
  const search = fixedPointStart();
  for (let iter = 0; iter < 100; iter++) {
    y = solveFixedActivity(problem, y, scratch);
    const residual = lnGammaZ2For(problem, scratch.ionicStrengthM) - lnGamma;
    // under sit the offsets settle in the same loop (plain substitution: they depend on the speciation only weakly)
    const moved = problem.sit ? sitRefresh(problem, y) : 0;
    if (Math.abs(residual) <= LN_GAMMA_TOLERANCE && moved <= SIT_TOLERANCE) return y;
    if (problem.sit) sitApply(problem);
    previous = lnGamma;
    lnGamma = fixedPointStep(search, lnGamma, residual);
    setActivity(problem, lnGamma);
  }
  return fail({ code: 'no_convergence', argument: 'reagents', received: `an ionic strength that did not settle (ln γ/z² still moving from ${previous} to ${lnGamma})`, expected: 'a mixture within the model range' });
}

/**
 * pH of a problem to a stated precision rather than to the last digits: the joint Newton stops at an evaluated
 * point where its next step in ln h, its step in L (a tenth of it) and the sit offsets' move are all below
 * `lnTolerance` (ln units), so the pH returned is that point's own and within about 2·lnTolerance/ln 10 of the
 * root; where the joint Newton does not settle, the full solve. For a pH only printed (WARNINGS' sit departure,
 * to 0.001), where the last confirming evaluations buy nothing.
 * @example pHWithin(prepareProblem(contents, 25, 'sit'), 1e-6) // the sit pH within about 1e-6
 */
export function pHWithin(problem: Problem, lnTolerance: number): number {
  const joint = solveJoint(problem, undefined, lnTolerance, lnTolerance, Infinity);
  return joint ? pHFromLnH(problem, joint.y) : solve(problem).pH;
}

/**
 * Solves the equilibrium: the charge balance in ln h with the ionic strength taken from the
 * speciation itself, self-consistently. A joint Newton step first; if it does not settle, the
 * bracketed Newton in ln h (which cannot fail) inside a fixed-point loop on the ionic strength.
 * `sitTolerance`: how far (ln units) the sit offsets may still move at the root the joint Newton accepts; the
 * bracketed fallback always settles them to SIT_TOLERANCE.
 * @example solve(prepareProblem(buildContents([{ reagent: 'acetic acid', amount: 0.1, unit: 'M', row: 1 }], 1), 25, 'davies')).pH // ≈ 2.88
 */
export function solve(problem: Problem, yStart?: number, method: 'auto' | 'bracketed' = 'auto', sitTolerance = SIT_TOLERANCE): Equilibrium {
  const before = problem.evaluations;
  if (problem.model !== 'ideal' && method === 'auto') {
    const joint = solveJoint(problem, yStart, sitTolerance);
    if (joint && Math.abs(joint.f) / joint.scale < RESIDUAL_TOLERANCE) {
      return { problem, lnH: joint.y, pH: pHFromLnH(problem, joint.y), ionicStrengthM: joint.ionic, residualRelative: Math.abs(joint.f) / joint.scale, evaluations: problem.evaluations - before, lnActivityPerBase: joint.perBase };
    }
  }
  const y = settleActivity(problem, yStart);
  // the bracketed method may return a midpoint it has not evaluated: evaluate there for the residual
  const f = chargeBalance(problem, y, scratch);
  return {
    problem,
    lnH: y,
    pH: pHFromLnH(problem, y),
    ionicStrengthM: scratch.ionicStrengthM,
    residualRelative: Math.abs(f) / scratch.chargeScaleM,
    evaluations: problem.evaluations - before,
    lnActivityPerBase: NaN,
  };
}
