import { buildContents, prepareProblem, solve } from '../src/engine';
import type { ActivityModel, Equilibrium } from '../src/engine';

/**
 * A known miss asserts its size: the signed miss (computed − reference) stays within ±margin of the miss measured
 * and written beside the row, so the row fails when the miss grows, shrinks to a pass, or the row throws.
 */
export function expectMissWithin(miss: number, measured: number, margin: number): void {
  expect(Number.isFinite(miss)).toBe(true);
  expect(miss).toBeGreaterThanOrEqual(measured - margin);
  expect(miss).toBeLessThanOrEqual(measured + margin);
}

/** Solves reagents given as final concentrations, mol/L. */
export function solveConcentrations(rows: [string, number][], temperatureC = 25, model: ActivityModel = 'davies'): Equilibrium {
  const contents = buildContents(rows.map(([reagent, amount], i) => ({ reagent, amount, unit: 'M', row: i + 1 })), undefined);
  return solve(prepareProblem(contents, temperatureC, model));
}
