import { LADDER_EFFECTS, buildContents, handLadder, parseModel } from '../engine';
import { PH_RULE, TEMPERATURE_RULE, VOLUME_RULE, mixtureRows, optionalNumber } from './args';
import type { Cell } from './args';
import type { CellScalar } from './impl';

// HANDCHECK: why a hand value differs from Protic's. The textbook estimate, the exact pH, and the shift each
// neglected effect makes, removed one at a time in a fixed order (LADDER_EFFECTS); the shifts sum to exact − estimate.

export const HANDCHECK_HEADER = ['step', 'pH', 'shift (pH)', 'note'];

export function handcheck(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, handPH?: Cell): CellScalar[][] {
  const rows = mixtureRows(reagents, amounts, units);
  const volumeL = optionalNumber(volume, 'volume', undefined, VOLUME_RULE);
  const temperatureC = optionalNumber(temperature, 'temperature', 25, TEMPERATURE_RULE);
  const hand = optionalNumber(handPH, 'handPH', undefined, PH_RULE);
  const ladder = handLadder(buildContents(rows, volumeL), temperatureC, parseModel(null));
  const { levels, pair } = ladder;
  const table: CellScalar[][] = [HANDCHECK_HEADER];
  table.push(['textbook estimate', ladder.estimate, '',
    `${pair.system} step ${pair.step}, pKa ${pair.pKa} (25 °C, I = 0): pKa + log10(${Number(pair.baseM.toPrecision(6))} / ${Number(pair.acidM.toPrecision(6))} mol/L), strong acid and base taken off by stoichiometry`]);
  table.push(['exact pH', levels[0], '', `davies, ${temperatureC} °C, every species, water and activity included`]);
  LADDER_EFFECTS.forEach((effect, m) => {
    const note = m === 5 ? 'with water left out the ratio, and so the estimate, no longer depends on the volume'
      : `pH without ${effect} and the effects above it`;
    table.push([`shift: ${effect}`, levels[m + 1], levels[m] - levels[m + 1], note]);
  });
  const sum = LADDER_EFFECTS.reduce((acc, _, m) => acc + (levels[m] - levels[m + 1]), 0);
  table.push(['sum of shifts', '', sum, 'equals exact − estimate']);
  if (hand !== undefined) {
    const names = ['exact pH', ...LADDER_EFFECTS.map((e) => `without ${e}`)];
    let best = 0;
    levels.forEach((v, m) => { if (Math.abs(hand - v) < Math.abs(hand - levels[best]) - 1e-12) best = m; });
    table.push(['hand value', hand, hand - ladder.estimate, 'hand value − textbook estimate']);
    levels.forEach((v, m) => table.push([`hand − ${names[m]}`, v, hand - v, m === best ? 'closest' : '']));
    table.push(['closest step', levels[best], hand - levels[best], best === 0
      ? 'the hand value matches the exact pH'
      : `the hand value matches the pH with ${LADDER_EFFECTS.slice(0, best).join(', ')} left out: it neglected ${LADDER_EFFECTS[best - 1]}`]);
  }
  return table;
}
