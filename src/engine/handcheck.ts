import { fail } from './failure';
import type { Contents } from './mixture';
import type { ActivityModel } from './activity';
import { prepareProblem, updateIonSums } from './problem';
import type { PreparedSystem, Problem } from './problem';
import { solve } from './solver';

// The hand-calculation ladder: from the exact pH, the neglected effects are removed one at a time, in this fixed
// order, each level keeping the removals before it, down to the textbook Henderson–Hasselbalch estimate.
export const LADDER_EFFECTS = ['temperature', 'activity', 'other steps of the system', 'other systems', 'water', 'dilution'] as const;

export interface HandLadder {
  /** pH with 0, 1, … 6 effects removed: levels[0] is exact, levels[6] the estimate */
  levels: number[];
  estimate: number;
  pair: { system: string; step: number; pKa: number; acidM: number; baseM: number };
}

/**
 * The textbook estimate and the ladder of effects for a mixture (see LADDER_EFFECTS). The pair is the step whose
 * nominal 25 °C pKa is nearest the exact pH; strong acid and base are taken off by stoichiometry: the protons the
 * systems must lose (strong-ion charge plus their most protonated charges) go to the steps strongest acid first.
 * @example handLadder(contents, 25, 'davies').estimate // 4.756 for equimolar acetic acid and sodium acetate
 */
export function handLadder(contents: Contents, temperatureC: number, model: ActivityModel): HandLadder {
  const exact = solve(prepareProblem(contents, temperatureC, model));
  const at25 = prepareProblem(contents, 25, model);
  const ideal = prepareProblem(contents, 25, 'ideal');
  // hand-out of protons by nominal pKa (25 °C, I = 0), strongest acid first
  const steps = ideal.systems.flatMap((s, i) => s.system.steps.map((st, k) => ({ i, k, pKa: st.pKa }))).filter((x) => ideal.totalsM[x.i] > 0);
  if (steps.length === 0) fail({ code: 'bad_argument', argument: 'reagents', received: 'a mixture with no acid system', expected: 'a buffer: a mixture with a weak acid and its conjugate base' });
  steps.sort((a, b) => a.pKa - b.pKa);
  let chosen = steps[0];
  for (const s of steps) if (Math.abs(s.pKa - exact.pH) < Math.abs(chosen.pKa - exact.pH)) chosen = s;
  let remaining = ideal.strongChargeM;
  ideal.systems.forEach((s, i) => { remaining += ideal.totalsM[i] * s.z0; });
  const order = steps.indexOf(chosen);
  for (let n = 0; n < order; n++) remaining -= ideal.totalsM[steps[n].i];
  const c = ideal.totalsM[chosen.i];
  const base = remaining, acid = c - remaining;
  if (!(base > 0 && acid > 0)) {
    fail({ code: 'bad_argument', argument: 'reagents', received: `no ${ideal.systems[chosen.i].system.name} pair: by stoichiometry step ${chosen.k + 1} holds only one form`,
      expected: 'a buffer whose pair nearest the pH holds both its acid and base forms' });
  }
  // the chosen pair alone: steps before it lost, after it kept; other systems as the fixed charges the hand-out gives
  const lostBefore = (i: number): number => steps.slice(0, order).filter((x) => x.i === i).length;
  const s = ideal.systems[chosen.i];
  const zAcid = s.z0 - lostBefore(chosen.i);
  const pair: PreparedSystem = { system: s.system, z0: zAcid, lnKa: Float64Array.of(s.lnKa[chosen.k]), lnCumK: new Float64Array(2), lnCumKSlope: Float64Array.of(0, 2 * (zAcid - 1)) };
  const onePair = clone(ideal, ideal.systems.map((x, i) => (i === chosen.i ? pair : x)));
  let fixedCharge = 0;
  ideal.systems.forEach((x, i) => { if (i !== chosen.i) fixedCharge += ideal.totalsM[i] * (x.z0 - lostBefore(i)); });
  const alone = clone(ideal, [pair], chosen.i);
  alone.ions.push({ id: 'fixed', charge: fixedCharge >= 0 ? 1 : -1, concentrationM: Math.abs(fixedCharge) });
  updateIonSums(alone);
  const estimate = chosen.pKa + Math.log10(base / acid);
  const levels = [exact.pH, solve(at25).pH, solve(ideal).pH, solve(onePair).pH, solve(alone).pH,
    // water left out: the charge balance is the stoichiometric ratio itself, which no longer depends on the volume
    estimate, estimate];
  return { levels, estimate, pair: { system: s.system.name, step: chosen.k + 1, pKa: chosen.pKa, acidM: acid, baseM: base } };
}

function clone(problem: Problem, systems: PreparedSystem[], keepIndex?: number): Problem {
  const totals = keepIndex === undefined ? Float64Array.from(problem.totalsM) : Float64Array.of(problem.totalsM[keepIndex]);
  const copies = systems.map((s) => ({ ...s, lnCumK: new Float64Array(s.lnCumK.length) }));
  const codes = copies.flatMap((s, i) => Array.from(s.lnKa, (_, k) => i * 8 + k));
  codes.sort((a, b) => copies[b >> 3].lnKa[b & 7] - copies[a >> 3].lnKa[a & 7]);
  const order = Int32Array.from(codes);
  return { ...problem, systems: copies, totalsM: totals, ions: problem.ions.map((ion) => ({ ...ion })), stepOrder: order, evaluations: 0 };
}
