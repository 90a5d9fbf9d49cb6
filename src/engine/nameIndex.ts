import { AMBIGUOUS_NAMES } from '../catalogue';
import type { AcidSystem, Reagent } from '../catalogue';
import { allReagents, allSystems, perGeneration } from './customStore';
import { foldConfusables } from './textScreen';

/** The key a name is looked up by: case, runs of spaces, dashes and a space before % do not matter. */
export function normaliseName(text: string): string {
  return text.trim().toLowerCase().replace(/\s+/g, ' ').replace(/ %/g, '%').replace(/[‐‑‒–—]/g, '-').replace(/[’‘′]/g, "'");
}

/**
 * A looser key: spaces, hyphens, dots, middle dots and commas dropped, so `Tris·HCl`, `Tris.HCl`, `TrisHCl`,
 * `tri-sodium citrate` and `sodium hydrogencarbonate` meet the catalogue's spelling. Only used when it names
 * one reagent: keys two reagents share are left out of the index.
 */
export function compactName(text: string): string {
  return normaliseName(text).replace(/[\s\-.,·•∙⋅*]/g, '');
}

/** The key a custom name is compared by: compact, with look-alike letters folded to Latin. */
export function lookalikeKey(text: string): string {
  return compactName(foldConfusables(text));
}

const nameIndex = perGeneration(() => {
  const exact = new Map<string, Reagent>();
  const compact = new Map<string, Reagent | null>(); // null: two reagents share the key
  for (const reagent of allReagents()) {
    for (const name of [reagent.name, ...reagent.aliases]) {
      const key = normaliseName(name);
      if (!exact.has(key)) exact.set(key, reagent);
      const loose = compactName(name);
      const seen = compact.get(loose);
      compact.set(loose, seen === undefined || seen === reagent ? reagent : null);
    }
  }
  return { exact, compact };
});

/** The reagent with this name or alias, if any. */
export function reagentByName(text: string): Reagent | undefined {
  return nameIndex().exact.get(normaliseName(text));
}

/** The reagent whose name or alias matches up to spaces, hyphens, dots and commas, if exactly one does. */
export function reagentByCompactName(text: string): Reagent | undefined {
  return nameIndex().compact.get(compactName(text)) ?? undefined;
}

const ambiguousIndex = new Map(AMBIGUOUS_NAMES.map((a) => [compactName(a.name), a.choices]));

/** The catalogue choices for a trade name that means more than one form, if the text is one. */
export function ambiguousChoices(text: string): Reagent[] | undefined {
  const choices = ambiguousIndex.get(compactName(text));
  return choices?.map((name) => reagentByName(name) as Reagent);
}

const systemNameIndex = perGeneration(() => {
  const index = new Map<string, AcidSystem>();
  for (const system of allSystems()) {
    for (const name of [system.id, system.name, ...system.aliases]) {
      const key = normaliseName(name);
      if (!index.has(key)) index.set(key, system);
    }
  }
  return index;
});

/** The system with this id, name or alias, if any. */
export function systemByName(text: string): AcidSystem | undefined {
  return systemNameIndex().get(normaliseName(text));
}

/** Every name and alias of the catalogue (reagents, systems, ambiguous trade names), as look-alike keys. */
export function catalogueLookalikeKeys(): Map<string, string> {
  const keys = new Map<string, string>();
  const add = (name: string): void => { if (!keys.has(lookalikeKey(name))) keys.set(lookalikeKey(name), name); };
  for (const reagent of allReagents()) if (!reagent.id.startsWith('custom:')) [reagent.name, ...reagent.aliases].forEach(add);
  for (const system of allSystems()) if (!system.custom) [system.name, ...system.aliases].forEach(add);
  for (const a of AMBIGUOUS_NAMES) add(a.name);
  return keys;
}
