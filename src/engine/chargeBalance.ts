import type { Problem } from './problem';

/** Written by `chargeBalance` so the solver's inner loop allocates nothing. */
export interface BalanceOut {
  /** d(charge balance)/d ln h, mol/L */
  derivative: number;
  /** ionic strength, mol/L */
  ionicStrengthM: number;
  /** Σ |z| c over all species, mol/L, the scale of the residual */
  chargeScaleM: number;
}

const full: JacobianOut = { f: 0, dfdy: 0, dfdL: 0, ionicStrengthM: 0, dIdy: 0, dIdL: 0, chargeScaleM: 0 };

/**
 * The charge balance Σ z c (mol/L) at y = ln [H⁺] (mol/L), with the problem's current
 * conditional constants. Strictly increasing in y. (One implementation serves both this and
 * the joint Newton step, so the two can never disagree.)
 */
export function chargeBalance(problem: Problem, y: number, out: BalanceOut): number {
  chargeBalanceJacobian(problem, y, full);
  out.derivative = full.dfdy;
  out.ionicStrengthM = full.ionicStrengthM;
  out.chargeScaleM = full.chargeScaleM;
  return full.f;
}

/** Written by `chargeBalanceJacobian`: the balance, the ionic strength and their partial derivatives. */
export interface JacobianOut {
  f: number;
  /** ∂f/∂ln h and ∂f/∂lnGammaZ2, mol/L */
  dfdy: number;
  dfdL: number;
  ionicStrengthM: number;
  dIdy: number;
  dIdL: number;
  chargeScaleM: number;
}

/**
 * The charge balance and ionic strength with their derivatives in y = ln h and in the activity
 * correction L (ln γ = z² L), for a joint Newton step. One pass over the forms of each system.
 */
export function chargeBalanceJacobian(problem: Problem, y: number, out: JacobianOut): void {
  problem.evaluations++;
  const h = Math.exp(y);
  const oh = Math.exp(problem.lnKwc - y);
  let f = h - oh + problem.strongChargeM;
  let dfdy = h + oh, dfdL = 2 * oh;
  let z2 = h + oh + problem.strongZ2M;
  let dz2dy = h - oh, dz2dL = -2 * oh;
  let scale = h + oh;
  for (const ion of problem.ions) scale += Math.abs(ion.charge) * ion.concentrationM;
  const systems = problem.systems;
  const sit = problem.sit;
  if (sit) { sit.molal[0] = h * sit.inverseRho; sit.molal[1] = oh * sit.inverseRho; }
  for (let i = 0; i < systems.length; i++) {
    const s = systems[i];
    const c = problem.totalsM[i];
    if (c === 0) {
      if (sit) sit.molal.fill(0, sit.formStart[i], sit.formStart[i] + s.lnCumK.length);
      continue;
    }
    const cum = s.lnCumK, slope = s.lnCumKSlope, n = cum.length - 1;
    let maxLog = -Infinity;
    for (let j = 0; j <= n; j++) { const u = cum[j] - j * y; if (u > maxLog) maxLog = u; }
    let w0 = 0, mj = 0, mjj = 0, mc = 0, mjc = 0, mz = 0, mjz = 0, mcz = 0;
    for (let j = 0; j <= n; j++) {
      const w = Math.exp(cum[j] - j * y - maxLog);
      if (sit) sit.molal[sit.formStart[i] + j] = w;
      const zj = s.z0 - j, zz = zj * zj, cj = slope[j];
      w0 += w; mj += w * j; mjj += w * j * j; mc += w * cj; mjc += w * j * cj; mz += w * zz; mjz += w * j * zz; mcz += w * cj * zz;
    }
    mj /= w0; mjj /= w0; mc /= w0; mjc /= w0; mz /= w0; mjz /= w0; mcz /= w0;
    // under sit, the forms' molalities at this point, for the specific-ion refresh that follows (sit.ts)
    if (sit) {
      const start = sit.formStart[i], k = (c * sit.inverseRho) / w0;
      for (let j = 0; j <= n; j++) sit.molal[start + j] *= k;
    }
    const varJ = Math.max(0, mjj - mj * mj);
    f += c * (s.z0 - mj);
    dfdy += c * varJ;
    dfdL -= c * (mjc - mj * mc);
    z2 += c * mz;
    dz2dy -= c * (mjz - mj * mz);
    dz2dL += c * (mcz - mc * mz);
    scale += c * Math.sqrt(mz);
  }
  out.f = f;
  out.dfdy = dfdy;
  out.dfdL = dfdL;
  out.ionicStrengthM = z2 / 2;
  out.dIdy = dz2dy / 2;
  out.dIdL = dz2dL / 2;
  out.chargeScaleM = scale;
}
