import { SPILL_SHAPES, address, pad, spillRows, text, DEFAULT_MODEL } from './blocks';
import type { Block, BlockCell, MixtureInput } from './blocks';

// The "review" block for a QA reviewer: the mixture with a ± tolerance beside each amount, the volume and the
// temperature (0 until the reviewer types the balance's, flask's and bath's), PHMIX and WARNINGS, then READBACK,
// HANDCHECK and UNCERTAINTY, each under a title with its spill's room left unwritten.

/** Rows of each spill, as the functions return them for this mixture (the pane calls them before writing). */
export interface ReviewSpillRows { readback: number; handcheck: number; uncertainty: number }

export function reviewBlock(m: MixtureInput, spills: ReviewSpillRows, top: number, left: number): Block {
  const rows: (BlockCell | null)[][] = [['Reagent', 'Amount', 'Unit', '± tolerance (its unit)']];
  for (const r of m.rows) rows.push([text(r.reagent), r.amount, text(r.unit), 0]);
  const first = top + 1, last = top + m.rows.length;
  const cell = (offset: number, col: number): string => address(last + offset, left + col);
  const [volume, volumeTolerance, temperature, temperatureTolerance, model] = [cell(1, 1), cell(1, 3), cell(2, 1), cell(2, 3), cell(3, 1)];
  const range = (c: number): string => `${address(first, left + c)}:${address(last, left + c)}`;
  const mixture = `${range(0)},${range(1)},${range(2)}`;
  rows.push(['Volume (L)', m.volumeL, '± (L)', 0]);
  rows.push(['Temperature (°C)', m.temperatureC, '± (°C)', 0]);
  rows.push(['Activity model', text(m.model ?? DEFAULT_MODEL), '', 'tolerances 0 = none given: type your own']);
  rows.push(['pH', `=PROTIC.PHMIX(${mixture},${volume},${temperature},${model})`]);
  rows.push(['Warnings', `=PROTIC.WARNINGS(${mixture},${volume},${temperature},${model})`]);
  rows.push(['What each row was read as (READBACK)']);
  rows.push(...spillRows(`=PROTIC.READBACK(${mixture},${volume},${temperature})`, SPILL_SHAPES.READBACK(spills.readback)));
  rows.push(['Why a hand value differs (HANDCHECK, Davies)']);
  rows.push(...spillRows(`=PROTIC.HANDCHECK(${mixture},${volume},${temperature})`, SPILL_SHAPES.HANDCHECK(spills.handcheck)));
  rows.push(['Uncertainty budget of the pH (UNCERTAINTY)']);
  rows.push(...spillRows(`=PROTIC.UNCERTAINTY(${mixture},${volume},${temperature},${model},${range(3)},${volumeTolerance},${temperatureTolerance})`,
    SPILL_SHAPES.UNCERTAINTY(spills.uncertainty)));
  return { cells: pad(rows) };
}
