import { address, pad, text, DEFAULT_MODEL } from './blocks';
import type { Block, BlockCell, MixtureInput } from './blocks';

// The "salt for a target ionic strength" block: the mixture's rows with the salt as one more row whose amount is
// SALTDOSE of the rows above it, then IONICSTRENGTH, PHMIX and WARNINGS of every row, salt included, so the
// reviewer sees the returned amount bring the ionic strength to the target.

export interface SaltInput { salt: string; targetIonicStrengthM: number; saltUnitSymbol: string }

export function saltBlock(m: MixtureInput, s: SaltInput, top: number, left: number): Block {
  const rows: (BlockCell | null)[][] = [['Reagent', 'Amount', 'Unit']];
  for (const r of m.rows) rows.push([text(r.reagent), r.amount, text(r.unit)]);
  const first = top + 1, last = top + m.rows.length, saltRow = last + 1;
  const at = (offset: number, col = 1): string => address(saltRow + offset, left + col);
  const [volume, temperature, model, target] = [at(1), at(2), at(3), at(4)];
  const range = (c: number, end: number): string => `${address(first, left + c)}:${address(end, left + c)}`;
  const before = `${range(0, last)},${range(1, last)},${range(2, last)}`;
  const withSalt = `${range(0, saltRow)},${range(1, saltRow)},${range(2, saltRow)}`;
  const conditions = `${volume},${temperature},${model}`;
  rows.push([text(s.salt), `=PROTIC.SALTDOSE(${target},${at(0, 0)},${before},${conditions},${at(0, 2)})`, text(s.saltUnitSymbol), 'salt for the target ionic strength (SALTDOSE of the rows above)']);
  rows.push(['Volume (L), salt included', m.volumeL]);
  rows.push(['Temperature (°C)', m.temperatureC]);
  rows.push(['Activity model', text(m.model ?? DEFAULT_MODEL)]);
  rows.push(['Target ionic strength (mol/L)', s.targetIonicStrengthM]);
  // the check: the same ionic strength the function verified, computed from the rows with the salt in them
  rows.push(['Ionic strength with the salt (mol/L)', `=PROTIC.IONICSTRENGTH(${withSalt},${conditions})`, '', 'equals the target (within 1e-9 relative)']);
  rows.push(['pH with the salt', `=PROTIC.PHMIX(${withSalt},${conditions})`]);
  rows.push(['Warnings (with the salt)', `=PROTIC.WARNINGS(${withSalt},${conditions})`]);
  return { cells: pad(rows) };
}
