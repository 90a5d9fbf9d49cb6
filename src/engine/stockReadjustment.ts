import type { ActivityModel } from './activity';
import { withStepPKa } from './alternative';
import { ProticError, fail } from './failure';
import { addReagent, cloneContents, parseReagentSpec } from './mixture';
import type { Contents, MixtureRow } from './mixture';
import type { Problem } from './problem';
import { prepareProblem } from './problem';
import { bufferCapacity } from './results';
import type { Equilibrium } from './solver';
import { solve } from './solver';
import type { AdjustedMaking } from './stockHandle';
import { temperatureRangeOf } from './temperatureCrossing';
import { shiftConstants } from './uncertainty';

// A stock written with a pH (`1 M Tris pH 8.0 with HCl`) is at that pH: it was brought there on a meter. Its titrant is
// what the catalogue constants say that took, so a constant that moves moves the titrant with it, and the stock stays
// at its pH. The budget's constant lines therefore differentiate the mixture with each such stock re-adjusted:
// d pH/dθ = ∂pH/∂θ + Σ_stocks ∂pH/∂n · dn/dθ, with dn/dθ = −(∂pH_stock/∂θ)/(∂pH_stock/∂n) from the stock's own
// solve (implicit function of its adjustment), n its titrant in mol per litre of stock; and the stated pH is an input
// of its own, dn/dpH_stated = 1/(∂pH_stock/∂n), and so is the temperature its pH was set at. The stock's partials are
// central differences of its full solves; the mixture's pH per mole of titrant is the implicit derivative where the
// model has one (davies, bates-guggenheim, ideal), else a difference of full solves. A moved constant moves by the same
// amount at the stock's temperature and at the mixture's (one constant, one error).

/** pH move aimed at by a titrant step (as budgetSensitivities' amount steps). */
const PH_STEP = 1e-4;
/** pKa and pKw step. */
const CONSTANT_STEP = 1e-3;
/** A re-made stock reads its made pH (plus any move of the stated pH) to this, at the solve that returns it (CONSTANTS). */
const REMADE_PH_TOLERANCE = 1e-10;
/**
 * The same for the budget's first-order check, which compares a pH move over a ± limit with first order against a 10 %
 * threshold and prints it to 1 %: 1e-8 pH is below 1e-4 of the smallest move it checks (NEGLIGIBLE_MOVE_PH).
 */
export const CHECK_REMADE_PH_TOLERANCE = 1e-8;
/** Most secant steps a stock's re-making may take before it is refused. */
const REMAKE_STEPS = 40;

/** A constant moved, addressed by system id so that it reads in the stock's problem and in the mixture's. */
export type ConstantMove = { systemId: string; step: number; pKaShift: number } | { pKwShift: number } | { systemId: string; step: number; pKa25: number };

/** One bottle of a pH-adjusted stock in a mixture: the rows that draw on it and the litres they hold together. */
export interface StockUse {
  /** indices in the mixture's rows */
  rows: number[];
  /** the first of them as numbered in messages (1-based, as typed) */
  rowNumber: number;
  name: string;
  making: AdjustedMaking;
  litres: number;
  /** the widest half-digit its rows write the stated pH with (pH 8.0 and pH 8.00 of one stock: 0.05), so row order cannot matter */
  statedHalfDigit: number;
  /** whether any of its rows writes the temperature its pH was set at */
  temperatureWritten: boolean;
}

/** What the budget needs of one stock: its use, and its contributions to the sensitivities. */
export interface ReadjustedStock extends StockUse {
  /** dpH of the mixture per unit of the stock's stated pH (its titrant re-solved to it) */
  perStatedPH: number;
  /** [system][step] of the mixture: dpH added through this stock's re-adjustment per unit of that pKa */
  perPKa: number[][];
  /** the same per unit of pKw */
  perPKw: number;
  /** dpH of the mixture per kelvin of the temperature the stock's pH was set at (its titrant re-solved to it there) */
  perAdjustmentKelvin: number;
  /** °C, the temperatures the stock's systems' and water's data all hold for (where its pH can have been set) */
  adjustmentRangeC: [number, number];
}

/** The stock's own solve and partials, which depend on nothing in the mixture: worked out once per stock. */
interface StockPartials {
  madePH: number;
  lnH: number;
  /** dpH_stock per mol/L of its titrant */
  perN: number;
  /** dpH_stock per unit of each step's pKa, by system id */
  perPKa: Map<string, number[]>;
  /** each step's 25 °C pKa as the stock was made with it, by system id */
  pKa25: Map<string, number[]>;
  /** re-made titrants already solved, by move (they depend on the stock alone: a table of mixtures drawing on it reuses them) */
  remade: Map<string, number>;
  perPKw: number;
  /** dpH_stock per kelvin at its own composition */
  perKelvin: number;
  /** °C, where its systems' and water's data all hold (temperatureRangeOf) */
  rangeC: [number, number];
}
const partialsOf = new WeakMap<AdjustedMaking, StockPartials>();

/** The move applied to a prepared problem (a system it does not hold is left as it is). */
export function applyMove(q: Problem, move: ConstantMove | undefined): Problem {
  if (move === undefined) return q;
  if ('pKwShift' in move) { shiftConstants(q, [], move.pKwShift); return q; }
  const j = q.systems.findIndex((s) => s.system.id === move.systemId);
  if (j < 0) return q;
  if ('pKa25' in move) return withStepPKa(q, j, move.step, move.pKa25);
  shiftConstants(q, q.systems.map((s, m) => (m === j ? Array.from(s.lnKa, (_, n) => (n === move.step ? move.pKaShift : 0)) : [])), 0);
  return q;
}

function touches(making: AdjustedMaking, move: ConstantMove | undefined): boolean {
  return move !== undefined && ('pKwShift' in move || making.contents.systemMoles.has(move.systemId));
}

/** `contents` with `moles` of `reagent` added (a copy: the stock's own contents are cached and shared). */
function withReagent(contents: Contents, reagent: AdjustedMaking['titrant'], moles: number): Contents {
  const out = cloneContents(contents);
  addReagent(out, reagent, moles);
  return out;
}

/** Moles of a reagent's first component in contents: whether a step back in it leaves the mixture physical. */
function heldMoles(contents: Contents, reagent: AdjustedMaking['titrant']): number {
  const ion = reagent.ions[0], system = reagent.systems[0];
  if (ion) return (contents.ionMoles.get(ion.ionId) ?? 0) / ion.count;
  return system ? (contents.systemMoles.get(system.systemId) ?? 0) / system.count : 0;
}

/** d pH / d(moles added), central where `held` allows the step back, else forward (Richardson, error of order step²). */
function perMolesOf(at: (moles: number) => number, pH0: number, step: number, held: number): number {
  if (held > 2 * step) return (at(step) - at(-step)) / (2 * step);
  return (4 * at(step) - at(2 * step) - 3 * pH0) / (2 * step);
}

/** A step that moves a pH by about PH_STEP in a solution of buffer capacity β (mol/(L·pH)) and `litres`. */
function stepFor(beta: number, litres: number): number {
  return PH_STEP * (Number.isFinite(beta) && beta > 1e-9 ? beta : 1e-9) * litres;
}

/** The stock's pH with its titrant moved by `delta` mol/L, its problem moved by `move`, at its temperature plus `kelvin`. */
function stockPH(making: AdjustedMaking, delta: number, move: ConstantMove | undefined, lnHStart?: number, kelvin = 0): number {
  const c = delta === 0 ? making.contents : withReagent(making.contents, making.titrant, delta);
  return solve(applyMove(prepareProblem(c, making.temperatureC + kelvin, making.model), move), lnHStart).pH;
}
/** Temperature step of the stock's own slope, °C. */
const TEMPERATURE_STEP_C = 0.01;

function stockPHOrUndefined(making: AdjustedMaking, lnH: number, kelvin: number): number | undefined {
  try { return stockPH(making, 0, undefined, lnH, kelvin); } catch (e) { if (e instanceof ProticError && e.failure.code === 'out_of_range') return undefined; throw e; }
}

function stockPartials(making: AdjustedMaking): StockPartials {
  const kept = partialsOf.get(making);
  if (kept) return kept;
  const made = solve(prepareProblem(making.contents, making.temperatureC, making.model));
  const at = (delta: number, move?: ConstantMove): number => stockPH(making, delta, move, made.lnH);
  const perN = perMolesOf((d) => at(d), made.pH, stepFor(bufferCapacity(made), 1), making.titrantMPerL);
  const perConstant = (move: (d: number) => ConstantMove): number => (at(0, move(CONSTANT_STEP)) - at(0, move(-CONSTANT_STEP))) / (2 * CONSTANT_STEP);
  const perPKa = new Map(made.problem.systems.map((s) => [s.system.id, s.system.steps.map((_, step) => perConstant((d) => ({ systemId: s.system.id, step, pKaShift: d })))]));
  const pKa25 = new Map(made.problem.systems.map((s) => [s.system.id, s.system.steps.map((step) => step.pKa)]));
  // where a step is outside the data's temperature range, the other side alone
  const hot = stockPHOrUndefined(making, made.lnH, TEMPERATURE_STEP_C), cold = stockPHOrUndefined(making, made.lnH, -TEMPERATURE_STEP_C);
  if (hot === undefined && cold === undefined) {
    fail({ code: 'out_of_range', argument: 'reagents', received: `a stock set at ${making.temperatureC} °C`, expected: 'a temperature with room either side in its systems\' data range' });
  }
  const perKelvin = hot !== undefined && cold !== undefined ? (hot - cold) / (2 * TEMPERATURE_STEP_C)
    : hot !== undefined ? (hot - made.pH) / TEMPERATURE_STEP_C : (made.pH - (cold as number)) / TEMPERATURE_STEP_C;
  const partials = { madePH: made.pH, lnH: made.lnH, perN, perPKa, pKa25, perPKw: perConstant((d) => ({ pKwShift: d })), perKelvin,
    rangeC: temperatureRangeOf(making.contents), remade: new Map<string, number>() };
  partialsOf.set(making, partials);
  return partials;
}

/**
 * The pH-adjusted stocks a mixture draws on, each bottle once: rows whose stocks are the same (reagent, concentration,
 * stated pH, titrant, temperature and model, however spelled) are one bottle, one input.
 */
export function stockUses(rows: MixtureRow[], contents: Contents): StockUse[] {
  const uses = new Map<string, StockUse>();
  rows.forEach((row, r) => {
    const making = parseReagentSpec(row.reagent, 'reagents', row.row).made?.adjusted;
    const litres = contents.rows[r].moles; // a made solution's reagent is one litre of it
    if (!making || !(litres > 0)) return;
    const use = uses.get(making.identity);
    if (use) {
      use.rows.push(r);
      use.litres += litres;
      use.statedHalfDigit = Math.max(use.statedHalfDigit, making.statedHalfDigit);
      use.temperatureWritten ||= making.temperatureWritten;
    } else {
      uses.set(making.identity, { rows: [r], rowNumber: row.row, name: row.reagent, making, litres, statedHalfDigit: making.statedHalfDigit, temperatureWritten: making.temperatureWritten });
    }
  });
  return [...uses.values()];
}

/**
 * The pH-adjusted stocks of a budget's mixture, each with its contribution to the constants' sensitivities and its
 * stated pH's own. `contents`, `eq`: the mixture as read and its solution under `model` at `temperatureC`.
 * @example readjustedStocks([{ reagent: '1 M Tris pH 8.0 with HCl', amount: 50, unit: 'mL', row: 1 }], contents, eq, 25, 'davies')[0].perPKa
 *   // [[≈ −0.96]]: most of the Tris line's direct ≈ +1 is taken back by the stock's HCl following the pKa
 */
export function readjustedStocks(rows: MixtureRow[], contents: Contents, eq: Equilibrium, temperatureC: number, model: ActivityModel,
  perMoleOf?: (reagent: AdjustedMaking['titrant']) => number): ReadjustedStock[] {
  const p = eq.problem;
  return stockUses(rows, contents).map((use) => {
    const stock = stockPartials(use.making);
    // the mixture's pH per mole of the titrant: `perMoleOf` (the implicit derivatives, where the model has them), or
    // stepped to move it by about PH_STEP; per mol/L of the stock's titrant, times its litres
    const mix = (d: number): number => solve(prepareProblem(withReagent(contents, use.making.titrant, d), temperatureC, model), eq.lnH).pH;
    const perMole = perMoleOf ? perMoleOf(use.making.titrant) : perMolesOf(mix, eq.pH, stepFor(bufferCapacity(eq), contents.volumeL), heldMoles(contents, use.making.titrant));
    const mixPerN = perMole * use.litres;
    const through = (stockSlope: number): number => (stockSlope === 0 ? 0 : mixPerN * (-stockSlope / stock.perN));
    return {
      ...use,
      perStatedPH: mixPerN / stock.perN,
      perPKa: p.systems.map((s) => s.system.steps.map((_, k) => through(stock.perPKa.get(s.system.id)?.[k] ?? 0))),
      perPKw: through(stock.perPKw),
      perAdjustmentKelvin: through(stock.perKelvin),
      adjustmentRangeC: stock.rangeC,
    };
  });
}

/**
 * The titrant change, mol per litre of stock, that brings a stock whose problem is moved by `move` to its made pH plus
 * `statedMove`, to `tolerance` (pH): from the change its partials predict, a Newton step on its slope, then secant
 * steps, each a full solve of the stock. Returned only at a point whose solve meets the pH to the tolerance; refused
 * (unreachable_target) where the stock's titrant would go below none, and (no_convergence) where it does not settle.
 */
function remadeTitrant(use: StockUse, move: ConstantMove | undefined, statedMove: number, tolerance: number): number {
  const stock = stockPartials(use.making), key = `${JSON.stringify(move ?? null)} ${statedMove} ${tolerance}`;
  const kept = stock.remade.get(key);
  if (kept !== undefined) return kept;
  const delta = solvedTitrant(use, stock, move, statedMove, tolerance);
  if (stock.remade.size < 1000) stock.remade.set(key, delta);
  return delta;
}

function solvedTitrant(use: StockUse, stock: StockPartials, move: ConstantMove | undefined, statedMove: number, tolerance: number): number {
  const making = use.making, target = stock.madePH + statedMove;
  // none of the titrant at all is the floor: below it the stock is not made with its own titrant
  const floor = -making.titrantMPerL;
  const offBy = (delta: number): number => stockPH(making, Math.max(delta, floor), move, stock.lnH) - target;
  const unreachable = (): never => fail({ code: 'unreachable_target', argument: 'reagents', row: use.rowNumber,
    received: `${use.name} re-made at pH ${target.toFixed(4)}${move ? ' with the constant moved' : ''}`,
    reason: `even with none of its titrant it reads ${(offBy(floor) + target).toFixed(4)} (it took ${Number(making.titrantMPerL.toPrecision(4))} mol/L)`,
    expected: 'a stock its own titrant can bring to that pH' });
  // the pH moves one way with the titrant (the sign of its slope): a step to below none is taken to none, and where the
  // pH there is still past the target in the slope's direction, the target lies below none of it
  const clamped = (delta: number): [number, number] => {
    if (delta >= floor) return [delta, offBy(delta)];
    const f = offBy(floor);
    if (Math.abs(f) > tolerance && Math.sign(f) === Math.sign(stock.perN)) unreachable();
    return [floor, f];
  };
  // the stock's pH off its target before any change, to first order from its partials
  const predicted = predictedMove(stock, move) - statedMove;
  let [d0, f0] = clamped(predicted === 0 ? 0 : -predicted / stock.perN);
  if (Math.abs(f0) <= tolerance) return d0;
  let [d1, f1] = clamped(d0 - f0 / stock.perN);
  for (let iter = 0; iter < REMAKE_STEPS; iter++) {
    if (Math.abs(f1) <= tolerance) return d1;
    if (f1 === f0) break;
    const [d2, f2] = clamped(d1 - (f1 * (d1 - d0)) / (f1 - f0));
    d0 = d1; f0 = f1;
    d1 = d2; f1 = f2;
  }
  return fail({ code: 'no_convergence', argument: 'reagents', row: use.rowNumber, received: `${use.name} re-made: still ${f1.toExponential(2)} pH from ${target.toFixed(4)}`, expected: 'a stock whose re-adjustment settles; please report this case' });
}

/** The stock's pH move, to first order, that `move` causes with its titrant as made. */
function predictedMove(stock: StockPartials, move: ConstantMove | undefined): number {
  if (move === undefined) return 0;
  if ('pKwShift' in move) return stock.perPKw * move.pKwShift;
  const slope = stock.perPKa.get(move.systemId)?.[move.step] ?? 0;
  if ('pKaShift' in move) return slope * move.pKaShift;
  const pKa25 = stock.pKa25.get(move.systemId)?.[move.step];
  return pKa25 === undefined ? 0 : slope * (move.pKa25 - pKa25);
}

/**
 * The mixture's contents with each stock re-made for `move` (a constant moved) and `statedMove` (its stated pH moved):
 * its titrant re-solved to `tolerance` (pH), and the mixture given the stock's litres times the change. Stocks neither
 * touches are as read.
 * @example withRemadeStocks(contents, stocks, { systemId: 'tris', step: 0, pKaShift: 0.02 }, () => 0) // Tris stocks re-made at pKa + 0.02
 */
export function withRemadeStocks(contents: Contents, stocks: StockUse[], move: ConstantMove | undefined, statedMove: (use: StockUse) => number,
  tolerance = REMADE_PH_TOLERANCE): Contents {
  let out = contents;
  for (const use of stocks) {
    const stated = statedMove(use);
    if (!touches(use.making, move) && stated === 0) continue;
    out = withReagent(out, use.making.titrant, use.litres * remadeTitrant(use, move, stated, tolerance));
  }
  return out;
}

/**
 * pH of the mixture with one step's 25 °C pKa replaced (CONSTANTS' alternative value), each pH-adjusted stock that holds
 * that system re-made at it; a stock its own titrant cannot re-make there is refused (unreachable_target).
 * @example pHWithStepPKaReadjusted(rows, contents, eq, 0, 0, 3.755) - eq.pH // formate at its alternative, the stock re-made
 */
export function pHWithStepPKaReadjusted(rows: MixtureRow[], contents: Contents, eq: Equilibrium, systemIndex: number, stepIndex: number, pKa25: number): number {
  const p = eq.problem;
  const move: ConstantMove = { systemId: p.systems[systemIndex].system.id, step: stepIndex, pKa25 };
  const remade = withRemadeStocks(contents, stockUses(rows, contents), move, () => 0);
  return solve(applyMove(prepareProblem(remade, p.temperatureC, p.model), move), eq.lnH).pH;
}
