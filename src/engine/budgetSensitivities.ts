import type { ActivityModel } from './activity';
import { ProticError } from './failure';
import { buildContents } from './mixture';
import type { MixtureRow } from './mixture';
import type { Problem } from './problem';
import { prepareProblem } from './problem';
import type { Equilibrium } from './solver';
import { solve } from './solver';
import { isConcentrationUnit, parseUnit } from './units';
import { PHSensitivity, rowAmountSensitivities, shiftConstants, volumeSensitivity } from './uncertainty';
import { bufferCapacity } from './results';

// The pH sensitivities an uncertainty budget needs, one shape for every model. Davies, Bates–Guggenheim and ideal:
// the solver's implicit derivatives (uncertainty.ts). sit: each species' ε term moves with the composition and the
// speciation, which the implicit derivatives hold fixed, so each sensitivity is a central difference of two full
// solves (contents, density, sit offsets and all), as CAPACITY under sit is.

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
  oneSided: { input: string; reason: string }[];
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
  const concentrationRows = rows.map((r) => isConcentrationUnit(parseUnit(r.unit, 'units', r.row)));
  // moles per unit of each row's amount: from the row itself, or for a row at 0 from the same row at one unit
  const molesPerUnit = rows.map((row, r) => (row.amount > 0 ? contents.rows[r].moles / row.amount : buildContents([{ ...row, amount: 1 }], volumeL).rows[0].moles));
  if (model === 'sit') return { ...resolvedSensitivities(eq, rows, volumeL, temperatureC, model, concentrationRows.every(Boolean), molesPerUnit), concentrationRows };
  const sens = new PHSensitivity(eq);
  const p = eq.problem;
  return {
    eq,
    perAmount: rowAmountSensitivities(sens, contents, molesPerUnit),
    perLitre: volumeSensitivity(sens, contents, concentrationRows),
    perKelvin: sens.perKelvin(),
    perPKa: p.systems.map((s, i) => s.system.steps.map((_, k) => sens.perPKa(i, k))),
    perPKw: sens.perPKw(),
    method: 'sensitivities: implicit derivatives of the solve',
    concentrationRows,
    oneSided: [],
  };
}

/** Under sit: every sensitivity a central difference of full solves, each started from the solution's own ln h. */
function resolvedSensitivities(eq: Equilibrium, rows: MixtureRow[], volumeL: number, temperatureC: number, model: ActivityModel,
  allConcentrations: boolean, molesPerUnit: number[]): Omit<BudgetSensitivities, 'concentrationRows'> {
  const oneSided: { input: string; reason: string }[] = [];
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
    oneSided.push({ input, reason: 'the other side is outside the data\'s range' });
    if (up !== undefined) return (up - eq.pH) / h;
    if (down !== undefined) return (eq.pH - down) / h;
    return at(h); // both sides refused: let the refusal through
  };
  const withAmount = (r: number, amount: number): number => pHAt(rows.map((x, k) => (k === r ? { ...x, amount } : x)), volumeL, temperatureC);
  const perAmount = rows.map((row, r) => {
    const input = `amount: ${row.reagent}`;
    if (row.amount > 0) return slope(input, (d) => withAmount(r, row.amount + d), row.amount * RELATIVE_STEP);
    if (!(molesPerUnit[r] > 0)) return 0; // water, or a row that releases nothing
    // at 0 a step back would be a negative amount: forward, Richardson-extrapolated ((4 f(h) − f(2h) − 3 f(0)) / 2h, error
    // of order h²), with the step the amount that moves the pH by about 1e-4 (β·1e-4 mol/L of base equivalent)
    oneSided.push({ input, reason: 'at amount 0, forward (a step back would be a negative amount)' });
    const h = (RELATIVE_STEP * Math.max(bufferCapacity(eq), 1e-9) * volumeL) / molesPerUnit[r];
    return (4 * withAmount(r, h) - withAmount(r, 2 * h) - 3 * eq.pH) / (2 * h);
  });
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
