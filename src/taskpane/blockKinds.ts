import { ACTIVITY_MODELS, MODEL_LIMIT_MOLAL, parseReagentSpec, systemFor, titrantUnit } from '../engine';
import { handcheck } from '../functions/handcheck';
import * as impl from '../functions/impl';
import { readback } from '../functions/readback';
import { saltDose } from '../functions/saltdose';
import { uncertainty } from '../functions/uncertainty';
import {
  MAX_TABLE_ROWS, WHAT_IF_TEMPERATURES_C, curveBlock, fractionsBlock, fractionsRowCount, phBlock, recipeBlock, speciesBlock, temperatureTableBlock, titrantBlock,
} from './blocks';
import type { Block, MixtureInput } from './blocks';
import { Refusal } from './refusal';
import { reviewBlock } from './reviewBlock';
import { saltBlock } from './saltBlock';

// The blocks the pane writes, as one table: adding a block is one entry here; an activity model the engine
// adds is offered at once (MODEL_CHOICES follows ACTIVITY_MODELS), named in MODEL_LABELS. Each entry names the fields it needs (the pane shows only those) and checks
// its inputs with the very functions its cells will run before anything is written.

/** Groups of fields in the pane's "Into the sheet" form. */
export type FieldGroup = 'mixture' | 'model' | 'titrant' | 'curve-end' | 'points' | 'recipe' | 'fractions' | 'salt';

/**
 * Names of the activity models the engine knows, as published, each with its range (mol/kg) when it has one.
 * Keyed by model id as the functions take it; a model the engine adds later is offered under its id until named here.
 */
export const MODEL_LABELS: Record<string, (limitMolal: number | undefined) => string> = {
  davies: (limit) => `Davies (to about ${limit} mol/kg)`,
  'bates-guggenheim': (limit) => `Bates–Guggenheim (to about ${limit} mol/kg)`,
  sit: (limit) => `SIT, specific ion interaction (to about ${limit ?? 3} mol/kg)`,
  ideal: () => 'Ideal (no activity correction)',
};

/** The choices for a list of engine model ids and their limits: every id offered, in order, named where MODEL_LABELS knows it. */
export function modelChoices(models: readonly string[], limitsMolal: Record<string, number | undefined>): { id: string; label: string }[] {
  return models.map((id) => {
    const limit = limitsMolal[id];
    const label = MODEL_LABELS[id];
    return { id, label: label ? label(limit) : limit ? `${id} (to about ${limit} mol/kg)` : id };
  });
}

/** Activity models the pane offers: every model the engine takes, in the engine's order (its default first). */
export const MODEL_CHOICES: { id: string; label: string }[] = modelChoices(ACTIVITY_MODELS, MODEL_LIMIT_MOLAL);

/** What a block reads from the pane; each reader refuses a blank or malformed box with its label. */
export interface BlockInputs {
  mixture(): MixtureInput;
  volumeL(): number;
  model(): string;
  titrant(): string;
  targetPH(): number;
  temperatureC(): number;
  ionicStrengthM(): number;
  curveEnd(): number;
  points(): number;
  acidForm(): string;
  baseForm(): string;
  concentrationM(): number;
  fromPH(): number;
  toPH(): number;
  stepPH(): number;
  systemId(): string;
  /** the salt of the ionic-strength block: a solid such as NaCl, or a stock such as 4 M NaCl */
  salt(): string;
  targetIonicStrengthM(): number;
}

export type BlockBuilder = (top: number, left: number) => Block;

export interface BlockKind {
  id: string;
  label: string;
  fields: FieldGroup[];
  /** the status shows the mixture's model warning beside "Wrote …" */
  showsMixtureWarning: boolean;
  /** checks the inputs (throws a message) and returns the block to write at a cell */
  prepare(inputs: BlockInputs): BlockBuilder;
}

/** The mixture as the functions take it. */
export function mixtureArgs(m: MixtureInput): [string[][], number[][], string[][], number, number, string | undefined] {
  return [m.rows.map((r) => [r.reagent]), m.rows.map((r) => [r.amount]), m.rows.map((r) => [r.unit]), m.volumeL, m.temperatureC, m.model];
}

/** The unit a titrant (or a salt) is dispensed in: mL for a stock solution, g for a solid (the functions' own default). */
export function titrantUnitSymbol(titrant: string, argument = 'titrant'): string {
  return titrantUnit(undefined, parseReagentSpec(titrant, argument), 'resultUnit').symbol;
}

function wholeNumber(value: number, label: string, lo: number, hi: number): number {
  if (!Number.isInteger(value) || value < lo || value > hi) throw new Refusal(`${label}: ${value} is not a whole number from ${lo} to ${hi}.`);
  return value;
}

export const BLOCK_KINDS: BlockKind[] = [
  {
    id: 'ph', label: 'pH of the mixture', fields: ['mixture', 'model'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      impl.ph(...mixtureArgs(m));
      return (t, l) => phBlock(m, t, l);
    },
  },
  {
    id: 'titrant', label: 'Titrant for the target pH', fields: ['mixture', 'model', 'titrant', 'curve-end'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      const [titrant, targetPH] = [inputs.titrant(), inputs.targetPH()];
      const unit = titrantUnitSymbol(titrant);
      const [reagents, amounts, units, volumeL, temperatureC, model] = mixtureArgs(m);
      impl.titrant(targetPH, reagents, amounts, units, volumeL, titrant, temperatureC, model, unit);
      return (t, l) => titrantBlock(m, titrant, targetPH, unit, t, l);
    },
  },
  {
    id: 'curve', label: 'Titration curve table', fields: ['mixture', 'model', 'titrant', 'curve-end', 'points'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      const [titrant, curveEnd] = [inputs.titrant(), inputs.curveEnd()];
      const points = wholeNumber(inputs.points(), 'Points', 2, MAX_TABLE_ROWS);
      const unit = titrantUnitSymbol(titrant);
      const [reagents, amounts, units, volumeL, temperatureC, model] = mixtureArgs(m);
      impl.curve(reagents, amounts, units, volumeL, titrant, curveEnd, points, temperatureC, model, unit);
      return (t, l) => curveBlock(m, titrant, curveEnd, points, unit, t, l);
    },
  },
  {
    id: 'recipe', label: 'Recipe: grams of two forms', fields: ['recipe', 'model'], showsMixtureWarning: false,
    prepare(inputs) {
      const r = {
        acidForm: inputs.acidForm(), baseForm: inputs.baseForm(), targetPH: inputs.targetPH(), concentrationM: inputs.concentrationM(),
        volumeL: inputs.volumeL(), temperatureC: inputs.temperatureC(), model: inputs.model(),
      };
      impl.recipe(r.acidForm, r.baseForm, r.targetPH, r.concentrationM, r.volumeL, r.temperatureC, r.model);
      return (t, l) => recipeBlock(r, t, l);
    },
  },
  {
    id: 'fractions', label: 'Fractions table across pH', fields: ['fractions'], showsMixtureWarning: false,
    prepare(inputs) {
      const [fromPH, toPH, stepPH, temperatureC, ionicStrengthM] = [inputs.fromPH(), inputs.toPH(), inputs.stepPH(), inputs.temperatureC(), inputs.ionicStrengthM()];
      const count = fractionsRowCount(fromPH, toPH, stepPH);
      if (typeof count === 'string') throw new Refusal(`Fractions table: ${count}. Nothing was written.`);
      const sys = systemFor(inputs.systemId());
      impl.fractions(sys.id, fromPH, temperatureC, ionicStrengthM);
      impl.fractions(sys.id, toPH, temperatureC, ionicStrengthM);
      return (t, l) => fractionsBlock({ system: sys.name, forms: sys.forms, fromPH, toPH, stepPH, temperatureC, ionicStrengthM }, t, l);
    },
  },
  {
    id: 'species', label: 'Audit: every species and constant', fields: ['mixture', 'model'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      const speciesRows = impl.species(...mixtureArgs(m)).length;
      const constantsRows = impl.constants(...mixtureArgs(m)).length;
      return (t, l) => speciesBlock(m, speciesRows, constantsRows, t, l);
    },
  },
  {
    id: 'temperatures', label: 'What-if: pH across temperatures', fields: ['mixture', 'model'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      impl.ph(...mixtureArgs(m)); // at the pane's temperature; each row's own temperature is the user's to edit
      return (t, l) => temperatureTableBlock(m, WHAT_IF_TEMPERATURES_C, t, l);
    },
  },
  {
    id: 'salt', label: 'Salt for a target ionic strength', fields: ['mixture', 'model', 'salt'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      const [salt, targetM] = [inputs.salt(), inputs.targetIonicStrengthM()];
      const unit = titrantUnitSymbol(salt, 'salt');
      const [reagents, amounts, units, volumeL, temperatureC, model] = mixtureArgs(m);
      const amount = saltDose(targetM, salt, reagents, amounts, units, volumeL, temperatureC, model, unit);
      // the check cell, computed before writing: the rows with the salt in them, as IONICSTRENGTH reads them
      impl.ionicStrength([...reagents, [salt]], [...amounts, [amount]], [...m.rows.map((r) => [r.unit]), [unit]], volumeL, temperatureC, model);
      return (t, l) => saltBlock(m, { salt, targetIonicStrengthM: targetM, saltUnitSymbol: unit }, t, l);
    },
  },
  {
    id: 'review', label: 'Review: read-back, hand check, uncertainty', fields: ['mixture', 'model'], showsMixtureWarning: true,
    prepare(inputs) {
      const m = inputs.mixture();
      const [reagents, amounts, units, volumeL, temperatureC, model] = mixtureArgs(m);
      impl.ph(reagents, amounts, units, volumeL, temperatureC, model);
      const spills = {
        readback: readback(reagents, amounts, units, volumeL, temperatureC).length,
        handcheck: handcheck(reagents, amounts, units, volumeL, temperatureC).length,
        uncertainty: uncertainty(reagents, amounts, units, volumeL, temperatureC, model, m.rows.map(() => [0]), 0, 0).length,
      };
      return (t, l) => reviewBlock(m, spills, t, l);
    },
  },
];

export function blockKind(id: string): BlockKind {
  return BLOCK_KINDS.find((k) => k.id === id) ?? BLOCK_KINDS[0];
}
