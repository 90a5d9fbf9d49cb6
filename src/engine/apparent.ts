import type { AcidSystem } from '../catalogue';
import { lnGammaPerZ2 } from './activity';
import type { ActivityModel } from './activity';
import { lnKaAt } from './problem';
import { naclMediumOffset } from './sit';
import { fractionsAt } from './speciation';
import { debyeHuckelA, waterDensityKgPerL } from './water';

// Constants at a stated ionic strength (mol/L) under an activity model (default Davies), as FRACTIONS,
// PKA and the pane's system view quote them: pKa' = pH − log10([A]/[HA]) = pKa + log10 γ(A) − log10 γ(HA).
// The model sees I/w (mol/kg), w the kg of water per litre: pure water's density unless a mixture's own w is
// passed (its problem.density.waterKgPerL), so that at a mixture's IONICSTRENGTH, model and w the value is the
// apparent one its CONSTANTS prints. Under `sit` a stated ionic strength is read as a NaCl medium of
// that molality (common practice for apparent constants), the forms' ε being those with Na⁺ or Cl⁻.

/**
 * Apparent pKa of each step (first proton lost first) at a temperature (°C) and ionic strength (mol/L), with I/w
 * on the molal basis (w, kg of water per litre of solution, defaults to pure water's density).
 * @example apparentPKas(phosphate, 25, 0.1, 'bates-guggenheim')[1] // ≈ 6.78
 */
export function apparentPKas(system: AcidSystem, temperatureC: number, ionicStrengthM: number, model: ActivityModel = 'davies', waterKgPerL = waterDensityKgPerL(temperatureC)): number[] {
  const molal = ionicStrengthM / waterKgPerL;
  const lnG = lnGammaPerZ2(model, molal, debyeHuckelA(temperatureC));
  const offset = (j: number): number => (model === 'sit' ? naclMediumOffset(`${system.id}/${j}`, system.chargeMostProtonated - j, molal) : 0);
  return Array.from(lnKaAt(system, temperatureC), (lnKa, i) => {
    const zAcid = system.chargeMostProtonated - i, zBase = zAcid - 1;
    return (-lnKa + lnG * (zBase * zBase - zAcid * zAcid) + offset(i + 1) - offset(i)) / Math.LN10;
  });
}

/** Fraction of each form, most protonated first, at an activity pH. */
export function fractionsAtPH(system: AcidSystem, pH: number, temperatureC: number, ionicStrengthM: number, model: ActivityModel = 'davies', waterKgPerL = waterDensityKgPerL(temperatureC)): number[] {
  const pKas = apparentPKas(system, temperatureC, ionicStrengthM, model, waterKgPerL);
  const cum = new Float64Array(pKas.length + 1);
  pKas.forEach((pKa, k) => { cum[k + 1] = cum[k] - pKa * Math.LN10; });
  return fractionsAt(cum, -pH * Math.LN10);
}
