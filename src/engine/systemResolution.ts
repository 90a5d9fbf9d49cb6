import type { AcidSystem } from '../catalogue';
import { systemFor } from './customStore';
import { ProticError, fail, quote } from './failure';
import { ambiguousChoices, systemByName } from './nameIndex';
import { molarMassOfReagent } from './formulaLookup';
import { resolveReagent } from './registry';
import { checkLength, plainText, screenText } from './textScreen';

/**
 * Resolves a system name, alias or id, or a reagent that releases exactly one system. A reagent that releases two
 * (`ammonium acetate`), one that releases none, and a trade name of several forms (`sodium citrate`) are refused,
 * with the choices. Example: resolveSystem('Tris hydrochloride') → the Tris system.
 */
export function resolveSystem(value: unknown, argument = 'system'): AcidSystem {
  const raw = typeof value === 'string' ? value : '';
  if (raw.trim() === '') fail({ code: 'unknown_system', argument, received: quote(value), expected: 'a system name (phosphate, citrate, Tris, ...) or a reagent of that system' });
  checkLength(raw, argument);
  screenText(raw, argument);
  const text = plainText(raw);
  const byName = systemByName(text);
  if (byName) return byName;
  const choices = ambiguousChoices(text);
  if (choices) {
    const systems = [...new Set(choices.flatMap((c) => c.systems.map((s) => systemFor(s.systemId).name)))];
    const listed = choices.map((c) => `${c.name} (${molarMassOfReagent(c).toFixed(2)} g/mol)`).join(', ');
    fail({ code: 'ambiguous_reagent', argument, received: quote(raw),
      expected: `a system name or one form: ${quote(raw)} names ${listed}${systems.length > 0 ? `, forms of ${systems.join(' and ')}: write ${systems.join(' or ')}` : ''}` });
  }
  let reagent;
  try {
    reagent = resolveReagent(text, argument).reagent;
  } catch (error) {
    // not a reagent either: the failure names systems instead, keeping the reagent message's suggestions
    if (!(error instanceof ProticError) || (error.failure.code !== 'unknown_reagent' && error.failure.code !== 'bad_formula')) throw error;
    fail({ code: 'unknown_system', argument, received: quote(raw), expected: 'a system name (phosphate, citrate, Tris, ...) or a reagent of that system' });
  }
  if (reagent.systems.length === 1) return systemFor(reagent.systems[0].systemId);
  if (reagent.systems.length === 0) {
    fail({ code: 'unknown_system', argument, received: quote(raw), expected: `an acid system: ${reagent.name} releases none (${reagent.excipient ? 'an excipient' : reagent.solvent ? 'the solvent' : 'fully dissociated ions only'})` });
  }
  const names = reagent.systems.map((s) => systemFor(s.systemId).name);
  fail({ code: 'ambiguous_reagent', argument, received: quote(raw), expected: `one system: ${reagent.name} releases ${names.length}, ${names.join(' and ')}; write ${names.join(' or ')}` });
}
