import type { ActivityModel } from './activity';
import { ProticError } from './failure';
import { buildContents, contentsWithMoles, molesPerUnit } from './mixture';
import type { Contents, MixtureRow } from './mixture';
import { prepareProblem } from './problem';
import { bufferCapacity } from './results';
import type { Equilibrium } from './solver';
import { solve } from './solver';
import { isConcentrationUnit, parseUnit } from './units';
import { CHECK_REMADE_PH_TOLERANCE, applyMove, readjustedStocks, withRemadeStocks } from './stockReadjustment';
import type { ConstantMove, ReadjustedStock } from './stockReadjustment';
import { PHSensitivity, reagentSensitivity, rowAmountSensitivities, volumeSensitivity } from './uncertainty';

// The pH sensitivities an uncertainty budget needs, one shape for every model. Davies, Bates–Guggenheim and ideal:
// the solver's implicit derivatives (uncertainty.ts). sit: each species' ε term moves with the composition and the
// speciation, which the implicit derivatives hold fixed, so each sensitivity is a central difference of two full
// solves of the mixture as read (its rows' moles moved, density and sit offsets and all), as CAPACITY under sit is.

/**
 * Which input a sensitivity belongs to: a row by its index in `rows`, the volume, the temperature, a pKa, pKw, or the
 * stated pH of a pH-adjusted stock by its index in `stocks`.
 */
export type BudgetInput = { row: number } | 'volume' | 'temperature' | { system: number; step: number } | 'pKw' | { stock: number };

/** dpH per unit of each input of a budget, at the solution `eq`. */
export interface BudgetSensitivities {
  eq: Equilibrium;
  /** per row, dpH per unit of its amount in the unit it was typed in (at amount 0 too: a row's moles are proportional to its amount) */
  perAmount: number[];
  /** dpH per litre of final volume */
  perLitre: number;
  /** dpH per kelvin */
  perKelvin: number;
  /** [system][step] dpH per unit of that step's pKa at the problem's temperature */
  perPKa: number[][];
  /** dpH per unit of pKw */
  perPKw: number;
  /** how the sensitivities were obtained, for the budget's note */
  method: string;
  /** per row: given as a concentration in the final solution (mol/L, g/L, % w/v, N), so the volume does not dilute it */
  concentrationRows: boolean[];
  /** inputs whose difference had to be one-sided, each with the reason */
  oneSided: { input: BudgetInput; reason: string }[];
  /**
   * The rows that are stocks adjusted to a stated pH: perPKa and perPKw above include each one's re-adjustment (its
   * titrant follows the constant, stockReadjustment.ts); its stated pH is an input with its own sensitivity.
   */
  stocks: ReadjustedStock[];
  /**
   * The pH of a full solve with one input moved by d (in its unit: the row's, L, °C, pKa, pKw or pH units), every other
   * as read, each pH-adjusted stock re-made to its pH where a constant or its stated pH moves; for the budget's check of
   * its first-order propagation over each ± limit. Throws a coded failure where the moved mixture is refused.
   */
  pHWith(input: BudgetInput, d: number): number;
}

/** Relative step of an amount or the volume for the central differences. */
const RELATIVE_STEP = 1e-4;
/** pH move aimed at by an amount's or the volume's step (truncation of order its square; the solves' scatter, up to 1e-11, far below it). */
const PH_STEP = 1e-4;
/** Below this pH move over a step, the solves' own scatter (up to about 1e-11 pH, in saline) would show in the slope (1e-4 of it): the step grows. */
const NOISE_MOVE = 1e-7;
/** The most a forward step adds of a row, mol/L. */
const FORWARD_CAP_M = 1e-3;
/** Temperature step, °C. */
const TEMPERATURE_STEP_C = 0.01;
/** pKa and pKw step. */
const CONSTANT_STEP = 1e-3;

/** Whether two inputs are the same (for the budget lines' notes). */
export function sameInput(a: BudgetInput, b: BudgetInput): boolean {
  if (typeof a === 'string' || typeof b === 'string') return a === b;
  if ('row' in a) return 'row' in b && a.row === b.row;
  if ('stock' in a) return 'stock' in b && a.stock === b.stock;
  return 'system' in a && 'system' in b && a.system === b.system && a.step === b.step;
}

/**
 * The budget's sensitivities of the mixture `rows` in `volumeL` at `temperatureC` under `model`.
 * @example budgetSensitivities([{ reagent: 'NaCl', amount: 58.44, unit: 'g', row: 1 }, { reagent: 'HCl', amount: 10, unit: 'mM', row: 2 }], 1, 25, 'sit').perAmount
 *   // dpH per g of NaCl and per mM of HCl, from central differences of sit solves
 */
export function budgetSensitivities(rows: MixtureRow[], volumeL: number, temperatureC: number, model: ActivityModel): BudgetSensitivities {
  const contents = buildContents(rows, volumeL);
  const eq = solve(prepareProblem(contents, temperatureC, model));
  const concentrationRows = rows.map((r) => isConcentrationUnit(parseUnit(r.unit, 'units', r.row)));
  // moles per unit of each row's amount: from the row itself, or for a row at 0 from its reagent and unit
  const perUnit = rows.map((row, r) => (row.amount > 0 ? contents.rows[r].moles / row.amount : molesPerUnit(row, volumeL)));
  // the stocks held as read (the partial sensitivities), and re-made where a constant or a stated pH moves (the check)
  const held = movedSolve(eq, contents, temperatureC, model, concentrationRows, perUnit, []);
  if (model === 'sit') {
    const stocks = readjustedStocks(rows, contents, eq, temperatureC, model);
    const pHWith = stocks.length === 0 ? held : movedSolve(eq, contents, temperatureC, model, concentrationRows, perUnit, stocks);
    return withReadjustedStocks({ ...resolvedSensitivities(eq, held, perUnit, contents, concentrationRows), concentrationRows, pHWith, stocks });
  }
  const sens = new PHSensitivity(eq);
  const stocks = readjustedStocks(rows, contents, eq, temperatureC, model, (reagent) => reagentSensitivity(sens, contents, reagent));
  const pHWith = stocks.length === 0 ? held : movedSolve(eq, contents, temperatureC, model, concentrationRows, perUnit, stocks);
  const p = eq.problem;
  return withReadjustedStocks({
    eq,
    pHWith,
    perAmount: rowAmountSensitivities(sens, contents, perUnit),
    perLitre: volumeSensitivity(sens, contents, concentrationRows),
    perKelvin: sens.perKelvin(),
    perPKa: p.systems.map((s, i) => s.system.steps.map((_, k) => sens.perPKa(i, k))),
    perPKw: sens.perPKw(),
    method: 'sensitivities: implicit derivatives of the solve',
    concentrationRows,
    oneSided: [],
    stocks,
  });
}

/** The constants' sensitivities with each pH-adjusted stock's re-adjustment added (the mixture's own are partials at its composition). */
function withReadjustedStocks(sens: BudgetSensitivities): BudgetSensitivities {
  if (sens.stocks.length === 0) return sens;
  const perPKa = sens.perPKa.map((steps, i) => steps.map((direct, k) => sens.stocks.reduce((sum, s) => sum + s.perPKa[i][k], direct)));
  const perPKw = sens.stocks.reduce((sum, s) => sum + s.perPKw, sens.perPKw);
  return { ...sens, perPKa, perPKw, method: `${sens.method}; each stock written with a pH re-adjusted to it as a constant moves (its titrant by the stock's own slopes, central differences of its full solves; the first-order checks re-make it)` };
}

/**
 * A full solve of the mixture as read with one input moved by d, started from the solution's own ln h; `stocks` (the
 * pH-adjusted ones) are re-made where a constant or their stated pH moves, and held as read otherwise.
 */
function movedSolve(eq: Equilibrium, contents: Contents, temperatureC: number, model: ActivityModel, concentrationRows: boolean[],
  perUnit: number[], stocks: ReadjustedStock[]): (input: BudgetInput, d: number) => number {
  const volumeL = contents.volumeL, baseMoles = contents.rows.map((r) => r.moles);
  const pHOf = (c: Contents, t: number, move?: ConstantMove): number => solve(applyMove(prepareProblem(c, t, model), move), eq.lnH).pH;
  // a constant moved in the mixture, and in each stock that follows it
  const moved = (move: ConstantMove): number =>
    pHOf(stocks.length === 0 ? contents : withRemadeStocks(contents, stocks, move, () => 0, CHECK_REMADE_PH_TOLERANCE), temperatureC, move);
  return (input, d) => {
    if (input === 'volume') {
      // rows given as concentrations of the final solution keep their concentration, the others dilute
      return pHOf(contentsWithMoles(contents, baseMoles.map((m, k) => (concentrationRows[k] ? (m * (volumeL + d)) / volumeL : m)), volumeL + d), temperatureC);
    }
    if (input === 'temperature') return pHOf(contents, temperatureC + d);
    if (input === 'pKw') return moved({ pKwShift: d });
    if ('row' in input) return pHOf(contentsWithMoles(contents, baseMoles.map((m, k) => (k === input.row ? m + d * perUnit[k] : m)), volumeL), temperatureC);
    if ('stock' in input) return pHOf(withRemadeStocks(contents, [stocks[input.stock]], undefined, () => d, CHECK_REMADE_PH_TOLERANCE), temperatureC);
    return moved({ systemId: eq.problem.systems[input.system].system.id, step: input.step, pKaShift: d });
  };
}

/** Under sit: every sensitivity a central difference of full solves. */
function resolvedSensitivities(eq: Equilibrium, pHWith: (input: BudgetInput, d: number) => number, perUnit: number[], contents: Contents,
  concentrationRows: boolean[]): Omit<BudgetSensitivities, 'concentrationRows' | 'pHWith' | 'stocks'> {
  const oneSided: { input: BudgetInput; reason: string }[] = [];
  const volumeL = contents.volumeL;
  const sided = (input: BudgetInput, reason: string): void => {
    if (!oneSided.some((x) => sameInput(x.input, input))) oneSided.push({ input, reason });
  };
  // a side outside the data's range (a temperature at the edge of a system's range, say) leaves a one-sided difference
  const central = (input: BudgetInput, at: (d: number) => number) => (h: number): number => {
    const side = (d: number): number | undefined => {
      try { return at(d); } catch (e) { if (e instanceof ProticError && e.failure.code === 'out_of_range') return undefined; throw e; }
    };
    const up = side(h), down = side(-h);
    if (up !== undefined && down !== undefined) return (up - down) / (2 * h);
    sided(input, 'the other side is outside the data\'s range');
    if (up !== undefined) return (up - eq.pH) / h;
    if (down !== undefined) return (eq.pH - down) / h;
    return at(h); // both sides refused: let the refusal through
  };
  // forward, Richardson-extrapolated ((4 f(h) − f(2h) − 3 f(0)) / 2h, error of order h²)
  const forward = (at: (d: number) => number) => (h: number): number => (4 * at(h) - at(2 * h) - 3 * eq.pH) / (2 * h);
  // the step fitted to the pH's own scale: where the pH moves by more than 2·PH_STEP over it (a steep region, an
  // equivalence point) the step shrinks to move it by PH_STEP; where by less than NOISE_MOVE (an input that barely acts,
  // where the solves' own scatter would show) it grows to move it by 10·NOISE_MOVE, within maxStep; at most 6 times.
  // `resolved`: the last step moved the pH by NOISE_MOVE or more
  const fitted = (difference: (h: number) => number, h0: number, maxStep: number): { slope: number; resolved: boolean } => {
    let h = Math.min(h0, maxStep), slope = difference(h);
    for (let k = 0; k < 6; k++) {
      if (!Number.isFinite(slope)) break;
      const move = Math.abs(slope * h);
      const next = move > 2 * PH_STEP ? PH_STEP / Math.abs(slope) : move < NOISE_MOVE ? (slope === 0 ? maxStep : Math.min((10 * NOISE_MOVE) / Math.abs(slope), maxStep)) : h;
      if (!(next < h || next > h)) break;
      h = next;
      slope = difference(h);
    }
    return { slope, resolved: Math.abs(slope * h) >= NOISE_MOVE };
  };
  // an amount's first step moves the pH by about PH_STEP as β·step of base would; no step adds more than
  // FORWARD_CAP_M of the row (a row that barely acts would otherwise ask for kilograms)
  const beta = bufferCapacity(eq);
  const betaStepMol = PH_STEP * (Number.isFinite(beta) && beta > 0 ? beta : 1e-9) * volumeL;
  const perAmount = contents.rows.map((row, r) => {
    if (!(perUnit[r] > 0)) return 0; // water, or a row that releases nothing
    const amount = row.moles / perUnit[r], cap = (FORWARD_CAP_M * volumeL) / perUnit[r];
    const hBeta = Math.min(betaStepMol / perUnit[r], cap), at = (d: number) => pHWith({ row: r }, d);
    if (amount >= hBeta) {
      // steps up to a tenth of the amount; above a hundredth, Richardson-extrapolated (4 D(h/2) − D(h)) / 3 (error of
      // order h⁴), since the pH can curve on the scale of the amount itself (a salt in water, through √I)
      const c1 = central({ row: r }, at);
      const c = fitted((h) => (h > amount * 1e-2 ? (4 * c1(h / 2) - c1(h)) / 3 : c1(h)), Math.min(hBeta, amount * RELATIVE_STEP), amount * 0.1);
      if (c.resolved) return c.slope;
    }
    // at 0, or an amount too small for a central step that resolves it (0.1 + 0.2 − 0.3 in a cell): forward, up from it
    sided({ row: r }, amount > 0 ? 'the amount is below the step that resolves it, forward' : 'at amount 0, forward (a step back would be a negative amount)');
    return fitted(forward(at), hBeta, cap).slope;
  });
  const p = eq.problem;
  return {
    eq,
    perAmount,
    // rows given as concentrations do not depend on the volume: exactly 0, not the rounding of two solves
    perLitre: concentrationRows.every(Boolean) ? 0 : fitted(central('volume', (d) => pHWith('volume', d)), volumeL * RELATIVE_STEP, volumeL * 1e-2).slope,
    perKelvin: central('temperature', (d) => pHWith('temperature', d))(TEMPERATURE_STEP_C),
    perPKa: p.systems.map((s, i) => s.system.steps.map((_, k) => central({ system: i, step: k }, (d) => pHWith({ system: i, step: k }, d))(CONSTANT_STEP))),
    perPKw: central('pKw', (d) => pHWith('pKw', d))(CONSTANT_STEP),
    method: 'sensitivities: central differences of full sit solves (the ε terms move with the composition)',
    oneSided,
  };
}

/** Above this relative departure from first order over an input's ± limit, the budget says that its line is not linear. */
export const LINEARITY_LIMIT = 0.1;

/** A first-order move over a ± limit below this (pH) cannot matter to u(pH): its line is not checked for linearity. */
export const NEGLIGIBLE_MOVE_PH = 1e-4;

/**
 * How far the pH's actual moves over ± `half` of an input depart from the first-order move `sensitivity`·half: the
 * larger of |Δ(+half)/(s·half) − 1| and |Δ(−half)/(−s·half) − 1|, each from a full solve (a step below `lowest`, such as
 * a negative amount, or one the data refuse is left out). 0 when the first-order move is below NEGLIGIBLE_MOVE_PH;
 * undefined when no end can be solved.
 * @example linearityDeparture(sens, { row: 1 }, 0.05, sens.perAmount[1], -3.55) // 0.002: linear over ± 0.05 of row 2's 3.55
 */
export function linearityDeparture(sens: BudgetSensitivities, input: BudgetInput, half: number, sensitivity: number, lowest = -Infinity,
  refused: ProticError[] = []): number | undefined {
  const linear = sensitivity * half;
  if (!(Math.abs(linear) >= NEGLIGIBLE_MOVE_PH)) return 0;
  // an end the data or the mixture refuse is left out, and handed back in `refused` so the line can say so
  const side = (d: number): number | undefined => {
    try { return (sens.pHWith(input, d) - sens.eq.pH) / (d > 0 ? linear : -linear); } catch (e) { if (e instanceof ProticError) { refused.push(e); return undefined; } throw e; }
  };
  const ratios = [side(half), lowest <= -half ? side(-half) : undefined].filter((x): x is number => x !== undefined && Number.isFinite(x));
  return ratios.length === 0 ? undefined : Math.max(...ratios.map((x) => Math.abs(x - 1)));
}
