import { ACID_SYSTEMS, AMBIGUOUS_NAMES, REAGENTS } from '../catalogue';
import type { AcidSystem, Reagent } from '../catalogue';
import { fail, ProticError, quote } from './failure';
import { compositionKey, compositionMassGPerMol, looksLikeFormula, parseFormula } from './formula';
import type { ParsedFormula } from './formula';

// The catalogue plus any custom systems the workbook or a --systems file defined. The custom
// part lives on globalThis so that the functions and pane bundles, which share one runtime in
// Excel, see the same definitions.
interface CustomStore { systems: AcidSystem[]; reagents: Reagent[]; generation: number }
const STORE_KEY = '__proticCustomDefinitions';
const store: CustomStore = ((globalThis as Record<string, unknown>)[STORE_KEY] as CustomStore | undefined)
  ?? ((globalThis as Record<string, unknown>)[STORE_KEY] = { systems: [], reagents: [], generation: 0 }) as CustomStore;

/** Changes whenever custom definitions change, so caches keyed on it stay honest. */
export function registryGeneration(): number {
  return store.generation;
}

export function setCustomDefinitions(systems: AcidSystem[], reagents: Reagent[]): void {
  store.systems = systems;
  store.reagents = reagents;
  store.generation++;
}

export function allSystems(): readonly AcidSystem[] {
  return store.systems.length === 0 ? ACID_SYSTEMS : [...ACID_SYSTEMS, ...store.systems];
}

export function allReagents(): readonly Reagent[] {
  return store.reagents.length === 0 ? REAGENTS : [...REAGENTS, ...store.reagents];
}

export function normaliseName(text: string): string {
  return text.trim().toLowerCase().replace(/\s+/g, ' ').replace(/ %/g, '%').replace(/[–—]/g, '-');
}

let nameIndex: Map<string, Reagent> | undefined;
let nameIndexGeneration = -1;

function reagentNameIndex(): Map<string, Reagent> {
  if (nameIndex && nameIndexGeneration === store.generation) return nameIndex;
  const index = new Map<string, Reagent>();
  for (const reagent of allReagents()) {
    for (const name of [reagent.name, ...reagent.aliases]) {
      const key = normaliseName(name);
      if (!index.has(key)) index.set(key, reagent);
    }
  }
  nameIndex = index;
  nameIndexGeneration = store.generation;
  return index;
}

const systemById = new Map<string, AcidSystem>(ACID_SYSTEMS.map((s) => [s.id, s]));

export function systemFor(id: string): AcidSystem {
  const builtin = systemById.get(id);
  if (builtin) return builtin;
  const custom = store.systems.find((s) => s.id === id);
  if (!custom) throw new Error(`catalogue inconsistency: no system ${id}`);
  return custom;
}

export interface ResolvedReagent {
  reagent: Reagent;
  /** molar mass of what is weighed, including its hydrate water, g/mol */
  molarMassGPerMol: number;
  hydrateWater: number;
  /** how the reagent was recognised, for the audit trail */
  matchedBy: 'name' | 'formula';
}

function reagentMolarMass(reagent: Reagent): number {
  const parsed = parseFormula(reagent.formula, 'catalogue');
  return compositionMassGPerMol(parsed.composition) + reagent.hydrateWater * compositionMassGPerMol({ H: 2, O: 1 });
}

const molarMassCache = new Map<Reagent, number>();
export function molarMassOfReagent(reagent: Reagent): number {
  let mass = molarMassCache.get(reagent);
  if (mass === undefined) {
    mass = reagentMolarMass(reagent);
    molarMassCache.set(reagent, mass);
  }
  return mass;
}

let formulaIndex: Map<string, Reagent[]> | undefined;
let formulaIndexGeneration = -1;
function reagentFormulaIndex(): Map<string, Reagent[]> {
  if (formulaIndex && formulaIndexGeneration === store.generation) return formulaIndex;
  const index = new Map<string, Reagent[]>();
  for (const reagent of allReagents()) {
    const key = compositionKey(parseFormula(reagent.formula, 'catalogue').anhydrous);
    index.set(key, [...(index.get(key) ?? []), reagent]);
  }
  formulaIndex = index;
  formulaIndexGeneration = store.generation;
  return index;
}

/** Finds a reagent by formula: the anhydrous part must match; any hydrate water is taken as written. */
export function reagentByFormula(parsed: ParsedFormula): Reagent | undefined {
  const candidates = reagentFormulaIndex().get(compositionKey(parsed.anhydrous)) ?? [];
  const solids = candidates.filter((c) => !c.liquid);
  const pool = solids.length > 0 ? solids : candidates;
  return pool.find((c) => c.hydrateWater === parsed.hydrateWater) ?? pool[0];
}

const ambiguousNames = new Map(AMBIGUOUS_NAMES.map((a) => [normaliseName(a.name), a.choices]));

/** Character trigrams of a normalised name, padded so word starts count. */
function trigrams(text: string): Set<string> {
  const padded = `  ${text} `;
  const out = new Set<string>();
  for (let i = 0; i + 3 <= padded.length; i++) out.add(padded.slice(i, i + 3));
  return out;
}

let trigramIndex: { reagent: Reagent; grams: Set<string> }[] | undefined;
let trigramIndexGeneration = -1;
function nameTrigrams(): { reagent: Reagent; grams: Set<string> }[] {
  if (trigramIndex && trigramIndexGeneration === store.generation) return trigramIndex;
  trigramIndex = allReagents().flatMap((reagent) => [reagent.name, ...reagent.aliases].map((name) => ({ reagent, grams: trigrams(normaliseName(name)) })));
  trigramIndexGeneration = store.generation;
  return trigramIndex;
}

/** Catalogue reagent names closest to a text (trigram Dice ≥ 0.45), best first: for an unknown-name message. */
export function closestReagentNames(text: string, count = 3): string[] {
  const key = normaliseName(text);
  if (key.length < 3 || key.length > 100) return []; // no catalogue name is that long: not a misspelling
  const query = trigrams(key);
  const best = new Map<Reagent, number>();
  for (const { reagent, grams } of nameTrigrams()) {
    let shared = 0;
    for (const t of query) if (grams.has(t)) shared++;
    const dice = (2 * shared) / (query.size + grams.size);
    if (dice > (best.get(reagent) ?? 0)) best.set(reagent, dice);
  }
  return [...best.entries()].filter(([, dice]) => dice >= 0.45).sort((a, b) => b[1] - a[1]).slice(0, count).map(([r]) => r.name);
}

/** The catalogue reagent with this name or alias, if any. */
export function reagentByName(text: string): Reagent | undefined {
  return reagentNameIndex().get(normaliseName(text));
}

/** Resolves a catalogue name, alias or formula to a reagent. */
export function resolveReagent(text: string, argument: string, row?: number): ResolvedReagent {
  const key = normaliseName(text);
  const byName = reagentNameIndex().get(key);
  if (byName) {
    return { reagent: byName, molarMassGPerMol: molarMassOfReagent(byName), hydrateWater: byName.hydrateWater, matchedBy: 'name' };
  }
  const choices = ambiguousNames.get(key);
  if (choices) {
    const reagents = choices.map((name) => reagentNameIndex().get(normaliseName(name))!);
    const listed = reagents.map((r) => `${r.name} (${molarMassOfReagent(r).toFixed(2)} g/mol)`);
    const example = reagents.find((r) => r.hydrateWater > 0) ?? reagents[0];
    const exampleFormula = example.hydrateWater > 0 ? `${example.formula}·${example.hydrateWater}H2O` : example.formula;
    fail({ code: 'ambiguous_reagent', argument, row, received: quote(text), expected: `one of ${listed.join(', ')}, or a formula with its water such as ${exampleFormula}` });
  }
  if (looksLikeFormula(text)) {
    const parsed = parseFormula(text, argument, row);
    const reagent = reagentByFormula(parsed);
    if (reagent) {
      return { reagent, molarMassGPerMol: compositionMassGPerMol(parsed.composition), hydrateWater: parsed.hydrateWater, matchedBy: 'formula' };
    }
  }
  const closest = closestReagentNames(text);
  fail({
    code: 'unknown_reagent', argument, row, received: quote(text),
    expected: 'a catalogue name or alias (sodium acetate trihydrate, Tris), a formula (Na2HPO4·7H2O) or a stock such as 1 M HCl; '
      + (closest.length > 0 ? `closest catalogue names: ${closest.join(', ')}` : 'the pane lists the catalogue'),
  });
}

/** Resolves a system name, alias, id, or any reagent of that system. */
export function resolveSystem(value: unknown, argument = 'system'): AcidSystem {
  const text = typeof value === 'string' ? value : '';
  const key = normaliseName(text);
  if (key !== '') {
    for (const system of allSystems()) {
      if (system.id === key || normaliseName(system.name) === key || system.aliases.some((a) => normaliseName(a) === key)) return system;
    }
    try {
      const resolved = resolveReagent(text, argument);
      if (resolved.reagent.systems.length > 0) return systemFor(resolved.reagent.systems[0].systemId);
    } catch (error) {
      // not a reagent either: the failure below names systems instead
      if (!(error instanceof ProticError)) throw error;
    }
  }
  fail({ code: 'unknown_system', argument, received: quote(value), expected: 'a system name (phosphate, citrate, Tris, ...) or a reagent of that system' });
}
