import type { Problem } from './problem';
import { systemMoments } from './speciation';
import type { Moments } from './speciation';

/** Written by `chargeBalance` so the solver's inner loop allocates nothing. */
export interface BalanceOut {
  /** d(charge balance)/d ln h, mol/L */
  derivative: number;
  /** ionic strength, mol/L */
  ionicStrengthM: number;
  /** Σ |z| c over all species, mol/L, the scale of the residual */
  chargeScaleM: number;
}

const moments: Moments = { mean: 0, variance: 0 };

/**
 * The charge balance Σ z c (mol/L) at y = ln [H⁺] (mol/L), with the problem's current
 * conditional constants. Strictly increasing in y.
 */
export function chargeBalance(problem: Problem, y: number, out: BalanceOut): number {
  problem.evaluations++;
  const h = Math.exp(y);
  const oh = Math.exp(problem.lnKwc - y);
  let f = h - oh + problem.strongChargeM;
  let df = h + oh;
  let z2 = h + oh + problem.strongZ2M;
  let scale = h + oh;
  for (const ion of problem.ions) scale += Math.abs(ion.charge) * ion.concentrationM;
  const systems = problem.systems;
  for (let i = 0; i < systems.length; i++) {
    const s = systems[i];
    const c = problem.totalsM[i];
    if (c === 0) continue;
    systemMoments(s.lnCumK, y, moments);
    const meanCharge = s.z0 - moments.mean;
    f += c * meanCharge;
    df += c * moments.variance;
    const meanZ2 = meanCharge * meanCharge + moments.variance;
    z2 += c * meanZ2;
    scale += c * Math.sqrt(meanZ2);
  }
  out.derivative = df;
  out.ionicStrengthM = z2 / 2;
  out.chargeScaleM = scale;
  return f;
}
