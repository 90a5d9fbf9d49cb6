import { applyCustomDefinitions, clearCustomDefinitions } from '../engine';
import type { CustomSystemDefinition } from '../engine';

// Custom systems travel with the workbook in its document settings, as our own JSON.
export const SETTINGS_KEY = 'protic.customSystems';

/** The part of Office.Settings the pane uses (so tests can hand in a mock). */
export interface SettingsLike {
  get(name: string): unknown;
  set(name: string, value: unknown): void;
  saveAsync(callback?: (result: { status: string; error?: { message: string } }) => void): void;
}

let current: CustomSystemDefinition[] = [];

export function currentDefinitions(): readonly CustomSystemDefinition[] {
  return current;
}

/** Reads and validates the workbook's custom systems; on any problem none is loaded and the problems are returned. */
export function loadFromSettings(settings: SettingsLike): string[] {
  const raw = settings.get(SETTINGS_KEY);
  if (raw === null || raw === undefined || raw === '') {
    current = [];
    clearCustomDefinitions();
    return [];
  }
  let parsed: unknown;
  try {
    parsed = typeof raw === 'string' ? JSON.parse(raw) : raw;
  } catch {
    clearCustomDefinitions();
    current = [];
    return ['the workbook\'s custom systems are not readable JSON; none were loaded'];
  }
  const problems = applyCustomDefinitions(parsed);
  if (problems.length > 0) {
    clearCustomDefinitions();
    current = [];
    return problems.map((p) => `rejected from the workbook: ${p}`);
  }
  current = (parsed as { systems: CustomSystemDefinition[] }).systems;
  return [];
}

/** Adds (or replaces, by name) a definition, validates all of them, registers and saves them. */
export async function saveDefinition(settings: SettingsLike, def: CustomSystemDefinition): Promise<string[]> {
  const next = [...current.filter((d) => d.name.trim().toLowerCase() !== def.name.trim().toLowerCase()), def];
  const problems = applyCustomDefinitions({ systems: next });
  if (problems.length > 0) {
    // keep the previous, valid set in force
    applyCustomDefinitions({ systems: current });
    return problems;
  }
  current = next;
  settings.set(SETTINGS_KEY, JSON.stringify({ systems: next }));
  return new Promise((resolve) => {
    settings.saveAsync((result) => resolve(result.status === 'failed' ? [`saved for this session, but the workbook did not save: ${result.error?.message ?? 'unknown reason'}`] : []));
  });
}

/** Parses the pane's text inputs into a definition (numbers separated by commas or spaces). */
export function definitionFromInputs(name: string, pKaText: string, chargeText: string, dHText: string, forms: { name: string; formula: string; protonsLost: string }[]): CustomSystemDefinition {
  const numbers = (t: string): number[] => t.split(/[,;\s]+/).filter((x) => x !== '').map(Number);
  const def: CustomSystemDefinition = { name, pKa: numbers(pKaText), charge: Number(chargeText) };
  if (dHText.trim() !== '') def.dH = numbers(dHText);
  const filled = forms.filter((f) => f.name.trim() !== '' || f.formula.trim() !== '');
  if (filled.length > 0) def.forms = filled.map((f) => ({ name: f.name, formula: f.formula, protonsLost: Number(f.protonsLost) }));
  return def;
}
