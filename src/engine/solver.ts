import { lnGammaPerZ2 } from './activity';
import { chargeBalance } from './chargeBalance';
import type { BalanceOut } from './chargeBalance';
import { fail } from './failure';
import type { Problem } from './problem';
import { setActivity } from './problem';

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
}

// ln [H⁺] bracket: pH about −4 to 23, wider than any aqueous solution the catalogue can make.
const LN_H_MIN = -23 * Math.LN10;
const LN_H_MAX = 4 * Math.LN10;
const MAX_STEP_LN = 3 * Math.LN10;
const Y_TOLERANCE = 1e-13;
const LN_GAMMA_TOLERANCE = 1e-14;

const scratch: BalanceOut = { derivative: 0, ionicStrengthM: 0, chargeScaleM: 0 };

/**
 * Root of the charge balance at fixed activity coefficients: Newton in ln h, safeguarded by a
 * bracket that the function's monotonicity keeps valid (bisection when Newton leaves it).
 */
export function solveFixedActivity(problem: Problem, yStart: number, out: BalanceOut): number {
  let lo = LN_H_MIN, hi = LN_H_MAX;
  let y = Math.min(Math.max(yStart, lo), hi);
  for (let iter = 0; iter < 200; iter++) {
    const f = chargeBalance(problem, y, out);
    if (f === 0) return y;
    const step = -f / out.derivative;
    // converged: `out` already holds this point's derivative and ionic strength
    if (Math.abs(step) < Y_TOLERANCE * Math.max(1, Math.abs(y))) return y;
    if (f > 0) hi = y; else lo = y;
    let next = Math.abs(step) <= MAX_STEP_LN ? y + step : y + Math.sign(step) * MAX_STEP_LN;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (hi - lo < Y_TOLERANCE) return next;
    y = next;
  }
  return fail({ code: 'no_convergence', argument: 'reagents', received: 'a mixture whose charge balance did not converge', expected: 'a mixture within the catalogue ranges; please report this case' });
}

/** A starting ln h: a strong acid or base excess if there is one, else the middle of the systems' pKa. */
export function startingLnH(problem: Problem): number {
  const excess = problem.strongChargeM;
  let weighted = 0, weight = 0;
  for (let i = 0; i < problem.systems.length; i++) {
    const s = problem.systems[i];
    for (let k = 0; k < s.lnKa.length; k++) {
      weighted += problem.totalsM[i] * s.lnKa[k];
      weight += problem.totalsM[i];
    }
  }
  if (weight === 0) {
    if (excess < -1e-7) return Math.log(-excess);
    if (excess > 1e-7) return problem.lnKwc - Math.log(excess);
    return problem.lnKwc / 2;
  }
  return weighted / weight;
}

export function lnGammaZ2For(problem: Problem, ionicStrengthM: number): number {
  return lnGammaPerZ2(problem.model, ionicStrengthM / Math.exp(problem.lnWaterDensity), problem.debyeHuckelA);
}

/** pH on the molal activity scale, −log10(γ m) with m = c/ρw, from ln [H⁺] (mol/L). */
export function pHFromLnH(problem: Problem, lnH: number): number {
  return -(lnH + problem.lnGammaZ2 - problem.lnWaterDensity) / Math.LN10;
}

export function lnHFromPH(problem: Problem, pH: number): number {
  return -pH * Math.LN10 - problem.lnGammaZ2 + problem.lnWaterDensity;
}

/**
 * Solves the equilibrium: the charge balance in ln h with the ionic strength taken from the
 * speciation itself, iterated to a self-consistent activity correction.
 */
export function solve(problem: Problem, yStart?: number): Equilibrium {
  const before = problem.evaluations;
  let lnGamma = 0;
  setActivity(problem, 0);
  let y = yStart ?? startingLnH(problem);
  if (problem.model !== 'ideal') {
    // First guess of the activity correction from the strong ions alone.
    lnGamma = lnGammaZ2For(problem, problem.strongZ2M / 2);
    setActivity(problem, lnGamma);
  }
  for (let iter = 0; iter < 100; iter++) {
    y = solveFixedActivity(problem, y, scratch);
    if (problem.model === 'ideal') break;
    const next = lnGammaZ2For(problem, scratch.ionicStrengthM);
    if (Math.abs(next - lnGamma) <= LN_GAMMA_TOLERANCE) break;
    lnGamma = next;
    setActivity(problem, lnGamma);
    if (iter === 99) fail({ code: 'no_convergence', argument: 'reagents', received: 'an ionic strength that did not settle', expected: 'a mixture within the model range' });
  }
  const f = chargeBalance(problem, y, scratch);
  return {
    problem,
    lnH: y,
    pH: pHFromLnH(problem, y),
    ionicStrengthM: scratch.ionicStrengthM,
    residualRelative: Math.abs(f) / scratch.chargeScaleM,
    evaluations: problem.evaluations - before,
  };
}
