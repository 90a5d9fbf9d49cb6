import { fail } from './failure';

export const KELVIN_OFFSET = 273.15;
/** Where each water property comes from, for audit output. */
export const WATER_SOURCES = {
  density: 'Kell 1975, J. Chem. Eng. Data 20, 97',
  pKw: 'IAPWS R11-07 (Bandura & Lvov 2006, J. Phys. Chem. Ref. Data 35, 15), at 0.1 MPa',
  debyeHuckelA: 'from the permittivity of Malmberg & Maryott 1956 (J. Res. NBS 56, 1), the Kell density and CODATA 2018 constants',
} as const;

/** Range over which the water properties below all hold (Kell density 0–150 °C, Malmberg–Maryott permittivity 0–100 °C). */
export const WATER_RANGE_C: [number, number] = [0, 100];

export function checkWaterRange(temperatureC: number, argument = 'temperature'): void {
  if (!(temperatureC >= WATER_RANGE_C[0] && temperatureC <= WATER_RANGE_C[1])) {
    fail({ code: 'out_of_range', argument, received: `${temperatureC} °C`, expected: `${WATER_RANGE_C[0]} to ${WATER_RANGE_C[1]} °C, where the properties of water are tabulated` });
  }
}

/** Density of air-free water at 0.1 MPa, kg/L (Kell 1975, J. Chem. Eng. Data 20, 97; 0–150 °C). */
export function waterDensityKgPerL(temperatureC: number): number {
  // the last temperature asked for: a what-if table asks at one temperature row after row
  if (temperatureC === lastDensityC) return lastDensityKgPerL;
  const t = temperatureC;
  const num = 999.83952 + 16.945176 * t - 7.9870401e-3 * t ** 2 - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5;
  lastDensityC = temperatureC;
  lastDensityKgPerL = num / (1 + 16.87985e-3 * t) / 1000;
  return lastDensityKgPerL;
}
let lastDensityC = NaN, lastDensityKgPerL = NaN;

/** Relative permittivity of water (Malmberg & Maryott 1956, J. Res. NBS 56, 1; 0–100 °C). */
export function waterPermittivity(temperatureC: number): number {
  const t = temperatureC;
  return 87.74 - 0.40008 * t + 9.398e-4 * t ** 2 - 1.41e-6 * t ** 3;
}

// CODATA 2018 exact or recommended values.
const ELEMENTARY_CHARGE_C = 1.602176634e-19;
const VACUUM_PERMITTIVITY_F_PER_M = 8.8541878128e-12;
const BOLTZMANN_J_PER_K = 1.380649e-23;
const AVOGADRO_PER_MOL = 6.02214076e23;

/**
 * Debye–Hückel A, (kg/mol)^½ for log10 γ on the molal scale:
 * A = (2π N_A ρw)^½ (e² / 4π ε0 εr k T)^{3/2} / ln 10.
 */
export function debyeHuckelA(temperatureC: number): number {
  const temperatureK = temperatureC + KELVIN_OFFSET;
  const densityKgPerM3 = waterDensityKgPerL(temperatureC) * 1000;
  const bjerrumM = ELEMENTARY_CHARGE_C ** 2 / (4 * Math.PI * VACUUM_PERMITTIVITY_F_PER_M * waterPermittivity(temperatureC) * BOLTZMANN_J_PER_K * temperatureK);
  return Math.sqrt(2 * Math.PI * AVOGADRO_PER_MOL * densityKgPerM3) * bjerrumM ** 1.5 / Math.LN10;
}

/**
 * pKw at 0.1 MPa from IAPWS R11-07 (Bandura & Lvov 2006, J. Phys. Chem. Ref. Data 35, 15),
 * with the density of water from Kell 1975.
 */
export function pKw(temperatureC: number): number {
  const T = temperatureC + KELVIN_OFFSET;
  const rho = waterDensityKgPerL(temperatureC); // g/cm³
  const n = 6;
  const alpha0 = -0.864671, alpha1 = 8659.19, alpha2 = -22786.2;
  const beta0 = 0.642044, beta1 = -56.8534, beta2 = -0.375754;
  const molarMassWater = 18.015268;
  const Z = rho * Math.exp(alpha0 + alpha1 / T + (alpha2 / T ** 2) * rho ** (2 / 3));
  const pKwGas = 0.61415 + 48251.33 / T - 67707.93 / T ** 2 + 10102100 / T ** 3;
  return -2 * n * (Math.log10(1 + Z) - (Z / (Z + 1)) * rho * (beta0 + beta1 / T + beta2 * rho)) + pKwGas + 2 * Math.log10(molarMassWater / 1000);
}
