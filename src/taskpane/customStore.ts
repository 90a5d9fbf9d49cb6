import { applyCustomDefinitions, normaliseName } from '../engine';
import type { CustomSystemDefinition } from '../engine';
import { SETTINGS_KEY, loadWorkbookSystems, readStoredSystems, registerStoredSystems } from '../functions/workbookSystems';
import type { SettingsLike, StoredSystems } from '../functions/workbookSystems';
import { parseNumberList, parseStrictNumber } from './numbers';
import { Refusal } from './refusal';

// Custom systems travel with the workbook in its document settings, as our own JSON. Nothing stored is
// dropped or replaced without the user's say-so: the pane asks, then calls these with `confirmed`.
export { SETTINGS_KEY };
export type { SettingsLike, StoredSystems };

/** Reads the workbook's custom systems, registers the valid ones; returns the problems of the others. */
export function loadFromSettings(settings: SettingsLike): string[] {
  const stored = loadWorkbookSystems(settings);
  if (stored.unreadable !== undefined) return [stored.unreadable];
  return stored.entries.filter((e) => e.problem !== undefined).map((e) => `rejected from the workbook: ${e.problem}`);
}

export type SaveOutcome =
  | { kind: 'saved'; replaced?: string; problems: string[] }
  | { kind: 'invalid'; problems: string[] }
  /** a stored system has the same name (any case): replace only when the user says so */
  | { kind: 'needs-confirmation'; existing: string }
  /** the stored setting cannot be read, so saving would overwrite it: only when the user says so */
  | { kind: 'needs-overwrite'; reason: string };

function writeAndSave(settings: SettingsLike, definitions: unknown[]): Promise<string[]> {
  settings.set(SETTINGS_KEY, JSON.stringify({ systems: definitions }));
  registerStoredSystems(readStoredSystems(settings));
  return new Promise((resolve) => {
    settings.saveAsync((result) => resolve(result.status === 'failed' ? [`kept for this session, but the workbook did not save: ${result.error?.message ?? 'unknown reason'}`] : []));
  });
}

/**
 * Adds a definition, keeping every stored one (valid or not) in its place. A same-name system (case and
 * spacing ignored) is replaced, in its place, only with `confirmed`; an unreadable setting is overwritten only with `confirmed`.
 */
export async function saveDefinition(settings: SettingsLike, def: CustomSystemDefinition, confirmed = false): Promise<SaveOutcome> {
  const stored = readStoredSystems(settings);
  if (stored.unreadable !== undefined && !confirmed) return { kind: 'needs-overwrite', reason: stored.unreadable };
  const key = normaliseName(def.name);
  const same = stored.entries.findIndex((e) => normaliseName(e.name) === key);
  if (same >= 0 && !confirmed) return { kind: 'needs-confirmation', existing: stored.entries[same].name };
  const others = stored.entries.filter((_, i) => i !== same);
  // the new one is checked against the valid others, so it alone decides whether this save goes ahead
  const problems = applyCustomDefinitions({ systems: [...others.filter((e) => e.problem === undefined).map((e) => e.definition), def] })
    .map((p) => p.replace(/^custom system \d+/, `custom system “${def.name}”`));
  if (problems.length > 0) {
    registerStoredSystems(stored); // the stored set stays in force
    return { kind: 'invalid', problems };
  }
  const next = stored.entries.map((e) => e.definition);
  if (same >= 0) next[same] = def;
  else next.push(def);
  return { kind: 'saved', replaced: same >= 0 ? stored.entries[same].name : undefined, problems: await writeAndSave(settings, next) };
}

/** Removes one stored entry (by its place in the list, as readStoredSystems gave it), after the user said so. */
export async function deleteDefinition(settings: SettingsLike, index: number): Promise<string[]> {
  const stored = readStoredSystems(settings);
  if (stored.unreadable !== undefined || index < 0 || index >= stored.entries.length) return ['that system is no longer stored; nothing was deleted'];
  return writeAndSave(settings, stored.entries.filter((_, i) => i !== index).map((e) => e.definition));
}

export interface CustomInputs { name: string; pKa: string; charge: string; dH: string; forms: { name: string; formula: string; protonsLost: string }[] }

/**
 * Parses the pane's text inputs into a definition. pKa and ΔrH° lists take a decimal point or comma
 * ("4,76"); values are separated by ";", spaces, or a comma followed by a space. Blank required boxes are refused.
 */
export function definitionFromInputs(inputs: CustomInputs): CustomSystemDefinition {
  if (inputs.name.trim() === '') throw new Refusal('Name is blank: give the system a name.');
  const def: CustomSystemDefinition = {
    name: inputs.name.trim(),
    pKa: parseNumberList(inputs.pKa, 'pKa values'),
    charge: parseStrictNumber(inputs.charge, 'Charge of the most protonated form'),
  };
  if (inputs.dH.trim() !== '') def.dH = parseNumberList(inputs.dH, 'ΔrH° per step');
  const filled = inputs.forms.filter((f) => f.name.trim() !== '' || f.formula.trim() !== '');
  if (filled.length > 0) def.forms = filled.map((f, i) => ({ name: f.name.trim(), formula: f.formula.trim(), protonsLost: parseStrictNumber(f.protonsLost, `Form ${i + 1} H⁺ lost`) }));
  return def;
}
