import type { ActivityModel } from './activity';
import { fail, quote } from './failure';
import { addReagent, cloneContents, molesPerLitreDispensed } from './mixture';
import type { Contents, ReagentSpec } from './mixture';
import { prepareProblem } from './problem';
import { chargeOf, iterateActivity, prepareTarget, reagentVector } from './linearTarget';
import { solve } from './solver';
import type { Equilibrium } from './solver';
import { findUnit } from './units';
import type { Unit } from './units';

export interface TitrantResult {
  /** moles of titrant formula units */
  moles: number;
  /** volume of titrant, L, for a stock or liquid; 0 for a solid */
  volumeL: number;
  startPH: number;
}

/** L per mole of titrant (its own volume, which dilutes the mixture); 0 for a solid. */
export function litresPerMole(spec: ReagentSpec): number {
  const perL = molesPerLitreDispensed(spec);
  return perL === undefined ? 0 : 1 / perL;
}

function describeTitrant(spec: ReagentSpec): string {
  return spec.stockM !== undefined ? `${spec.stockM} M ${spec.resolved.reagent.name}` : spec.resolved.reagent.name;
}

/** The equilibrium of the mixture with `moles` of titrant added (volume grows by its own volume). */
export function withTitrant(contents: Contents, spec: ReagentSpec, moles: number, temperatureC: number, model: ActivityModel): Equilibrium {
  const mixed = cloneContents(contents);
  addReagent(mixed, spec.resolved.reagent, moles);
  mixed.volumeL = contents.volumeL + moles * litresPerMole(spec);
  return solve(prepareProblem(mixed, temperatureC, model));
}

/** pH of the titrant on its own, for a stock or liquid; undefined for a solid. */
function titrantOwnPH(spec: ReagentSpec, temperatureC: number, model: ActivityModel): number | undefined {
  const perL = molesPerLitreDispensed(spec);
  if (perL === undefined) return undefined;
  const alone: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL: 1, rows: [] };
  addReagent(alone, spec.resolved.reagent, perL);
  return solve(prepareProblem(alone, temperatureC, model)).pH;
}

/**
 * Amount of titrant that brings the mixture to the target pH, solved directly at the target:
 * V(n)(h − Kw/h) + Σ charges of the mixture + n · charge per mole of titrant = 0, linear in n.
 */
export function titrantForTarget(targetPH: number, contents: Contents, spec: ReagentSpec, temperatureC: number, model: ActivityModel): TitrantResult {
  const start = solve(prepareProblem(contents, temperatureC, model));
  const target = prepareTarget(contents, [spec.resolved.reagent], temperatureC, model);
  const vector = reagentVector(target, spec.resolved.reagent);
  const lPerMol = litresPerMole(spec);
  const result = iterateActivity(target, targetPH, (at) => {
    const mixtureCharge = chargeOf(target.problem, target.base, at.lnH);
    const perMole = chargeOf(target.problem, vector, at.lnH);
    const numerator = target.baseVolumeL * at.waterChargeM + mixtureCharge;
    const denominator = lPerMol * at.waterChargeM + perMole;
    const moles = -numerator / denominator;
    return { amountsMol: [moles], volumeL: target.baseVolumeL + Math.max(0, moles) * lPerMol, vectors: [vector] };
  });
  const moles = result ? result.amountsMol[0] : NaN;
  if (Math.abs(targetPH - start.pH) < 1e-12) return { moles: 0, volumeL: 0, startPH: start.pH };
  if (!(moles >= 0) || !Number.isFinite(moles)) {
    const ownPH = titrantOwnPH(spec, temperatureC, model);
    const name = describeTitrant(spec);
    const startText = start.pH.toFixed(2);
    const raises = ownPH !== undefined ? ownPH > start.pH : chargeOf(target.problem, vector, start.lnH) > 0;
    const wrongWay = raises ? targetPH < start.pH : targetPH > start.pH;
    const reason = wrongWay
      ? `the mixture starts at pH ${startText} and ${name} ${raises ? 'raises' : 'lowers'} it, but the target is on the other side`
      : `the target lies beyond what ${name} can reach${ownPH !== undefined ? `: on its own it has pH ${ownPH.toFixed(2)}` : ''}`;
    fail({
      code: 'unreachable_target', argument: 'targetPH', received: `pH ${targetPH}`, reason,
      expected: wrongWay ? `a target ${raises ? 'above' : 'below'} pH ${startText}, or a titrant that ${raises ? 'lowers' : 'raises'} pH` : 'a more concentrated titrant, or a target closer to the starting pH',
    });
  }
  return { moles, volumeL: moles * lPerMol, startPH: start.pH };
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
  const okKinds = dispensed ? ['volume', 'amount'] : ['mass', 'amount'];
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
