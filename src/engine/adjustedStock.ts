import { strongIonById } from '../catalogue';
import { parseModel } from './activity';
import type { ActivityModel } from './activity';
import { ProticError, fail, quote } from './failure';
import { addReagent } from './mixture';
import type { Contents, ReagentSpec } from './mixture';
import { prepareProblem } from './problem';
import { modelWarning } from './results';
import { resolveReagent } from './registry';
import type { ResolvedReagent } from './registry';
import { solve } from './solver';
import type { StockComposition } from './stockHandle';
import { titrantForTarget } from './titrant';
import { findUnit } from './units';
import type { Unit } from './units';

// A stock as the trade writes it on a bottle: `1 M Tris pH 8.0 with HCl`, `0.5 M Na2EDTA·2H2O pH 8.0
// with NaOH at 25 °C`, or the shorthand `1 M Tris-HCl pH 8.0` (Tris base brought to pH 8.0 with HCl).
// Its composition is solved at its own concentration and temperature, made up to volume.

export interface AdjustedStockText {
  concentrationM: number;
  reagentText: string;
  targetPH: number;
  /** the target pH as written (8.0), for messages that suggest a text */
  targetPHText: string;
  /** decimals the target pH was written with (pH 8.0: 1) */
  targetPHDecimals: number;
  /** the titrant as written, or undefined to choose HCl or NaOH by the side of the target */
  titrantText?: string;
  temperatureC: number;
  /** whether the text says the temperature (`at 37 °C`), or 25 °C was taken */
  temperatureWritten: boolean;
  /** the activity model the stock is adjusted under: what is in the bottle does not change with a later cell's model */
  model: ActivityModel;
}

const NUMBER = String.raw`(\d+(?:[.,]\d+)?(?:[eE][-+]?\d+)?|[.,]\d+)`;
const PATTERN = new RegExp(String.raw`^\s*${NUMBER}\s*(M|mM|[uµμ]M|mol\/[lL]|mmol\/[lL])\s+(.+?)\s*,?\s+pH\s*${NUMBER}`
  + String.raw`(?:\s+(?:with|using)\s+(.+?))?(?:\s+at\s+${NUMBER}\s*°?\s*C)?(?:\s+under\s+([A-Za-z–-]+))?\s*$`);
// `Tris-HCl`, `HEPES-NaOH`, `MES/KOH`: the base (or acid) then the titrant that set the pH
const SHORTHAND = /^(.+?)\s*[-/–]\s*(HCl|NaOH|KOH)$/i;

function num(text: string): number {
  return Number(text.replace(',', '.'));
}

/** Decimals a number was written with (8.0: 1; 8: 0; 80.5e-1: 2), its resolution for the stated pH's limit. */
function decimalsOf(text: string): number {
  const m = /^\d*(?:[.,](\d*))?(?:[eE]([-+]?\d+))?$/.exec(text);
  return Math.max(0, (m?.[1]?.length ?? 0) - Number(m?.[2] ?? 0));
}

/** Reads `<concentration> <reagent> pH <x> [with <titrant>] [at <T> °C]`, or undefined when the text is not one. */
export function parseAdjustedStock(text: string): AdjustedStockText | undefined {
  const m = PATTERN.exec(text);
  if (!m) return undefined;
  const unit = findUnit(m[2].replace(/l$/, 'L')) as Unit;
  let reagentText = m[3].trim();
  let titrantText = m[5]?.trim();
  const short = SHORTHAND.exec(reagentText);
  if (short && titrantText === undefined) {
    reagentText = short[1];
    titrantText = short[2];
  }
  return {
    concentrationM: num(m[1]) * unit.toBase, reagentText, targetPH: num(m[4]), targetPHText: m[4], targetPHDecimals: decimalsOf(m[4]), titrantText,
    temperatureC: m[6] === undefined ? 25 : num(m[6]), temperatureWritten: m[6] !== undefined, model: m[7] === undefined ? 'davies' : parseModel(m[7], 'reagents'),
  };
}

// `Tris HCl pH 8.0` (a space, not a hyphen): the name of a salt, Tris hydrochloride, which is then brought to the pH with
// NaOH; labs also write it for Tris base brought down with HCl, which holds other counter-ions (0.6 against 1 mol/L Cl⁻)
const SPACED_TITRANT = /\s(HCl|NaOH|KOH)$/i;

/**
 * A warning where the text could be read the other way (SPACED_TITRANT), naming both, where the other is one its titrant
 * can reach (X alone above the target for HCl, below it for NaOH or KOH); '' otherwise.
 */
function readingWarning(s: AdjustedStockText, reagentName: string, titrantName: string, stockName: string): string {
  const spaced = SPACED_TITRANT.exec(s.reagentText);
  if (!spaced || s.titrantText !== undefined) return '';
  const base = s.reagentText.slice(0, spaced.index).trim(), acid = /^HCl$/i.test(spaced[1]);
  let baseAlonePH: number;
  try {
    const alone: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL: 1, rows: [] };
    addReagent(alone, resolveReagent(base, 'reagents').reagent, s.concentrationM);
    baseAlonePH = solve(prepareProblem(alone, s.temperatureC, s.model)).pH;
  } catch (e) {
    if (e instanceof ProticError) return ''; // the other reading names no reagent: there is no other reading
    throw e;
  }
  if (acid ? !(baseAlonePH > s.targetPH) : !(baseAlonePH < s.targetPH)) return '';
  const molar = `${String(Number(s.concentrationM.toPrecision(6)))} M`, pH = s.targetPHText;
  return `the stock ${stockName} is read as ${reagentName} brought to pH ${pH} with ${titrantName} (write … with ${titrantName} to keep this reading); if it is ${base} brought to pH ${pH} with ${spaced[1]}, write ${molar} ${base}-${spaced[1]} pH ${pH} (or ${molar} ${base} pH ${pH} with ${spaced[1]})`;
}

/**
 * What a stock is, however its text was spelled: its composition per litre (to 10 digits: 0.7 M and 700 mM, a hydrate
 * and its anhydrous name, HCl and 37 % hydrochloric acid make the same stock), stated pH, temperature and model.
 */
function stockIdentity(contents: Contents, s: AdjustedStockText, model: ActivityModel): string {
  const part = (m: Map<string, number>): string => [...m.entries()].filter(([, v]) => v !== 0).map(([k, v]) => `${k}=${v.toPrecision(10)}`).sort().join(',');
  return [part(contents.systemMoles), part(contents.ionMoles), s.targetPH, s.temperatureC, model].join('|');
}

/** The titrant as a pure compound made up to volume: it adds no volume of its own. */
function asMadeUpToVolume(resolved: ResolvedReagent): ReagentSpec {
  return { resolved: { ...resolved, reagent: { ...resolved.reagent, liquid: undefined } } };
}

/**
 * Composition per litre of a pH-adjusted stock, under the model its text names (davies unless `under <model>`).
 * @example adjustedStockComposition(parseAdjustedStock('1 M Tris-HCl pH 8.0')!, text)
 *   → Tris 1 mol/L, Cl⁻ ≈ 0.4 mol/L (the HCl that brings it to pH 8.0 at 25 °C)
 */
export function adjustedStockComposition(s: AdjustedStockText, text: string, argument = 'reagents', row?: number): StockComposition {
  const model = s.model;
  if (!(s.concentrationM > 0)) fail({ code: 'bad_amount', argument, row, received: quote(text), expected: 'a stock concentration above zero' });
  const reagent = resolveReagent(s.reagentText, argument, row);
  const contents: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL: 1, rows: [] };
  addReagent(contents, reagent.reagent, s.concentrationM);
  const alonePH = solve(prepareProblem(contents, s.temperatureC, model)).pH;
  const titrantText = s.titrantText ?? (s.targetPH < alonePH ? 'HCl' : 'NaOH');
  const titrant = asMadeUpToVolume(resolveReagent(titrantText, argument, row));
  // a titrant must bring acid or base: a neutral salt (NaCl) moves the pH only through activity, and a 'stock' made
  // that way took 16.6 mol/L of it to reach pH 11.2 in 1 M Tris
  const t = titrant.resolved.reagent;
  if (t.systems.length === 0 && t.ions.reduce((q, ion) => q + ion.count * (strongIonById(ion.ionId)?.charge ?? 0), 0) === 0) {
    fail({ code: 'bad_argument', argument, row, received: quote(text), expected: `a titrant that brings acid or base (HCl, NaOH, KOH, or a weak acid or base); ${t.name} brings neither` });
  }
  const result = titrantForTarget(s.targetPH, contents, titrant, s.temperatureC, model);
  addReagent(contents, titrant.resolved.reagent, result.moles);
  // exact or refused: the stock as made must read its own pH
  const made = solve(prepareProblem(contents, s.temperatureC, model));
  const madePH = made.pH;
  if (!(Math.abs(madePH - s.targetPH) <= 1e-6)) {
    fail({ code: 'no_convergence', argument, row, received: quote(text), expected: `a stock whose adjustment settles (the computed composition reads pH ${madePH.toFixed(4)}); please report this case` });
  }
  const name = `${String(Number(s.concentrationM.toPrecision(6)))} M ${reagent.reagent.name} pH ${s.targetPH}`;
  return {
    name,
    summary: `${reagent.reagent.name} ${s.concentrationM} mol/L brought to pH ${s.targetPH} with ${titrant.resolved.reagent.name}`
      + ` (${Number((result.moles).toPrecision(6))} mol/L) at ${s.temperatureC} °C, ${model}, made up to volume`,
    systemsMPerL: contents.systemMoles,
    ionsMPerL: contents.ionMoles,
    warning: [readingWarning(s, reagent.reagent.name, titrant.resolved.reagent.name, name),
      modelWarning(made) === '' ? '' : `the stock ${name} itself, as adjusted at ${s.temperatureC} °C: ${modelWarning(made)}`].filter(Boolean).join('; ') || undefined,
    adjusted: { identity: stockIdentity(contents, s, model),
      statedPH: s.targetPH, statedHalfDigit: 0.5 * 10 ** -s.targetPHDecimals, contents, titrant: titrant.resolved.reagent, titrantMPerL: result.moles,
      temperatureC: s.temperatureC, temperatureWritten: s.temperatureWritten, model },
  };
}
