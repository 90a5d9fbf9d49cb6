import { MODEL_LIMIT_MOLAL } from './activity';
import { chargeBalance } from './chargeBalance';
import type { BalanceOut } from './chargeBalance';
import type { Problem } from './problem';
import type { Equilibrium } from './solver';
import { systemMoments } from './speciation';

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

function row(problem: Problem, species: string, charge: number, concentrationM: number, systemId?: string): SpeciesRow {
  const gamma = Math.exp(problem.lnGammaZ2 * charge * charge);
  return { species, charge, concentrationM, activityCoefficient: gamma, activity: (gamma * concentrationM) / Math.exp(problem.lnWaterDensity), systemId };
}

/** Every species at the solution: H⁺, OH⁻, strong ions, then each form of each system. */
export function speciesRows(eq: Equilibrium): SpeciesRow[] {
  const p = eq.problem;
  const rows: SpeciesRow[] = [row(p, 'H⁺', 1, Math.exp(eq.lnH)), row(p, 'OH⁻', -1, Math.exp(p.lnKwc - eq.lnH))];
  for (const ion of p.ions) rows.push(row(p, ion.id.replace(/(\d*)\+$/, (_, n) => `${supDigits(n)}⁺`).replace(/(\d*)-$/, (_, n) => `${supDigits(n)}⁻`), ion.charge, ion.concentrationM));
  p.systems.forEach((s, i) => {
    const fractions = new Float64Array(s.lnCumK.length);
    systemMoments(s.lnCumK, eq.lnH, { mean: 0, variance: 0 }, fractions);
    fractions.forEach((alpha, j) => rows.push(row(p, s.system.forms[j] ?? `${s.system.name} form ${j}`, s.z0 - j, alpha * p.totalsM[i], s.system.id)));
  });
  return rows;
}

function supDigits(digits: string): string {
  const map: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
  return digits.split('').map((d) => map[d] ?? d).join('');
}

const scratch: BalanceOut = { derivative: 0, ionicStrengthM: 0, chargeScaleM: 0 };

/**
 * Buffer capacity β = dCb/dpH, mol/(L·pH), analytic: ln 10 (h + Kw/h + Σ C var(protons)),
 * water included, activity coefficients held at their equilibrium values.
 */
export function bufferCapacity(eq: Equilibrium): number {
  chargeBalance(eq.problem, eq.lnH, scratch);
  return Math.LN10 * scratch.derivative;
}

/**
 * Warnings, joined by "; ", when the ionic strength is above the activity model's range, a system's total
 * is above the concentration its catalogue model holds for, or a system meets a metal ion it binds; '' when none.
 */
export function modelWarning(eq: Equilibrium): string {
  const p = eq.problem;
  const warnings: string[] = [];
  const limit = MODEL_LIMIT_MOLAL[p.model];
  const ionicMolal = eq.ionicStrengthM / Math.exp(p.lnWaterDensity);
  if (p.model !== 'ideal' && ionicMolal > limit) {
    warnings.push(`ionic strength ${ionicMolal.toPrecision(3)} mol/kg is above the ${p.model} model's range (about ${limit} mol/kg): treat the pH as an estimate`);
  }
  if (p.model === 'ideal' && ionicMolal > 0.001) {
    warnings.push(`ideal model at ionic strength ${ionicMolal.toPrecision(3)} mol/kg: activity corrections are ignored`);
  }
  p.systems.forEach((s, i) => {
    const cap = s.system.concentrationLimit;
    if (cap && p.totalsM[i] > cap.maxTotalM) {
      warnings.push(`${s.system.name} total ${p.totalsM[i].toPrecision(3)} mol/L is above ${cap.maxTotalM} mol/L: ${cap.reason}`);
    }
    const binds = s.system.bindsIons;
    const bound = binds ? p.ions.filter((ion) => ion.concentrationM > 0 && binds.ionIds.includes(ion.id)).map((ion) => ion.id) : [];
    if (binds && p.totalsM[i] > 0 && bound.length > 0) warnings.push(`${s.system.name} with ${bound.join(' and ')}: ${binds.reason}`);
  });
  return warnings.join('; ');
}
