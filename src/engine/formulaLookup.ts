import type { Reagent } from '../catalogue';
import { allReagents, perGeneration } from './customStore';
import { fail, quote } from './failure';
import { compositionKey, compositionMassGPerMol, hydrateText, parseFormula } from './formula';
import type { ParsedFormula } from './formula';

function reagentMolarMass(reagent: Reagent): number {
  const parsed = parseFormula(reagent.formula, 'catalogue');
  return compositionMassGPerMol(parsed.composition) + reagent.hydrateWater * compositionMassGPerMol({ H: 2, O: 1 });
}

const molarMassCache = new Map<Reagent, number>();
/** Molar mass of what is weighed, hydrate water included, g/mol (from the standard atomic weights). */
export function molarMassOfReagent(reagent: Reagent): number {
  let mass = molarMassCache.get(reagent);
  if (mass === undefined) {
    mass = reagentMolarMass(reagent);
    molarMassCache.set(reagent, mass);
  }
  return mass;
}

const formulaIndex = perGeneration(() => {
  const byComposition = new Map<string, Reagent[]>();
  const byLowerCaseText = new Map<string, Reagent | null>(); // null: two reagents share the text
  for (const reagent of allReagents()) {
    const key = compositionKey(parseFormula(reagent.formula, 'catalogue').anhydrous);
    byComposition.set(key, [...(byComposition.get(key) ?? []), reagent]);
    if (reagent.liquid) continue;
    const lower = hydrateText(reagent.formula, reagent.hydrateWater).toLowerCase();
    const seen = byLowerCaseText.get(lower);
    byLowerCaseText.set(lower, seen === undefined || seen === reagent ? reagent : null);
  }
  return { byComposition, byLowerCaseText };
});

/** Every catalogue reagent with this anhydrous composition (solids first is the caller's choice). */
export function reagentsWithComposition(parsed: ParsedFormula): Reagent[] {
  return formulaIndex().byComposition.get(compositionKey(parsed.anhydrous)) ?? [];
}

/**
 * Finds a reagent by formula: the anhydrous part must match; any hydrate water is taken as written. Isomers the
 * catalogue holds as excipients (sucrose and trehalose, mannitol and sorbitol) are refused with their names.
 */
export function reagentByFormula(parsed: ParsedFormula, text = '', argument = 'reagents', row?: number): Reagent | undefined {
  const candidates = reagentsWithComposition(parsed);
  const solids = candidates.filter((c) => !c.liquid);
  const pool = solids.length > 0 ? solids : candidates;
  const isomers = [...new Set(pool.filter((c) => c.excipient).map((c) => c.id.replace(/-\d+$/, '')))];
  if (isomers.length > 1) {
    const names = pool.filter((c) => c.hydrateWater === 0 || c.hydrateWater === parsed.hydrateWater).map((c) => c.name);
    fail({ code: 'ambiguous_reagent', argument, row, received: quote(text), expected: `a name: this formula is shared by ${names.join(', ')}` });
  }
  return pool.find((c) => c.hydrateWater === parsed.hydrateWater) ?? pool[0];
}

/** A formula typed in one case (`NACL`, `nahco3`) that matches exactly one catalogue formula as written. */
export function reagentByFormulaIgnoringCase(text: string): Reagent | undefined {
  return formulaIndex().byLowerCaseText.get(text.trim().toLowerCase().replace(/[.*∙⋅•]/g, '·')) ?? undefined;
}
