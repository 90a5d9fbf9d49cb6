import { buildContents, encodeHandle, fail, findUnit, parseReagentSpec } from '../engine';
import type { MixtureRow } from '../engine';
import { VOLUME_RULE, mixtureRows, optionalText, requiredNumber } from './args';
import type { Cell } from './args';

// STOCK: a made solution as a text handle, dispensed by volume wherever a reagent is accepted.

/** `NaCl 80 g`, or `10× PBS 100 mL` for a row that is itself a made solution. */
function rowSummary(row: MixtureRow): string {
  const spec = parseReagentSpec(row.reagent, 'reagents', row.row);
  const what = spec.made ? spec.made.name : row.reagent.trim();
  const unit = findUnit(row.unit)?.symbol ?? row.unit.trim();
  return `${what} ${row.amount} ${unit}`;
}

/**
 * A handle for a solution made from `reagents` and made up to `volume` litres.
 * @example stock({{"NaCl";"KCl"}}, {{80;2}}, "g", 1, "10× saline") → '10× saline: NaCl 80 g, KCl 2 g, to 1 L ⟦stock v1 …⟧'
 */
export function stock(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, name?: Cell): string {
  const rows = mixtureRows(reagents, amounts, units);
  if (rows.length === 0) fail({ code: 'bad_argument', argument: 'reagents', received: 'no reagent rows', expected: 'at least one reagent that goes into the stock' });
  const volumeL = requiredNumber(volume, 'volume', VOLUME_RULE);
  const label = optionalText(name, 'name') ?? 'stock';
  // rows inside a stock are made up under the default model (davies): a pH-adjusted row is adjusted under it
  const contents = buildContents(rows, volumeL);
  const perL = (m: Map<string, number>): Map<string, number> => new Map([...m.entries()].map(([k, v]) => [k, v / volumeL]));
  const carried = [...new Set(rows.map((row) => parseReagentSpec(row.reagent, 'reagents', row.row).made?.warning).filter((w): w is string => !!w))];
  return encodeHandle({
    name: label,
    summary: `${rows.map(rowSummary).join(', ')}, to ${volumeL} L`,
    systemsMPerL: perL(contents.systemMoles),
    ionsMPerL: perL(contents.ionMoles),
    warning: carried.length > 0 ? carried.join('; ') : undefined,
  });
}
