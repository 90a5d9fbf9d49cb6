// The activity correction L is a fixed point L = g(L) (the ionic strength the speciation gives at L
// sets the next L). Plain iteration converges only when |g'| < 1 and slowly when g' is near −1, as
// at high ionic strength; a secant step on the residual r = g(L) − L converges from either side.

/** The two last points of a fixed-point search. */
export interface FixedPointState { lastL: number; lastResidual: number }

export function fixedPointStart(): FixedPointState {
  return { lastL: NaN, lastResidual: NaN };
}

// A secant step may not move L by more than this (ln γ per z²; a factor e on every γ).
const MAX_STEP = 1;

/**
 * The next L from the current one and its residual r = g(L) − L: the secant root of r once two
 * points are known, else the plain step L + r; at most MAX_STEP either way. Example: L = fixedPointStep(state, L, g(L) − L).
 */
export function fixedPointStep(state: FixedPointState, L: number, residual: number): number {
  const slope = (residual - state.lastResidual) / (L - state.lastL);
  const step = Number.isFinite(slope) && slope !== 0 ? -residual / slope : residual;
  state.lastL = L;
  state.lastResidual = residual;
  return L + Math.max(-MAX_STEP, Math.min(MAX_STEP, step));
}
