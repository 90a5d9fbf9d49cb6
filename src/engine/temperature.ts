import type { AcidStep } from '../catalogue';
import { KELVIN_OFFSET } from './water';

const GAS_CONSTANT_J_PER_K_MOL = 8.314462618; // CODATA 2018
const REFERENCE_K = 298.15;

/**
 * pKa at a temperature by the integrated van 't Hoff equation with constant ΔrCp°
 * (Clarke & Glew 1966 form, reference 298.15 K).
 */
export function pKaAt(step: AcidStep, temperatureC: number): number {
  const T = temperatureC + KELVIN_OFFSET;
  const dH = (step.dHkJPerMol ?? 0) * 1000;
  const dCp = step.dCpJPerKMol ?? 0;
  const lnKRatio = (-dH / GAS_CONSTANT_J_PER_K_MOL) * (1 / T - 1 / REFERENCE_K)
    + (dCp / GAS_CONSTANT_J_PER_K_MOL) * (REFERENCE_K / T - 1 + Math.log(T / REFERENCE_K));
  return step.pKa - lnKRatio / Math.LN10;
}

/** dpKa/dT at a temperature, per kelvin (ΔrH° at T = ΔrH° + ΔrCp° (T − 298.15)). */
export function dpKaPerK(step: AcidStep, temperatureC: number): number {
  const T = temperatureC + KELVIN_OFFSET;
  const dH = (step.dHkJPerMol ?? 0) * 1000 + (step.dCpJPerKMol ?? 0) * (T - REFERENCE_K);
  return -dH / (GAS_CONSTANT_J_PER_K_MOL * T * T * Math.LN10);
}
