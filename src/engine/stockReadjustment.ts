import type { ActivityModel } from './activity';
import { withStepPKa } from './alternative';
import { fail } from './failure';
import { addReagent, cloneContents, parseReagentSpec } from './mixture';
import type { Contents, MixtureRow } from './mixture';
import type { Problem } from './problem';
import { prepareProblem } from './problem';
import { bufferCapacity } from './results';
import type { Equilibrium } from './solver';
import { solve } from './solver';
import type { AdjustedMaking } from './stockHandle';
import { shiftConstants } from './uncertainty';

// A stock written with a pH (`1 M Tris pH 8.0 with HCl`) is at that pH: it was brought there on a meter. Its titrant is
// what the catalogue constants say that took, so a constant that moves moves the titrant with it, and the stock stays
// at its stated pH. The budget's constant lines therefore differentiate the mixture with each such stock re-adjusted:
// d pH/dθ = ∂pH/∂θ + Σ_stocks ∂pH/∂n · dn/dθ, with dn/dθ = −(∂pH_stock/∂θ)/(∂pH_stock/∂n) from the stock's own
// solve (implicit function of its adjustment), n its titrant in mol per litre of stock; and the stated pH is an input
// of its own, dn/dpH_stated = 1/(∂pH_stock/∂n). Every partial is a central difference of full solves.

/** pH move aimed at by a titrant step (as budgetSensitivities' amount steps). */
const PH_STEP = 1e-4;
/** pKa and pKw step. */
const CONSTANT_STEP = 1e-3;

/** What the budget needs of one pH-adjusted stock row. */
export interface ReadjustedStock {
  /** index of the row in the budget's rows */
  row: number;
  name: string;
  making: AdjustedMaking;
  /** dpH of the mixture per unit of the stock's stated pH (its titrant re-solved to it) */
  perStatedPH: number;
  /** [system][step] of the mixture: dpH added through this stock's re-adjustment per unit of that pKa */
  perPKa: number[][];
  /** the same per unit of pKw */
  perPKw: number;
}

/** pH of a solve, with the problem's constants moved first. */
function pHOf(contents: Contents, temperatureC: number, model: ActivityModel, lnHStart: number, shift?: (p: Problem) => void): number {
  const p = prepareProblem(contents, temperatureC, model);
  shift?.(p);
  return solve(p, lnHStart).pH;
}

/** d pH / d(moles of `reagent` added), central where `held` moles (already in) allow the step back, else forward (Richardson). */
function perMolesOf(at: (moles: number) => number, pH0: number, step: number, held: number): number {
  if (held > 2 * step) return (at(step) - at(-step)) / (2 * step);
  return (4 * at(step) - at(2 * step) - 3 * pH0) / (2 * step);
}

/** `contents` with `moles` of `reagent` added (a copy: the stock's own contents are cached and shared). */
export function withReagent(contents: Contents, reagent: AdjustedMaking['titrant'], moles: number): Contents {
  const out = cloneContents(contents);
  addReagent(out, reagent, moles);
  return out;
}

/** Moles of a reagent's first component in contents (its titrant's share, for whether a step back fits). */
function heldMoles(contents: Contents, reagent: AdjustedMaking['titrant']): number {
  const ion = reagent.ions[0], system = reagent.systems[0];
  if (ion) return (contents.ionMoles.get(ion.ionId) ?? 0) / ion.count;
  return system ? (contents.systemMoles.get(system.systemId) ?? 0) / system.count : 0;
}

/**
 * The pH-adjusted stock rows of a budget's mixture, each with its contribution to the constants' sensitivities and
 * its stated pH's own. `contents`, `eq`: the mixture as read and its solution under `model` at `temperatureC`.
 * @example readjustedStocks([{ reagent: '1 M Tris pH 8.0 with HCl', amount: 50, unit: 'mL', row: 1 }], contents, eq, 25, 'davies')[0].perPKa
 *   // [[≈ −1]]: the Tris line's direct ≈ +1 is taken back by the stock's HCl following the pKa
 */
export function readjustedStocks(rows: MixtureRow[], contents: Contents, eq: Equilibrium, temperatureC: number, model: ActivityModel): ReadjustedStock[] {
  const out: ReadjustedStock[] = [];
  const p = eq.problem;
  rows.forEach((row, r) => {
    const making = parseReagentSpec(row.reagent, 'reagents', row.row).made?.adjusted;
    const litres = contents.rows[r].moles; // a made solution's reagent is one litre of it
    if (!making || !(litres > 0)) return;
    // the stock's own partials, at its own temperature and model
    const stock = solve(prepareProblem(making.contents, making.temperatureC, making.model));
    const stepN = PH_STEP * Math.max(bufferCapacity(stock), 1e-9);
    const stockAt = (moles: number, shift?: (q: Problem) => void): number =>
      pHOf(moles === 0 ? making.contents : withReagent(making.contents, making.titrant, moles), making.temperatureC, making.model, stock.lnH, shift);
    const perN = perMolesOf((d) => stockAt(d), stock.pH, stepN, heldMoles(making.contents, making.titrant));
    const stockSystems = stock.problem.systems.map((s) => s.system.id);
    const stockPerConstant = (shiftOf: (d: number) => (q: Problem) => void): number =>
      (stockAt(0, shiftOf(CONSTANT_STEP)) - stockAt(0, shiftOf(-CONSTANT_STEP))) / (2 * CONSTANT_STEP);
    // the mixture's pH per mole of the titrant, stepped to move it by about PH_STEP
    const stepMix = PH_STEP * Math.max(bufferCapacity(eq), 1e-9) * contents.volumeL;
    const mixPerMole = perMolesOf((d) => pHOf(withReagent(contents, making.titrant, d), temperatureC, model, eq.lnH), eq.pH, stepMix, heldMoles(contents, making.titrant));
    // per mol/L of the stock's titrant, the mixture moves by its litres of stock times that
    const mixPerN = mixPerMole * litres;
    const through = (stockSlope: number): number => (stockSlope === 0 ? 0 : mixPerN * (-stockSlope / perN));
    const perPKa = p.systems.map((s) => {
      const j = stockSystems.indexOf(s.system.id);
      return s.system.steps.map((_, k) => (j < 0 ? 0 : through(stockPerConstant((d) => (q) => shiftConstants(q, q.systems.map((_, m) => (m === j ? Array.from(q.systems[m].lnKa, (_, n) => (n === k ? d : 0)) : [])), 0)))));
    });
    const perPKw = through(stockPerConstant((d) => (q) => shiftConstants(q, [], d)));
    out.push({ row: r, name: row.reagent, making, perStatedPH: mixPerN / perN, perPKa, perPKw });
  });
  return out;
}

/** A stock's stated pH is met to this (pH) when it is re-made at another constant; the verifying solve is the one that meets it. */
const REMADE_PH_TOLERANCE = 1e-10;

/**
 * pH of the mixture with one step's 25 °C pKa replaced (CONSTANTS' alternative value), each pH-adjusted stock that holds
 * that system re-made at it: its titrant re-solved (secant on full solves of the stock) until the stock reads its stated
 * pH again, to 1e-10; then the mixture with those titrants and that constant, solved. Refused (no_convergence,
 * out_of_range) where a stock cannot be re-made with its own titrant.
 * @example pHWithStepPKaReadjusted(rows, contents, eq, 0, 0, 3.755) - eq.pH // formate at its alternative, the stock re-made
 */
export function pHWithStepPKaReadjusted(rows: MixtureRow[], contents: Contents, eq: Equilibrium, systemIndex: number, stepIndex: number, pKa25: number): number {
  const p = eq.problem, id = p.systems[systemIndex].system.id;
  let mixture = contents;
  rows.forEach((row, r) => {
    const making = parseReagentSpec(row.reagent, 'reagents', row.row).made?.adjusted;
    const litres = contents.rows[r].moles;
    if (!making || !(litres > 0)) return;
    const stock = solve(prepareProblem(making.contents, making.temperatureC, making.model));
    const j = stock.problem.systems.findIndex((s) => s.system.id === id);
    if (j < 0) return;
    mixture = withReagent(mixture, making.titrant, litres * remadeTitrant(making, stock, row, j, stepIndex, pKa25));
  });
  const q = withStepPKa(prepareProblem(mixture, p.temperatureC, p.model), systemIndex, stepIndex, pKa25);
  return solve(q, eq.lnH).pH;
}

/** Most secant steps a stock's re-making may take before it is refused. */
const REMAKE_STEPS = 40;

/**
 * The titrant (mol/L of stock) to add to a pH-adjusted stock so that it reads its stated pH again with step `stepIndex`
 * of its system `j` at 25 °C pKa `pKa25`: a secant on full solves of the stock, from the titrant as made and a small
 * step (the slope's sign is the titrant's: an acid lowers the pH). Returned only at a point whose solve meets the
 * stated pH to REMADE_PH_TOLERANCE; refused where the titrant would go below none, or where it does not settle.
 */
function remadeTitrant(making: AdjustedMaking, stock: Equilibrium, row: MixtureRow, j: number, stepIndex: number, pKa25: number): number {
  const held = heldMoles(making.contents, making.titrant);
  const offBy = (delta: number): number => {
    if (held + delta < 0) fail({ code: 'out_of_range', argument: 'reagents', row: row.row, received: `${row.reagent} at pKa ${pKa25}`, expected: 'a stock its own titrant can bring to its stated pH at this constant' });
    const q = withStepPKa(prepareProblem(delta === 0 ? making.contents : withReagent(making.contents, making.titrant, delta), making.temperatureC, making.model), j, stepIndex, pKa25);
    return solve(q, stock.lnH).pH - making.statedPH;
  };
  let d0 = PH_STEP * Math.max(bufferCapacity(stock), 1e-9), f0 = offBy(d0);
  const atMade = offBy(0);
  let d1 = -atMade * (d0 / (f0 - atMade)), f1 = offBy(d1);
  for (let iter = 0; iter < REMAKE_STEPS; iter++) {
    if (Math.abs(f1) <= REMADE_PH_TOLERANCE) return d1;
    if (f1 === f0) break;
    const d2 = d1 - (f1 * (d1 - d0)) / (f1 - f0);
    d0 = d1; f0 = f1;
    d1 = d2; f1 = offBy(d1);
  }
  return fail({ code: 'no_convergence', argument: 'reagents', row: row.row, received: `${row.reagent} re-made at pKa ${pKa25}: still ${f1.toExponential(2)} pH from its stated pH`, expected: 'a stock whose re-adjustment settles; please report this case' });
}
