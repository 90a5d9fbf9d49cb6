import { ProticError, parseModel, parseReagentSpec, parseUnit } from '../src/engine';
import * as impl from '../src/functions/impl';

// Every spelling the batch-record sweep listed as refused (issue "batch records as they are written", names and
// units), with the reagent or unit it means. Each is either accepted as exactly that reagent (and stock
// concentration), or refused with a message that names it. None may be accepted as something else.

type Accepted = { text: string; id: string; stockM?: number; molarMass?: number };
type Refused = { text: string; names: RegExp; code?: string };

const ACCEPTED: Accepted[] = [
  // names read as broken formulas
  { text: 'Tris·HCl', id: 'tris-hcl' },
  { text: 'Tris.HCl', id: 'tris-hcl' },
  { text: 'TrisHCl', id: 'tris-hcl' },
  { text: 'Tris-HCl', id: 'tris-hcl' },
  { text: 'NaOAc', id: 'naoac' },
  { text: 'HOAc', id: 'acetic' },
  { text: 'NACL', id: 'nacl' },
  // hydrate and supplier styles
  { text: 'Na2HPO4 7H2O', id: 'na2hpo4-7' },
  { text: 'Na2HPO4·7 H2O', id: 'na2hpo4-7' },
  { text: 'Na2HPO4x7H2O', id: 'na2hpo4-7' },
  { text: 'Na₂HPO₄·7H₂O', id: 'na2hpo4-7' },
  { text: 'Na2HPO4 heptahydrate', id: 'na2hpo4-7' },
  { text: 'citric acid, monohydrate', id: 'citric-1' },
  { text: 'acetic acid, glacial', id: 'acetic-glacial' },
  { text: 'tri-sodium citrate dihydrate', id: 'na3cit-2' },
  { text: 'sodium hydrogencarbonate', id: 'nahco3' },
  { text: 'HEPES Na', id: 'hepes-na' },
  { text: 'HEPES acid', id: 'hepes' },
  { text: 'sodium chloride (NaCl)', id: 'nacl' },
  { text: 'NaOH pellets', id: 'naoh' },
  // liquids as sold
  { text: 'H3PO4 85%', id: 'h3po4-85' },
  { text: 'HCl 37%', id: 'hcl-37' },
  { text: 'NaOH 50%', id: 'naoh-50' },
  { text: '50% NaOH', id: 'naoh-50' },
  { text: 'conc. HCl', id: 'hcl-37' },
  // stocks, in every word order
  { text: '1 mol/l NaOH', id: 'naoh', stockM: 1 },
  { text: 'NaOH 1 M', id: 'naoh', stockM: 1 },
  { text: 'NaCl 5 M', id: 'nacl', stockM: 5 },
  { text: 'NaOH (1 M)', id: 'naoh', stockM: 1 },
  // 10 g per 100 mL of NaOH (CIAAW 2021 atomic weights): 2.5 mol/L
  { text: '10% (w/v) NaOH', id: 'naoh', stockM: 100 / (22.98976928 + 15.999 + 1.008) },
  // normality of strong acids and bases: 1 eq/mol, H2SO4 2 eq/mol
  { text: '1 N NaOH', id: 'naoh', stockM: 1 },
  { text: '10 N NaOH', id: 'naoh', stockM: 10 },
  { text: '6 N HCl', id: 'hcl', stockM: 6 },
  { text: '2 N H2SO4', id: 'h2so4', stockM: 1 },
  // rows every bill of materials carries
  { text: 'sucrose', id: 'sucrose' },
  { text: 'mannitol', id: 'mannitol' },
  { text: 'trehalose dihydrate', id: 'trehalose-2' },
  { text: 'glycerol', id: 'glycerol' },
  { text: 'polysorbate 20', id: 'polysorbate-20' },
  { text: 'polysorbate 80', id: 'polysorbate-80' },
  { text: 'water', id: 'water' },
  { text: 'WFI', id: 'water' },
  { text: 'arginine', id: 'arginine' },
  { text: 'L-arginine hydrochloride', id: 'arginine-hcl' },
  { text: 'lysine', id: 'lysine' },
  { text: 'lysine HCl', id: 'lysine-hcl' },
  { text: 'L-glutamic acid', id: 'glutamic' },
  { text: 'monosodium glutamate monohydrate', id: 'msg-1' },
  { text: 'L-aspartic acid', id: 'aspartic' },
  { text: 'L-methionine', id: 'methionine' },
];

const REFUSED: Refused[] = [
  // a spelling that could mean two reagents: refused with the choices and their molar masses
  { text: 'EDTA', names: /EDTA free acid \(292\.24 g\/mol\), disodium EDTA dihydrate \(372\.24 g\/mol\), tetrasodium EDTA \(380\.17 g\/mol\)/, code: 'ambiguous_reagent' },
  { text: '0.5 M EDTA', names: /EDTA free acid \(292\.24 g\/mol\), disodium EDTA dihydrate \(372\.24 g\/mol\)/, code: 'ambiguous_reagent' },
  { text: 'L-histidine monohydrochloride', names: /L-histidine monohydrochloride monohydrate \(209\.6\d g\/mol\)/, code: 'ambiguous_reagent' },
  { text: 'trehalose', names: /trehalose dihydrate \(378\.3\d g\/mol\), trehalose anhydrous/, code: 'ambiguous_reagent' },
  { text: 'glutamate', names: /L-glutamic acid .*monosodium L-glutamate monohydrate/, code: 'ambiguous_reagent' },
  // capitalised misspellings: names suggested, not "not a chemical formula"
  { text: 'Trsi', names: /closest catalogue names: Tris\b/, code: 'unknown_reagent' },
  { text: 'Glycin', names: /closest catalogue names: glycine\b/, code: 'unknown_reagent' },
  { text: 'Phosphate', names: /phosphate is an acid system, sold as phosphoric acid, sodium dihydrogen phosphate/, code: 'unknown_reagent' },
  // a bare percentage: w/w or w/v? 10% w/w and 10% w/v NaOH differ by the density (about 11 %)
  { text: '10% NaOH', names: /stock of sodium hydroxide with its basis: 10% w\/v NaOH .*liquids as sold: sodium hydroxide 50%/, code: 'bad_argument' },
  // look-alike and invisible characters: named, located, and what the text would read as
  { text: '\u0422ris base', names: /character 1 is U\+0422 CYRILLIC CAPITAL LETTER TE, which looks like Latin T .*would read as Tris/, code: 'bad_character' },
  { text: 'ＮａＣｌ', names: /character 1 is U\+FF2E FULLWIDTH N, a full-width form of N .*would read as sodium chloride/, code: 'bad_character' },
  { text: 'NaCl\u200f', names: /character 5 is U\+200F RIGHT-TO-LEFT MARK, an invisible character .*would read as sodium chloride/, code: 'bad_character' },
  { text: '\u202eNaCl', names: /character 1 is U\+202E RIGHT-TO-LEFT OVERRIDE/, code: 'bad_character' },
  { text: 'Na\u200bCl', names: /character 3 is U\+200B ZERO WIDTH SPACE/, code: 'bad_character' },
  { text: '1 M Н\u0421l', names: /character 5 is U\+041D CYRILLIC CAPITAL LETTER EN, which looks like Latin H .*would read as hydrogen chloride/, code: 'bad_character' },
];

function failure(run: () => unknown): ProticError {
  try {
    run();
  } catch (error) {
    if (error instanceof ProticError) return error;
    throw error;
  }
  throw new Error('expected a refusal');
}

describe('spellings as batch records write them', () => {
  test.each(ACCEPTED.map((a) => [a.text, a] as const))('%s is accepted as the reagent it names', (_, a) => {
    const spec = parseReagentSpec(a.text, 'reagents', 1);
    expect(spec.resolved.reagent.id).toBe(a.id);
    if (a.stockM === undefined) expect(spec.stockM).toBeUndefined();
    else expect(spec.stockM!).toBeCloseTo(a.stockM, 9);
  });

  test.each(REFUSED.map((r) => [r.text, r] as const))('%s is refused with a message that names what it means', (_, r) => {
    const error = failure(() => parseReagentSpec(r.text, 'reagents', 1));
    if (r.code) expect(error.failure.code).toBe(r.code);
    expect(error.message).toMatch(r.names);
  });

  test('by volume, the pure compound points to the liquid as sold', () => {
    expect(failure(() => impl.ph([['phosphoric acid']], [[1]], 'mL', 1)).message)
      .toMatch(/phosphoric acid, the pure compound; by volume write the liquid as sold \(phosphoric acid 85%\)/);
    expect(failure(() => impl.ph([['hydrochloric acid']], [[1]], 'mL', 1)).message)
      .toMatch(/hydrogen chloride, the pure compound; by volume write the liquid as sold \(hydrochloric acid 37%\)/);
    // and the liquids as sold, by volume, are accepted
    expect(impl.ph([['phosphoric acid 85%']], [[1]], 'mL', 1)).toBeLessThan(2.5);
  });

  test('Na2HPO4 heptahydrate is the phosphate heptahydrate, never magnesium sulfate heptahydrate', () => {
    const spec = parseReagentSpec('Na2HPO4 heptahydrate', 'reagents', 1);
    expect(spec.resolved.reagent.name).toBe('disodium hydrogen phosphate heptahydrate');
    expect(failure(() => parseReagentSpec('Na2HPO4 heptahydrat', 'reagents', 1)).message).not.toMatch(/magnesium/);
  });

  // units column, as typed
  test.each([
    ['g/L', 'massConcentration', 1], ['% w/v', 'massConcentration', 10], ['mg/mL', 'massConcentration', 1], ['mg/L', 'massConcentration', 1e-3],
    ['µg/mL', 'massConcentration', 1e-3], ['ug/ml', 'massConcentration', 1e-3], ['mmol/l', 'concentration', 1e-3], ['mol/l', 'concentration', 1],
    ['mol/L', 'concentration', 1], ['nM', 'concentration', 1e-9], ['nmol', 'amount', 1e-9], ['N', 'normality', 1], ['ml', 'volume', 1e-3],
  ])('unit %s is accepted', (text, kind, toBase) => {
    const unit = parseUnit(text, 'units', 1);
    expect(unit.kind).toBe(kind);
    expect(unit.toBase).toBeCloseTo(toBase as number, 15);
  });

  test.each([
    ['Mg', /mg \(prefixes keep their SI case; M is the SI prefix mega\)/],
    ['MG', /mg \(prefixes keep their SI case; M is the SI prefix mega\)/],
    ['Mmol', /mmol \(prefixes keep their SI case; M is the SI prefix mega\)/],
    ['ML', /mL \(prefixes keep their SI case; M is the SI prefix mega\)/],
  ])('unit %s is refused with the unit meant', (text, pattern) => {
    const error = failure(() => parseUnit(text, 'units', 1));
    expect(error.failure.code).toBe('bad_unit');
    expect(error.message).toMatch(pattern);
  });

  test('model BG is bates-guggenheim', () => {
    expect(parseModel('BG')).toBe('bates-guggenheim');
    expect(parseModel('bg')).toBe('bates-guggenheim');
  });

});

describe('hostile reagent texts', () => {
  // Random joins of the pieces the spelling rules read: each either resolves or is a coded refusal, never an internal error.
  test('1,000 random texts made of spelling pieces', () => {
    const pieces = ['Na', 'Cl', '2', '·', 'H2O', ' ', ',', '(', ')', 'M', '%', 'w/v', 'pellets', 'conc.', 'sodium', 'x', '7', '.', 'N', 'µ', 'hydrate', 'hepta', 'Tris', '-', '\u0422', 'ACS', 'mol/l', 'water'];
    let seed = 20261201;
    const next = (): number => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648; };
    for (let i = 0; i < 1000; i++) {
      let text = '';
      const n = 1 + Math.floor(next() * 10);
      for (let k = 0; k < n; k++) text += pieces[Math.floor(next() * pieces.length)];
      try {
        parseReagentSpec(text, 'reagents', 1);
      } catch (error) {
        expect(error).toBeInstanceOf(ProticError);
      }
    }
  });

  test('a text longer than any name is refused before any pattern runs on it', () => {
    const error = failure(() => parseReagentSpec(`NaCl ${' '.repeat(20000)}5 M`, 'reagents', 1));
    expect(error.message).toMatch(/a reagent of at most 200 characters/);
  });
});

describe('spelling rules never change what a text names', () => {
  test('a hydrate the catalogue does not list is the named reagent with the water written', () => {
    const spec = parseReagentSpec('sucrose·H2O', 'reagents', 1);
    expect(spec.resolved.reagent.id).toBe('sucrose');
    expect(spec.resolved.molarMassGPerMol).toBeCloseTo(342.2965 + 18.015, 2); // CIAAW 2021 atomic weights
    expect(parseReagentSpec('sodium acetate·3H2O', 'reagents', 1).resolved.reagent.id).toBe('naoac-3');
    expect(failure(() => parseReagentSpec('sodium acetate trihydrate·2H2O', 'reagents', 1)).message).toMatch(/already says its water/);
  });
  test('"concentrated" only for the grades the trade calls so', () => {
    expect(parseReagentSpec('conc. H2SO4', 'reagents', 1).resolved.reagent.id).toBe('h2so4-96');
    expect(parseReagentSpec('conc. H3PO4', 'reagents', 1).resolved.reagent.id).toBe('h3po4-85');
    expect(failure(() => parseReagentSpec('conc. NaOH', 'reagents', 1)).message).toMatch(/the catalogue has no concentrated sodium hydroxide/);
  });
  test('a parenthesis that names another reagent is refused', () => {
    expect(failure(() => parseReagentSpec('sodium chloride (KCl)', 'reagents', 1)).message).toMatch(/sodium chloride and potassium chloride differ/);
    expect(parseReagentSpec('sodium acetate (trihydrate)', 'reagents', 1).resolved.reagent.id).toBe('naoac-3');
  });
});

describe('isomers stay apart', () => {
  test('trehalose anhydrous·2H2O is trehalose dihydrate; sucrose·2H2O is not', () => {
    expect(parseReagentSpec('trehalose anhydrous·2H2O', 'reagents', 1).resolved.reagent.id).toBe('trehalose-2');
    expect(parseReagentSpec('sucrose·2H2O', 'reagents', 1).resolved.reagent.id).toBe('sucrose');
  });
});
