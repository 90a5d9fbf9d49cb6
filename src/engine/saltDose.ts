import { strongIonById } from '../catalogue';
import type { ActivityModel } from './activity';
import { fail } from './failure';
import { solveInverse } from './inverse';
import { addReagent, cloneContents, molesPerLitreDispensed } from './mixture';
import type { Contents, ReagentSpec } from './mixture';
import { MAX_COMPONENT_M, prepareProblem } from './problem';
import { solve } from './solver';

/** The contract of SALTDOSE: fed back, the ionic strength is within this fraction of the target. */
export const IONIC_STRENGTH_RELATIVE_TOLERANCE = 1e-9;

export interface SaltDoseResult {
  /** moles of salt formula units */
  moles: number;
  /** the equilibrium ionic strength with them, mol/L: the verification */
  ionicStrengthM: number;
  startIonicStrengthM: number;
}

/** The most salt, mol, that the volume holds: each component at most MAX_COMPONENT_M, a stock's volume within what is left. */
function saltLimit(contents: Contents, spec: ReagentSpec): { moles: number; byVolume: boolean } {
  const volumeL = contents.volumeL;
  let moles = Infinity, byVolume = false;
  const reagent = spec.resolved.reagent;
  for (const s of reagent.systems) if (s.count > 0) moles = Math.min(moles, (MAX_COMPONENT_M * volumeL - (contents.systemMoles.get(s.systemId) ?? 0)) / s.count);
  for (const ion of reagent.ions) if (ion.count > 0) moles = Math.min(moles, (MAX_COMPONENT_M * volumeL - (contents.ionMoles.get(ion.ionId) ?? 0)) / ion.count);
  const perL = molesPerLitreDispensed(spec);
  if (perL !== undefined) {
    const roomL = volumeL - contents.rows.reduce((sum, r) => sum + r.volumeL, 0);
    if (roomL * perL < moles) { moles = roomL * perL; byVolume = true; }
  }
  if (!Number.isFinite(moles)) moles = MAX_COMPONENT_M * volumeL;
  return { moles: moles * (1 - 1e-9), byVolume };
}

/** Ionic strength per mole of salt in the volume from its strong ions alone (a first guess's slope). */
function strongIonSlope(spec: ReagentSpec, volumeL: number): number {
  let z2 = 0;
  for (const ion of spec.resolved.reagent.ions) {
    const charge = strongIonById(ion.ionId)?.charge ?? 0;
    z2 += ion.count * charge * charge;
  }
  return z2 / 2 / volumeL;
}

/**
 * Amount of `salt` that brings the mixture's equilibrium ionic strength (mol/L, as IONICSTRENGTH)
 * to the target, in the mixture's final volume: bracketed between none and the salt's limit,
 * found on the forward solve, verified there (1e-9 relative). A target no amount reaches is
 * `unreachable_target` with the reachable range. Example: saltForIonicStrength(0.15, contents, parseReagentSpec('NaCl', 'salt'), 25, 'davies').moles.
 */
export function saltForIonicStrength(targetM: number, contents: Contents, spec: ReagentSpec, temperatureC: number, model: ActivityModel): SaltDoseResult {
  const start = solve(prepareProblem(contents, temperatureC, model));
  const limit = saltLimit(contents, spec);
  const name = spec.stockM !== undefined ? `${spec.stockM} M ${spec.resolved.reagent.name}` : spec.resolved.reagent.name;
  if (!(limit.moles > 0)) {
    fail({ code: 'unreachable_target', argument: 'targetIonicStrength', received: `${targetM} mol/L`, reason: `no ${name} fits in the volume`, expected: 'a larger volume, or a solid or more concentrated salt' });
  }
  const forward = (moles: number): number => {
    const mixed = cloneContents(contents);
    addReagent(mixed, spec.resolved.reagent, moles);
    return solve(prepareProblem(mixed, temperatureC, model)).ionicStrengthM;
  };
  const slope = strongIonSlope(spec, contents.volumeL);
  const guess = slope > 0 && targetM > start.ionicStrengthM ? (targetM - start.ionicStrengthM) / slope : undefined;
  const outcome = solveInverse({
    forward, limit: limit.moles, target: targetM, tolerance: IONIC_STRENGTH_RELATIVE_TOLERANCE * targetM, quantity: 'ionic strength',
    argument: 'targetIonicStrength', atZero: start.ionicStrengthM, guess,
  });
  if (outcome.found) return { moles: outcome.amount, ionicStrengthM: outcome.value, startIonicStrengthM: start.ionicStrengthM };
  const below = targetM < outcome.lowest;
  const text = (x: number): string => String(Number(x.toPrecision(4)));
  return fail({
    code: 'unreachable_target', argument: 'targetIonicStrength', received: `${targetM} mol/L`,
    reason: below && outcome.lowest === outcome.atZero
      ? `the mixture's ionic strength is already ${text(outcome.atZero)} mol/L before any ${name}`
      : `${name} takes it only to ${text(outcome.highest)} mol/L ${outcome.searchedTo < limit.moles ? 'as far as the activity model converges' : limit.byVolume ? 'with as much as fits in the volume' : `at the ${MAX_COMPONENT_M} mol/L limit of a component`}`,
    reachable: { quantity: 'ionic strength', low: outcome.lowest, high: outcome.highest, unit: ' mol/L' },
    expected: below ? 'a target above the starting ionic strength, or a more dilute mixture' : 'a target in the reachable range, a larger volume, or a salt with more highly charged ions',
  });
}
