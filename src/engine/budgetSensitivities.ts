import type { ActivityModel } from './activity';
import { ProticError } from './failure';
import { buildContents } from './mixture';
import type { MixtureRow } from './mixture';
import type { Problem } from './problem';
import { prepareProblem } from './problem';
import type { Equilibrium } from './solver';
import { solve } from './solver';
import { parseUnit } from './units';
import { PHSensitivity, rowAmountSensitivities, shiftConstants, volumeSensitivity } from './uncertainty';

// The pH sensitivities an uncertainty budget needs, one shape for every model. Davies, Bates–Guggenheim and ideal:
// the solver's implicit derivatives (uncertainty.ts). sit: each species' ε term moves with the composition and the
// speciation, which the implicit derivatives hold fixed, so each sensitivity is a central difference of two full
// solves (contents, density, sit offsets and all), as CAPACITY under sit is.

/** dpH per unit of each input of a budget, at the solution `eq`. */
export interface BudgetSensitivities {
  eq: Equilibrium;
  /** per row, dpH per unit of its amount in the unit it was typed in; 0 for a row whose amount is 0 */
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
  /** inputs whose difference had to be one-sided (the other side is outside the data's range) */
  oneSided: string[];
}

/** Relative step of an amount or the volume for the central differences (truncation about 1e-8 relative, solve noise below 1e-8). */
const RELATIVE_STEP = 1e-4;
/** Temperature step, °C. */
const TEMPERATURE_STEP_C = 0.01;
/** pKa and pKw step. */
const CONSTANT_STEP = 1e-3;

/**
 * The budget's sensitivities of the mixture `rows` in `volumeL` at `temperatureC` under `model`.
 * @example budgetSensitivities([{ reagent: 'NaCl', amount: 58.44, unit: 'g', row: 1 }, { reagent: 'HCl', amount: 10, unit: 'mM', row: 2 }], 1, 25, 'sit').perAmount
 *   // dpH per g of NaCl and per mM of HCl, from central differences of sit solves
 */
export function budgetSensitivities(rows: MixtureRow[], volumeL: number, temperatureC: number, model: ActivityModel): BudgetSensitivities {
  const contents = buildContents(rows, volumeL);
  const eq = solve(prepareProblem(contents, temperatureC, model));
  const concentrationRows = rows.map((r) => parseUnit(r.unit, 'units', r.row).kind === 'concentration');
  if (model === 'sit') return resolvedSensitivities(eq, rows, volumeL, temperatureC, model, concentrationRows.every(Boolean));
  const sens = new PHSensitivity(eq);
  const p = eq.problem;
  return {
    eq,
    perAmount: rowAmountSensitivities(sens, contents, rows.map((r) => r.amount)),
    perLitre: volumeSensitivity(sens, contents, concentrationRows),
    perKelvin: sens.perKelvin(),
    perPKa: p.systems.map((s, i) => s.system.steps.map((_, k) => sens.perPKa(i, k))),
    perPKw: sens.perPKw(),
    method: 'sensitivities: implicit derivatives of the solve',
    oneSided: [],
  };
}

/** Under sit: every sensitivity a central difference of full solves, each started from the solution's own ln h. */
function resolvedSensitivities(eq: Equilibrium, rows: MixtureRow[], volumeL: number, temperatureC: number, model: ActivityModel,
  allConcentrations: boolean): BudgetSensitivities {
  const oneSided: string[] = [];
  const pHAt = (r: MixtureRow[], v: number, t: number, shift?: (p: Problem) => void): number => {
    const p = prepareProblem(buildContents(r, v), t, model);
    shift?.(p);
    return solve(p, eq.lnH).pH;
  };
  // a side outside the data's range (a temperature at the edge of a system's range, say) leaves a one-sided difference
  const slope = (input: string, at: (d: number) => number, h: number): number => {
    const side = (d: number): number | undefined => {
      try { return at(d); } catch (e) { if (e instanceof ProticError && e.failure.code === 'out_of_range') return undefined; throw e; }
    };
    const up = side(h), down = side(-h);
    if (up !== undefined && down !== undefined) return (up - down) / (2 * h);
    oneSided.push(input);
    if (up !== undefined) return (up - eq.pH) / h;
    if (down !== undefined) return (eq.pH - down) / h;
    return at(h); // both sides refused: let the refusal through
  };
  const perAmount = rows.map((row, r) => (row.amount > 0
    ? slope(`amount: ${row.reagent}`, (d) => pHAt(rows.map((x, k) => (k === r ? { ...x, amount: x.amount + d } : x)), volumeL, temperatureC), row.amount * RELATIVE_STEP)
    : 0));
  const p = eq.problem;
  return {
    eq,
    perAmount,
    // rows given as concentrations do not depend on the volume: exactly 0, not the rounding of two solves
    perLitre: allConcentrations ? 0 : slope('final volume', (d) => pHAt(rows, volumeL + d, temperatureC), volumeL * RELATIVE_STEP),
    perKelvin: slope('temperature', (d) => pHAt(rows, volumeL, temperatureC + d), TEMPERATURE_STEP_C),
    perPKa: p.systems.map((s, i) => s.system.steps.map((_, k) => slope(`pKa ${s.system.name} ${k + 1}`,
      (d) => pHAt(rows, volumeL, temperatureC, (q) => shiftConstants(q, q.systems.map((_, j) => (j === i ? s.system.steps.map((__, m) => (m === k ? d : 0)) : [])), 0)), CONSTANT_STEP))),
    perPKw: slope('pKw', (d) => pHAt(rows, volumeL, temperatureC, (q) => shiftConstants(q, [], d)), CONSTANT_STEP),
    method: 'sensitivities: central differences of full sit solves (the ε terms move with the composition)',
    oneSided,
  };
}
