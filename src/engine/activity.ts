import { fail, quote } from './failure';

export type ActivityModel = 'davies' | 'bates-guggenheim' | 'ideal' | 'sit';
export const ACTIVITY_MODELS: readonly ActivityModel[] = ['davies', 'bates-guggenheim', 'ideal', 'sit'];

/** Ionic strength, mol/kg, above which each model is no longer trusted (common practice). */
export const MODEL_LIMIT_MOLAL: Record<ActivityModel, number> = {
  davies: 0.5,
  'bates-guggenheim': 0.1,
  ideal: 0,
  // SIT with ε independent of I: the NEA TDB reviews use it to about 3–4 mol/kg (Grenthe et al. 1997); our
  // γ± checks (test/sit.gamma.test.ts) hold to 3 mol/kg, and beyond it ε itself drifts with I (ClO4⁻, Cl⁻ media)
  sit: 3,
};

export function parseModel(value: unknown, argument = 'model'): ActivityModel {
  if (value === null || value === undefined || value === '') return 'davies';
  const text = typeof value === 'string' ? value.trim().toLowerCase().replace(/[\s_–—]+/g, '-') : '';
  const model = text === 'bates–guggenheim' || text === 'batesguggenheim' || text === 'bg' ? 'bates-guggenheim' : text;
  if (!(ACTIVITY_MODELS as readonly string[]).includes(model)) {
    fail({ code: 'bad_model', argument, received: quote(value), expected: 'davies, bates-guggenheim, sit or ideal' });
  }
  return model as ActivityModel;
}

/**
 * The ionic-strength factor F(I) with log10 γ = −A z² F(I):
 * Davies 1962 (0.3 I term); Bates–Guggenheim convention (Bates & Guggenheim 1960, åB = 1.5); `sit` has the
 * same D = √I/(1 + 1.5√I) (its ε terms are per species, in sit.ts).
 */
export function ionicStrengthFactor(model: ActivityModel, ionicStrengthMolal: number): number {
  if (model === 'ideal' || ionicStrengthMolal <= 0) return 0;
  const s = Math.sqrt(ionicStrengthMolal);
  return model === 'davies' ? s / (1 + s) - 0.3 * ionicStrengthMolal : s / (1 + 1.5 * s);
}

/** ln γ of an ion of charge z is z² times this. */
export function lnGammaPerZ2(model: ActivityModel, ionicStrengthMolal: number, debyeHuckelA: number): number {
  return -debyeHuckelA * Math.LN10 * ionicStrengthFactor(model, ionicStrengthMolal);
}

/** dF/dI of `ionicStrengthFactor`, per mol/kg (for the joint Newton step of the solver). */
export function ionicStrengthFactorSlope(model: ActivityModel, ionicStrengthMolal: number): number {
  if (model === 'ideal' || ionicStrengthMolal <= 0) return 0;
  const s = Math.sqrt(ionicStrengthMolal);
  return model === 'davies' ? 1 / (2 * s * (1 + s) ** 2) - 0.3 : 1 / (2 * s * (1 + 1.5 * s) ** 2);
}
