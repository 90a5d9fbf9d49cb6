import { SIT_EPSILON_BAND_C, SIT_ESTIMATE_UNCERTAINTY } from '../catalogue';
import { MODEL_LIMIT_MOLAL, ionicStrengthFactor } from './activity';
import { ProticError } from './failure';
import type { Problem } from './problem';
import { setActivity } from './problem';
import type { Equilibrium, JointJacobian } from './solver';
import { jointJacobian, lnGammaZ2For, pHWithin, solve } from './solver';
import { prepareSit, sitEstimatesInUse, sitRestore, sitSnapshot, sitStrongOffsets } from './sit';
import { fractionsAt } from './speciation';
import { ionLabel } from './ionLabel';

export { ionLabel };

export interface SpeciesRow {
  species: string;
  charge: number;
  concentrationM: number;
  activityCoefficient: number;
  /** activity on the molal scale, γ c / ρw */
  activity: number;
  /** the acid system the species belongs to, if any */
  systemId?: string;
}

function row(problem: Problem, species: string, charge: number, concentrationM: number, systemId?: string, lnGammaOffset = 0): SpeciesRow {
  const gamma = Math.exp(problem.lnGammaZ2 * charge * charge + lnGammaOffset);
  return { species, charge, concentrationM, activityCoefficient: gamma, activity: (gamma * concentrationM) / Math.exp(problem.lnWaterDensity), systemId };
}

/** Every species at the solution: H⁺, OH⁻, strong ions, then each form of each system. */
export function speciesRows(eq: Equilibrium): SpeciesRow[] {
  const p = eq.problem;
  // under sit: the offsets the solution was solved with (water ions, forms), and each strong ion's at the solution
  const sit = p.sit;
  const strong = sit ? sitStrongOffsets(p, eq.lnH) : undefined;
  const rows: SpeciesRow[] = [row(p, 'H⁺', 1, Math.exp(eq.lnH), undefined, sit?.offset[0]), row(p, 'OH⁻', -1, Math.exp(p.lnKwc - eq.lnH), undefined, sit?.offset[1])];
  p.ions.forEach((ion, k) => rows.push(row(p, ionLabel(ion.id), ion.charge, ion.concentrationM, undefined, strong?.[k])));
  p.systems.forEach((s, i) => {
    fractionsAt(s.lnCumK, eq.lnH).forEach((alpha, j) => rows.push(row(p, s.system.forms[j] ?? `${s.system.name} form ${j}`, s.z0 - j, alpha * p.totalsM[i], s.system.id,
      sit?.offset[sit.formStart[i] + j])));
  });
  return rows;
}

/** Activity models as they are published (Davies 1938; Bates and Guggenheim 1960), for warning prose. */
const MODEL_DISPLAY_NAMES: Record<string, string> = { davies: 'Davies', 'bates-guggenheim': 'Bates–Guggenheim', ideal: 'ideal', sit: 'SIT' };

/** A Davies or Bates–Guggenheim pH is flagged when it departs from the sit pH of the same mixture by more than this. */
export const SIT_DEPARTURE_PH = 0.02;
/**
 * The sit pH of the departure check is found to this (ln units; pHWithin): its pH is printed to 0.001 and compared
 * with 0.02, so it stops at the evaluated point whose Newton step and offsets' move are below 1e-6 (about 1e-6 pH;
 * 2.4e-7 at worst against the full solve over 9 buffers × 0.02–2.5 M NaCl × 2 models). It saves the last evaluation,
 * which only confirms digits never printed: 3 to 2 per solve for 50 mM phosphate in 0.05–1 M NaCl, 4 to 3 at 1.5–2.5 M.
 */
const DEPARTURE_LN_TOLERANCE = 1e-6;
/** Largest |ε| the sit model can use, kg/mol: 0.33 (Mg²⁺, ClO4⁻) in the table, 0.4 from the ClO4⁻ estimate rule at z = 2. */
const SIT_EPSILON_MAX = 0.4;

/**
 * An upper bound on |pH(model) − pH(sit)| from the ionic strength alone (mol/kg): the D terms differ by
 * A·|F(I) − D(I)| per z², which moves an acid–base pair's log(γA/γHA) by at most |1 − 2 z(acid)| times that
 * (1 for the water ions); each of the two species' Σ ε m is at most ε_max·2I; ln aw moves pKw by at most
 * 0.02·I (φ ≤ 1.1, Σm ≤ 2I). Below 0.02 the sit solve is skipped: it cannot flag anything.
 */
function departureBound(p: Problem, ionicMolal: number): number {
  let factor = 1;
  for (const s of p.systems) for (let k = 0; k < s.lnKa.length; k++) factor = Math.max(factor, Math.abs(1 - 2 * (s.z0 - k)));
  const dF = Math.abs(ionicStrengthFactor(p.model, ionicMolal) - ionicStrengthFactor('sit', ionicMolal));
  return p.debyeHuckelA * factor * dF + 2 * SIT_EPSILON_MAX * 2 * ionicMolal + 0.02 * ionicMolal;
}

/**
 * The same mixture solved under sit, for the departure warning of a Davies or Bates–Guggenheim result; undefined
 * when the bound says it cannot matter, when the ionic strength is beyond sit's own range, or when the sit solve
 * itself is refused. Exported so that `npm run bench` can state this second solve's share of WARNINGS.
 * @example sitDeparture(solve(prepareProblem(contents, 25, 'davies')))?.pH // the sit pH, or undefined
 */
export function sitDeparture(eq: Equilibrium): { pH: number } | undefined {
  const p = eq.problem;
  const ionicMolal = eq.ionicStrengthM / Math.exp(p.lnWaterDensity);
  if (ionicMolal > MODEL_LIMIT_MOLAL.sit || departureBound(p, ionicMolal) < SIT_DEPARTURE_PH) return undefined;
  // its own conditional constants (the solve writes them); the totals and strong ions it only reads, so they are shared
  const q: Problem = { ...p, model: 'sit', systems: p.systems.map((s) => ({ ...s, lnCumK: new Float64Array(s.lnCumK.length) })), evaluations: 0, sit: undefined };
  q.sit = prepareSit(q);
  try {
    // from the solver's own start, not the Davies root: at 1–3 mol/kg that root is 0.4–1 pH from sit's, and Newton
    // from it took 5–6 evaluations at 0.5–1.5 M NaCl and fell back to the bracketed method (51) from 2 M, against 4
    return { pH: pHWithin(q, DEPARTURE_LN_TOLERANCE) };
  } catch (e) {
    if (e instanceof ProticError) return undefined;
    throw e;
  }
}

/** A sit species key (`Na+`, `H+`, `phosphate/2`) as it is printed. */
function sitSpeciesLabel(p: Problem, key: string): string {
  const slash = key.lastIndexOf('/');
  if (slash < 0) return ionLabel(key);
  const s = p.systems.find((x) => x.system.id === key.slice(0, slash).replace(/\*-?\d*$/, ''));
  const j = Number(key.slice(slash + 1));
  return s?.system.forms[j] ?? key;
}

/** sit's own warnings: the charge-type ε estimates that matter here, and the 25 °C ε used away from 25 °C. */
function sitWarnings(eq: Equilibrium): string[] {
  const p = eq.problem;
  const out: string[] = [];
  const pairs = sitEstimatesInUse(p, eq.lnH);
  if (pairs.length > 0) {
    const named = pairs.map((x) => `${sitSpeciesLabel(p, x.cation)}–${sitSpeciesLabel(p, x.anion)} ${x.epsilon >= 0 ? '' : '−'}${Math.abs(x.epsilon).toFixed(2)}`);
    out.push(`sit: no published ε for ${named.join(', ')} kg/mol: charge-type estimates (Hummel 2009 rules, ± ${SIT_ESTIMATE_UNCERTAINTY}) are used`);
  }
  const [lo, hi] = SIT_EPSILON_BAND_C;
  if ((p.temperatureC < lo || p.temperatureC > hi) && eq.ionicStrengthM / Math.exp(p.lnWaterDensity) > 0.05) {
    out.push(`sit: the ε are 25 °C values (no temperature dependence is represented) used at ${p.temperatureC} °C: treat the pH as an estimate`);
  }
  return out;
}

const joint: JointJacobian = { f: 0, F2: 0, j11: 0, j12: 0, j21: 0, j22: 0, scale: 0, ionicStrengthM: 0 };

/**
 * Buffer capacity β = dCb/dpH = −dCa/dpH, mol/(L·pH) (IUPAC), analytic, water included: implicit
 * derivatives of the solved system, so the ionic strength follows the speciation as base goes in.
 * The titrant's own counter-ion is left out, so adding base and adding acid give the same β.
 */
export function bufferCapacity(eq: Equilibrium): number {
  const p = eq.problem;
  if (p.sit) return sitBufferCapacity(eq);
  // the joint Newton's last evaluation was at the solution itself: its Jacobian gives β with no evaluation of its own
  if (Number.isFinite(eq.lnActivityPerBase)) return -Math.LN10 / eq.lnActivityPerBase;
  // jointJacobian sets the problem's conditional constants; put back the solution's own, so a result
  // read from this equilibrium afterwards (SPECIES, CONSTANTS) does not depend on whether β came first
  const solvedLnGammaZ2 = p.lnGammaZ2;
  jointJacobian(p, eq.lnH, lnGammaZ2For(p, eq.ionicStrengthM), joint);
  setActivity(p, solvedLnGammaZ2);
  // d(ln h, L)/dCb = −J⁻¹ (1, 0): one mol/L of strong-base charge; pH = −(ln h + L − ln ρw)/ln 10
  const det = joint.j11 * joint.j22 - joint.j12 * joint.j21;
  const dy = -joint.j22 / det;
  const dL = joint.j21 / det;
  return -Math.LN10 / (dy + dL);
}

/**
 * β under sit: the specific-ion offsets follow the speciation, which the implicit derivatives above hold
 * fixed, so β is the central difference of two full solves with ± δ mol/L of strong-base charge (no
 * counter-ion, as above); δ = 1e-5 of the charge scale, which leaves a truncation error near 1e-10 relative.
 * The problem is put back as the solution left it.
 */
function sitBufferCapacity(eq: Equilibrium): number {
  const p = eq.problem;
  const saved = sitSnapshot(p), savedL = p.lnGammaZ2, charge = p.strongChargeM;
  const delta = 1e-5 * Math.max(eq.ionicStrengthM, Math.exp(eq.lnH), Math.exp(p.lnKwc - eq.lnH), 1e-12);
  try {
    p.strongChargeM = charge + delta;
    const up = solve(p, eq.lnH).pH;
    p.strongChargeM = charge - delta;
    const down = solve(p, eq.lnH).pH;
    return (2 * delta) / (up - down);
  } finally {
    p.strongChargeM = charge;
    sitRestore(p, saved);
    setActivity(p, savedL);
  }
}

/**
 * Warnings, joined by "; ", when the ionic strength is above the activity model's range, a system's total
 * is above the concentration its catalogue model holds for, a form is above its solubility, a step without ΔrH° is
 * used away from 25 °C, or a system meets a metal ion it binds; '' when none.
 */
export function modelWarning(eq: Equilibrium): string {
  const p = eq.problem;
  const warnings: string[] = [];
  const limit = MODEL_LIMIT_MOLAL[p.model];
  // the model's range is molal (I/ρw); it is printed in mol/L, the unit of IONICSTRENGTH and SPECIES
  const rhoW = Math.exp(p.lnWaterDensity);
  const ionicMolal = eq.ionicStrengthM / rhoW;
  const departure = p.model === 'davies' || p.model === 'bates-guggenheim' ? sitDeparture(eq) : undefined;
  if (departure !== undefined) {
    if (Math.abs(departure.pH - eq.pH) > SIT_DEPARTURE_PH) {
      warnings.push(`the ${MODEL_DISPLAY_NAMES[p.model]} pH departs from the SIT model's (${departure.pH.toFixed(3)}) by ${Math.abs(departure.pH - eq.pH).toFixed(3)} at ionic strength ${eq.ionicStrengthM.toPrecision(3)} mol/L: treat it as an estimate, or use model sit`);
    }
  } else if (p.model !== 'ideal' && ionicMolal > limit) {
    warnings.push(`ionic strength ${eq.ionicStrengthM.toPrecision(3)} mol/L is above the ${MODEL_DISPLAY_NAMES[p.model] ?? p.model} model's range (about ${Number((limit * rhoW).toPrecision(3))} mol/L here): treat the pH as an estimate`);
  }
  if (p.sit) warnings.push(...sitWarnings(eq));
  if (p.model === 'ideal' && ionicMolal > 0.001) {
    warnings.push(`ideal model at ionic strength ${eq.ionicStrengthM.toPrecision(3)} mol/L: activity corrections are ignored`);
  }
  p.systems.forEach((s, i) => {
    const cap = s.system.concentrationLimit;
    if (cap && p.totalsM[i] > cap.maxTotalM) {
      warnings.push(`${s.system.name} total ${p.totalsM[i].toPrecision(3)} mol/L is above ${cap.maxTotalM} mol/L: ${cap.reason}`);
    }
    // The total solubility in water stands in for the form's own: a little higher, so this warns late, not early.
    const sol = s.system.formSolubility;
    if (sol && p.totalsM[i] > sol.maxM) {
      const formM = fractionsAt(s.lnCumK, eq.lnH)[sol.formIndex] * p.totalsM[i];
      if (formM > sol.maxM) {
        warnings.push(`${s.system.forms[sol.formIndex]} ${formM.toPrecision(3)} mol/L is above its solubility, about ${sol.maxM} mol/L at ${sol.temperatureC} °C: ${sol.consequence}`);
      }
    }
    // outside the measured range the pKa are van 't Hoff extrapolations with the catalogue ΔrH° and ΔrCp°
    const measured = s.system.measuredRangeC;
    if (measured && p.totalsM[i] > 0 && (p.temperatureC < measured[0] || p.temperatureC > measured[1])) {
      warnings.push(`${s.system.name} at ${p.temperatureC} °C: the data were measured over ${measured[0]}–${measured[1]} °C; its pKa here are extrapolated by van 't Hoff with the catalogue ΔrH°`);
    }
    // a step with no ΔrH° keeps its 25 °C pKa at every temperature: say so where that step matters
    if (Math.abs(p.temperatureC - 25) > 2) {
      s.system.steps.forEach((step, k) => {
        if (step.dHkJPerMol === undefined && Math.abs(step.pKa - eq.pH) < 2) {
          warnings.push(`${s.system.name} step ${k + 1} has no ΔrH°: its 25 °C pKa (${step.pKa}) is used unchanged at ${p.temperatureC} °C`);
        }
      });
    }
    const binds = s.system.bindsIons;
    if (binds && p.totalsM[i] > 0) {
      const bound = p.ions.filter((ion) => ion.concentrationM > 0 && binds.ionIds.includes(ion.id)).map((ion) => ionLabel(ion.id));
      if (bound.length > 0) warnings.push(`${s.system.name} with ${bound.join(' and ')}: ${binds.reason}`);
    }
  });
  warnings.push(...p.notes);
  return warnings.join('; ');
}
