import type { Reagent } from '../catalogue';
import type { ActivityModel } from './activity';
import { cloneContents } from './mixture';
import type { Contents } from './mixture';
import { prepareProblem, updateIonSums } from './problem';
import type { Problem } from './problem';
import { lnHFromPH } from './solver';
import { systemMoments } from './speciation';

// At a fixed pH and fixed activity coefficients the charge balance is linear in the amounts
// of added reagents: this module holds those linear pieces (reagent vectors, their charge at a
// pH); targetActivity.ts iterates the ionic strength around them.

/** Moles of each system and ion per mole of a reagent, as vectors over a problem's entries. */
export interface ReagentVector {
  systems: Float64Array;
  ions: Float64Array;
}

export interface TargetProblem {
  problem: Problem;
  base: ReagentVector;
  baseVolumeL: number;
  systemIndex: Map<string, number>;
  ionIndex: Map<string, number>;
}

export function prepareTarget(contents: Contents, extras: Reagent[], temperatureC: number, model: ActivityModel): TargetProblem {
  const all = cloneContents(contents);
  for (const reagent of extras) {
    for (const s of reagent.systems) if (!all.systemMoles.has(s.systemId)) all.systemMoles.set(s.systemId, 0);
    for (const ion of reagent.ions) if (!all.ionMoles.has(ion.ionId)) all.ionMoles.set(ion.ionId, 0);
  }
  const problem = prepareProblem(all, temperatureC, model);
  const systemIndex = new Map(problem.systems.map((s, i) => [s.system.id, i] as [string, number]));
  const ionIndex = new Map(problem.ions.map((ion, i) => [ion.id, i] as [string, number]));
  const base: ReagentVector = {
    systems: Float64Array.from(problem.systems, (s) => all.systemMoles.get(s.system.id) ?? 0),
    ions: Float64Array.from(problem.ions, (ion) => all.ionMoles.get(ion.id) ?? 0),
  };
  return { problem, base, baseVolumeL: contents.volumeL, systemIndex, ionIndex };
}

export function reagentVector(target: TargetProblem, reagent: Reagent): ReagentVector {
  const v: ReagentVector = { systems: new Float64Array(target.problem.systems.length), ions: new Float64Array(target.problem.ions.length) };
  for (const s of reagent.systems) v.systems[target.systemIndex.get(s.systemId) as number] += s.count;
  for (const ion of reagent.ions) v.ions[target.ionIndex.get(ion.ionId) as number] += ion.count;
  return v;
}

/** Sets the problem's concentrations to base + Σ amounts[k]·vectors[k] in volumeL. */
export function setAmounts(target: TargetProblem, vectors: ReagentVector[], amountsMol: number[], volumeL: number): void {
  const p = target.problem;
  for (let i = 0; i < p.systems.length; i++) {
    let moles = target.base.systems[i];
    vectors.forEach((v, k) => { moles += amountsMol[k] * v.systems[i]; });
    p.totalsM[i] = moles / volumeL;
  }
  for (let i = 0; i < p.ions.length; i++) {
    let moles = target.base.ions[i];
    vectors.forEach((v, k) => { moles += amountsMol[k] * v.ions[i]; });
    p.ions[i].concentrationM = moles / volumeL;
  }
  updateIonSums(p);
}

/** Charge (mol) carried by a vector of moles at ln h, with the current constants. */
export function chargeOf(problem: Problem, v: ReagentVector, lnH: number): number {
  const m = { mean: 0, variance: 0 };
  let q = 0;
  problem.systems.forEach((s, i) => {
    if (v.systems[i] === 0) return;
    systemMoments(s.lnCumK, lnH, m);
    q += v.systems[i] * (s.z0 - m.mean);
  });
  problem.ions.forEach((ion, i) => { q += v.ions[i] * ion.charge; });
  return q;
}

export interface AtTarget {
  lnH: number;
  /** [H⁺] − [OH⁻], mol/L, at the target */
  waterChargeM: number;
}

/** ln h and the water term at a target pH for the current activity correction. */
export function atTarget(problem: Problem, targetPH: number): AtTarget {
  const lnH = lnHFromPH(problem, targetPH);
  return { lnH, waterChargeM: Math.exp(lnH) - Math.exp(problem.lnKwc - lnH) };
}
