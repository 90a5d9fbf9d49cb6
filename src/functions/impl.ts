import { ADDIN_VERSION, CATALOGUE_VERSION, levelLabel } from '../catalogue';
import {
  apparentPKas, checkSystemRange, checkWaterRange, fail, fractionsAtPH,
  WATER_RANGE_C, WATER_SOURCES, debyeHuckelA, pHWithStepPKa, pHWithStepPKaReadjusted, fractionsAt, looksLikeFormula, modelWarning, pKw, molarMassGPerMol, molarMassOfReagent, molesToUnit, parseModel, parseReagentSpec,
  MAX_REAGENT_TEXT, ProticError, pKaAt, quote, reagentByName, recipeForTarget, resolveReagent, resolveSystem, speciesRows,
  titrantForTarget, titrantUnit, unitToMoles, withTitrant,
} from '../engine';
import {
  IONIC_STRENGTH_RULE, PH_RULE, TEMPERATURE_RULE, VOLUME_RULE, mixtureRows, optionalNumber, requiredNumber, requiredText, toMatrix,
} from './args';
import type { Cell } from './args';
import { capacityOf, contentsOf, equilibriumOf, mixtureEntry, readMixture, warningOf } from './mixtureCache';

// The cell functions as plain TypeScript: Excel's wrappers (functions.ts) and the headless
// sheet runner call these same implementations. They throw ProticError for bad input.

export type CellScalar = number | string;
export type CellResult = CellScalar | CellScalar[][];

/** The last guard before a number reaches a cell: never NaN or Infinity. */
function finite(value: number, what: string): number {
  if (!Number.isFinite(value)) fail({ code: 'no_convergence', argument: what, received: String(value), expected: 'a finite result; please report this input' });
  return value;
}

// The mixture functions share one solved entry per mixture (mixtureCache.ts): beside PHMIX in a row,
// IONICSTRENGTH, CAPACITY, WARNINGS and SPECIES read and check their arguments, then find it.
export function ph(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, model?: Cell): number {
  return finite(mixtureEntry(reagents, amounts, units, volume, temperature, model).pH, 'pH');
}

export function ionicStrength(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, model?: Cell): number {
  return finite(mixtureEntry(reagents, amounts, units, volume, temperature, model).ionicStrengthM, 'ionic strength');
}

export function capacity(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, model?: Cell): number {
  return finite(capacityOf(mixtureEntry(reagents, amounts, units, volume, temperature, model)), 'buffer capacity');
}

/** The mixture's model warnings as one text, or "none": a column to keep beside PHMIX in a table. */
export function warnings(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, model?: Cell): string {
  const warning = warningOf(mixtureEntry(reagents, amounts, units, volume, temperature, model));
  return warning === '' ? 'none' : warning;
}

export const CONSTANTS_HEADER = ['constant', 'step', 'at this temperature, I = 0', 'at this ionic strength', 'source',
  'ΔrH° (kJ/mol)', 'ΔrCp° (J/(K·mol))', 'data range (°C)', 'provenance', 'alternative pKa (25 °C)', 'pH with the alternative − pH'];

/**
 * Every constant the mixture's solve used, with its source: each pKa at the temperature, and the apparent value
 * pH − log10([base]/[acid]) at the mixture's own ionic strength under its model; then pKw, A, the solution's density
 * and the kg of water per litre it leaves (the mol/L → mol/kg factor).
 */
export function constants(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, model?: Cell): CellScalar[][] {
  const eq = equilibriumOf(mixtureEntry(reagents, amounts, units, volume, temperature, model));
  const p = eq.problem;
  const m = { temperatureC: p.temperatureC, model: p.model };
  const table: CellScalar[][] = [CONSTANTS_HEADER];
  // a stock written with a pH is at that pH whichever constant is used: the alternative re-makes it (stockReadjustment.ts)
  const read = readMixture(reagents, amounts, units, volume, temperature, model);
  const withStocks = read.rows.some((r) => parseReagentSpec(r.reagent, 'reagents', r.row).made?.adjusted !== undefined);
  const alternativePH = (i: number, k: number, pKa25: number): number => (withStocks
    ? pHWithStepPKaReadjusted(read.rows, contentsOf(read.rows, read.volumeL), eq, i, k, pKa25) : pHWithStepPKa(p, i, k, pKa25));
  // one alternative whose stock cannot be re-made is that cell's note, not the table's failure
  const alternativeShift = (i: number, k: number, pKa25: number): CellScalar => {
    try {
      return finite(alternativePH(i, k, pKa25) - eq.pH, 'pH shift');
    } catch (e) {
      if (withStocks && e instanceof ProticError) return `not computed: ${e.message}`;
      throw e;
    }
  };
  p.systems.forEach((s, i) => {
    const alpha = fractionsAt(s.lnCumK, eq.lnH);
    s.system.steps.forEach((step, k) => {
      // where a form is too rare to carry a ratio (below 1e-300), the apparent value is not shown
      const ratio = alpha[k + 1] / alpha[k];
      const apparent = Number.isFinite(ratio) && ratio > 0 ? eq.pH - Math.log10(ratio) : '';
      const range = s.system.measuredRangeC ?? s.system.temperatureRangeC;
      const level = [`pKa ${levelLabel(step.provenance.pKa)}`, step.provenance.dH && `ΔrH° ${levelLabel(step.provenance.dH)}`,
        step.provenance.dCp && `ΔrCp° ${levelLabel(step.provenance.dCp)}`].filter(Boolean).join('; ');
      const alt = step.alternative;
      // the other published value, re-solved: how much the choice between the two moves this mixture's pH
      const altShift = alt ? alternativeShift(i, k, alt.pKa) : '';
      table.push([`pKa ${s.system.name}`, k + 1, finite(pKaAt(step, m.temperatureC), 'pKa'), apparent, step.source,
        step.dHkJPerMol ?? '', step.dCpJPerKMol ?? '', `${range[0]}–${range[1]}`, level,
        alt ? alt.pKa : '', altShift]);
    });
  });
  const water = (name: string, value: number, source: string): CellScalar[] => [name, '', value, '', source, '', '', `${WATER_RANGE_C[0]}–${WATER_RANGE_C[1]}`, 'recalled, not checked', '', ''];
  table.push(water('pKw', finite(pKw(m.temperatureC), 'pKw'), WATER_SOURCES.pKw));
  table.push(water('Debye–Hückel A (kg/mol)^½', debyeHuckelA(m.temperatureC), WATER_SOURCES.debyeHuckelA));
  // the solution's own density, and the kg of water per litre it leaves: the mol/L → mol/kg factor of every constant above
  const d = p.density;
  const densityLevel = d.solutes.some((x) => x.basis === 'estimate') ? 'recalled, not checked; partly estimated (see source)' : 'recalled, not checked';
  table.push(['solution density (kg/L)', '', finite(d.densityKgPerL, 'density'), '', d.source, '', '', `${WATER_RANGE_C[0]}–${WATER_RANGE_C[1]}`, densityLevel, '', '']);
  table.push(['water (kg per L of solution)', '', finite(d.waterKgPerL, 'water content'), '', `solution density − Σ c·M of the solutes; m = c / this (pure water here: ${d.pureWaterKgPerL.toFixed(6)})`, '', '', '', densityLevel, '', '']);
  table.push(['model', `${m.model}, ${m.temperatureC} °C, ionic strength ${eq.ionicStrengthM.toPrecision(4)} mol/L`, '', '', '', '', '', '', '', '', '']);
  return table;
}

export const SPECIES_HEADER = ['species', 'charge', 'concentration (mol/L)', 'activity coefficient', 'activity'];

export function species(reagents: Cell, amounts: Cell, units: Cell, volume?: Cell, temperature?: Cell, model?: Cell): CellScalar[][] {
  const entry = mixtureEntry(reagents, amounts, units, volume, temperature, model);
  const eq = equilibriumOf(entry);
  const m = { temperatureC: eq.problem.temperatureC, model: eq.problem.model };
  const table: CellScalar[][] = [SPECIES_HEADER];
  for (const s of speciesRows(eq)) table.push([s.species, s.charge, finite(s.concentrationM, s.species), finite(s.activityCoefficient, s.species), finite(s.activity, s.species)]);
  const warning = warningOf(entry);
  table.push(['pH', finite(eq.pH, 'pH'), '', '', '']);
  table.push(['ionic strength (mol/L)', finite(eq.ionicStrengthM, 'ionic strength'), '', '', '']);
  table.push(['charge-balance residual (relative)', finite(eq.residualRelative, 'residual'), '', '', '']);
  // The basis a reviewer needs to reproduce the activity column: activity = γ·c/w (molal), w the kg of water per litre.
  const d = eq.problem.density;
  const w = Math.exp(eq.problem.lnWaterDensity);
  // under sit γ also carries Σ ε·m (catalogue ε table) and Kw the water activity: both stated, so the column can be reproduced
  const sit = eq.problem.sit;
  const basis = sit
    ? `log γ = −z²·D(I/w) + Σ ε·m (SIT, m = c/w), water activity ${Math.exp(sit.lnWaterActivity).toFixed(5)} in Kw`
    : 'γ from the ionic strength on the molal basis I/w';
  table.push(['model', `${m.model}, ${m.temperatureC} °C; activity = γ·c/w, ${basis}, w ${w.toFixed(6)} kg of water per L of solution; solution density ${d.densityKgPerL.toFixed(5)} kg/L (${d.source})`, '', '', '']);
  table.push(['warning', warning === '' ? 'none' : warning, '', '', '']);
  return table;
}

function requiredVolume(volume: Cell): number {
  const v = optionalNumber(volume, 'volume', undefined, VOLUME_RULE);
  if (v === undefined) fail({ code: 'missing_volume', argument: 'volume', received: 'an empty cell', expected: "the mixture's volume in litres before the titrant goes in" });
  return v;
}

export function titrant(targetPH: Cell, reagents: Cell, amounts: Cell, units: Cell, volume: Cell, titrantText: Cell,
  temperature?: Cell, model?: Cell, resultUnit?: Cell, finalVolume?: Cell): number {
  const target = requiredNumber(targetPH, 'targetPH', PH_RULE);
  const m = readMixture(reagents, amounts, units, null, temperature, model);
  const volumeL = requiredVolume(volume);
  const spec = parseReagentSpec(requiredText(titrantText, 'titrant', 'a titrant such as 1 M NaOH or NaOH'), 'titrant');
  const unit = titrantUnit(resultUnit, spec, 'resultUnit');
  // with a final volume the adjusted solution is made up to it; without, the titrant's own volume adds to `volume`
  const finalVolumeL = optionalNumber(finalVolume ?? null, 'finalVolume', undefined, { ...VOLUME_RULE, expected: 'the volume, in litres, the adjusted solution is made up to' });
  const result = titrantForTarget(target, contentsOf(m.rows, volumeL), spec, m.temperatureC, m.model, { finalVolumeL });
  return finite(molesToUnit(result.moles, spec, unit), 'titrant');
}

export function curve(reagents: Cell, amounts: Cell, units: Cell, volume: Cell, titrantText: Cell, maxAmount: Cell,
  points?: Cell, temperature?: Cell, model?: Cell, resultUnit?: Cell): CellScalar[][] {
  const m = readMixture(reagents, amounts, units, null, temperature, model);
  const volumeL = requiredVolume(volume);
  const spec = parseReagentSpec(requiredText(titrantText, 'titrant', 'a titrant such as 1 M NaOH or NaOH'), 'titrant');
  const max = requiredNumber(maxAmount, 'maxAmount', { min: 0, max: 1e9, expected: 'the largest titrant amount, above zero, in resultUnit' });
  if (max === 0) fail({ code: 'bad_argument', argument: 'maxAmount', received: '0', expected: 'the largest titrant amount, above zero, in resultUnit' });
  const n = optionalNumber(points, 'points', 51, { min: 2, max: 1001, integer: true, expected: 'a whole number of points from 2 to 1001 (default 51)' });
  const unit = titrantUnit(resultUnit, spec, 'resultUnit');
  const contents = contentsOf(m.rows, volumeL);
  const out: CellScalar[][] = [];
  for (let i = 0; i < n; i++) {
    const amount = (max * i) / (n - 1);
    const eq = withTitrant(contents, spec, unitToMoles(amount, spec, unit), m.temperatureC, m.model);
    // the check text: empty inside the model's validity, else the reason (as WARNINGS words it)
    out.push([amount, finite(eq.pH, 'pH'), modelWarning(eq)]);
  }
  return out;
}

function temperatureFor(temperature: Cell): number {
  return optionalNumber(temperature, 'temperature', 25, TEMPERATURE_RULE);
}

export function fractions(system: Cell, pH: Cell, temperature?: Cell, ionicStrengthArg?: Cell, model?: Cell): number[][] {
  const sys = resolveSystem(Array.isArray(system) ? toSingle(system) : system);
  const pHValue = requiredNumber(pH, 'pH', PH_RULE);
  const temperatureC = temperatureFor(temperature);
  checkWaterRange(temperatureC);
  checkSystemRange(sys, temperatureC);
  const ionic = optionalNumber(ionicStrengthArg, 'ionicStrength', 0, IONIC_STRENGTH_RULE);
  const activityModel = parseModel(model);
  return [fractionsAtPH(sys, pHValue, temperatureC, ionic, activityModel).map((f) => finite(f, 'fraction'))];
}

function toSingle(value: Cell[]): Cell {
  const flat = toMatrix(value).flat();
  if (flat.length !== 1) fail({ code: 'shape_mismatch', argument: 'system', received: `a range of ${flat.length} cells`, expected: 'a single cell' });
  return flat[0];
}

export function pka(system: Cell, step: Cell, temperature?: Cell, ionicStrengthArg?: Cell, model?: Cell): number {
  const sys = resolveSystem(Array.isArray(system) ? toSingle(system) : system);
  const n = sys.steps.length;
  const k = requiredNumber(step, 'step', { min: 1, max: n, integer: true, expected: `a step from 1 to ${n} for ${sys.name} (1 = first proton lost)` });
  const temperatureC = temperatureFor(temperature);
  checkWaterRange(temperatureC);
  checkSystemRange(sys, temperatureC);
  const ionic = optionalNumber(ionicStrengthArg, 'ionicStrength', 0, IONIC_STRENGTH_RULE);
  const activityModel = parseModel(model);
  if (ionic === 0) return finite(pKaAt(sys.steps[k - 1], temperatureC), 'pKa');
  return finite(apparentPKas(sys, temperatureC, ionic, activityModel)[k - 1], 'pKa');
}

export function recipe(acidForm: Cell, baseForm: Cell, targetPH: Cell, concentration: Cell, volume: Cell, temperature?: Cell, model?: Cell,
  otherReagents?: Cell, otherAmounts?: Cell, otherUnits?: Cell): CellScalar[][] {
  const acid = parseReagentSpec(requiredText(acidForm, 'acidForm', 'the acid form, e.g. NaH2PO4·H2O'), 'acidForm');
  const base = parseReagentSpec(requiredText(baseForm, 'baseForm', 'the base form, e.g. Na2HPO4·7H2O'), 'baseForm');
  const target = requiredNumber(targetPH, 'targetPH', PH_RULE);
  const concentrationM = requiredNumber(concentration, 'concentration', { min: 1e-9, max: 10, expected: 'the total buffer concentration in mol/L, above zero' });
  const volumeL = requiredNumber(volume, 'volume', VOLUME_RULE);
  const temperatureC = temperatureFor(temperature);
  const activityModel = parseModel(model);
  const hasOthers = !(otherReagents === null || otherReagents === undefined || otherReagents === '');
  const rows = hasOthers
    ? mixtureRows(otherReagents, otherAmounts ?? null, otherUnits ?? null, { reagents: 'otherReagents', amounts: 'otherAmounts', units: 'otherUnits' })
    : [];
  const others = rows.length > 0 ? contentsOf(rows, volumeL) : { systemMoles: new Map(), ionMoles: new Map(), volumeL, rows: [] };
  checkWaterRange(temperatureC);
  const lines = recipeForTarget(acid, base, target, concentrationM, volumeL, others, temperatureC, activityModel);
  // the form as typed (a 1×1 range is read as its one cell), the amount, and its unit: g to weigh, mL to measure
  const names = [requiredText(acidForm, 'acidForm', ''), requiredText(baseForm, 'baseForm', '')];
  return lines.map((line, i) => [names[i].trim(), finite(line.amount, 'amount'), line.unit]);
}

export function molarMass(formula: Cell): number {
  const text = requiredText(formula, 'formula', 'a formula such as Na2HPO4·7H2O, or a catalogue name');
  const byName = reagentByName(text);
  if (byName?.liquid) {
    fail({ code: 'bad_argument', argument: 'formula', received: quote(text), expected: `a solid or a formula: a liquid as sold has no single molar mass (its compound is ${byName.formula})` });
  }
  if (byName) return molarMassOfReagent(byName);
  if (looksLikeFormula(text)) {
    try {
      return finite(molarMassGPerMol(text, 'formula'), 'molar mass');
    } catch (error) {
      // not a formula as written: a trade spelling (Tris·HCl, NACL) may still name a reagent; a text too long for a name keeps the formula's message
      if (!(error instanceof ProticError) || error.failure.code !== 'bad_formula' || text.length > MAX_REAGENT_TEXT) throw error;
    }
  }
  // a trade spelling, or an ambiguous or unknown name: the message says which, with choices
  const resolved = resolveReagent(text, 'formula');
  if (resolved.reagent.liquid) {
    fail({ code: 'bad_argument', argument: 'formula', received: quote(text), expected: `a solid or a formula: a liquid as sold has no single molar mass (its compound is ${resolved.reagent.formula})` });
  }
  return finite(resolved.molarMassGPerMol, 'molar mass');
}

export function version(): string {
  return `Protic ${ADDIN_VERSION}; catalogue ${CATALOGUE_VERSION}`;
}
