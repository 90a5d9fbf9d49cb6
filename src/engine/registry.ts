import type { Reagent } from '../catalogue';
import { allReagents } from './customStore';
import { fail, quote, ProticError } from './failure';
import { compositionMassGPerMol, hydrateText, looksLikeFormula, parseFormula, splitHydrate } from './formula';
import { molarMassOfReagent, reagentByFormula, reagentByFormulaIgnoringCase } from './formulaLookup';
import { ambiguousChoices, reagentByCompactName, reagentByName, systemByName } from './nameIndex';
import { closestReagentNames } from './suggestions';
import { checkLength, firstCharacterProblem, plainText, screenText } from './textScreen';

// Resolving a reagent text: names first (exact, then trade spellings), then formulas, then a refusal
// that says what was meant where it can. The parts live in their own files:
//   customStore.ts (catalogue + custom definitions), nameIndex.ts (names, aliases, ambiguous trade names),
//   suggestions.ts (closest names), formulaLookup.ts (formulas, molar masses), systemResolution.ts (systems).

export { allReagents, allSystems, registryGeneration, setCustomDefinitions, systemFor } from './customStore';
export { molarMassOfReagent, reagentByFormula } from './formulaLookup';
export { compactName, normaliseName, reagentByName } from './nameIndex';
export { closestReagentNames } from './suggestions';
export { resolveSystem } from './systemResolution';

export interface ResolvedReagent {
  reagent: Reagent;
  /** molar mass of what is weighed, including its hydrate water, g/mol */
  molarMassGPerMol: number;
  hydrateWater: number;
  /** how the reagent was recognised, for the audit trail */
  matchedBy: 'name' | 'formula';
}

function byName(reagent: Reagent): ResolvedReagent {
  return { reagent, molarMassGPerMol: molarMassOfReagent(reagent), hydrateWater: reagent.hydrateWater, matchedBy: 'name' };
}

// Supplier grade and form words after a name (`NaOH pellets`, `sodium chloride, ACS reagent`): they say how it is
// sold, not what it is. Water and assay words are never dropped.
const GRADE_WORDS = /(?:[\s,]+(?:pellets|flakes|powder|crystals|crystalline|granules|granular|beads|prills|solid|ACS|ACS reagent|reagent|reagent grade|reagent plus|analytical grade|analytical reagent|AR|GR|p\.a\.|pa|for analysis|BioUltra|BioXtra|BioReagent|USP|NF|Ph\.? ?Eur\.?|EP|JP|BP|extra pure|puriss\.?|HPLC grade|molecular biology grade|cell culture grade|for molecular biology|for cell culture|pharma grade|GMP grade|multi-compendial))+$/i;

/** Exact name, trade name of several forms, then the compact spelling. */
function lookUpName(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  const exact = reagentByName(text);
  if (exact) return byName(exact);
  const choices = ambiguousChoices(text);
  if (choices) refuseAmbiguous(original, choices, argument, row);
  const compact = reagentByCompactName(text);
  if (compact) return byName(compact);
  return undefined;
}

function refuseAmbiguous(text: string, reagents: Reagent[], argument: string, row?: number): never {
  const listed = reagents.map((r) => `${r.name} (${molarMassOfReagent(r).toFixed(2)} g/mol)`);
  const example = reagents.find((r) => r.hydrateWater > 0) ?? reagents[0];
  fail({ code: 'ambiguous_reagent', argument, row, received: quote(text), expected: `one of ${listed.join(', ')}, or a formula with its water such as ${hydrateText(example.formula, example.hydrateWater)}` });
}

/** A name or formula followed by its water (`NaOAc·3H2O`, `Na2HPO4 heptahydrate`): the catalogue form with that water. */
function lookUpHydrate(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  const hydrate = splitHydrate(text);
  if (!hydrate) return undefined;
  const base = lookUpName(hydrate.base, original, argument, row);
  if (!base) return undefined;
  if (base.reagent.hydrateWater !== 0 && base.reagent.hydrateWater !== hydrate.hydrateWater) {
    fail({ code: 'bad_argument', argument, row, received: quote(original), expected: `one hydrate: ${base.reagent.name} already says its water (${base.reagent.hydrateWater} H2O)` });
  }
  const sameForm = allReagents().find((r) => r.formula === base.reagent.formula && r.hydrateWater === hydrate.hydrateWater && !r.liquid
    && r.systems.length === base.reagent.systems.length && !r.excipient === !base.reagent.excipient
    // isomeric excipients share a formula (sucrose, trehalose): only the same compound's hydrate counts
    && (!r.excipient || r.id.replace(/-\d+$/, '') === base.reagent.id.replace(/-\d+$/, '')));
  if (sameForm) return byName(sameForm);
  if (base.reagent.liquid || base.reagent.solvent) {
    fail({ code: 'bad_argument', argument, row, received: quote(original), expected: `a solid with its water: ${base.reagent.name} is ${base.reagent.solvent ? 'the solvent' : 'a liquid as sold'}` });
  }
  // a hydrate the catalogue does not list: the named reagent, weighed with the water written
  const water = compositionMassGPerMol({ H: 2, O: 1 }) * hydrate.hydrateWater;
  return { reagent: base.reagent, molarMassGPerMol: molarMassOfReagent(base.reagent) + water, hydrateWater: hydrate.hydrateWater, matchedBy: 'formula' };
}

function lookUpFormula(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  const parsed = parseFormula(text, argument, row);
  const reagent = reagentByFormula(parsed, original, argument, row);
  if (!reagent) return undefined;
  if (reagent.solvent && parsed.hydrateWater === 0) return byName(reagent);
  return { reagent, molarMassGPerMol: compositionMassGPerMol(parsed.composition), hydrateWater: parsed.hydrateWater, matchedBy: 'formula' };
}

/** `conc. HCl`, `concentrated H2SO4`: the catalogue's one liquid as sold of that compound. */
function lookUpConcentrated(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  const match = /^(?:conc\.?|concentrated)\s+(.+)$/i.exec(text);
  if (!match) return undefined;
  const compound = resolveReagentText(match[1], original, argument, row).reagent;
  // only grades the trade calls concentrated (HCl 37 %, H2SO4 96 %, ...): their catalogue entries carry that alias
  const liquids = allReagents().filter((r) => r.liquid && r.formula === compound.formula && r.aliases.some((a) => /^concentrated /i.test(a)));
  if (liquids.length === 1) return byName(liquids[0]);
  fail({ code: 'unknown_reagent', argument, row, received: quote(original),
    expected: liquids.length === 0 ? `a stock or a liquid as sold: the catalogue has no concentrated ${compound.name}` : `one of ${liquids.map((l) => l.name).join(', ')}` });
}

/** The text, cleaned of supplier styles, tried as a name; the variants never change what the text names. */
function lookUpTradeSpelling(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  const ungraded = text.replace(GRADE_WORDS, '').trim();
  if (ungraded !== text && ungraded !== '') return resolveReagentText(ungraded, original, argument, row);
  // a name followed by its formula or another name in parentheses: `sodium chloride (NaCl)`. Both must name one reagent.
  const paren = /^(.+?)\s*\(([^()]+)\)$/.exec(text);
  if (paren && !/^[A-Z([][A-Za-z0-9()[\]]*$/.test(text)) {
    const joined = tryResolve(`${paren[1]} ${paren[2]}`, original, argument, row);
    if (joined) return joined;
    const outer = tryResolve(paren[1], original, argument, row);
    const inner = tryResolve(paren[2], original, argument, row);
    if (outer && inner && outer.reagent === inner.reagent) return outer;
    if (outer && inner) {
      fail({ code: 'bad_argument', argument, row, received: quote(original), expected: `one reagent: ${outer.reagent.name} and ${inner.reagent.name} differ` });
    }
  }
  return undefined;
}

function tryResolve(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  try {
    return resolveReagentText(text, original, argument, row);
  } catch (error) {
    if (error instanceof ProticError && (error.failure.code === 'unknown_reagent' || error.failure.code === 'bad_formula')) return undefined;
    throw error;
  }
}

/** A word the catalogue has as an acid system (`phosphate`): refused with that system's reagents. */
function refuseSystemName(text: string, original: string, argument: string, row?: number): void {
  const system = systemByName(text);
  if (!system) return;
  const reagents = allReagents().filter((r) => r.systems.length === 1 && r.systems[0].systemId === system.id && !r.liquid).map((r) => r.name);
  fail({ code: 'unknown_reagent', argument, row, received: quote(original),
    expected: `one reagent: ${system.name} is an acid system, sold as ${reagents.slice(0, 8).join(', ')}${reagents.length > 8 ? ', ...' : ''}` });
}

/**
 * A liquid as sold written by its assay, `H3PO4 85%`, `50% NaOH`, `HCl 37% w/w`: the catalogue liquid of that
 * compound and assay. A bare percentage that matches none is refused: it could be w/w or w/v.
 */
function lookUpAsSold(text: string, original: string, argument: string, row?: number): ResolvedReagent | undefined {
  const match = /^(\d+(?:\.\d+)?)\s*%\s*(?:\(?w\/w\)?\s+)?(.+)$/i.exec(text) ?? /^(.+?)\s+(\d+(?:\.\d+)?)\s*%(?:\s*\(?w\/w\)?)?$/i.exec(text);
  if (!match) return undefined;
  const leading = /^\d/.test(match[1]);
  const percent = Number(leading ? match[1] : match[2]);
  const compound = resolveReagentText((leading ? match[2] : match[1]).trim(), original, argument, row).reagent;
  const liquid = allReagents().find((r) => r.liquid && r.formula === compound.formula && Math.abs(r.liquid.massFraction * 100 - percent) < 1e-9);
  if (liquid) return byName(liquid);
  const sold = allReagents().filter((r) => r.liquid && r.formula === compound.formula).map((r) => r.name);
  fail({ code: 'bad_argument', argument, row, received: quote(original),
    expected: `a stock of ${compound.name} with its basis: ${percent}% w/v ${compound.formula} (${percent} g per 100 mL) or a molarity`
      + (sold.length > 0 ? `; the catalogue's liquids as sold: ${sold.join(', ')}` : '') });
}

// Nested attempts (a spelling tried inside another) fail without suggestions: only the outermost failure, the one
// the user reads, pays for the closest-name search.
let attemptDepth = 0;
function suggest(text: string): string[] {
  return attemptDepth > 1 ? [] : closestReagentNames(text);
}

function resolveReagentText(text: string, original: string, argument: string, row?: number): ResolvedReagent {
  attemptDepth++;
  try {
    return resolveReagentTextAt(text, original, argument, row);
  } finally {
    attemptDepth--;
  }
}

function resolveReagentTextAt(text: string, original: string, argument: string, row?: number): ResolvedReagent {
  const named = lookUpName(text, original, argument, row) ?? lookUpHydrate(text, original, argument, row)
    ?? lookUpConcentrated(text, original, argument, row) ?? lookUpAsSold(text, original, argument, row)
    ?? lookUpTradeSpelling(text, original, argument, row);
  if (named) return named;
  const formulaPart = splitHydrate(text)?.base ?? text;
  const wordLike = /[a-z]{2}/.test(formulaPart); // no element symbol has two lower-case letters
  if (!wordLike && (looksLikeFormula(text) || /^[A-Z0-9()[\]·.*]+$/.test(text))) {
    let found: ResolvedReagent | undefined;
    try {
      found = lookUpFormula(text, original, argument, row);
    } catch (error) {
      if (!(error instanceof ProticError) || error.failure.code !== 'bad_formula') throw error;
      const caseless = reagentByFormulaIgnoringCase(text); // NACL, KCL typed in capitals
      if (caseless) return byName(caseless);
      const closest = suggest(text);
      if (closest.length === 0) throw error;
      fail({ ...error.failure, expected: `${error.failure.expected}; or a catalogue name: closest ${closest.join(', ')}` });
    }
    if (found) return found;
    const caseless = reagentByFormulaIgnoringCase(text);
    if (caseless) return byName(caseless);
  }
  refuseSystemName(text, original, argument, row);
  const closest = suggest(text);
  fail({
    code: 'unknown_reagent', argument, row, received: quote(original),
    expected: 'a catalogue name or alias (sodium acetate trihydrate, Tris), a formula (Na2HPO4·7H2O) or a stock such as 1 M HCl; '
      + (closest.length > 0 ? `closest catalogue names: ${closest.join(', ')}` : 'the pane lists the catalogue'),
  });
}

/** What a text with its look-alike letters folded would name, for the message that refuses it. */
export function readsAs(folded: string): string | undefined {
  if (firstCharacterProblem(folded)) return undefined;
  const plain = plainText(folded).trim();
  attemptDepth++; // a guess for a message: no suggestions of its own
  try {
    return resolveReagentText(plain, plain, 'reagents').reagent.name;
  } finally {
    attemptDepth--;
  }
}

/**
 * Resolves a catalogue name, alias, trade spelling or formula to a reagent.
 * Example: resolveReagent('Na2HPO4 heptahydrate', 'reagents').reagent.name → 'disodium hydrogen phosphate heptahydrate'.
 */
export function resolveReagent(text: string, argument: string, row?: number): ResolvedReagent {
  checkLength(text, argument, row);
  screenText(text, argument, row, readsAs);
  const plain = plainText(text).trim();
  return resolveReagentText(plain.replace(/\s*,\s*/g, (m, offset: number) => (offset > 0 ? ', ' : m)), text, argument, row);
}
