import { LINEARITY_LIMIT, ProticError, budgetSensitivities, fail, linearityDeparture, parseModel, sameInput } from '../engine';
import type { BudgetInput } from '../engine';
import { TEMPERATURE_RULE, VOLUME_RULE, isBlank, mixtureRows, optionalNumber, requiredNumber, toMatrix } from './args';
import type { Cell } from './args';
import type { CellScalar } from './impl';

// UNCERTAINTY: the GUM (JCGM 100:2008) budget of a computed pH. Tolerances typed as ± limits are rectangular
// distributions, u = a/√3 (GUM 4.3.7); a constant's stated ± is taken as its standard uncertainty; sensitivities are
// the solver's implicit derivatives, or under sit central differences of full solves (src/engine/budgetSensitivities.ts);
// u(pH) = √Σ (c·u)², U = 2 u (k = 2).

export const UNCERTAINTY_HEADER = ['input', 'value', 'unit', '± limit or stated u', 'distribution', 'standard uncertainty u', 'sensitivity ∂pH/∂x', 'contribution |∂pH/∂x|·u (pH)', 'note'];

/** Half-width, pKa units, assumed for a pKa whose source gives no uncertainty (or was not read). */
export const ASSUMED_PKA_HALF_WIDTH = 0.02;
/** Half-width assumed for pKw (the IAPWS release's own uncertainty statement was not read here). */
export const ASSUMED_PKW_HALF_WIDTH = 0.01;
/** Least half-width of a stock's stated pH: a meter calibrated at two points reads to about ± 0.02 (common practice, from memory). */
export const STATED_PH_METER_HALF_WIDTH = 0.02;

const RECT = Math.sqrt(3);

function tolerances(value: Cell, count: number): number[] {
  if (isBlank(value)) return Array(count).fill(0);
  const flat = toMatrix(value).flat();
  const rule = { min: 0, max: 1e9, expected: 'a ± tolerance, zero or above, in the unit of its amount' };
  if (flat.length === 1) return Array(count).fill(requiredNumber(flat[0], 'amountTolerances', rule));
  if (flat.length !== count) fail({ code: 'shape_mismatch', argument: 'amountTolerances', received: `a range of ${flat.length} cells`, expected: `one tolerance, or one per amount (${count})` });
  return flat.map((v) => (isBlank(v) ? 0 : requiredNumber(v, 'amountTolerances', rule)));
}

export interface BudgetLine { input: string; value: number; unit: string; limit: number; distribution: string; u: number; sensitivity: number; note: string }

/** The budget lines and the combined result, for the cell function, the tests and the bench. */
export function uncertaintyBudget(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, temperature?: Cell, model?: Cell,
  amountTolerances?: Cell, volumeTolerance?: Cell, temperatureTolerance?: Cell): { pH: number; lines: BudgetLine[]; combined: number; method: string; nonlinear: string[] } {
  const rows = mixtureRows(reagents, amounts, units);
  const volumeL = requiredNumber(volume, 'volume', VOLUME_RULE);
  const temperatureC = optionalNumber(temperature, 'temperature', 25, TEMPERATURE_RULE);
  const activityModel = parseModel(model);
  const cellCount = toMatrix(amounts).flat().length;
  const tol = tolerances(amountTolerances ?? null, cellCount);
  const volTol = optionalNumber(volumeTolerance, 'volumeTolerance', 0, { min: 0, max: 1e6, expected: 'a ± tolerance of the volume, L' });
  const tTol = optionalNumber(temperatureTolerance, 'temperatureTolerance', 0, { min: 0, max: 50, expected: 'a ± tolerance of the temperature, °C' });
  const sens = budgetSensitivities(rows, volumeL, temperatureC, activityModel);
  const sided = (input: BudgetInput, note: string): string => {
    const one = sens.oneSided.find((x) => sameInput(x.input, input));
    return one ? [note, `a one-sided difference: ${one.reason}`].filter(Boolean).join('; ') : note;
  };
  const lines: BudgetLine[] = [];
  // the first-order budget holds only where the pH is close to linear over each ± limit (JCGM 101 is the check where not):
  // each amount and the volume are solved at the ends of their limits, and a line that departs by more than 10 % says so.
  // The pKa (± 0.02), pKw (± 0.01) and temperature lines are not: the pH's slope in them follows the speciation, which
  // moves by a few hundredths of a pH unit over such limits, so they stay within a few % of first order; except where a
  // stock written with a pH is re-made as the constant moves, and for that stated pH itself: those move a titrant.
  const nonlinear: string[] = [];
  const addNote = (l: BudgetLine, note: string): void => { l.note = [l.note, note].filter(Boolean).join('; '); };
  const checkLinearity = (l: BudgetLine, key: BudgetInput, lowest: number, name: string): void => {
    if (!(l.limit > 0)) return;
    if (l.limit > -lowest) addNote(l, 'the ± limit is larger than the amount: below 0 is no mixture, so only the upper end is checked');
    const refused: ProticError[] = [];
    const departure = linearityDeparture(sens, key, l.limit, l.sensitivity, lowest, refused);
    if (departure !== undefined && refused.length > 0) addNote(l, `one end of the ± limit could not be solved, so only the other is checked (${'reason' in refused[0].failure ? refused[0].failure.reason : refused[0].message})`);
    if (departure !== undefined && departure <= LINEARITY_LIMIT) return;
    nonlinear.push(name);
    addNote(l, departure === undefined
      ? 'first order could not be checked: the ends of the ± limit are refused'
      : `not linear over ± ${Number(l.limit.toPrecision(3))}: the pH's move there departs from first order by ${Math.round(departure * 100)} %, so this line's contribution is not reliable (check by a Monte Carlo, JCGM 101, or narrow the tolerance)`);
  };
  rows.forEach((r, i) => {
    const a = tol[r.row - 1];
    const line: BudgetLine = { input: `amount: ${r.reagent}`, value: r.amount, unit: r.unit, limit: a, distribution: 'rectangular', u: a / RECT, sensitivity: sens.perAmount[i], note: sided({ row: i }, a === 0 ? 'no tolerance given' : '') };
    lines.push(line);
    checkLinearity(line, { row: i }, -r.amount, `${line.input} (row ${r.row})`);
  });
  const volumeLine: BudgetLine = { input: 'final volume', value: volumeL, unit: 'L', limit: volTol, distribution: 'rectangular', u: volTol / RECT, sensitivity: sens.perLitre,
    note: sided('volume', sens.concentrationRows.every(Boolean) ? 'rows given as concentrations do not depend on it' : '') };
  lines.push(volumeLine);
  checkLinearity(volumeLine, 'volume', -Infinity, volumeLine.input);
  lines.push({ input: 'temperature', value: temperatureC, unit: '°C', limit: tTol, distribution: 'rectangular', u: tTol / RECT, sensitivity: sens.perKelvin,
    note: sided('temperature', 'through each pKa (its ΔrH°, ΔrCp°), pKw, the Debye–Hückel A and the kg of water per litre (the solution density)') });
  // a stock written with a pH is at that pH (brought there on a meter): the pH as stated is an input, and the constants'
  // lines move its titrant with them (budgetSensitivities' stocks)
  sens.stocks.forEach((stock, index) => {
    const half = stock.statedHalfDigit, limit = Math.max(half, STATED_PH_METER_HALF_WIDTH);
    const rule = half >= STATED_PH_METER_HALF_WIDTH
      ? `± ${half}, half the last digit it is written with`
      : `± ${STATED_PH_METER_HALF_WIDTH}, a meter calibrated at two points (common practice; recalled, not checked), more than half its last written digit`;
    const rowsNote = stock.rows.length > 1 ? `; rows ${stock.rows.map((r) => rows[r].row).join(', ')} draw on this one stock: one input` : '';
    const line: BudgetLine = { input: `stated pH: ${stock.name}`, value: stock.making.statedPH, unit: 'pH', limit, distribution: 'rectangular', u: limit / RECT, sensitivity: stock.perStatedPH,
      note: `the stock is taken to be at the pH it is written with, its titrant following it; ${rule}${rowsNote}` };
    lines.push(line);
    checkLinearity(line, { stock: index }, -Infinity, line.input);
    // the temperature its pH was set at: a stock set at another temperature holds another titrant
    const t = stock.making.temperatureC, perK = stock.perAdjustmentKelvin, [lo, hi] = stock.adjustmentRangeC;
    // at an end of the data, 1 °C beyond it is no temperature the stock can have been set at: only the side that is left.
    // Set anywhere in [t, t + 1] (or [t − 1, t]) with the value still read as t, the error's root mean square is
    // 1/√3 °C (spread 0.5/√3 about t ± 0.5, and that 0.5 offset), as for ± 1 °C. (No catalogue or custom system's
    // range is under 2 °C wide, so one side is always left.)
    const warmer = t + 1 <= hi, cooler = t - 1 >= lo;
    const side = warmer && cooler ? '± 1 °C' : `set up to 1 °C ${warmer ? 'warmer' : 'cooler'} (the data hold for ${lo} to ${hi} °C)`;
    lines.push({ input: `adjustment temperature: ${stock.name}`, value: t, unit: '°C', limit: 0, distribution: 'rectangular', u: 0, sensitivity: perK,
      note: `its pH taken as set at ${t} °C (${stock.temperatureWritten ? 'as written' : 'none written'}); no tolerance given: ${side} would add ${Number((Math.abs(perK) / RECT).toPrecision(2))} pH in u (write the stock's 'at … °C' as it was set)` });
  });
  // a constant's line notes the stocks that hold its system (pKw: every stock), whose titrant follows it
  const readjusted = (holds: (s: (typeof sens.stocks)[number]) => boolean): string => {
    const names = sens.stocks.filter(holds).map((s) => s.name);
    return names.length === 0 ? '' : `with ${names.join(', ')} re-adjusted to ${names.length === 1 ? 'its' : 'their'} stated pH as it moves`;
  };
  const p = sens.eq.problem;
  p.systems.forEach((s, i) => {
    if (p.totalsM[i] <= 0) return;
    s.system.steps.forEach((step, k) => {
      const stated = step.provenance.pKa.pKaPlusMinus;
      const input = `pKa ${s.system.name} ${k + 1}`, sensitivity = sens.perPKa[i][k], key = { system: i, step: k };
      const also = readjusted((x) => x.making.contents.systemMoles.has(s.system.id));
      const line: BudgetLine = stated !== undefined
        ? { input, value: step.pKa, unit: '', limit: stated, distribution: 'normal (stated ± as u)', u: stated, sensitivity, note: sided(key, [`stated in ${step.provenance.pKa.source}`, also].filter(Boolean).join('; ')) }
        : { input, value: step.pKa, unit: '', limit: ASSUMED_PKA_HALF_WIDTH, distribution: 'rectangular', u: ASSUMED_PKA_HALF_WIDTH / RECT, sensitivity,
          note: sided(key, [`no uncertainty from the source (${step.provenance.pKa.level}): ±${ASSUMED_PKA_HALF_WIDTH} assumed`, also].filter(Boolean).join('; ')) };
      lines.push(line);
      // a re-made stock's titrant follows the constant like an amount: near an equivalence point that is far from linear
      if (also) checkLinearity(line, key, -Infinity, line.input);
    });
  });
  const alsoPKw = readjusted(() => true);
  const pKwLine: BudgetLine = { input: 'pKw', value: p.lnKw / -Math.LN10, unit: '', limit: ASSUMED_PKW_HALF_WIDTH, distribution: 'rectangular', u: ASSUMED_PKW_HALF_WIDTH / RECT, sensitivity: sens.perPKw,
    note: sided('pKw', [`no uncertainty read from IAPWS R11-07: ±${ASSUMED_PKW_HALF_WIDTH} assumed`, alsoPKw].filter(Boolean).join('; ')) };
  lines.push(pKwLine);
  if (alsoPKw) checkLinearity(pKwLine, 'pKw', -Infinity, pKwLine.input);
  const combined = Math.sqrt(lines.reduce((sum, l) => sum + (l.sensitivity * l.u) ** 2, 0));
  return { pH: sens.eq.pH, lines, combined, method: sens.method, nonlinear };
}

/** The budget as a spill: pH, one line per input, then u(pH) and U (k = 2). */
export function uncertainty(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, temperature?: Cell, model?: Cell,
  amountTolerances?: Cell, volumeTolerance?: Cell, temperatureTolerance?: Cell): CellScalar[][] {
  const b = uncertaintyBudget(reagents, amounts, units, volume, temperature, model, amountTolerances, volumeTolerance, temperatureTolerance);
  const fin = (v: number): number => { if (!Number.isFinite(v)) fail({ code: 'no_convergence', argument: 'reagents', received: String(v), expected: 'a finite sensitivity; please report this input' }); return v; };
  const table: CellScalar[][] = [UNCERTAINTY_HEADER, ['pH', fin(b.pH), '', '', '', '', '', '', 'the value the budget is for']];
  for (const l of b.lines) table.push([l.input, l.value, l.unit, l.limit, l.distribution, fin(l.u), fin(l.sensitivity), fin(Math.abs(l.sensitivity) * l.u), l.note]);
  // where a line's own check found first order failing, u and U are no numbers a formula should take up: each cell
  // says so in words, with the first-order value beside the reason (a reference to it reads as text, #VALUE! in arithmetic).
  // The lines' contributions stay numbers, each with its note: as text, a SUMSQ over the column would skip the very
  // lines that fail and give a smaller u with no sign of it.
  const why = `first order does not hold, or could not be checked, over the ± limit of ${b.nonlinear.join(', ')}`;
  const reliable = b.nonlinear.length === 0;
  const value = (v: number): CellScalar => (reliable ? fin(v) : `not reliable: ${Number(fin(v).toPrecision(3))} by first order, but ${why}; check by a Monte Carlo (JCGM 101) or narrow the tolerance`);
  table.push(['combined standard uncertainty u(pH)', value(b.combined), '', '', '', '', '', '', `GUM (JCGM 100:2008), first-order propagation, inputs uncorrelated; ${b.method}${reliable ? '' : `; not reliable: ${why}`}`]);
  table.push(['expanded uncertainty U (k = 2)', value(2 * b.combined), '', '', '', '', '', '', 'about 95 % coverage for a near-normal output']);
  return table;
}
