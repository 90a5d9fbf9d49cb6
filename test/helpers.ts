import { buildContents, prepareProblem, solve } from '../src/engine';
import type { ActivityModel, Equilibrium } from '../src/engine';

/** Solves reagents given as final concentrations, mol/L. */
export function solveConcentrations(rows: [string, number][], temperatureC = 25, model: ActivityModel = 'davies'): Equilibrium {
  const contents = buildContents(rows.map(([reagent, amount], i) => ({ reagent, amount, unit: 'M', row: i + 1 })), undefined);
  return solve(prepareProblem(contents, temperatureC, model));
}
