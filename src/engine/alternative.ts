import type { Problem } from './problem';
import { prepareSit } from './sit';
import { solve } from './solver';
import { pKaAt } from './temperature';

/**
 * A copy of a problem with one step's 25 °C pKa replaced (its ΔrH° and ΔrCp° kept), so the original, which
 * may be cached and shared, is untouched: under sit the copy has specific-ion offsets of its own (a shared state
 * would leave the original's γ, which SPECIES prints, at the other constant's solution).
 */
export function withStepPKa(problem: Problem, systemIndex: number, stepIndex: number, pKa25: number): Problem {
  const systems = problem.systems.map((s, i) => {
    if (i !== systemIndex) return { ...s, lnCumK: new Float64Array(s.lnCumK.length) };
    const lnKa = Float64Array.from(s.lnKa);
    lnKa[stepIndex] = -pKaAt({ ...s.system.steps[stepIndex], pKa: pKa25 }, problem.temperatureC) * Math.LN10;
    return { ...s, lnKa, lnCumK: new Float64Array(s.lnCumK.length) };
  });
  const copy: Problem = { ...problem, systems, totalsM: Float64Array.from(problem.totalsM), ions: problem.ions.map((ion) => ({ ...ion })), evaluations: 0, sit: undefined };
  if (problem.sit) copy.sit = prepareSit(copy);
  return copy;
}

/**
 * pH of the same mixture with one step's 25 °C pKa replaced: what a disputed constant's alternative does to the result.
 * @example pHWithStepPKa(eq.problem, 0, 0, 2.038) - eq.pH // maleate step 1 at its alternative value
 */
export function pHWithStepPKa(problem: Problem, systemIndex: number, stepIndex: number, pKa25: number): number {
  return solve(withStepPKa(problem, systemIndex, stepIndex, pKa25)).pH;
}
