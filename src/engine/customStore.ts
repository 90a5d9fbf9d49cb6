import { ACID_SYSTEMS, REAGENTS } from '../catalogue';
import type { AcidSystem, Reagent } from '../catalogue';

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

export function clearCustomStore(): void {
  setCustomDefinitions([], []);
}

export function allSystems(): readonly AcidSystem[] {
  return store.systems.length === 0 ? ACID_SYSTEMS : [...ACID_SYSTEMS, ...store.systems];
}

export function allReagents(): readonly Reagent[] {
  return store.reagents.length === 0 ? REAGENTS : [...REAGENTS, ...store.reagents];
}

/** A value computed from the registry, rebuilt only when the custom definitions change. */
export function perGeneration<T>(build: () => T): () => T {
  let value: T | undefined;
  let generation = -1;
  return () => {
    if (value === undefined || generation !== store.generation) {
      value = build();
      generation = store.generation;
    }
    return value;
  };
}

const systemById = new Map<string, AcidSystem>(ACID_SYSTEMS.map((s) => [s.id, s]));

export function systemFor(id: string): AcidSystem {
  const builtin = systemById.get(id);
  if (builtin) return builtin;
  const custom = store.systems.find((s) => s.id === id);
  if (!custom) throw new Error(`catalogue inconsistency: no system ${id}`);
  return custom;
}
