// A seeded battery of random inverse problems (TITRANT, RECIPE, SALTDOSE), each answer fed back
// through the forward cell function (PHMIX or IONICSTRENGTH) with the rows a user would type.
// Shared by test/inverse.battery.test.ts and the before/after figures; written against the cell
// functions only, so the same file runs on older versions (where SALTDOSE and finalVolume are absent).
import * as impl from '../src/functions/impl';
import { ACTIVITY_MODELS, ProticError } from '../src/engine';

/** mulberry32: a small seeded generator, so every run draws the same problems. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Rand = () => number;
const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
const between = (r: Rand, lo: number, hi: number): number => lo + (hi - lo) * r();
const logBetween = (r: Rand, lo: number, hi: number): number => Math.exp(between(r, Math.log(lo), Math.log(hi)));

export type Kind = 'titrant' | 'recipe' | 'saltdose';
export type Verdict = 'ok' | 'refused' | 'wrong' | 'internal';

export interface Case {
  kind: Kind;
  /** the cell function's arguments, as a sheet would pass them */
  args: unknown[];
  /** rows and volume of the forward mixture, given the answer; undefined when the answer cannot be typed back */
  feedBack: (answer: unknown) => { reagents: string[][]; amounts: number[][]; units: string[][]; volumeL: number } | undefined;
  target: number;
  temperatureC: number;
  model: string;
  label: string;
}

// Mixture solids the problems start from (a buffer substance or a salt), grams per litre range.
const MIXTURE_SOLIDS: [string, number, number][] = [
  ['KH2PO4', 0.5, 30], ['Na2HPO4', 0.5, 30], ['Tris', 0.5, 60], ['Tris hydrochloride', 0.5, 60], ['citric acid monohydrate', 0.5, 40],
  ['trisodium citrate dihydrate', 0.5, 40], ['sodium acetate trihydrate', 0.5, 40], ['sodium bicarbonate', 0.2, 20], ['glycine', 0.5, 30],
  ['HEPES', 1, 60], ['MES', 1, 40], ['disodium EDTA dihydrate', 0.5, 20], ['boric acid', 0.5, 10], ['ammonium chloride', 0.5, 20],
];

// Titrants: strong and weak, solids, stocks and liquids as sold.
const TITRANTS = [
  'NaOH', 'KOH', 'HCl', '1 M NaOH', '0.1 M NaOH', '5 M NaOH', '0.01 M HCl', '1 M HCl', '6 M HCl', '2 M KOH', '0.5 M H2SO4',
  'Tris', 'sodium acetate trihydrate', 'Na2HPO4·7H2O', 'KH2PO4', 'trisodium citrate dihydrate', 'citric acid monohydrate', 'Tris hydrochloride',
  'sodium carbonate', 'sodium bicarbonate', 'ammonium chloride', '1 M Tris', '0.5 M sodium acetate', '0.2 M Na2HPO4', '1 M acetic acid',
  'hydrochloric acid 37%', 'sodium hydroxide 50%', 'glacial acetic acid', 'ammonia solution 28%', 'phosphoric acid 85%', 'sulfuric acid 96%',
];

const RECIPE_PAIRS: [string, string][] = [
  ['NaH2PO4·H2O', 'Na2HPO4·7H2O'], ['KH2PO4', 'K2HPO4'], ['Na2HPO4', 'Na3PO4'], ['Tris hydrochloride', 'Tris'],
  ['citric acid monohydrate', 'trisodium citrate dihydrate'], ['acetic acid', 'sodium acetate trihydrate'], ['glacial acetic acid', 'sodium acetate'],
  ['hydrochloric acid 37%', 'Tris'], ['HEPES', 'sodium hydroxide 50%'], ['MES', 'NaOH'], ['boric acid', 'borax decahydrate'],
  ['0.1 M KH2PO4', '0.1 M K2HPO4'], ['1 M KH2PO4', '1 M K2HPO4'], ['1 M Tris hydrochloride', '1 M Tris'], ['0.5 M acetic acid', '0.5 M sodium acetate'],
  ['phosphoric acid 85%', 'NaH2PO4'], ['glycine', '1 M NaOH'], ['1 M HCl', 'Tris'], ['ammonium chloride', 'ammonia solution 28%'],
];

const SALTS = ['NaCl', 'KCl', 'Na2SO4', 'magnesium chloride hexahydrate', 'potassium nitrate', '4 M NaCl', '1 M KCl', 'ammonium sulfate'];

const STRONG_ACID = /HCl|H2SO4|hydrochloric|sulfuric|phosphoric|citric|acetic|hydrochloride|KH2PO4|ammonium chloride/i;

function startValue(f: () => number): number | undefined {
  try { return f(); } catch { return undefined; }
}

interface Mixture { reagents: string[][]; amounts: number[][]; units: string[][]; volumeL: number; temperatureC: number; model: string }

function mixture(r: Rand, models: readonly string[]): Mixture {
  const volumeL = logBetween(r, 0.05, 2);
  const rows = 1 + Math.floor(r() * 3);
  const reagents: string[][] = [], amounts: number[][] = [], units: string[][] = [];
  const used = new Set<string>();
  for (let i = 0; i < rows; i++) {
    const [name, lo, hi] = pick(r, MIXTURE_SOLIDS);
    if (used.has(name)) continue;
    used.add(name);
    reagents.push([name]); amounts.push([logBetween(r, lo, hi) * volumeL]); units.push(['g']);
  }
  // 0 to 4 M added salt, as moles, in a third of the problems
  if (r() < 0.35) { reagents.push(['NaCl']); amounts.push([between(r, 0, 4) * volumeL]); units.push(['mol']); }
  return { reagents, amounts, units, volumeL, temperatureC: Math.round(between(r, 0, 50) * 10) / 10, model: pick(r, models) };
}

function titrantCase(r: Rand, models: readonly string[], withFinalVolume: boolean): Case {
  const m = mixture(r, models);
  const titrant = pick(r, TITRANTS);
  const dispensed = /\bM\b|%|glacial/.test(titrant);
  const finalVolumeL = withFinalVolume && r() < 0.3 ? m.volumeL * between(r, 1.05, 3) : undefined;
  // a target anywhere in 1–13, or a step from the starting pH the way the titrant drives it
  const startPH = startValue(() => impl.ph(m.reagents, m.amounts, m.units, m.volumeL, m.temperatureC, m.model) as number);
  const way = STRONG_ACID.test(titrant) ? -1 : 1;
  const target = r() < 0.4 || startPH === undefined ? Math.round(between(r, 1, 13) * 1000) / 1000
    : Math.round((startPH + way * logBetween(r, 0.005, 5)) * 1e4) / 1e4;
  const unit = dispensed ? 'mL' : 'g';
  const args: unknown[] = [target, m.reagents, m.amounts, m.units, m.volumeL, titrant, m.temperatureC, m.model, unit];
  if (finalVolumeL !== undefined) args.push(finalVolumeL);
  return {
    kind: 'titrant', args, target, temperatureC: m.temperatureC, model: m.model,
    label: `TITRANT(${target}, ${m.reagents.flat().join('+')}, V ${m.volumeL.toFixed(3)}, ${titrant}, ${m.temperatureC} °C, ${m.model}${finalVolumeL ? `, final ${finalVolumeL.toFixed(3)} L` : ''})`,
    feedBack: (answer) => {
      const amount = answer as number;
      const volumeL = finalVolumeL ?? m.volumeL + (dispensed ? amount / 1000 : 0);
      return { reagents: [...m.reagents, [titrant]], amounts: [...m.amounts, [amount]], units: [...m.units, [unit]], volumeL };
    },
  };
}

function recipeCase(r: Rand, models: readonly string[]): Case {
  const [acid, base] = pick(r, RECIPE_PAIRS);
  const volumeL = logBetween(r, 0.05, 2);
  const concentrationM = logBetween(r, 1e-3, 2);
  const target = Math.round(between(r, 1.5, 12.5) * 1000) / 1000;
  const temperatureC = Math.round(between(r, 0, 50) * 10) / 10;
  const model = pick(r, models);
  const saltM = r() < 0.4 ? between(r, 0, 4) : 0;
  const args: unknown[] = [acid, base, target, concentrationM, volumeL, temperatureC, model];
  if (saltM > 0) args.push([['NaCl']], [[saltM]], [['M']]);
  return {
    kind: 'recipe', args, target, temperatureC, model,
    label: `RECIPE(${acid}, ${base}, ${target}, ${concentrationM.toPrecision(3)} M, ${volumeL.toFixed(3)} L, ${temperatureC} °C, ${model}, NaCl ${saltM.toFixed(2)} M)`,
    feedBack: (answer) => {
      const table = answer as unknown[][];
      const rows = table.map((row, i) => {
        // RECIPE's unit column; a two-column table (older versions) marks a stock's mL in its label
        const unit = row.length >= 3 ? String(row[2]) : String(row[0]).endsWith('(mL)') ? 'mL' : 'g';
        return { reagent: i === 0 ? acid : base, amount: row[1] as number, unit };
      });
      const reagents = rows.map((x) => [x.reagent]), amounts = rows.map((x) => [x.amount]), units = rows.map((x) => [x.unit]);
      if (saltM > 0) { reagents.push(['NaCl']); amounts.push([saltM * volumeL]); units.push(['mol']); }
      return { reagents, amounts, units, volumeL };
    },
  };
}

function saltCase(r: Rand, models: readonly string[]): Case {
  const m = mixture(r, models);
  const salt = pick(r, SALTS);
  const dispensed = /\bM\b/.test(salt);
  const startI = startValue(() => impl.ionicStrength(m.reagents, m.amounts, m.units, m.volumeL, m.temperatureC, m.model) as number);
  const target = r() < 0.4 || startI === undefined ? Math.round(logBetween(r, 0.005, 6) * 1e4) / 1e4 : startI * (1 + logBetween(r, 1e-3, 20));
  const unit = dispensed ? 'mL' : 'g';
  return {
    kind: 'saltdose', args: [target, salt, m.reagents, m.amounts, m.units, m.volumeL, m.temperatureC, m.model, unit], target,
    temperatureC: m.temperatureC, model: m.model,
    label: `SALTDOSE(${target}, ${salt}, ${m.reagents.flat().join('+')}, V ${m.volumeL.toFixed(3)}, ${m.temperatureC} °C, ${m.model})`,
    feedBack: (answer) => ({ reagents: [...m.reagents, [salt]], amounts: [...m.amounts, [answer as number]], units: [...m.units, [unit]], volumeL: m.volumeL }),
  };
}

export interface BatteryOptions { seed: number; counts: Partial<Record<Kind, number>>; finalVolume: boolean; /** default: every model the engine has */ models?: readonly string[] }

/** Draws the battery's problems; the same seed and counts always give the same problems. */
export function drawCases(options: BatteryOptions): Case[] {
  const r = seeded(options.seed);
  const models = options.models ?? ACTIVITY_MODELS;
  const out: Case[] = [];
  for (let i = 0; i < (options.counts.titrant ?? 0); i++) out.push(titrantCase(r, models, options.finalVolume));
  for (let i = 0; i < (options.counts.recipe ?? 0); i++) out.push(recipeCase(r, models));
  for (let i = 0; i < (options.counts.saltdose ?? 0); i++) out.push(saltCase(r, models));
  return out;
}

/** Tolerances of the contract: pH within 1e-6; ionic strength within 1e-9 relative. */
export function withinTolerance(kind: Kind, target: number, value: number): boolean {
  return kind === 'saltdose' ? Math.abs(value - target) <= 1e-9 * target : Math.abs(value - target) <= 1e-6;
}

export interface Outcome { verdict: Verdict; answer?: unknown; value?: number; detail: string; /** for a refusal, the argument it names */ argument?: string }

type Fn = (...a: unknown[]) => unknown;
/** SALTDOSE lives in its own module; on a version without it, its cases report as internal errors. */
function saltDoseFunction(): Fn {
  try {
    return (require('../src/functions/saltdose') as { saltDose: Fn }).saltDose;
  } catch {
    return () => { throw new Error('SALTDOSE is not in this version'); };
  }
}
const FUNCTIONS: Record<Kind, Fn> = { titrant: impl.titrant as Fn, recipe: impl.recipe as Fn, saltdose: saltDoseFunction() };

/** The forward value of a fed-back mixture through the cell functions (impl, no spreadsheet). */
export function forward(kind: Kind, rows: NonNullable<ReturnType<Case['feedBack']>>, c: Case): number {
  const f = kind === 'saltdose' ? impl.ionicStrength : impl.ph;
  return f(rows.reagents, rows.amounts, rows.units, rows.volumeL, c.temperatureC, c.model) as number;
}

/** Runs one case: a coded refusal, an answer that reaches its target, or a wrong (silent) answer. */
export function runCase(c: Case): Outcome {
  let answer: unknown;
  try {
    answer = FUNCTIONS[c.kind](...c.args);
  } catch (e) {
    if (e instanceof ProticError) return { verdict: 'refused', detail: e.failure.code, argument: e.failure.argument };
    return { verdict: 'internal', detail: String(e) };
  }
  const numbers = c.kind === 'recipe' ? (answer as unknown[][]).map((row) => row[1]) : [answer];
  if (numbers.some((x) => typeof x !== 'number' || !Number.isFinite(x))) return { verdict: 'wrong', answer, detail: `not a finite number: ${String(numbers)}` };
  const rows = c.feedBack(answer);
  if (!rows) return { verdict: 'wrong', answer, detail: 'cannot be typed back' };
  let value: number;
  try {
    value = forward(c.kind, rows, c);
  } catch (e) {
    return { verdict: 'wrong', answer, detail: `fed back, the forward solve refuses it: ${e instanceof ProticError ? e.failure.code : String(e)}` };
  }
  if (!withinTolerance(c.kind, c.target, value)) return { verdict: 'wrong', answer, value, detail: `fed back gives ${value} for target ${c.target}` };
  return { verdict: 'ok', answer, value, detail: '' };
}

export interface Tally { total: number; ok: number; refused: number; wrong: number; internal: number; examples: string[] }

export function tally(cases: Case[], run: (c: Case) => Outcome = runCase): Record<Kind, Tally> {
  const out = {} as Record<Kind, Tally>;
  for (const c of cases) {
    const t = (out[c.kind] ??= { total: 0, ok: 0, refused: 0, wrong: 0, internal: 0, examples: [] });
    const o = run(c);
    t.total++;
    t[o.verdict]++;
    if ((o.verdict === 'wrong' || o.verdict === 'internal') && t.examples.length < 8) t.examples.push(`${c.label}: ${o.detail}`);
  }
  return out;
}
