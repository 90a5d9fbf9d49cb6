import { chargeBalance } from './chargeBalance';
import type { BalanceOut } from './chargeBalance';
import { fail } from './failure';
import { fixedPointStart, fixedPointStep } from './fixedPoint';
import { atTarget, setAmounts } from './linearTarget';
import type { AtTarget, ReagentVector, TargetProblem } from './linearTarget';
import { setActivity } from './problem';
import { sitApply, sitRefresh } from './sit';
import { lnGammaZ2For } from './solver';

// The activity correction of a linear-at-target solve: the amounts solved at fixed activity
// coefficients set the ionic strength, which sets the next coefficients, until they agree. Under
// `sit` the specific-ion offsets (sit.ts) are refreshed with them, to LN_GAMMA_TOLERANCE as well.

const scratch: BalanceOut = { derivative: 0, ionicStrengthM: 0, chargeScaleM: 0 };
const MAX_PASSES = 100;
// looser than the solver's: the amounts carry the noise of a cancelling linear solve, and the answer is verified anyway
const LN_GAMMA_TOLERANCE = 1e-12;

export interface LinearSolution { amountsMol: number[]; volumeL: number; vectors: ReagentVector[] }

/**
 * Iterates the activity correction: `solveLinear` returns amounts and volume at the current
 * constants; the ionic strength they give sets the next correction. Returns the amounts once
 * the correction has settled, or throws `no_convergence` naming what did not settle (the
 * inverse solves then fall back to their bracket). Example: iterateActivity(target, 7.4, solveAt).
 */
export function iterateActivity(target: TargetProblem, targetPH: number, solveLinear: (at: AtTarget) => LinearSolution): { amountsMol: number[]; volumeL: number } {
  const p = target.problem;
  let lnGamma = 0;
  setActivity(p, 0);
  let previous = NaN;
  const search = fixedPointStart();
  for (let pass = 0; pass < MAX_PASSES; pass++) {
    const at = atTarget(p, targetPH);
    const solved = solveLinear(at);
    if (p.model === 'ideal') return solved;
    // a negative amount means no solution; it is judged by the caller, clamped here so I stays physical
    setAmounts(target, solved.vectors, solved.amountsMol.map((a) => Math.max(0, a)), Math.max(solved.volumeL, target.baseVolumeL));
    chargeBalance(p, at.lnH, scratch);
    const residual = lnGammaZ2For(p, scratch.ionicStrengthM) - lnGamma;
    // under sit the specific-ion offsets at the target settle in the same loop (they follow the amounts and the speciation)
    const moved = p.sit ? sitRefresh(p, at.lnH, true) : 0;
    if (Math.abs(residual) <= LN_GAMMA_TOLERANCE && moved <= LN_GAMMA_TOLERANCE) return solved;
    if (p.sit) sitApply(p);
    previous = lnGamma;
    lnGamma = fixedPointStep(search, lnGamma, residual);
    setActivity(p, lnGamma);
  }
  return fail({ code: 'no_convergence', argument: 'targetPH', received: `an activity correction at the target that still moved from ${previous} to ${lnGamma} after ${MAX_PASSES} passes`,
    expected: 'an ionic strength that settles at the target pH' });
}
