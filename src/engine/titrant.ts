import type { ActivityModel } from './activity';
import { ProticError, fail, quote } from './failure';
import { PH_TOLERANCE, solveInverse } from './inverse';
import { chargeOf, prepareTarget, reagentVector } from './linearTarget';
import { addReagent, cloneContents, molesPerLitreDispensed } from './mixture';
import type { Contents, ReagentSpec } from './mixture';
import { MAX_COMPONENT_M, prepareProblem } from './problem';
import { solve } from './solver';
import { iterateActivity } from './targetActivity';
import type { Equilibrium } from './solver';
import { findUnit } from './units';
import type { Unit } from './units';

export interface TitrantResult {
  /** moles of titrant formula units */
  moles: number;
  /** volume of titrant, L, for a stock or liquid; 0 for a solid */
  volumeL: number;
  startPH: number;
  /** the pH the forward solve gives with `moles` added: the verification, within 1e-6 of the target */
  pH: number;
  /** forward solves the inverse took (the verification included; the starting mixture's solve not) */
  forwardSolves: number;
}

export interface TitrantOptions {
  /** make the adjusted solution up to this volume, L (a batch record's "adjust, then make up to volume") */
  finalVolumeL?: number;
}

/** L per mole of titrant (its own volume, which dilutes the mixture); 0 for a solid. */
export function litresPerMole(spec: ReagentSpec): number {
  const perL = molesPerLitreDispensed(spec);
  return perL === undefined ? 0 : 1 / perL;
}

function describeTitrant(spec: ReagentSpec): string {
  if (spec.made) return spec.made.name;
  return spec.stockM !== undefined ? `${spec.stockM} M ${spec.resolved.reagent.name}` : spec.resolved.reagent.name;
}

/**
 * The equilibrium of the mixture with `moles` of titrant added: the volume grows by the
 * titrant's own volume, or is `finalVolumeL` when the solution is made up to volume.
 * Example: withTitrant(contents, parseReagentSpec('1 M NaOH', 'titrant'), 0.01, 25, 'davies').pH.
 */
export function withTitrant(contents: Contents, spec: ReagentSpec, moles: number, temperatureC: number, model: ActivityModel, finalVolumeL?: number): Equilibrium {
  const mixed = cloneContents(contents);
  addReagent(mixed, spec.resolved.reagent, moles);
  mixed.volumeL = finalVolumeL ?? contents.volumeL + moles * litresPerMole(spec);
  return solve(prepareProblem(mixed, temperatureC, model));
}

/** pH of the titrant on its own, for a stock or liquid; undefined for a solid. */
function titrantOwnPH(spec: ReagentSpec, temperatureC: number, model: ActivityModel): number | undefined {
  const perL = molesPerLitreDispensed(spec);
  if (perL === undefined) return undefined;
  const alone: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL: 1, rows: [] };
  addReagent(alone, spec.resolved.reagent, perL);
  try {
    return solve(prepareProblem(alone, temperatureC, model)).pH;
  } catch (error) {
    // a stock above the component limit has no pH of its own to quote
    if (error instanceof ProticError) return undefined;
    throw error;
  }
}

/** Why the titrant amount stops where it does. */
export type TitrantLimitReason = 'component' | 'final volume' | 'practical';

/** A practical ceiling for a stock that never reaches a component limit: a thousand times the mixture's volume. */
export const MAX_TITRANT_VOLUME_RATIO = 1000;

/**
 * The most titrant, mol, the physics allows: every component at most MAX_COMPONENT_M in the
 * final solution; with a final volume, the titrant's own volume must fit in it; a dilute stock
 * without one stops at MAX_TITRANT_VOLUME_RATIO times the mixture's volume.
 * Example: titrantLimit(contents, parseReagentSpec('NaOH', 'titrant')) → { moles: 20 (in 1 L), reason: 'component' }.
 */
export function titrantLimit(contents: Contents, spec: ReagentSpec, finalVolumeL?: number): { moles: number; reason: TitrantLimitReason } {
  const reagent = spec.resolved.reagent;
  const lPerMol = litresPerMole(spec);
  const v0 = contents.volumeL;
  let moles = Infinity;
  let reason: TitrantLimitReason = 'component';
  const components: [number, number][] = [
    ...reagent.systems.map((s) => [contents.systemMoles.get(s.systemId) ?? 0, s.count] as [number, number]),
    ...reagent.ions.map((ion) => [contents.ionMoles.get(ion.ionId) ?? 0, ion.count] as [number, number]),
  ];
  for (const [before, count] of components) {
    if (!(count > 0)) continue;
    let n: number;
    if (finalVolumeL !== undefined || lPerMol === 0) n = (MAX_COMPONENT_M * (finalVolumeL ?? v0) - before) / count;
    else if (count - MAX_COMPONENT_M * lPerMol > 0) n = (MAX_COMPONENT_M * v0 - before) / (count - MAX_COMPONENT_M * lPerMol);
    else continue;
    if (n < moles) moles = n;
  }
  if (finalVolumeL !== undefined && lPerMol > 0 && (finalVolumeL - v0) / lPerMol < moles) {
    moles = (finalVolumeL - v0) / lPerMol;
    reason = 'final volume';
  }
  if (!Number.isFinite(moles)) {
    // nothing the titrant brings can pass the limit: a stock as dilute as its own components allow, or a reagent that adds none
    moles = lPerMol > 0 ? (MAX_TITRANT_VOLUME_RATIO * v0) / lPerMol : MAX_COMPONENT_M * (finalVolumeL ?? v0);
    reason = 'practical';
  }
  // just inside the limit, so that the forward solve at the limit is not refused by rounding
  return { moles: moles * (1 - 1e-9), reason };
}

/**
 * The linear-at-target amount: V(n)(h − Kw/h) + Σ charges of the mixture + n · charge per mole
 * of titrant = 0 at the target, linear in n, with the ionic strength iterated. A first guess
 * for the bracketed solve; undefined when it does not settle or is not a usable amount.
 */
function linearGuess(targetPH: number, contents: Contents, spec: ReagentSpec, temperatureC: number, model: ActivityModel, finalVolumeL?: number): number | undefined {
  const made: Contents = finalVolumeL === undefined ? contents : { ...contents, volumeL: finalVolumeL };
  const target = prepareTarget(made, [spec.resolved.reagent], temperatureC, model);
  const vector = reagentVector(target, spec.resolved.reagent);
  // made up to volume, the titrant's own volume no longer changes the final volume
  const lPerMol = finalVolumeL === undefined ? litresPerMole(spec) : 0;
  try {
    const result = iterateActivity(target, targetPH, (at) => {
      const mixtureCharge = chargeOf(target.problem, target.base, at.lnH);
      const perMole = chargeOf(target.problem, vector, at.lnH);
      const numerator = target.baseVolumeL * at.waterChargeM + mixtureCharge;
      const denominator = lPerMol * at.waterChargeM + perMole;
      const moles = -numerator / denominator;
      return { amountsMol: [moles], volumeL: target.baseVolumeL + Math.max(0, moles) * lPerMol, vectors: [vector] };
    });
    const moles = result.amountsMol[0];
    return moles > 0 && Number.isFinite(moles) ? moles : undefined;
  } catch (error) {
    if (error instanceof ProticError && error.failure.code === 'no_convergence') return undefined;
    throw error;
  }
}

const LIMIT_TEXT: Record<TitrantLimitReason, string> = {
  component: `with as much as the ${MAX_COMPONENT_M} mol/L limit of a component allows`,
  'final volume': 'with as much as fits in the final volume',
  practical: `with up to ${MAX_TITRANT_VOLUME_RATIO} times the mixture's volume added`,
};

/**
 * Amount of titrant that brings the mixture to the target pH: bracketed between none and the
 * titrant's limit, found on the forward solve PHMIX uses, and verified there (within 1e-6 pH).
 * A target no amount reaches is `unreachable_target` with the reachable pH range.
 * Example: titrantForTarget(7.4, contents, parseReagentSpec('1 M NaOH', 'titrant'), 25, 'davies').moles.
 */
export function titrantForTarget(targetPH: number, contents: Contents, spec: ReagentSpec, temperatureC: number, model: ActivityModel,
  options: TitrantOptions = {}): TitrantResult {
  const { finalVolumeL } = options;
  const start = solve(prepareProblem(contents, temperatureC, model));
  const name = describeTitrant(spec);
  if (finalVolumeL !== undefined && !(finalVolumeL >= contents.volumeL)) {
    fail({ code: 'bad_argument', argument: 'finalVolume', received: `${finalVolumeL} L`, expected: `a final volume at least the mixture's ${contents.volumeL} L` });
  }
  const limit = titrantLimit(contents, spec, finalVolumeL);
  if (!(limit.moles > 0)) {
    fail({ code: 'unreachable_target', argument: 'targetPH', received: `pH ${targetPH}`, reason: `no ${name} fits: the mixture already fills the final volume or holds a component at its limit`,
      expected: 'a larger final volume, or a more concentrated titrant' });
  }
  const forward = (moles: number): number => withTitrant(contents, spec, moles, temperatureC, model, finalVolumeL).pH;
  const outcome = solveInverse({
    forward, limit: limit.moles, target: targetPH, tolerance: PH_TOLERANCE, quantity: 'pH', argument: 'targetPH',
    atZero: finalVolumeL === undefined ? start.pH : undefined,
    guess: linearGuess(targetPH, contents, spec, temperatureC, model, finalVolumeL),
  });
  if (outcome.found) return { moles: outcome.amount, volumeL: outcome.amount * litresPerMole(spec), startPH: start.pH, pH: outcome.value, forwardSolves: outcome.evaluations };
  const raises = outcome.atLimit > outcome.atZero;
  const startText = outcome.atZero.toFixed(2);
  const wrongWay = raises ? targetPH < outcome.lowest : targetPH > outcome.highest;
  const ownPH = titrantOwnPH(spec, temperatureC, model);
  const made = finalVolumeL === undefined ? '' : ` made up to ${finalVolumeL} L`;
  const reason = wrongWay
    ? `the mixture${made} starts at pH ${startText} and ${name} ${raises ? 'raises' : 'lowers'} it, but the target is on the other side`
    : `the target lies beyond what ${name} can reach ${outcome.searchedTo < limit.moles ? 'with as much as the solution can hold (its solutes\' volume) and the activity model converges for' : LIMIT_TEXT[limit.reason]}${ownPH !== undefined ? `: on its own it has pH ${ownPH.toFixed(2)}` : ''}`;
  return fail({
    code: 'unreachable_target', argument: 'targetPH', received: `pH ${targetPH}`, reason,
    reachable: { quantity: 'pH', low: outcome.lowest, high: outcome.highest },
    expected: wrongWay ? `a target ${raises ? 'above' : 'below'} pH ${startText}, or a titrant that ${raises ? 'lowers' : 'raises'} pH`
      : `a target in the reachable range, or a ${ownPH === undefined ? 'stronger' : 'more concentrated or stronger'} titrant`,
  });
}

/** Units a titrant amount may be given in, and how moles convert to each. */
export function titrantUnit(value: unknown, spec: ReagentSpec, argument: string): Unit {
  const reagent = spec.resolved.reagent;
  if (reagent.systems.length === 0 && reagent.ions.length === 0) {
    fail({ code: 'bad_argument', argument: 'titrant', received: quote(reagent.name), expected: `an acid, a base or a buffer component: ${reagent.name} (${reagent.solvent ? 'the solvent' : 'an excipient'}) moves no pH` });
  }
  const dispensed = molesPerLitreDispensed(spec) !== undefined;
  if (value === null || value === undefined || value === '') return findUnit(dispensed ? 'mL' : 'g') as Unit;
  const unit = typeof value === 'string' ? findUnit(value) : undefined;
  // a made solution is only ever measured by volume: a "mole" of it is a litre
  const okKinds = spec.made ? ['volume'] : dispensed ? ['volume', 'amount'] : ['mass', 'amount'];
  if (spec.resolved.reagent.liquid && spec.stockM === undefined) okKinds.push('mass');
  if (!unit || !okKinds.includes(unit.kind)) {
    fail({ code: 'bad_unit', argument, received: quote(value),
      expected: dispensed ? 'L mL µL or mol mmol µmol for a titrant dispensed by volume' : 'g mg kg or mol mmol µmol for a solid titrant' });
  }
  return unit;
}

/** Converts moles of titrant to the chosen unit. */
export function molesToUnit(moles: number, spec: ReagentSpec, unit: Unit): number {
  switch (unit.kind) {
    case 'amount': return moles / unit.toBase;
    case 'volume': return (moles * litresPerMole(spec)) / unit.toBase;
    case 'mass': {
      const liquid = spec.resolved.reagent.liquid;
      const grams = moles * spec.resolved.molarMassGPerMol / (liquid && spec.stockM === undefined ? liquid.massFraction : 1);
      return grams / unit.toBase;
    }
    default: throw new Error('a titrant amount is never a concentration');
  }
}

export function unitToMoles(amount: number, spec: ReagentSpec, unit: Unit): number {
  return amount / molesToUnit(1, spec, unit);
}
