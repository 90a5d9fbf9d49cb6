import type { Reagent } from '../catalogue';
import { allReagents, perGeneration } from './customStore';
import { normaliseName } from './nameIndex';

/** Character trigrams of a normalised name, padded so word starts count. */
function trigrams(text: string): Set<string> {
  const padded = `  ${text} `;
  const out = new Set<string>();
  for (let i = 0; i + 3 <= padded.length; i++) out.add(padded.slice(i, i + 3));
  return out;
}

// Built once per registry generation: the cache that keeps a misspelling's message cheap. An inverted index
// (trigram → names holding it) counts shared trigrams without visiting names that share none.
const nameTrigrams = perGeneration(() => {
  const entries = allReagents().flatMap((reagent) => [reagent.name, ...reagent.aliases].map((name) => ({ reagent, key: normaliseName(name), size: trigrams(normaliseName(name)).size })));
  const postings = new Map<string, number[]>();
  entries.forEach((entry, i) => {
    for (const gram of trigrams(entry.key)) {
      const list = postings.get(gram);
      if (list) list.push(i);
      else postings.set(gram, [i]);
    }
  });
  return { entries, postings, shared: new Int32Array(entries.length) };
});

/** Edit distance with transpositions (optimal string alignment), stopping early above `limit`. */
function editDistance(a: string, b: string, limit: number): number {
  if (Math.abs(a.length - b.length) > limit) return limit + 1;
  let prevPrev: number[] = [];
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    let best = i;
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min(prev[j] + 1, row[j - 1] + 1, prev[j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, prevPrev[j - 2] + 1);
      row.push(d);
      best = Math.min(best, d);
    }
    if (best > limit) return limit + 1;
    prevPrev = prev;
    prev = row;
  }
  return prev[b.length];
}

/**
 * Catalogue reagent names closest to a text, best first, for an unknown-name message: names within one or two
 * typing slips (a swapped, missing or extra letter: `Trsi`, `Glycin`), then trigram Dice ≥ 0.45.
 * Example: closestReagentNames('Trsi') → ['Tris', ...].
 */
export function closestReagentNames(text: string, count = 3): string[] {
  const key = normaliseName(text);
  if (key.length < 3 || key.length > 100) return []; // no catalogue name is that long: not a misspelling
  const query = trigrams(key);
  const limit = key.length <= 5 ? 1 : 2;
  const best = new Map<Reagent, number>();
  const { entries, postings, shared } = nameTrigrams();
  shared.fill(0);
  for (const gram of query) for (const i of postings.get(gram) ?? []) shared[i]++;
  entries.forEach((entry, i) => {
    let score = (2 * shared[i]) / (query.size + entry.size);
    // a near-miss of the whole name (a swapped, missing or extra letter) beats any trigram overlap
    if (Math.abs(entry.key.length - key.length) <= limit) {
      const slips = editDistance(key, entry.key, limit);
      if (slips <= limit) score = Math.max(score, 2 - slips);
    }
    if (score > (best.get(entry.reagent) ?? 0)) best.set(entry.reagent, score);
  });
  return [...best.entries()].filter(([, score]) => score >= 0.45).sort((a, b) => b[1] - a[1]).slice(0, count).map(([r]) => r.name);
}
