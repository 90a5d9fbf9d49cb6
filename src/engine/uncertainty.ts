import { ionicStrengthFactorSlope } from './activity';
import { fail } from './failure';
import type { Contents } from './mixture';
import type { Problem } from './problem';
import type { Equilibrium, JointJacobian } from './solver';
import { jointJacobian, lnGammaZ2For } from './solver';
import { dpKaPerK } from './temperature';
import { solutionDensity, stoichiometricParts } from './density';
import { excipientParts } from './problem';
import { debyeHuckelA, pKw } from './water';

// Sensitivities of the pH to its inputs by implicit differentiation of the solved system
// F(y, L; θ) = (charge balance, L − g(I)) = 0 at the solution: d(y, L)/dθ = −J⁻¹ ∂F/∂θ, with J the solver's own
// Newton matrix (jointJacobian), and pH = −(y + L − ln ρw)/ln 10. No finite differences of the solve.

const joint: JointJacobian = { f: 0, F2: 0, j11: 0, j12: 0, j21: 0, j22: 0, scale: 0, ionicStrengthM: 0 };

/**
 * ∂F/∂θ of one parameter: the charge balance's (mol/L) and the ionic strength's (mol/L), from which F2's follows;
 * `dF2` adds a direct term of F2 (for A and ρw), `dpH` a direct term of the pH (for ρw).
 */
interface Partial { df: number; dI: number; dF2?: number; dpH?: number }

/** Moments of one system's forms at the solution, for the partial derivatives of F. */
interface Moments { alpha: Float64Array; meanJ: number; meanZ2: number }

/** The pH's implicit derivatives at a solution: call `dpH` with ∂f and ∂I of any parameter. */
export class PHSensitivity {
  private readonly a11: number; private readonly a12: number; private readonly a21: number; private readonly a22: number;
  private readonly dg: number;
  readonly moments: Moments[];
  readonly ohM: number;

  constructor(readonly eq: Equilibrium) {
    const p = eq.problem;
    // the implicit derivatives hold each species' specific-ion offset fixed, but under sit it moves with every
    // amount (Na⁺ from a salt row, the forms with the pH): refused rather than a budget that leaves that out
    if (p.sit) {
      fail({ code: 'bad_model', argument: 'model', received: 'sit', expected: 'davies, bates-guggenheim or ideal: implicit derivatives hold the sit ε terms fixed (under sit the budget differences full solves, budgetSensitivities.ts)' });
    }
    const L = lnGammaZ2For(p, eq.ionicStrengthM);
    jointJacobian(p, eq.lnH, L, joint);
    const det = joint.j11 * joint.j22 - joint.j12 * joint.j21;
    this.a11 = joint.j22 / det; this.a12 = -joint.j12 / det; this.a21 = -joint.j21 / det; this.a22 = joint.j11 / det;
    const rho = Math.exp(p.lnWaterDensity);
    const ionicMolal = joint.ionicStrengthM / rho;
    // dg/dI per mol/L, as in jointJacobian: F2 = L − g(I)
    this.dg = ionicMolal > 1e-12 ? (-p.debyeHuckelA * Math.LN10 * ionicStrengthFactorSlope(p.model, ionicMolal)) / rho : 0;
    this.ohM = Math.exp(p.lnKwc - eq.lnH);
    this.moments = p.systems.map((s) => {
      const n = s.lnCumK.length;
      const logs = Array.from({ length: n }, (_, j) => s.lnCumK[j] - j * eq.lnH);
      const max = Math.max(...logs);
      const w = logs.map((u) => Math.exp(u - max));
      const sum = w.reduce((x, y) => x + y, 0);
      const alpha = Float64Array.from(w, (x) => x / sum);
      let meanJ = 0, meanZ2 = 0;
      alpha.forEach((a, j) => { meanJ += a * j; meanZ2 += a * (s.z0 - j) ** 2; });
      return { alpha, meanJ, meanZ2 };
    });
  }

  /** dpH/dθ from the parameter's partial derivatives of the charge balance and of the ionic strength. */
  dpH(part: Partial): number {
    const dF1 = part.df, dF2 = -this.dg * part.dI + (part.dF2 ?? 0);
    const dy = -(this.a11 * dF1 + this.a12 * dF2);
    const dL = -(this.a21 * dF1 + this.a22 * dF2);
    return -(dy + dL) / Math.LN10 + (part.dpH ?? 0);
  }

  /** dpH per unit of ln ρw: every cumulative constant moves by j·ln ρw, Kw by 2 ln ρw, g(I) through I/ρw, pH directly. */
  perLnWaterDensity(): number {
    const p = this.eq.problem;
    let df = -2 * this.ohM, dI = this.ohM;
    p.systems.forEach((s, i) => {
      const m = this.moments[i], c = p.totalsM[i];
      let jj = 0, jz = 0;
      m.alpha.forEach((a, j) => { jj += a * j * j; jz += a * j * (s.z0 - j) ** 2; });
      df -= c * (jj - m.meanJ * m.meanJ);
      dI += (c / 2) * (jz - m.meanJ * m.meanZ2);
    });
    // g = −A ln10 F(I/ρw): at fixed I, ∂g/∂ln ρw = −dg·I with dg = ∂g/∂I (per mol/L), so ∂F2/∂ln ρw = dg·I
    return this.dpH({ df, dI, dF2: this.dg * this.eq.ionicStrengthM, dpH: 1 / Math.LN10 });
  }

  /** dpH per unit of the Debye–Hückel A: F2 = L − g with g proportional to A. */
  perDebyeHuckelA(): number {
    const p = this.eq.problem;
    const g = lnGammaZ2For(p, this.eq.ionicStrengthM);
    return this.dpH({ df: 0, dI: 0, dF2: p.debyeHuckelA > 0 ? -g / p.debyeHuckelA : 0 }); // ∂F2/∂A = −∂g/∂A = −g/A
  }

  /** dpH per mol/L of system i's total. */
  perSystemM(i: number): number {
    const s = this.eq.problem.systems[i], m = this.moments[i];
    return this.dpH({ df: s.z0 - m.meanJ, dI: m.meanZ2 / 2 });
  }

  /** dpH per mol/L of a strong ion of this charge. */
  perIonM(charge: number): number {
    return this.dpH({ df: charge, dI: (charge * charge) / 2 });
  }

  /** dpH per unit of pKa of system i's step k (0-based) at the problem's temperature. */
  perPKa(i: number, k: number): number {
    const s = this.eq.problem.systems[i], m = this.moments[i], c = this.eq.problem.totalsM[i];
    let pAfter = 0, jAfter = 0, z2After = 0;
    m.alpha.forEach((a, j) => { if (j > k) { pAfter += a; jAfter += a * j; z2After += a * (s.z0 - j) ** 2; } });
    // ln Ka enters every cumulative constant past step k; pKa = −ln Ka / ln 10
    const perLnKa = this.dpH({ df: -c * (jAfter - m.meanJ * pAfter), dI: (c / 2) * (z2After - m.meanZ2 * pAfter) });
    return -Math.LN10 * perLnKa;
  }

  /** dpH per unit of pKw. */
  perPKw(): number {
    return -Math.LN10 * this.dpH({ df: -this.ohM, dI: this.ohM / 2 });
  }

  /**
   * dpH per kelvin, through each pKa (dpKa/dT from its ΔrH° and ΔrCp°), pKw, the Debye–Hückel A and the kg of water
   * per litre (the solution's density at its composition in mol/L); the slopes of the explicit formulas (IAPWS pKw, A,
   * the density fits) by a central difference of those formulas, the solve's own sensitivity implicit.
   */
  perKelvin(): number {
    const p = this.eq.problem, t = p.temperatureC, h = 0.005;
    const slope = (fn: (x: number) => number): number => (fn(t + h) - fn(t - h)) / (2 * h);
    let total = this.perPKw() * slope(pKw)
      + this.perDebyeHuckelA() * slope(debyeHuckelA)
      + this.perLnWaterDensity() * slope((x) => Math.log(solutionDensity([...p.density.parts], x).waterKgPerL));
    p.systems.forEach((s, i) => {
      if (p.totalsM[i] <= 0) return;
      s.system.steps.forEach((step, k) => { total += this.perPKa(i, k) * dpKaPerK(step, t); });
    });
    return total;
  }
}

/**
 * ln of the kg of water per litre of the problem's solution with each row's reagent moved by deltaM[r] mol/L: the
 * density formula alone (density.ts), no solve, for the density's part of the amount and volume sensitivities.
 */
function lnWaterMoved(p: Problem, contents: Contents, deltaM: number[]): number {
  const totals = Float64Array.from(p.totalsM);
  const ionsM = p.ions.map((ion) => ion.concentrationM);
  contents.rows.forEach((row, r) => {
    if (!deltaM[r]) return;
    for (const s of row.reagent.systems) { const i = p.systems.findIndex((x) => x.system.id === s.systemId); if (i >= 0) totals[i] += deltaM[r] * s.count; }
    for (const ion of row.reagent.ions) { const i = p.ions.findIndex((x) => x.id === ion.ionId); if (i >= 0) ionsM[i] += deltaM[r] * ion.count; }
  });
  const moved = { ...contents, rows: contents.rows.map((row, r) => ({ ...row, moles: row.moles + deltaM[r] * contents.volumeL })) };
  const parts = stoichiometricParts(p.systems.map((s, i) => ({ system: s.system, totalM: totals[i], lnKa: s.lnKa })),
    p.ions.map((ion, i) => ({ id: ion.id, charge: ion.charge, concentrationM: ionsM[i] })), excipientParts(moved));
  return Math.log(solutionDensity(parts, p.temperatureC).waterKgPerL);
}

/**
 * d ln w per unit step of the composition along deltaPerUnit (mol/L of each row), by a central difference of the density
 * formula; `forward`: a forward difference, for a row at amount 0 (a step back would be a negative amount).
 */
function lnWaterSlope(p: Problem, contents: Contents, deltaPerUnit: number[], h: number, forward = false): number {
  const at = (k: number): number => lnWaterMoved(p, contents, deltaPerUnit.map((d) => d * k * h));
  // forward: Richardson-extrapolated, (4 f(h) − f(2h) − 3 f(0)) / 2h, error of order h²
  return forward ? (4 * at(1) - at(2) - 3 * at(0)) / (2 * h) : (at(1) - at(-1)) / (2 * h);
}

/**
 * Per row: dpH per unit of its amount (in the unit it was typed in), through what the row releases, and through the
 * kg of water per litre the row's solute changes (the solution's density). `molesPerUnit[r]`: the row's moles of
 * reagent per unit of its amount (a row's moles are proportional to its amount), so a row at 0 has its slope too.
 */
export function rowAmountSensitivities(sens: PHSensitivity, contents: Contents, molesPerUnit: number[]): number[] {
  const p = sens.eq.problem;
  const perLnWater = sens.perLnWaterDensity();
  return contents.rows.map((row, r) => {
    const perUnit = molesPerUnit[r];
    if (!(perUnit > 0)) return 0; // water, or a row that releases nothing
    const along = contents.rows.map((_, k) => (k === r ? perUnit / contents.volumeL : 0));
    // the density formula's slope by a difference of ± 1e-4 of the row's amount, or at amount 0 forward by 1 µmol/L of it
    // (the formula has kinks where its protons change hands, within a few mmol/L of a row at 0; it has no solve noise)
    const viaDensity = perLnWater * (row.moles > 0 ? lnWaterSlope(p, contents, along, (1e-4 * row.moles) / perUnit) : lnWaterSlope(p, contents, along, (1e-6 * contents.volumeL) / perUnit, true));
    return releasedSensitivity(sens, contents, row.reagent) * perUnit + viaDensity;
  });
}

/**
 * dpH per mole of `reagent` added to the mixture (in its final volume), the density's share included: as a row of it
 * at amount 0 (rowAmountSensitivities' forward density step of 1 µmol/L).
 * @example reagentSensitivity(new PHSensitivity(eq), contents, hcl) // dpH per mol of HCl more
 */
export function reagentSensitivity(sens: PHSensitivity, contents: Contents, reagent: Contents['rows'][number]['reagent']): number {
  const rows = [...contents.rows, { row: 0, text: '', reagent, moles: 0, volumeL: 0 }];
  return rowAmountSensitivities(sens, { ...contents, rows }, rows.map((_, k) => (k === rows.length - 1 ? 1 : 0)))[rows.length - 1];
}

/**
 * dpH per mole of a reagent's formula units in the final volume, through what it releases (its systems and ions),
 * at fixed density (rowAmountSensitivities adds the density's share).
 */
function releasedSensitivity(sens: PHSensitivity, contents: Contents, reagent: Contents['rows'][number]['reagent']): number {
  const p = sens.eq.problem;
  let perMole = 0;
  for (const s of reagent.systems) {
    const i = p.systems.findIndex((x) => x.system.id === s.systemId);
    if (i >= 0) perMole += (s.count / contents.volumeL) * sens.perSystemM(i);
  }
  for (const ion of reagent.ions) {
    const found = p.ions.find((x) => x.id === ion.ionId);
    if (found) perMole += (ion.count / contents.volumeL) * sens.perIonM(found.charge);
  }
  return perMole;
}

/** dpH per litre of final volume: every row not given as a concentration dilutes as the volume grows (its solutes, and their share of the density). */
export function volumeSensitivity(sens: PHSensitivity, contents: Contents, concentrationRows: boolean[]): number {
  const p = sens.eq.problem;
  const along = contents.rows.map((row, r) => (concentrationRows[r] ? 0 : -row.moles / contents.volumeL ** 2));
  let total = sens.perLnWaterDensity() * lnWaterSlope(p, contents, along, 1e-4 * contents.volumeL);
  contents.rows.forEach((row, r) => {
    if (concentrationRows[r]) return;
    for (const s of row.reagent.systems) {
      const i = p.systems.findIndex((x) => x.system.id === s.systemId);
      if (i >= 0) total += sens.perSystemM(i) * (-(row.moles * s.count) / contents.volumeL ** 2);
    }
    for (const ion of row.reagent.ions) {
      const found = p.ions.find((x) => x.id === ion.ionId);
      if (found) total += sens.perIonM(found.charge) * (-(row.moles * ion.count) / contents.volumeL ** 2);
    }
  });
  return total;
}

/** For tests and Monte Carlo: the same problem with every pKa and pKw shifted (their ΔrH°, ΔrCp° kept). */
export function shiftConstants(problem: Problem, pKaShifts: number[][], pKwShift: number): void {
  problem.systems.forEach((s, i) => {
    const lnKa = Float64Array.from(s.lnKa);
    pKaShifts[i]?.forEach((d, k) => { lnKa[k] -= d * Math.LN10; });
    s.lnKa = lnKa;
  });
  problem.lnKw -= pKwShift * Math.LN10;
}
