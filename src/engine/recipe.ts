import type { ActivityModel } from './activity';
import { ProticError, fail } from './failure';
import { PH_TOLERANCE, solveInverse } from './inverse';
import { chargeOf, prepareTarget, reagentVector } from './linearTarget';
import { addReagent, cloneContents, molesPerLitreDispensed } from './mixture';
import type { Contents, ReagentSpec } from './mixture';
import { MAX_COMPONENT_M, prepareProblem } from './problem';
import { systemFor } from './registry';
import { solve } from './solver';
import { iterateActivity } from './targetActivity';

export interface RecipeLine {
  spec: ReagentSpec;
  moles: number;
  /** grams to weigh for a solid; millilitres for a stock or a liquid as sold */
  amount: number;
  unit: 'g' | 'mL';
}

/** A solid is weighed (g); a stock or a catalogue liquid is measured by volume (mL, from its density and assay). */
export function recipeLine(spec: ReagentSpec, moles: number): RecipeLine {
  const perL = molesPerLitreDispensed(spec);
  if (perL !== undefined) return { spec, moles, amount: (moles / perL) * 1000, unit: 'mL' };
  return { spec, moles, amount: moles * spec.resolved.molarMassGPerMol, unit: 'g' };
}

/**
 * The one free amount of a recipe: moles of acid form x = x0 + xSlope·t and of base form
 * y = y0 + ySlope·t. With both forms in the system, t is the base form's share of the system;
 * with one form outside it (HCl with Tris, NaOH with MES), t is the moles of that form.
 */
interface RecipeLineUp { x0: number; xSlope: number; y0: number; ySlope: number; tMax: number }

function lineUp(sA: number, sB: number, totalMol: number): RecipeLineUp {
  if (sA > 0 && sB > 0) return { x0: totalMol / sA, xSlope: -totalMol / sA, y0: 0, ySlope: totalMol / sB, tMax: 1 };
  if (sA > 0) return { x0: totalMol / sA, xSlope: 0, y0: 0, ySlope: 1, tMax: Infinity };
  return { x0: 0, xSlope: 1, y0: totalMol / sB, ySlope: 0, tMax: Infinity };
}

/** The range of t in which every component of the recipe stays within MAX_COMPONENT_M. */
function componentRange(others: Contents, acid: ReagentSpec, base: ReagentSpec, line: RecipeLineUp, volumeL: number): [number, number] {
  const moles = new Map<string, [number, number]>();
  const add = (key: string, at0: number, slope: number): void => {
    const m = moles.get(key) ?? [0, 0];
    moles.set(key, [m[0] + at0, m[1] + slope]);
  };
  for (const [id, n] of others.systemMoles) add(`s:${id}`, n, 0);
  for (const [id, n] of others.ionMoles) add(`i:${id}`, n, 0);
  for (const [spec, at0, slope] of [[acid, line.x0, line.xSlope], [base, line.y0, line.ySlope]] as const) {
    for (const s of spec.resolved.reagent.systems) add(`s:${s.systemId}`, at0 * s.count, slope * s.count);
    for (const ion of spec.resolved.reagent.ions) add(`i:${ion.ionId}`, at0 * ion.count, slope * ion.count);
  }
  let lo = 0, hi = line.tMax;
  const cap = MAX_COMPONENT_M * volumeL * (1 - 1e-9);
  for (const [at0, slope] of moles.values()) {
    if (slope > 0) hi = Math.min(hi, (cap - at0) / slope);
    else if (slope < 0) lo = Math.max(lo, (cap - at0) / slope);
    else if (at0 > cap) return [1, 0];
  }
  // a free form that adds nothing the limit counts: a practical ceiling of MAX_COMPONENT_M in the volume
  if (!Number.isFinite(hi)) hi = MAX_COMPONENT_M * volumeL;
  return [lo, hi];
}

/** The linear-at-target solution (two equations, system total and charge balance), as t; undefined when it does not settle. */
function linearGuess(target: ReturnType<typeof prepareTarget>, acid: ReagentSpec, base: ReagentSpec, index: number, totalMol: number, targetPH: number,
  volumeL: number, line: RecipeLineUp): number | undefined {
  const vA = reagentVector(target, acid.resolved.reagent);
  const vB = reagentVector(target, base.resolved.reagent);
  const sA = vA.systems[index], sB = vB.systems[index];
  try {
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
    const [x, y] = result.amountsMol;
    const t = line.ySlope !== 0 ? (y - line.y0) / line.ySlope : (x - line.x0) / line.xSlope;
    return Number.isFinite(t) && x >= 0 && y >= 0 ? t : undefined;
  } catch (error) {
    if (error instanceof ProticError && error.failure.code === 'no_convergence') return undefined;
    throw error;
  }
}

/**
 * Moles of an acid form and a base form of one system so that the system totals
 * `concentrationM` in `volumeL` at the target pH, other reagents included. The one free amount
 * (the base form's share, or a form outside the system) is bracketed within the component
 * limit and found on the forward solve PHMIX uses; the answer is verified there (1e-6 pH).
 * Stocks and liquids that do not fit in `volumeL` are refused with the most concentrated
 * buffer they can make. Example: recipeForTarget(acid, base, 7.4, 0.1, 1, none, 25, 'davies').
 */
export function recipeForTarget(
  acid: ReagentSpec, base: ReagentSpec, targetPH: number, concentrationM: number, volumeL: number,
  others: Contents, temperatureC: number, model: ActivityModel,
): [RecipeLine, RecipeLine] {
  const lines = solveRecipe(acid, base, targetPH, concentrationM, volumeL, others, temperatureC, model);
  checkFits(lines, volumeL, othersVolumeL(others), concentrationM, targetPH,
    (c) => formsVolumeL(solveRecipe(acid, base, targetPH, c, volumeL, others, temperatureC, model)));
  return lines;
}

/** The recipe at the target, verified, without the check that stocks fit in the volume. */
function solveRecipe(
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
  const index = target.systemIndex.get(systemId) as number;
  const sA = reagentVector(target, acid.resolved.reagent).systems[index], sB = reagentVector(target, base.resolved.reagent).systems[index];
  const totalMol = concentrationM * volumeL - target.base.systems[index];
  const acidName = acid.resolved.reagent.name, baseName = base.resolved.reagent.name;
  if (!(totalMol > 0)) {
    fail({ code: 'bad_argument', argument: 'concentration', received: `${concentrationM} mol/L`, expected: `more than the ${systemFor(systemId).name} the other reagents already bring` });
  }
  const line = lineUp(sA, sB, totalMol);
  const [tLo, tHi] = componentRange(others, acid, base, line, volumeL);
  if (!(tHi > tLo)) {
    fail({ code: 'out_of_range', argument: 'concentration', received: `${concentrationM} mol/L`, expected: `a concentration at which no component of ${acidName} and ${baseName} passes ${MAX_COMPONENT_M} mol/L` });
  }
  const molesAt = (t: number): [number, number] => [Math.max(0, line.x0 + line.xSlope * t), Math.max(0, line.y0 + line.ySlope * t)];
  const forward = (a: number): number => {
    const [x, y] = molesAt(tLo + a);
    const mixed = cloneContents(contents);
    addReagent(mixed, acid.resolved.reagent, x);
    addReagent(mixed, base.resolved.reagent, y);
    return solve(prepareProblem(mixed, temperatureC, model)).pH;
  };
  const guess = linearGuess(target, acid, base, index, totalMol, targetPH, volumeL, line);
  const outcome = solveInverse({
    forward, limit: tHi - tLo, target: targetPH, tolerance: PH_TOLERANCE, quantity: 'pH', argument: 'targetPH',
    guess: guess !== undefined && guess >= tLo && guess <= tHi ? guess - tLo : undefined,
  });
  if (!outcome.found) {
    const whole = tLo === 0 && tHi === line.tMax && sA > 0 && sB > 0 && outcome.searchedTo === tHi;
    const span = whole ? `: alone, ${acidName} gives pH ${outcome.atZero.toFixed(2)} and ${baseName} gives pH ${outcome.atLimit.toFixed(2)}`
      : `: within the ${MAX_COMPONENT_M} mol/L limit of a component${outcome.searchedTo < tHi - tLo ? ' and as far as the activity model converges' : ''} they give pH ${outcome.lowest.toFixed(2)} to ${outcome.highest.toFixed(2)}`;
    return fail({
      code: 'unreachable_target', argument: 'targetPH', received: `pH ${targetPH}`,
      reason: `${acidName} and ${baseName} cannot bracket it at ${concentrationM} mol/L${span}`,
      reachable: { quantity: 'pH', low: outcome.lowest, high: outcome.highest },
      expected: 'a target between the pH of the two forms, or a more acidic acid form or more basic base form',
    });
  }
  const [x, y] = molesAt(tLo + outcome.amount);
  return [recipeLine(acid, x), recipeLine(base, y)];
}

/** Four significant digits, rounded down, so the concentration quoted as "at most" fits. */
function roundedDown(x: number): number {
  const unit = 10 ** (Math.floor(Math.log10(x)) - 3);
  return Number((Math.floor(x / unit) * unit).toPrecision(4));
}

/** Litres of stock and liquid as sold the forms take. */
function formsVolumeL(lines: RecipeLine[]): number {
  return lines.reduce((sum, l) => sum + (l.unit === 'mL' ? l.amount / 1000 : 0), 0);
}

function othersVolumeL(others: Contents): number {
  return others.rows.reduce((sum, r) => sum + r.volumeL, 0);
}

/**
 * Stocks and liquids must fit in the final volume. If they do not, the refusal names the most
 * concentrated buffer they make at this pH: the concentration at which they fill the room left,
 * found on the same recipe solve (the forms' ratio moves a little with the ionic strength).
 */
function checkFits(lines: RecipeLine[], volumeL: number, othersL: number, concentrationM: number, targetPH: number,
  volumeAt: (concentrationM: number) => number): void {
  const formsL = formsVolumeL(lines);
  if (formsL + othersL <= volumeL * (1 + 1e-9)) return;
  const roomL = Math.max(0, volumeL - othersL);
  let most: string;
  try {
    const outcome = roomL > 0 ? solveInverse({ forward: (c) => (c === 0 ? 0 : volumeAt(c)), limit: concentrationM, target: roomL, tolerance: 1e-9 * roomL,
      atZero: 0, guess: (roomL / formsL) * concentrationM, quantity: 'stock volume', argument: 'concentration' }) : undefined;
    most = outcome?.found ? `at most ${roundedDown(outcome.amount)} mol/L` : `at most about ${Number(((roomL / formsL) * concentrationM).toPrecision(3))} mol/L`;
  } catch (error) {
    // a leaner recipe that itself fails (its pH out of reach): fall back to the proportional estimate
    if (!(error instanceof ProticError)) throw error;
    most = `at most about ${Number(((roomL / formsL) * concentrationM).toPrecision(3))} mol/L`;
  }
  fail({
    code: 'unreachable_target', argument: 'concentration', received: `${concentrationM} mol/L`,
    reason: `the stocks and liquids take ${Number((formsL * 1000).toPrecision(6))} mL${othersL > 0 ? ` (and the other reagents ${Number((othersL * 1000).toPrecision(4))} mL)` : ''}, more than the final ${volumeL} L`,
    expected: `${most} with these stocks at pH ${targetPH}, more concentrated stocks, or solids`,
  });
}
