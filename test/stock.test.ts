import { evaluateSheet } from '../scripts/lib/sheetEngine';
import type { SheetValue } from '../scripts/lib/sheetEngine';
import { decodeHandle, encodeHandle } from '../src/engine';
import { ionicStrength, molarMass, ph, species, titrant, warnings } from '../src/functions/impl';
import { stock } from '../src/functions/stock';

// STOCK handles and pH-adjusted stocks, through the real spreadsheet engine where a user would type them.

// A 10× phosphate-buffered saline of our own (invented amounts, g per litre of concentrate).
const PBS10 = { reagents: [['NaCl'], ['KCl'], ['Na2HPO4'], ['KH2PO4']], grams: [[80], [2], [14.2], [2.4]] };
const MODELS = ['davies', 'bates-guggenheim', 'ideal'] as const;

function errorText(v: SheetValue): string {
  return typeof v === 'object' && v !== null && 'message' in v ? `${v.error} ${v.message}` : String(v);
}

describe('STOCK: a made solution in one cell', () => {
  const concentrate = stock(PBS10.reagents, PBS10.grams, 'g', 1, '10× PBS');

  test('the cell reads at a glance: name, what went in, to what volume', () => {
    expect(concentrate.startsWith('10× PBS: NaCl 80 g, KCl 2 g, Na2HPO4 14.2 g, KH2PO4 2.4 g, to 1 L ⟦stock v1 ')).toBe(true);
  });

  test.each(MODELS)('dilution identity under %s: 100 mL of 10× made up to 1 L is the 1× weigh-out (PHMIX, SPECIES, IONICSTRENGTH)', (model) => {
    const oneX = PBS10.grams.map(([g]) => [g / 10]);
    const diluted = [[[concentrate]], [[100]], 'mL', 1, 25, model] as const;
    const direct = [PBS10.reagents, oneX, 'g', 1, 25, model] as const;
    expect(Math.abs(ph(...diluted) - ph(...direct))).toBeLessThan(1e-9);
    expect(Math.abs(ionicStrength(...diluted) - ionicStrength(...direct)) / ionicStrength(...direct)).toBeLessThan(1e-9);
    // the same species with the same numbers (strong ions may be listed in another order)
    const a = species(...diluted), b = new Map(species(...direct).map((row) => [row[0], row] as const));
    expect(a.length).toBe(b.size);
    for (const row of a) row.forEach((cell, j) => {
      if (typeof cell === 'number') expect(Math.abs(cell - (b.get(row[0])![j] as number))).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(cell)));
    });
  });

  test('mixing identity: two halves of one buffer mixed give that buffer; A and B 1:1 equal the combined weigh-out', () => {
    const half = stock([['KH2PO4'], ['Na2HPO4']], [[1.7], [1.775]], 'g', 0.5, 'half');
    const whole = ph([['KH2PO4'], ['Na2HPO4']], [[3.4], [3.55]], 'g', 1);
    expect(Math.abs(ph([[half], [half]], [[500], [500]], 'mL') - whole)).toBeLessThan(1e-9);
    const a = stock([['Tris'], ['NaCl']], [[12.114], [5.844]], 'g', 1, 'A');
    const b = stock([['HCl'], ['KCl']], [[0.05], [0.02]], 'mol', 1, 'B');
    const mixed = ph([[a], [b]], [[250], [250]], 'mL');
    const direct = ph([['Tris'], ['NaCl'], ['HCl'], ['KCl']], [[12.114 / 4], [5.844 / 4], [0.05 / 4], [0.02 / 4]], [['g'], ['g'], ['mol'], ['mol']], 0.5);
    expect(Math.abs(mixed - direct)).toBeLessThan(1e-9);
  });

  test('handles nest: a solution made from solutions, 20 levels deep, keeps its composition exactly', () => {
    let handle = concentrate;
    for (let level = 0; level < 20; level++) handle = stock([[handle]], [[1]], 'L', 1, `level ${level}`);
    expect(handle.length).toBeLessThan(400);
    expect(decodeHandle(handle).systemsMPerL.get('phosphate')).toBe(decodeHandle(concentrate).systemsMPerL.get('phosphate'));
    expect(ph([[handle]], [[100]], 'mL', 1)).toBe(ph([[concentrate]], [[100]], 'mL', 1));
  });

  test('round trip: the exact part carries full precision', () => {
    const c = decodeHandle(concentrate);
    const again = encodeHandle(c);
    expect(again).toBe(concentrate);
    // independent arithmetic: sodium from NaCl and Na2HPO4 at their molar masses, per litre
    expect(Math.abs(c.ionsMPerL.get('Na+')! - (80 / molarMass('NaCl') + (2 * 14.2) / molarMass('Na2HPO4')))).toBeLessThan(1e-15);
  });

  test('a handle edited by hand, cut short or from a newer version is refused, never half-read', () => {
    const amount = [[100]];
    // every single-character edit and every truncation
    for (let i = 0; i < concentrate.length; i += 7) {
      const edited = concentrate.slice(0, i) + (concentrate[i] === '1' ? '2' : '1') + concentrate.slice(i + 1);
      expect(() => ph([[edited]], amount, 'mL', 1)).toThrow(/exactly as PROTIC\.STOCK wrote it|newer version|not readable/);
    }
    for (let n = 12; n < concentrate.length; n += 5) {
      expect(() => ph([[concentrate.slice(0, n)]], amount, 'mL', 1)).toThrow(/exactly as PROTIC\.STOCK wrote it/);
    }
    const body = concentrate.slice(0, concentrate.lastIndexOf(' #')).replace('stock v1 ', 'stock v2 ');
    expect(() => ph([[`${body} #00000000⟧`]], amount, 'mL', 1)).toThrow(/newer version of Protic/);
  });

  test('a made solution is dispensed by volume only', () => {
    expect(() => ph([[concentrate]], [[5]], 'g', 1)).toThrow(/volume .* for a stock/);
    expect(() => ph([[concentrate]], [[0.1]], 'mol', 1)).toThrow(/a volume \(L mL µL\) of 10× PBS/);
    expect(() => titrant(8, [['Tris']], [[1.2]], 'g', 1, concentrate, null, null, 'g')).toThrow(/unit not allowed here/);
  });

  test('in the spreadsheet engine: a STOCK cell used as a reagent, and a cut-short copy refused with a message', () => {
    const v = evaluateSheet([
      ['NaCl', 80, 'g'], ['KCl', 2, 'g'], ['Na2HPO4', 14.2, 'g'], ['KH2PO4', 2.4, 'g'],
      ['=PROTIC.STOCK(A1:A4,B1:B4,C1:C4,1,"10× PBS")'],
      ['=PROTIC.PHMIX(A5,100,"mL",1)', '=PROTIC.PHMIX(LEFT(A5,40),100,"mL",1)'],
    ]);
    expect(v[4][0]).toBe(concentrate);
    expect(Math.abs((v[5][0] as number) - ph(PBS10.reagents, PBS10.grams.map(([g]) => [g / 10]), 'g', 1))).toBeLessThan(1e-9);
    expect(errorText(v[5][1])).toMatch(/^#VALUE! .*whose exact part is missing/);
  });
});

describe('stocks with a pH, as the trade writes them', () => {
  test.each([
    ['1 M Tris-HCl pH 8.0', 25, 8.0],
    ['1 M Tris pH 7.4 with HCl', 25, 7.4],
    ['1 M Tris-HCl pH 8.0 at 4 °C', 4, 8.0],
    ['0.5 M Na2EDTA·2H2O pH 8.0 with NaOH', 25, 8.0],
    ['1 M HEPES-NaOH pH 7.5', 25, 7.5],
    ['0.2 M sodium acetate trihydrate pH 5.2', 25, 5.2],
  ])('%s, undiluted at its own conditions, reads its stated pH within 1e-6', (text, t, target) => {
    expect(Math.abs(ph([[text]], [[1]], 'L', undefined, t) - target)).toBeLessThan(1e-6);
    // adjusted under another model, read under that model
    for (const model of MODELS) expect(Math.abs(ph([[`${text} under ${model}`]], [[1]], 'L', undefined, t, model) - target)).toBeLessThan(1e-6);
  });

  test('its HCl content is what TITRANT gives for the same stock (HCl made up to volume, at 25 and 4 °C)', () => {
    for (const t of [25, 4]) {
      const label = t === 25 ? '1 M Tris-HCl pH 8.0' : '1 M Tris-HCl pH 8.0 at 4 °C';
      const made = decodeHandle(stock(label, 1, 'L', 1));
      const hclMol = titrant(8.0, [['Tris']], [[1]], 'mol', 1, 'HCl', t, null, 'mol');
      expect(Math.abs(made.ionsMPerL.get('Cl-')! - hclMol) / hclMol).toBeLessThan(1e-6);
      expect(made.systemsMPerL.get('tris')).toBe(1);
    }
  });

  test('diluted 1:20 it is the weigh-out of what the stock holds, at a pH of its own', () => {
    const made = decodeHandle(stock('1 M Tris-HCl pH 8.0', 1, 'L', 1));
    const diluted = ph([['1 M Tris-HCl pH 8.0']], [[50]], 'mL', 1);
    const direct = ph([['Tris'], ['HCl']], [[0.05], [made.ionsMPerL.get('Cl-')! * 0.05]], 'mol', 1);
    expect(Math.abs(diluted - direct)).toBeLessThan(1e-9);
    expect(Math.abs(diluted - 8.0)).toBeGreaterThan(0.01);
  });

  test('`Tris HCl` with a space (the salt\'s name) brought to a pH is read as the salt with NaOH, and WARNINGS names the other reading', () => {
    // the two readings hold other counter-ions (Cl⁻ 1 against 0.6 mol/L), which moves a diluted mixture's pH by about 0.04
    const warned = warnings([['1 M Tris HCl pH 8.0'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1);
    // the suggestion keeps the pH's digits as written (pH 8 would widen UNCERTAINTY's stated-pH limit tenfold)
    expect(warned).toContain('the stock 1 M Tris hydrochloride pH 8 is read as Tris hydrochloride brought to pH 8.0 with sodium hydroxide (write … with sodium hydroxide to keep this reading); if it is Tris brought to pH 8.0 with HCl, write 1 M Tris-HCl pH 8.0 (or 1 M Tris pH 8.0 with HCl)');
    // where the other reading cannot be made (Tris base alone reads about 11.05, so HCl cannot bring it to 11.5), no warning
    expect(warnings([['1 M Tris HCl pH 11.5'], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1)).not.toContain('is read as');
    for (const text of ['1 M Tris-HCl pH 8.0', '1 M Tris hydrochloride pH 8.0', '1 M Tris HCl pH 8.0 with NaOH']) {
      expect([text, warnings([[text], ['NaCl']], [[50], [8.77]], [['mL'], ['g']], 1)]).not.toEqual([text, expect.stringContaining('is read as')]);
    }
  });

  test('a neutral salt is no titrant: the stock is refused, naming it, rather than made with 16.6 mol/L of NaCl', () => {
    const v = evaluateSheet([['=PROTIC.PHMIX("1 M Tris pH 11.2 with NaCl",1,"L")', '=PROTIC.PHMIX("1 M Tris pH 7.5 with KCl",1,"L")', '=PROTIC.PHMIX("1 M sodium acetate pH 5.0 with acetic acid",1,"L")']]);
    expect(errorText(v[0][0])).toMatch(/^#VALUE! .*a titrant that brings acid or base.*sodium chloride brings neither/);
    expect(errorText(v[0][1])).toMatch(/^#VALUE! .*potassium chloride brings neither/);
    expect(Math.abs((v[0][2] as number) - 5.0)).toBeLessThan(1e-6); // a weak acid is a titrant
  });

  test('a target the titrant cannot reach is #N/A, and an unknown reagent names itself', () => {
    const v = evaluateSheet([['=PROTIC.PHMIX("1 M Tris pH 3 with NaOH",1,"L")', '=PROTIC.PHMIX("1 M Trsi pH 8.0",1,"L")']]);
    expect(errorText(v[0][0])).toMatch(/^#N\/A /);
    expect(errorText(v[0][1])).toMatch(/^#VALUE! .*Trsi/);
  });
});

describe('the README example', () => {
  test('STOCK of a 10× phosphate and its 1:10 dilution print what the README says', () => {
    const readme = require('fs').readFileSync('README.md', 'utf8').replace(/\s*\n\s*/g, ' ');
    const v = evaluateSheet([['KH2PO4', 34, 'g'], ['Na2HPO4', 35.5, 'g'], ['=PROTIC.STOCK(A1:A2,B1:B2,C1:C2,1,"10× phosphate")'], ['=PROTIC.PHMIX(A3,100,"mL",1)']]);
    const visible = (v[2][0] as string).slice(0, (v[2][0] as string).indexOf('⟦stock v1 ') + 10);
    expect(readme).toContain(`\`=PROTIC.STOCK(A1:A2,B1:B2,C1:C2,1,"10× phosphate")\` → \`${visible}…⟧\``);
    expect(readme).toContain('`=PROTIC.PHMIX(A3,100,"mL",1)`, gives the pH of the 1× weigh-out, 6.8758');
    expect(Math.abs((v[3][0] as number) - 6.8758)).toBeLessThan(5e-5);
  });
});

describe('what is in the bottle is fixed by its label', () => {
  test('a later cell\'s model does not change a pH stock\'s composition; the label may name the model it was adjusted under', () => {
    const davies = decodeHandle(stock('1 M Tris-HCl pH 8.0', 1, 'L', 1));
    const again = decodeHandle(stock('1 M Tris-HCl pH 8.0 under davies', 1, 'L', 1));
    const ideal = decodeHandle(stock('1 M Tris-HCl pH 8.0 under ideal', 1, 'L', 1));
    expect(again.ionsMPerL.get('Cl-')).toBe(davies.ionsMPerL.get('Cl-'));
    expect(Math.abs(ideal.ionsMPerL.get('Cl-')! - davies.ionsMPerL.get('Cl-')!)).toBeGreaterThan(1e-3);
    // read under bates-guggenheim, the Davies-adjusted stock is no longer exactly at 8.0: the model is the reader's
    expect(Math.abs(ph([['1 M Tris-HCl pH 8.0']], [[1]], 'L', undefined, 25, 'bates-guggenheim') - 8)).toBeGreaterThan(1e-4);
    expect(() => ph([['1 M Tris-HCl pH 8.0 under pitzer']], [[1]], 'L')).toThrow(/unknown activity model/);
  });
});

describe('a stock made outside the model says so wherever it is used', () => {
  test('1 M Tris-HCl pH 8.0 (I ≈ 0.6 mol/kg) carries its warning into WARNINGS of a dilution, and through a STOCK of it', () => {
    const direct = warnings([['1 M Tris-HCl pH 8.0']], [[50]], 'mL', 1);
    // the stock's own Davies pH departs from its sit pH by more than 0.02 (the departure warning, issue 12)
    expect(direct).toMatch(/^the stock 1 M Tris pH 8 itself, as adjusted at 25 °C: the Davies pH departs from the SIT model's \(8\.0\d+\) by 0\.0\d+ at ionic strength 0\.6\d+ mol\/L/);
    const handle = stock('1 M Tris-HCl pH 8.0', 1, 'L', 1, 'Tris stock');
    expect(warnings([[handle]], [[50]], 'mL', 1)).toBe(direct);
    // a dilute pH stock inside the model's range carries nothing
    expect(warnings([['0.05 M Tris-HCl pH 8.0']], [[100]], 'mL', 1)).toBe('none');
  });
});
