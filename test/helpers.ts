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

/**
 * mol/L for each row so that the engine sees the stated molalities (mol/kg): c = m·w with w the solution's own kg of
 * water per litre, which depends on c (the density fits, an input of the solve, not its balance); settled by iteration.
 */
export function molarForMolal(rows: [string, number][], temperatureC = 25): [string, number][] {
  let w = 0.997, previous = 0;
  for (let i = 0; i < 100 && Math.abs(w - previous) > 1e-13; i++) {
    previous = w;
    const eq = solveConcentrations(rows.map(([r, m]) => [r, m * w]), temperatureC, 'ideal');
    w = Math.exp(eq.problem.lnWaterDensity);
  }
  if (Math.abs(w - previous) > 1e-13) throw new Error('kg of water per litre did not settle');
  return rows.map(([r, m]) => [r, m * w]);
}
