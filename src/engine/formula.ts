import { ATOMIC_WEIGHTS_G_PER_MOL } from '../catalogue';
import { fail } from './failure';

/** Element symbol to count, e.g. { Na: 2, H: 15, P: 1, O: 11 } for Na2HPO4·7H2O. */
export type Composition = Record<string, number>;

export interface ParsedFormula {
  composition: Composition;
  /** water of crystallisation written as trailing `·nH2O` parts */
  hydrateWater: number;
  /** composition without the trailing water parts */
  anhydrous: Composition;
}

const HYDRATE_DOTS = /[·•.*∙⋅]/;

/** Deeper nesting than this is no real formula; the bound keeps the recursive reader off the stack limit. */
export const MAX_FORMULA_DEPTH = 12;

const HYDRATE_WORDS: Record<string, number> = {
  hemi: 0.5, mono: 1, sesqui: 1.5, di: 2, tri: 3, tetra: 4, penta: 5, hexa: 6, hepta: 7, octa: 8, nona: 9, deca: 10, undeca: 11, dodeca: 12,
};

/** A hydrate written any way the trade writes it, split into what precedes the water and the water count. */
export interface HydrateSplit {
  /** the text before the water part, trimmed (a formula or a name) */
  base: string;
  hydrateWater: number;
}

/**
 * The one hydrate grammar (catalogue, custom systems, cells): `X·7H2O`, `X.7H2O`, `X*7H2O`, `X∙7H2O`, `X⋅7H2O`,
 * `X x7H2O`, `Xx7H2O`, `X×7H2O`, `X 7H2O`, `X·7 H2O`, decimal `X·1.5H2O`, and a word `X heptahydrate`
 * (`, monohydrate` too). Subscript digits are folded before (plainText). Undefined when no water is written.
 * Example: splitHydrate('Na2HPO4 7H2O') → { base: 'Na2HPO4', hydrateWater: 7 }.
 */
export function splitHydrate(text: string): HydrateSplit | undefined {
  const src = text.trim();
  const written = /^(.+?)(?:\s*[·•.*∙⋅×]\s*|\s*(?<=[\dA-Za-z)\]])x\s*|\s+)(\d+(?:\.\d+)?)?\s*H2O$/.exec(src);
  if (written && written[1].trim() !== '') {
    const count = written[2] === undefined ? 1 : Number(written[2]);
    if (count > 0) return { base: written[1].trim(), hydrateWater: count };
  }
  const word = /^(.+?)[\s,]+(hemi|mono|sesqui|di|tri|tetra|penta|hexa|hepta|octa|nona|deca|undeca|dodeca)hydrate$/i.exec(src);
  if (word && word[1].trim() !== '') return { base: word[1].trim(), hydrateWater: HYDRATE_WORDS[word[2].toLowerCase()] };
  return undefined;
}

/** A formula with its water in the catalogue's own spelling: `Na2HPO4·7H2O`. */
export function hydrateText(formula: string, hydrateWater: number): string {
  return hydrateWater > 0 ? `${formula}·${hydrateWater === 1 ? '' : hydrateWater}H2O` : formula;
}

/**
 * Parses a formula: element symbols, counts, parentheses or brackets, and adducts after a
 * hydrate dot (`·`, `.`, `*`) with a leading coefficient (`Na2HPO4·7H2O`, `C4H11NO3·HCl`).
 */
export function parseFormula(text: string, argument = 'formula', row?: number): ParsedFormula {
  const trimmed = text.trim();
  // every hydrate style reads as `base·nH2O`; the base is a prefix, so positions in messages still hold
  const hydrate = splitHydrate(trimmed);
  const src = hydrate ? `${hydrate.base}·${hydrate.hydrateWater}H2O` : trimmed;
  if (src === '') fail({ code: 'bad_formula', argument, row, received: 'an empty text', expected: 'a formula such as Na2HPO4·7H2O', position: 1 });
  let pos = 0;
  const bad = (expected: string): never =>
    fail({ code: 'bad_formula', argument, row, received: `"${short(src)}"`, expected, position: pos + 1 });

  // counts inside a formula are whole; only a hydrate coefficient may be decimal (·1.5H2O)
  const readNumber = (decimal = false): number | undefined => {
    const match = (decimal ? /^\d+(\.\d+)?/ : /^\d+/).exec(src.slice(pos));
    if (!match) return undefined;
    pos += match[0].length;
    return Number(match[0]);
  };

  const readGroup = (closer: string | undefined, depth: number): Composition => {
    if (depth > MAX_FORMULA_DEPTH) bad(`at most ${MAX_FORMULA_DEPTH} nested parentheses or brackets`);
    const out: Composition = {};
    let empty = true;
    while (pos < src.length) {
      const ch = src[pos];
      if (closer !== undefined && ch === closer) break;
      if (HYDRATE_DOTS.test(ch)) break;
      let part: Composition;
      if (ch === '(' || ch === '[') {
        pos++;
        part = readGroup(ch === '(' ? ')' : ']', depth + 1);
        if (src[pos] !== (ch === '(' ? ')' : ']')) bad(`a closing ${ch === '(' ? ')' : ']'}`);
        pos++;
      } else if (/[A-Z]/.test(ch)) {
        const match = /^[A-Z][a-z]?/.exec(src.slice(pos)) as RegExpExecArray;
        let symbol = match[0];
        if (ATOMIC_WEIGHTS_G_PER_MOL[symbol] === undefined && symbol.length === 2 && ATOMIC_WEIGHTS_G_PER_MOL[symbol[0]] !== undefined) symbol = symbol[0];
        if (ATOMIC_WEIGHTS_G_PER_MOL[symbol] === undefined) bad('an element symbol (H, C, N, O, Na, ...)');
        pos += symbol.length;
        part = { [symbol]: 1 };
      } else {
        bad('an element symbol, a count, a parenthesis or a hydrate dot');
        part = {};
      }
      const count = readNumber() ?? 1;
      if (count === 0) bad('a count of at least 1');
      for (const [el, n] of Object.entries(part)) out[el] = (out[el] ?? 0) + n * count;
      empty = false;
    }
    if (empty) bad('an element symbol');
    return out;
  };

  const composition: Composition = {};
  const anhydrous: Composition = {};
  let hydrateWater = 0;
  let first = true;
  while (pos <= src.length) {
    const coefficient = first ? 1 : readNumber(true) ?? 1;
    const group = readGroup(undefined, 0);
    const isWater = !first && Object.keys(group).length === 2 && group.H === 2 && group.O === 1;
    for (const [el, n] of Object.entries(group)) {
      composition[el] = (composition[el] ?? 0) + n * coefficient;
      if (!isWater) anhydrous[el] = (anhydrous[el] ?? 0) + n * coefficient;
    }
    if (isWater) hydrateWater += coefficient;
    first = false;
    if (pos >= src.length) break;
    if (!HYDRATE_DOTS.test(src[pos])) bad('a hydrate dot or the end of the formula');
    pos++;
  }
  return { composition, hydrateWater, anhydrous };
}

export function compositionMassGPerMol(composition: Composition): number {
  let sum = 0;
  for (const [el, n] of Object.entries(composition)) sum += ATOMIC_WEIGHTS_G_PER_MOL[el] * n;
  return sum;
}

/** Molar mass of a formula from the standard atomic weights, g/mol. */
export function molarMassGPerMol(formula: string, argument = 'formula', row?: number): number {
  return compositionMassGPerMol(parseFormula(formula, argument, row).composition);
}

/** A canonical text key for a composition (Hill order), to compare formulas written differently. */
export function compositionKey(composition: Composition): string {
  const els = Object.keys(composition).filter((el) => composition[el] !== 0);
  const hasC = els.includes('C');
  els.sort((a, b) => {
    if (hasC) {
      const rank = (e: string): number => (e === 'C' ? 0 : e === 'H' ? 1 : 2);
      if (rank(a) !== rank(b)) return rank(a) - rank(b);
    }
    return a < b ? -1 : a > b ? 1 : 0;
  });
  return els.map((el) => `${el}${composition[el]}`).join('');
}

/** The composition with `hydrogens` H atoms removed (for the forms of an acid system). */
export function withoutHydrogens(composition: Composition, hydrogens: number): Composition {
  return { ...composition, H: (composition.H ?? 0) - hydrogens };
}

export function looksLikeFormula(text: string): boolean {
  const t = text.trim();
  return /^[A-Z([][A-Za-z0-9()[\]·•.*∙⋅]*$/.test(t) || /^[A-Z([]/.test(t) && splitHydrate(t) !== undefined && /^[A-Z([][A-Za-z0-9()[\]]*$/.test(splitHydrate(t)!.base);
}

function short(text: string): string {
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}
