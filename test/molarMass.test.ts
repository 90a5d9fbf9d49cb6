import { REAGENTS } from '../src/catalogue';
import { ProticError, molarMassGPerMol, molarMassOfReagent, parseFormula, resolveReagent } from '../src/engine';
import { expectMissWithin } from './helpers';

describe('molar masses against handbook values, within 0.01 g/mol', () => {
  // Finding: the recalled handbook value for Na2SO4·10H2O (322.20) is 0.014 above the 2021 atomic
  // weights; kept as a known miss until checked against the handbook.
  const KNOWN_MISSES = ['na2so4-10'];
  // A mixture of molecules (polysorbates) has a nominal molar mass, stated to the gram: checked to 1 g/mol.
  const nominal = REAGENTS.filter((r) => r.excipient?.nominalMolarMass);
  const withHandbook = REAGENTS.filter((r) => r.handbookMolarMass && !KNOWN_MISSES.includes(r.id) && !r.excipient?.nominalMolarMass);
  test.each(nominal.map((r) => [r.name, r.handbookMolarMass!.gPerMol, r] as const))('nominal %s: %d g/mol within 1 g/mol', (_, ref, r) => {
    expect(Math.abs(molarMassOfReagent(r) - ref)).toBeLessThan(1);
  });
  const misses = REAGENTS.filter((r) => KNOWN_MISSES.includes(r.id));
  // measured miss (formula − recalled handbook value), g/mol, and its margin
  const MEASURED: Record<string, [number, number]> = { 'na2so4-10': [-0.0145, 0.002] };
  test.each(misses.map((r) => [r.name, r.handbookMolarMass!.gPerMol, ...MEASURED[r.id], r] as const))('known miss: %s: %d g/mol, measured miss %d ± %d', (_, ref, measured, margin, r) => {
    expectMissWithin(molarMassOfReagent(r) - ref, measured, margin);
  });
  test('every known miss has its measured size, outside the 0.01 bound', () => {
    expect(Object.keys(MEASURED).sort()).toEqual([...KNOWN_MISSES].sort());
    for (const [measured, margin] of Object.values(MEASURED)) expect(Math.abs(measured) - margin).toBeGreaterThan(0.01);
  });
  test('at least 15 reagents carry a handbook value', () => expect(withHandbook.length).toBeGreaterThanOrEqual(15));
  test('every solid reagent carries one; a liquid as sold shares its formula with a checked solid, or carries its own', () => {
    for (const r of REAGENTS) {
      if (r.liquid) expect(r.handbookMolarMass !== undefined || REAGENTS.some((x) => !x.liquid && x.formula === r.formula && x.handbookMolarMass)).toBe(true);
      else expect(r.handbookMolarMass).toBeDefined();
    }
  });
  test.each(withHandbook.map((r) => [r.name, r.handbookMolarMass!.gPerMol, r.handbookMolarMass!.source, r] as const))('%s: %d g/mol (%s)', (_, ref, __, r) => {
    expect(Math.abs(molarMassOfReagent(r) - ref)).toBeLessThan(0.01);
  });
});

describe('formula parser', () => {
  test.each([
    ['Na2HPO4·7H2O', 268.07, 'CRC Handbook (from memory)'],
    ['Na2HPO4.7H2O', 268.07, 'same compound, dot written as a full stop'],
    ['Na2HPO4*7H2O', 268.07, 'same compound, dot written as an asterisk'],
    ['(NH4)2SO4', 132.14, 'CRC Handbook (from memory)'],
    ['CaCl2·2H2O', 147.01, 'CRC Handbook (from memory)'],
    ['K4[Fe(CN)6]·3H2O', 422.39, 'CRC Handbook (from memory)'],
  ])('%s = %d', (formula, ref) => {
    expect(Math.abs(molarMassGPerMol(formula) - ref)).toBeLessThan(0.01);
  });

  test('hydrate water is counted apart from the anhydrous part', () => {
    const p = parseFormula('Na2HPO4·12H2O');
    expect(p.hydrateWater).toBe(12);
    expect(p.anhydrous).toEqual({ Na: 2, H: 1, P: 1, O: 4 });
  });

  test('a hydrate not in the catalogue resolves by formula with its own molar mass', () => {
    const r = resolveReagent('Na2HPO4·12H2O', 'reagents');
    expect(r.reagent.id).toBe('na2hpo4-12');
    const odd = resolveReagent('NaH2PO4·3H2O', 'reagents');
    expect(odd.reagent.systems[0].systemId).toBe('phosphate');
    expect(Math.abs(odd.molarMassGPerMol - (119.977 + 3 * 18.015))).toBeLessThan(0.01);
  });

  test.each([
    ['Na2HPO4)', 8],
    ['Xx2O', 1],
    ['(NaCl', 6],
    ['H2O··', 5],
    ['', 1],
  ])('bad formula %p fails at character %d', (formula, position) => {
    try {
      parseFormula(formula);
      throw new Error('expected a failure');
    } catch (error) {
      expect(error).toBeInstanceOf(ProticError);
      const f = (error as ProticError).failure;
      expect(f.code).toBe('bad_formula');
      if (f.code === 'bad_formula') expect(f.position).toBe(position);
    }
  });
});
