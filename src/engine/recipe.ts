import type { ActivityModel } from './activity';
import { fail } from './failure';
import { addReagent } from './mixture';
import type { Contents, ReagentSpec } from './mixture';
import { prepareProblem } from './problem';
import { chargeOf, iterateActivity, prepareTarget, reagentVector } from './linearTarget';
import { systemFor } from './registry';
import { solve } from './solver';

export interface RecipeLine {
  spec: ReagentSpec;
  moles: number;
  /** grams to weigh (of the liquid as sold, for a catalogue liquid); for a stock, millilitres */
  amount: number;
  unit: 'g' | 'mL';
}

function lineFor(spec: ReagentSpec, moles: number): RecipeLine {
  if (spec.stockM !== undefined) return { spec, moles, amount: (moles / spec.stockM) * 1000, unit: 'mL' };
  const fraction = spec.resolved.reagent.liquid?.massFraction ?? 1;
  return { spec, moles, amount: (moles * spec.resolved.molarMassGPerMol) / fraction, unit: 'g' };
}

/**
 * Moles of an acid form and a base form of one system so that the system totals
 * `concentrationM` in `volumeL` at the target pH, other reagents included: two linear
 * equations (system total, charge balance) at the target, with the ionic strength iterated.
 */
export function recipeForTarget(
  acid: ReagentSpec, base: ReagentSpec, targetPH: number, concentrationM: number, volumeL: number,
  others: Contents, temperatureC: number, model: ActivityModel,
): [RecipeLine, RecipeLine] {
  const systemId = acid.resolved.reagent.systems[0]?.systemId ?? base.resolved.reagent.systems[0]?.systemId;
  if (systemId === undefined) {
    fail({ code: 'bad_argument', argument: 'acidForm', received: `${acid.resolved.reagent.name} and ${base.resolved.reagent.name}`, expected: 'at least one form that belongs to an acid system (a buffer substance)' });
  }
  for (const [spec, argument] of [[acid, 'acidForm'], [base, 'baseForm']] as const) {
    const ids = spec.resolved.reagent.systems.map((s) => s.systemId);
    if (ids.length > 0 && !ids.includes(systemId)) {
      fail({ code: 'bad_argument', argument, received: spec.resolved.reagent.name, expected: `a form of the ${systemFor(systemId).name} system, like the other form` });
    }
  }
  const contents: Contents = { ...others, volumeL };
  const target = prepareTarget(contents, [acid.resolved.reagent, base.resolved.reagent], temperatureC, model);
  const vA = reagentVector(target, acid.resolved.reagent);
  const vB = reagentVector(target, base.resolved.reagent);
  const index = target.systemIndex.get(systemId) as number;
  const sA = vA.systems[index], sB = vB.systems[index];
  const totalMol = concentrationM * volumeL - target.base.systems[index];
  const result = iterateActivity(target, targetPH, (at) => {
    const rest = chargeOf(target.problem, target.base, at.lnH);
    // made up to the final volume: every form, stocks included, ends up in volumeL
    const qA = chargeOf(target.problem, vA, at.lnH);
    const qB = chargeOf(target.problem, vB, at.lnH);
    const r = volumeL * at.waterChargeM + rest;
    const det = sA * qB - sB * qA;
    const x = (totalMol * qB + sB * r) / det;
    const y = (-sA * r - qA * totalMol) / det;
    return { amountsMol: [x, y], volumeL, vectors: [vA, vB] };
  });
  const [x, y] = result ? result.amountsMol : [NaN, NaN];
  if (!(x >= 0 && y >= 0) || !Number.isFinite(x) || !Number.isFinite(y)) {
    const pHOf = (spec: ReagentSpec, count: number): string => {
      const alone: Contents = { systemMoles: new Map(others.systemMoles), ionMoles: new Map(others.ionMoles), volumeL, rows: [] };
      addReagent(alone, spec.resolved.reagent, count > 0 ? (concentrationM * volumeL) / count : 0);
      return solve(prepareProblem(alone, temperatureC, model)).pH.toFixed(2);
    };
    const span = sA > 0 && sB > 0 ? `: alone, ${acid.resolved.reagent.name} gives pH ${pHOf(acid, sA)} and ${base.resolved.reagent.name} gives pH ${pHOf(base, sB)}` : '';
    fail({
      code: 'unreachable_target', argument: 'targetPH', received: `pH ${targetPH}`,
      reason: `${acid.resolved.reagent.name} and ${base.resolved.reagent.name} cannot bracket it at ${concentrationM} mol/L${span}`,
      expected: 'a target between the pH of the two forms, or a more acidic acid form or more basic base form',
    });
  }
  return [lineFor(acid, x), lineFor(base, y)];
}
