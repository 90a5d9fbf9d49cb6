import { fail, quote } from './failure';

// Reagent texts and custom names are read as Latin text. A look-alike letter from another script
// (Cyrillic Т for T), a full-width form or an invisible mark makes a name that reads right but
// matches something else, or nothing: such a character is refused, named and located.

/** Characters outside ASCII that names, formulas and units legitimately use. */
const ALLOWED_EXTRA = new Set([
  '·', '•', '∙', '⋅', '×', '°', '±', '≥', '≤', '’', '‘', '′', '–', '—', '‐', '‑', '‒', '½',
  'µ', 'μ', 'α', 'β', 'γ', 'ω', // micro in units; α-, β-, γ-, ω- in chemical names
  '\u00a0', '\u2009', '\u202f', // no-break, thin and narrow no-break spaces, as pasted from documents
]);
const SUBSCRIPT_OR_SUPERSCRIPT_DIGIT = /[\u2080-\u2089\u2070\u00b9\u00b2\u00b3\u2074-\u2079]/u;

// Look-alikes: the Latin letter each is confused with (Unicode confusables, common subset).
const LOOKALIKE_NAMES: Record<string, [string, string]> = {
  'А': ['CYRILLIC CAPITAL LETTER A', 'A'], 'В': ['CYRILLIC CAPITAL LETTER VE', 'B'], 'Е': ['CYRILLIC CAPITAL LETTER IE', 'E'],
  'К': ['CYRILLIC CAPITAL LETTER KA', 'K'], 'М': ['CYRILLIC CAPITAL LETTER EM', 'M'], 'Н': ['CYRILLIC CAPITAL LETTER EN', 'H'],
  'О': ['CYRILLIC CAPITAL LETTER O', 'O'], 'Р': ['CYRILLIC CAPITAL LETTER ER', 'P'], 'С': ['CYRILLIC CAPITAL LETTER ES', 'C'],
  'Т': ['CYRILLIC CAPITAL LETTER TE', 'T'], 'У': ['CYRILLIC CAPITAL LETTER U', 'Y'], 'Х': ['CYRILLIC CAPITAL LETTER HA', 'X'],
  'Ѕ': ['CYRILLIC CAPITAL LETTER DZE', 'S'], 'І': ['CYRILLIC CAPITAL LETTER BYELORUSSIAN-UKRAINIAN I', 'I'], 'Ј': ['CYRILLIC CAPITAL LETTER JE', 'J'],
  'а': ['CYRILLIC SMALL LETTER A', 'a'], 'е': ['CYRILLIC SMALL LETTER IE', 'e'], 'о': ['CYRILLIC SMALL LETTER O', 'o'],
  'р': ['CYRILLIC SMALL LETTER ER', 'p'], 'с': ['CYRILLIC SMALL LETTER ES', 'c'], 'у': ['CYRILLIC SMALL LETTER U', 'y'],
  'х': ['CYRILLIC SMALL LETTER HA', 'x'], 'ѕ': ['CYRILLIC SMALL LETTER DZE', 's'], 'і': ['CYRILLIC SMALL LETTER BYELORUSSIAN-UKRAINIAN I', 'i'],
  'ј': ['CYRILLIC SMALL LETTER JE', 'j'], 'һ': ['CYRILLIC SMALL LETTER SHHA', 'h'], 'ԁ': ['CYRILLIC SMALL LETTER KOMI DE', 'd'],
  'Α': ['GREEK CAPITAL LETTER ALPHA', 'A'], 'Β': ['GREEK CAPITAL LETTER BETA', 'B'], 'Ε': ['GREEK CAPITAL LETTER EPSILON', 'E'],
  'Ζ': ['GREEK CAPITAL LETTER ZETA', 'Z'], 'Η': ['GREEK CAPITAL LETTER ETA', 'H'], 'Ι': ['GREEK CAPITAL LETTER IOTA', 'I'],
  'Κ': ['GREEK CAPITAL LETTER KAPPA', 'K'], 'Μ': ['GREEK CAPITAL LETTER MU', 'M'], 'Ν': ['GREEK CAPITAL LETTER NU', 'N'],
  'Ο': ['GREEK CAPITAL LETTER OMICRON', 'O'], 'Ρ': ['GREEK CAPITAL LETTER RHO', 'P'], 'Τ': ['GREEK CAPITAL LETTER TAU', 'T'],
  'Υ': ['GREEK CAPITAL LETTER UPSILON', 'Y'], 'Χ': ['GREEK CAPITAL LETTER CHI', 'X'], 'ο': ['GREEK SMALL LETTER OMICRON', 'o'],
  'ν': ['GREEK SMALL LETTER NU', 'v'], 'ι': ['GREEK SMALL LETTER IOTA', 'i'], 'ρ': ['GREEK SMALL LETTER RHO', 'p'],
};

const INVISIBLE_NAMES: Record<string, string> = {
  '\u200b': 'ZERO WIDTH SPACE', '\u200c': 'ZERO WIDTH NON-JOINER', '\u200d': 'ZERO WIDTH JOINER',
  '\u200e': 'LEFT-TO-RIGHT MARK', '\u200f': 'RIGHT-TO-LEFT MARK', '\u061c': 'ARABIC LETTER MARK',
  '\u202a': 'LEFT-TO-RIGHT EMBEDDING', '\u202b': 'RIGHT-TO-LEFT EMBEDDING', '\u202c': 'POP DIRECTIONAL FORMATTING',
  '\u202d': 'LEFT-TO-RIGHT OVERRIDE', '\u202e': 'RIGHT-TO-LEFT OVERRIDE', '\u2066': 'LEFT-TO-RIGHT ISOLATE',
  '\u2067': 'RIGHT-TO-LEFT ISOLATE', '\u2068': 'FIRST STRONG ISOLATE', '\u2069': 'POP DIRECTIONAL ISOLATE',
  '\u2060': 'WORD JOINER', '\ufeff': 'ZERO WIDTH NO-BREAK SPACE (byte-order mark)', '\u00ad': 'SOFT HYPHEN', '\u0000': 'NULL',
};

/** No catalogue name, formula or stock is longer; a longer text is refused before any pattern is tried on it. */
export const MAX_REAGENT_TEXT = 200;

/** Fails for a reagent text longer than MAX_REAGENT_TEXT characters. */
export function checkLength(text: string, argument: string, row?: number): void {
  if (text.length > MAX_REAGENT_TEXT) {
    fail({ code: 'bad_argument', argument, row, received: `a text of ${text.length} characters, ${quote(text)}`, expected: `a reagent of at most ${MAX_REAGENT_TEXT} characters: a name, a formula or a stock such as 1 M HCl` });
  }
}

export interface CharacterProblem {
  /** 1-based position in code points */
  position: number;
  codePoint: string;
  /** the Unicode name where we carry it, else the kind of character */
  description: string;
}

function hex(ch: string): string {
  return `U+${(ch.codePointAt(0) as number).toString(16).toUpperCase().padStart(4, '0')}`;
}

function describe(ch: string): string | undefined {
  const code = ch.codePointAt(0) as number;
  if (code < 0x80) {
    if (code >= 0x20 && code !== 0x7f) return undefined;
    if (ch === '\t' || ch === '\n' || ch === '\r') return undefined; // whitespace, as a cell with a line break holds
    return INVISIBLE_NAMES[ch] ?? 'a control character';
  }
  if (ALLOWED_EXTRA.has(ch) || SUBSCRIPT_OR_SUPERSCRIPT_DIGIT.test(ch)) return undefined;
  const lookalike = LOOKALIKE_NAMES[ch];
  if (lookalike) return `${lookalike[0]}, which looks like Latin ${lookalike[1]}`;
  if (INVISIBLE_NAMES[ch]) return `${INVISIBLE_NAMES[ch]}, an invisible character`;
  if (code >= 0xff01 && code <= 0xff5e) return `FULLWIDTH ${String.fromCharCode(code - 0xfee0)}, a full-width form of ${String.fromCharCode(code - 0xfee0)}`;
  if (code === 0x3000) return 'IDEOGRAPHIC SPACE, a full-width space';
  if (/\p{Cf}/u.test(ch)) return 'an invisible format character';
  if (/\p{Cc}/u.test(ch)) return 'a control character';
  if (/\p{M}/u.test(ch)) return 'a combining mark';
  if (/\p{Script=Cyrillic}/u.test(ch)) return 'a Cyrillic letter';
  if (/\p{Script=Greek}/u.test(ch)) return 'a Greek letter';
  if (/\p{L}/u.test(ch) && !/\p{Script=Latin}/u.test(ch)) return 'a letter of a script other than Latin (or a styled letter)';
  if (/\p{Nd}/u.test(ch)) return 'a digit of a script other than Latin';
  if (/\p{Zs}/u.test(ch)) return 'a space character other than the ordinary space';
  return undefined;
}

/** The first character that is not plain Latin text, if any. */
export function firstCharacterProblem(text: string): CharacterProblem | undefined {
  let position = 0;
  for (const ch of text.normalize('NFC')) {
    position++;
    const description = describe(ch);
    if (description) return { position, codePoint: hex(ch), description };
  }
  return undefined;
}

/**
 * Fails when the text holds a look-alike, full-width, invisible or control character, naming it and where.
 * `readsAs`, given the text with look-alikes folded, may name what it would otherwise have meant.
 */
export function screenText(text: string, argument: string, row?: number, readsAs?: (folded: string) => string | undefined): void {
  const problem = firstCharacterProblem(text);
  if (problem) {
    let meant: string | undefined;
    try {
      meant = readsAs?.(foldConfusables(text));
    } catch {
      meant = undefined; // the folded text names nothing either: the character alone is reported
    }
    fail({
      // eslint-disable-next-line no-control-regex -- control characters are shown as '?' so the message stays printable
      code: 'bad_character', argument, row, received: quote(text.replace(/[\u0000-\u001f\u007f]/g, '?')), position: problem.position,
      expected: `plain Latin letters, digits and the usual signs; character ${problem.position} is ${problem.codePoint} ${problem.description} (retype it)`
        + (meant ? `; retyped, it would read as ${meant}` : ''),
    });
  }
}

/**
 * The text as the rest of the engine reads it, once screened: compatibility forms folded (subscript
 * digits, no-break spaces), typographic dashes and quotes made plain.
 */
export function plainText(text: string): string {
  if (/^[\x20-\x7e]*$/.test(text)) return text; // plain ASCII: nothing to fold
  return text.replace(/½/g, '0.5').normalize('NFKC').replace(/[‐‑‒–—]/g, '-').replace(/[’‘′]/g, "'").replace(/[\t\n\r]/g, ' ');
}

/**
 * Folds look-alike letters to the Latin letter they imitate, after NFKC: for comparing a new name
 * with the catalogue's, so that "Тris base" (Cyrillic Т) counts as "Tris base".
 */
export function foldConfusables(text: string): string {
  let out = '';
  for (const ch of text.normalize('NFKC')) {
    if (INVISIBLE_NAMES[ch] || /\p{Cf}/u.test(ch)) continue;
    out += LOOKALIKE_NAMES[ch]?.[1] ?? ch;
  }
  return out;
}
