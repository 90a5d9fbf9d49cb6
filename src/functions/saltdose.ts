import { buildContents, checkWaterRange, fail, molesToUnit, parseModel, parseReagentSpec, saltForIonicStrength, titrantUnit } from '../engine';
import { TEMPERATURE_RULE, VOLUME_RULE, mixtureRows, optionalNumber, requiredNumber, requiredText } from './args';
import type { Cell } from './args';

// SALTDOSE: the amount of a salt that brings a mixture's equilibrium ionic strength to a target,
// on the inverse mechanism TITRANT and RECIPE use, so the amount it returns is checked by the
// forward solve IONICSTRENGTH makes.

const TARGET_RULE = { min: 0, max: 100, expected: 'a target ionic strength in mol/L, from 0 to 100' };

/**
 * Amount of `salt` (a solid such as NaCl, or a stock such as 4 M NaCl) that brings the mixture in `volume` L
 * (its final volume, salt included) to `targetIonicStrength` mol/L; in resultUnit (g for a solid, mL for a stock).
 * Example: saltDose(0.15, 'NaCl', [['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1) → grams of NaCl.
 */
export function saltDose(targetIonicStrength: Cell, salt: Cell, reagents: Cell, amounts: Cell, units: Cell, volume: Cell,
  temperature?: Cell, model?: Cell, resultUnit?: Cell): number {
  const targetM = requiredNumber(targetIonicStrength, 'targetIonicStrength', TARGET_RULE);
  const spec = parseReagentSpec(requiredText(salt, 'salt', 'a salt such as NaCl or 4 M NaCl'), 'salt');
  const rows = mixtureRows(reagents, amounts, units);
  const volumeL = requiredNumber(volume, 'volume', { ...VOLUME_RULE, expected: 'the final volume in litres, salt included' });
  const temperatureC = optionalNumber(temperature ?? null, 'temperature', 25, TEMPERATURE_RULE);
  const activityModel = parseModel(model);
  const unit = titrantUnit(resultUnit, spec, 'resultUnit');
  checkWaterRange(temperatureC);
  const result = saltForIonicStrength(targetM, buildContents(rows, volumeL), spec, temperatureC, activityModel);
  const amount = molesToUnit(result.moles, spec, unit);
  if (!Number.isFinite(amount)) fail({ code: 'no_convergence', argument: 'salt', received: String(amount), expected: 'a finite result; please report this input' });
  return amount;
}
