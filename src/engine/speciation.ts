// The distribution of one acid system over its forms, in a numerically stable form:
// log-weights are shifted by their maximum before exponentiation, so totals from 1e-12 to
// 10 mol/L and pH −1 to 15 neither overflow nor lose the small fractions.

/** Moments of the number of protons lost, written by `systemMoments` (no allocation per call). */
export interface Moments {
  /** mean number of protons lost */
  mean: number;
  /** variance of the number of protons lost (d mean / d ln h = −variance) */
  variance: number;
}

/**
 * `lnCumK[j]` = Σ_{k≤j} ln Kc_k (lnCumK[0] = 0); `lnProton` = ln of the proton variable the
 * constants are expressed in. Fills `fractions` (length n+1) when given.
 */
export function systemMoments(lnCumK: Float64Array, lnProton: number, out: Moments, fractions?: Float64Array | number[]): void {
  const n = lnCumK.length - 1;
  let maxLog = -Infinity;
  for (let j = 0; j <= n; j++) {
    const logWeight = lnCumK[j] - j * lnProton;
    if (logWeight > maxLog) maxLog = logWeight;
  }
  let sum = 0, sumJ = 0, sumJ2 = 0;
  for (let j = 0; j <= n; j++) {
    const w = Math.exp(lnCumK[j] - j * lnProton - maxLog);
    sum += w;
    sumJ += j * w;
    sumJ2 += j * j * w;
    if (fractions) fractions[j] = w;
  }
  const mean = sumJ / sum;
  out.mean = mean;
  out.variance = Math.max(0, sumJ2 / sum - mean * mean);
  if (fractions) for (let j = 0; j <= n; j++) fractions[j] /= sum;
}

// the moments fractionsAt does not return
const momentsScratch: Moments = { mean: 0, variance: 0 };

/** Fractions of each form, most protonated first, for cumulative ln-constants and ln(proton variable). */
export function fractionsAt(lnCumK: Float64Array, lnProton: number): number[] {
  // a plain array filled in place (Array.from of a typed array walks an iterator)
  const fractions: number[] = [];
  for (let j = 0; j < lnCumK.length; j++) fractions.push(0);
  systemMoments(lnCumK, lnProton, momentsScratch, fractions);
  return fractions;
}
