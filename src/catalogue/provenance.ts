import type { AcidStep, Provenance, ProvenanceLevel, StepProvenance } from './types';

// Builders and labels for the provenance of catalogue constants (see ProvenanceLevel in types.ts).

export const recalled = (source: string): Provenance => ({ level: 'recalled', source });
export const checked = (source: string, where: string, pKaPlusMinus?: number): Provenance => ({ level: 'checked', source, where, ...(pKaPlusMinus === undefined ? {} : { pKaPlusMinus }) });
export const practice = (source = 'common practice'): Provenance => ({ level: 'common practice', source });

/** The level as a reviewer reads it: "checked: abstract, fitted pK(T) …", "recalled, not checked", … */
export function levelLabel(p: Provenance | null): string {
  if (!p) return 'no value';
  return levelText(p.level, p.where);
}

export function levelText(level: ProvenanceLevel, where?: string): string {
  switch (level) {
    case 'checked': return where ? `checked: ${where}` : 'checked';
    case 'recalled': return 'recalled, not checked';
    case 'common practice': return 'common practice';
    case 'user': return 'user-defined';
  }
}

/** One line naming each constant's source and level, constants with the same provenance grouped. */
export function stepSourceText(provenance: StepProvenance): string {
  const parts: { names: string[]; p: Provenance }[] = [];
  const entries: [string, Provenance | null][] = [['pKa', provenance.pKa], ['ΔrH°', provenance.dH], ['ΔrCp°', provenance.dCp]];
  for (const [name, p] of entries) {
    if (!p) continue;
    const same = parts.find((x) => x.p.source === p.source && x.p.level === p.level && x.p.where === p.where);
    if (same) same.names.push(name); else parts.push({ names: [name], p });
  }
  if (parts.length === 1) return `${parts[0].p.source} (${levelLabel(parts[0].p)})`;
  return parts.map((x) => `${x.names.join(', ')}: ${x.p.source} (${levelLabel(x.p)})`).join('; ');
}

/** Every provenance of a step's constants that has a value (pKa, then ΔrH°, ΔrCp° where present). */
export function stepProvenances(step: AcidStep): Provenance[] {
  return [step.provenance.pKa, step.provenance.dH, step.provenance.dCp].filter((p): p is Provenance => p !== null);
}
