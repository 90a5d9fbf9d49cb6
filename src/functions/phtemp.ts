import { buildContents, fail, parseModel, temperatureForPH } from '../engine';
import { PH_RULE, TEMPERATURE_RULE, VOLUME_RULE, mixtureRows, optionalNumber, requiredNumber } from './args';
import type { Cell } from './args';

// PHTEMP: the temperature at which a mixture's pH crosses a limit (a what-if for a buffer that warms or
// cools in use), found on the inverse mechanism and verified by the forward solve PHMIX makes there.

/**
 * Temperature, °C, at which the mixture's pH equals `limitPH`, searched from `fromC` to `toC` (default: the range
 * the mixture's data hold for). Example: phTemp(8.3, [['Tris'], ['Tris hydrochloride']], [[50], [50]], 'mM') → °C.
 */
export function phTemp(limitPH: Cell, reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, model?: Cell, fromC?: Cell, toC?: Cell): number {
  const limit = requiredNumber(limitPH, 'limitPH', PH_RULE);
  const rows = mixtureRows(reagents, amounts, units);
  const volumeL = optionalNumber(volume, 'volume', undefined, VOLUME_RULE);
  const activityModel = parseModel(model);
  const from = optionalNumber(fromC, 'fromC', undefined, { ...TEMPERATURE_RULE, expected: 'the lowest temperature to search, °C (default: the data\'s range)' });
  const to = optionalNumber(toC, 'toC', undefined, { ...TEMPERATURE_RULE, expected: 'the highest temperature to search, °C (default: the data\'s range)' });
  const crossing = temperatureForPH(limit, buildContents(rows, volumeL), activityModel, from, to);
  if (!Number.isFinite(crossing.temperatureC)) fail({ code: 'no_convergence', argument: 'limitPH', received: String(crossing.temperatureC), expected: 'a finite result; please report this input' });
  return crossing.temperatureC;
}
