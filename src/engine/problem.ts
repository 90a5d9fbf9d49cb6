import type { AcidSystem, Reagent } from '../catalogue';
import { strongIonById } from '../catalogue';
import { fail } from './failure';
import type { ActivityModel } from './activity';
import { stepOrderOf, stoichiometricParts, solutionDensity } from './density';
import type { DensityPartAmount, SolutionDensity, SystemAmount } from './density';
import { compositionMassGPerMol, parseFormula } from './formula';
import type { Contents } from './mixture';
import { systemFor } from './registry';
import { prepareSit } from './sit';
import type { SitState } from './sit';
import { pKaAt } from './temperature';
import { checkWaterRange, debyeHuckelA, pKw } from './water';

export interface PreparedSystem {
  system: AcidSystem;
  /** charge of the most protonated form */
  z0: number;
  /** thermodynamic ln Ka of each step at the problem's temperature */
  lnKa: Float64Array;
  /** conditional cumulative ln K (scratch, set by `setActivity`); lnCumK[0] = 0 */
  lnCumK: Float64Array;
  /** d lnCumK[j] / d lnGammaZ2 = Σ_{k≤j} 2 (z0 − k): how the constants move with the activity correction */
  lnCumKSlope: Float64Array;
}

export interface PreparedIon {
  id: string;
  charge: number;
  concentrationM: number;
}

/** An equilibrium problem at one temperature and activity model, in mol/L. */
export interface Problem {
  temperatureC: number;
  model: ActivityModel;
  /** Debye–Hückel A, molal scale */
  debyeHuckelA: number;
  /**
   * ln of the kilograms of water per litre of solution, w = ρsolution − Σ c·M (density.ts): the factor that turns
   * mol/L into mol/kg (m = c/w) everywhere; pure water's density ρw when the solution is dilute
   */
  lnWaterDensity: number;
  /** the solution's density and what it was computed from, fixed by the composition the problem was prepared with */
  density: SolutionDensity;
  lnKw: number;
  systems: PreparedSystem[];
  totalsM: Float64Array;
  ions: PreparedIon[];
  strongChargeM: number;
  strongZ2M: number;
  /** current ln γ per z² (scratch) */
  lnGammaZ2: number;
  /** current conditional ln Kw (scratch) */
  lnKwc: number;
  /** count of charge-balance evaluations, for benchmarks */
  evaluations: number;
  /** every step as system index · 8 + step index, strongest acid first (for the starting guess) */
  stepOrder: Int32Array;
  /** warnings the contents carried in (made solutions), shown with the model's own */
  notes: readonly string[];
  /** the specific-ion offsets and water activity under `sit` (sit.ts); undefined for the other models */
  sit?: SitState;
}

interface TemperatureConstants {
  debyeHuckelA: number;
  lnKw: number;
}

// Constants depend on temperature only: computed once per temperature and system.
const waterCache = new Map<number, TemperatureConstants>();
// per catalogue system, by temperature (°C)
const lnKaCache = new WeakMap<AcidSystem, Map<number, Float64Array>>();

function waterConstants(temperatureC: number): TemperatureConstants {
  let c = waterCache.get(temperatureC);
  if (!c) {
    c = { debyeHuckelA: debyeHuckelA(temperatureC), lnKw: -pKw(temperatureC) * Math.LN10 };
    if (waterCache.size > 10000) waterCache.clear();
    waterCache.set(temperatureC, c);
  }
  return c;
}

export function checkSystemRange(system: AcidSystem, temperatureC: number, argument = 'temperature'): void {
  const [lo, hi] = system.temperatureRangeC;
  if (!(temperatureC >= lo && temperatureC <= hi)) {
    fail({ code: 'out_of_range', argument, received: `${temperatureC} °C`, expected: `${lo} to ${hi} °C, the range the ${system.name} data hold for` });
  }
}

export function lnKaAt(system: AcidSystem, temperatureC: number): Float64Array {
  // a custom system may be redefined under the same id: computed each time
  if (system.custom) return Float64Array.from(system.steps, (step) => -pKaAt(step, temperatureC) * Math.LN10);
  let byTemperature = lnKaCache.get(system);
  if (!byTemperature) lnKaCache.set(system, (byTemperature = new Map()));
  let lnKa = byTemperature.get(temperatureC);
  if (!lnKa) {
    lnKa = Float64Array.from(system.steps, (step) => -pKaAt(step, temperatureC) * Math.LN10);
    if (byTemperature.size > 5000) byTemperature.clear();
    byTemperature.set(temperatureC, lnKa);
  }
  return lnKa;
}

export function prepareSystem(system: AcidSystem, temperatureC: number): PreparedSystem {
  const n = system.steps.length, z0 = system.chargeMostProtonated;
  const slope = new Float64Array(n + 1);
  for (let k = 1; k <= n; k++) slope[k] = slope[k - 1] + 2 * (z0 - k);
  return { system, z0, lnKa: lnKaAt(system, temperatureC), lnCumK: new Float64Array(n + 1), lnCumKSlope: slope };
}

/** The largest concentration of one system or ion, mol/L, that aqueous solution can hold (common practice). */
export const MAX_COMPONENT_M = 20;

function checkConcentration(name: string, concentrationM: number): void {
  if (!(concentrationM <= MAX_COMPONENT_M)) {
    fail({ code: 'out_of_range', argument: 'amounts', received: `${name} at ${Number.isFinite(concentrationM) ? concentrationM.toPrecision(3) : String(concentrationM)} mol/L`,
      expected: `at most ${MAX_COMPONENT_M} mol/L of any one component; check the amount, its unit and the volume` });
  }
}

const NO_NOTES: readonly string[] = Object.freeze([]);

export function prepareProblem(contents: Contents, temperatureC: number, model: ActivityModel): Problem {
  checkWaterRange(temperatureC);
  const water = waterConstants(temperatureC);
  const systems: PreparedSystem[] = [];
  const totals: number[] = [];
  for (const [id, moles] of contents.systemMoles) {
    const system = systemFor(id);
    checkSystemRange(system, temperatureC);
    const concentrationM = moles / contents.volumeL;
    checkConcentration(system.name, concentrationM);
    systems.push(prepareSystem(system, temperatureC));
    totals.push(concentrationM);
  }
  const ions: PreparedIon[] = [];
  for (const [id, moles] of contents.ionMoles) {
    const ion = strongIonById(id);
    if (!ion) throw new Error(`catalogue inconsistency: no ion ${id}`);
    const concentrationM = moles / contents.volumeL;
    checkConcentration(id, concentrationM);
    ions.push({ id, charge: ion.charge, concentrationM });
  }
  const stepOrder = stepOrderOf(systems);
  const amounts: SystemAmount[] = [];
  for (let i = 0; i < systems.length; i++) amounts.push({ system: systems[i].system, totalM: totals[i], lnKa: systems[i].lnKa });
  const density = solutionDensity(stoichiometricParts(amounts, ions, excipientParts(contents), stepOrder), temperatureC);
  const problem: Problem = {
    temperatureC, model, debyeHuckelA: water.debyeHuckelA, lnWaterDensity: Math.log(density.waterKgPerL), density, lnKw: water.lnKw,
    systems, totalsM: Float64Array.from(totals), ions, strongChargeM: 0, strongZ2M: 0, lnGammaZ2: 0, lnKwc: 0, evaluations: 0,
    stepOrder,
    notes: contents.notes === undefined && density.warnings.length === 0 ? NO_NOTES : [...(contents.notes ?? []), ...density.warnings],
    // always present, so every problem has one shape for the solver's hot loops
    sit: undefined,
  };
  if (model === 'sit') problem.sit = prepareSit(problem);
  updateIonSums(problem);
  setActivity(problem, 0);
  return problem;
}

const excipientInfoCache = new WeakMap<Reagent, { part: string; molarMassGPerMol: number; organic: boolean }>();
/** An excipient's density part, worked out once per reagent. */
function excipientInfo(reagent: Reagent): { part: string; molarMassGPerMol: number; organic: boolean } {
  let info = excipientInfoCache.get(reagent);
  if (!info) {
    const composition = parseFormula(reagent.formula).composition;
    // a mixture of molecules (polysorbates) weighs its nominal molar mass, as its amount was reckoned with
    const molarMass = reagent.excipient?.nominalMolarMass && reagent.handbookMolarMass ? reagent.handbookMolarMass.gPerMol : compositionMassGPerMol(composition);
    info = { part: `excipient:${reagent.id}`, molarMassGPerMol: molarMass, organic: (composition.C ?? 0) > 0 };
    excipientInfoCache.set(reagent, info);
  }
  return info;
}

/** Excipient rows, which release nothing, as neutral solutes of the density (anhydrous: hydrate water is water). */
export function excipientParts(contents: Contents): DensityPartAmount[] {
  const parts: DensityPartAmount[] = [];
  for (const row of contents.rows) {
    const reagent = row.reagent;
    if (!reagent.excipient || !(row.moles > 0)) continue;
    const info = excipientInfo(reagent);
    parts.push({ part: info.part, label: reagent.name, charge: 0, concentrationM: row.moles / contents.volumeL, molarMassGPerMol: info.molarMassGPerMol, organic: info.organic });
  }
  return parts;
}

export function updateIonSums(problem: Problem): void {
  let charge = 0, z2 = 0;
  for (const ion of problem.ions) {
    charge += ion.charge * ion.concentrationM;
    z2 += ion.charge * ion.charge * ion.concentrationM;
  }
  problem.strongChargeM = charge;
  problem.strongZ2M = z2;
}

/**
 * Sets the conditional constants for ln γ = z² · lnGammaZ2 (molal constants, m = c/w, w kg of water per L); under `sit`
 * each species' ln γ also carries its offset ln10·Σ ε m and Kw the water activity (Kw = aH·aOH/aw).
 */
export function setActivity(problem: Problem, lnGammaZ2: number): void {
  problem.lnGammaZ2 = lnGammaZ2;
  const lnRho = problem.lnWaterDensity;
  const sit = problem.sit;
  const offH = sit ? sit.offset[0] : 0;
  const systems = problem.systems;
  for (let i = 0; i < systems.length; i++) {
    const s = systems[i];
    let cum = 0;
    s.lnCumK[0] = 0;
    const start = sit ? sit.formStart[i] : -1;
    for (let k = 1; k < s.lnCumK.length; k++) {
      const zBefore = s.z0 - (k - 1);
      const zAfter = s.z0 - k;
      cum += s.lnKa[k - 1] + lnRho + lnGammaZ2 * (zBefore * zBefore - 1 - zAfter * zAfter);
      // ln γ(acid) − ln γ(H⁺) − ln γ(base), the offsets' share
      if (sit) cum += sit.offset[start + k - 1] - offH - sit.offset[start + k];
      s.lnCumK[k] = cum;
    }
  }
  problem.lnKwc = problem.lnKw + 2 * lnRho - 2 * lnGammaZ2 + (sit ? sit.lnWaterActivity - offH - sit.offset[1] : 0);
}
