import fc from 'fast-check';
import { strongIonById } from '../src/catalogue';
import {
  buildContents, debyeHuckelA, pKaAt, pKw, prepareProblem, recipeForTarget, parseReagentSpec, solve, speciesRows, systemFor, titrantForTarget,
  withTitrant,
} from '../src/engine';
import type { ActivityModel, Contents, Equilibrium } from '../src/engine';
import { fractions } from '../src/functions/impl';

/**
 * The balances at a claimed solution, evaluated from the definitions and nothing of chargeBalance.ts, problem.ts
 * or activity.ts: the catalogue pKa at the temperature, Kw, the water density and A, the activity pH and ionic
 * strength the solve returned, activity coefficients written out here (Davies 1962; Bates–Guggenheim, åB = 1.5),
 * each form from Ka = a(H⁺) a(base)/a(acid) on the molal scale, then c = m w (w kg of water per L, an input).
 */
function independentBalances(eq: Equilibrium, contents: Contents, temperatureC: number, model: ActivityModel):
  { chargeRelative: number; ionicRelative: number; species: Map<string, number> } {
  // the mol/L → mol/kg factor is an input, as the solver's: the density module's kg of water per litre
  const rho = eq.problem.density.waterKgPerL, A = debyeHuckelA(temperatureC);
  const I = eq.ionicStrengthM / rho, s = Math.sqrt(I);
  const F = model === 'ideal' ? 0 : model === 'davies' ? s / (1 + s) - 0.3 * I : s / (1 + 1.5 * s);
  const log10Gamma = (z: number): number => -A * z * z * F;
  const log10aH = -eq.pH;
  const species = new Map<string, number>();
  let charge = 0, scale = 0, z2 = 0;
  const add = (label: string, z: number, cM: number): void => {
    species.set(label, (species.get(label) ?? 0) + cM);
    charge += z * cM; scale += Math.abs(z) * cM; z2 += z * z * cM;
  };
  add('H⁺', 1, 10 ** (log10aH - log10Gamma(1)) * rho);
  add('OH⁻', -1, 10 ** (-pKw(temperatureC) - log10aH - log10Gamma(-1)) * rho);
  for (const [id, moles] of contents.ionMoles) add(id, strongIonById(id)!.charge, moles / contents.volumeL);
  for (const [id, moles] of contents.systemMoles) {
    const sys = systemFor(id);
    const totalM = moles / contents.volumeL;
    // log10 of m_j / m_0: each step multiplies by Ka γ(acid) / (a(H⁺) γ(base))
    const logW = [0];
    sys.steps.forEach((step, k) => {
      const zAcid = sys.chargeMostProtonated - k;
      logW.push(logW[k] - pKaAt(step, temperatureC) + log10Gamma(zAcid) - log10aH - log10Gamma(zAcid - 1));
    });
    const top = Math.max(...logW);
    const w = logW.map((x) => 10 ** (x - top));
    const sum = w.reduce((a, b) => a + b, 0);
    w.forEach((wj, j) => add(`${id} ${j}`, sys.chargeMostProtonated - j, (wj / sum) * totalM));
  }
  return { chargeRelative: Math.abs(charge) / scale, ionicRelative: Math.abs(z2 / 2 - eq.ionicStrengthM) / (z2 / 2), species };
}

const BUFFERS = ['KH2PO4', 'Na2HPO4', 'citric acid', 'trisodium citrate dihydrate', 'sodium acetate', 'acetic acid', 'Tris', 'Tris hydrochloride', 'HEPES', 'NaHCO3', 'boric acid', 'glycine', 'disodium EDTA dihydrate', 'imidazole', 'MES'];
const MODELS: ActivityModel[] = ['ideal', 'davies', 'bates-guggenheim'];

const mixture = fc.record({
  rows: fc.array(fc.record({ reagent: fc.constantFrom(...BUFFERS), log10C: fc.double({ min: -10, max: Math.log10(0.3), noNaN: true }) }), { minLength: 1, maxLength: 4 }),
  salt: fc.double({ min: 0, max: 0.3, noNaN: true }),
  model: fc.constantFrom(...MODELS),
  temperatureC: fc.integer({ min: 5, max: 45 }),
});

function contentsOf(m: { rows: { reagent: string; log10C: number }[]; salt: number }): Contents {
  const rows = m.rows.map((r, i) => ({ reagent: r.reagent, amount: 10 ** r.log10C, unit: 'M', row: i + 1 }));
  rows.push({ reagent: 'NaCl', amount: m.salt, unit: 'M', row: rows.length + 1 });
  return buildContents(rows, undefined);
}

describe('invariants at every solution', () => {
  test('mass and charge balances hold to 1e-9 relative, evaluated independently of the solver\'s own balance', () => {
    fc.assert(fc.property(mixture, (m) => {
      const contents = contentsOf(m);
      const eq = solve(prepareProblem(contents, m.temperatureC, m.model));
      expect(Number.isFinite(eq.pH)).toBe(true);
      expect(eq.residualRelative).toBeLessThan(1e-10);
      const check = independentBalances(eq, contents, m.temperatureC, m.model);
      expect(check.chargeRelative).toBeLessThan(1e-9);
      expect(check.ionicRelative).toBeLessThan(1e-9);
      // SPECIES's concentrations are the independent ones, so each system's forms sum to its total (mass balance)
      const rows = speciesRows(eq);
      eq.problem.systems.forEach((s, i) => {
        const forms = rows.filter((r) => r.systemId === s.system.id);
        forms.forEach((r, j) => {
          const expected = check.species.get(`${s.system.id} ${j}`)!;
          expect(Math.abs(r.concentrationM - expected)).toBeLessThanOrEqual(1e-9 * eq.problem.totalsM[i]);
        });
        const sum = forms.reduce((acc, r) => acc + r.concentrationM, 0);
        expect(Math.abs(sum - (contents.systemMoles.get(s.system.id)! / contents.volumeL)) / eq.problem.totalsM[i]).toBeLessThan(1e-10);
      });
    }), { numRuns: 300, seed: 7 });
  });

  test('the joint Newton and the bracketed fallback agree on the pH to 1e-9', () => {
    fc.assert(fc.property(mixture, (m) => {
      const contents = contentsOf(m);
      const joint = solve(prepareProblem(contents, m.temperatureC, m.model));
      const bracketed = solve(prepareProblem(contents, m.temperatureC, m.model), undefined, 'bracketed');
      expect(Math.abs(joint.pH - bracketed.pH)).toBeLessThan(1e-9);
      expect(Math.abs(joint.ionicStrengthM - bracketed.ionicStrengthM) / bracketed.ionicStrengthM).toBeLessThan(1e-9);
    }), { numRuns: 300, seed: 12 });
  });

  test('fractions sum to 1 across the pH scale', () => {
    fc.assert(fc.property(fc.constantFrom('phosphate', 'citrate', 'EDTA', 'Tris', 'carbonate', 'histidine'), fc.double({ min: -1, max: 15, noNaN: true }), fc.double({ min: 0, max: 0.5, noNaN: true }), (system, pH, ionic) => {
      const row = fractions(system, pH, 25, ionic)[0];
      expect(Math.abs(row.reduce((a, b) => a + b, 0) - 1)).toBeLessThan(1e-12);
      for (const f of row) expect(f).toBeGreaterThanOrEqual(0);
    }), { numRuns: 300, seed: 8 });
  });

  test('adding strong base never lowers pH', () => {
    fc.assert(fc.property(mixture, fc.double({ min: 1e-6, max: 0.05, noNaN: true }), (m, step) => {
      const contents = contentsOf(m);
      const spec = parseReagentSpec('NaOH', 'titrant');
      const before = withTitrant(contents, spec, 0, m.temperatureC, m.model).pH;
      const after = withTitrant(contents, spec, step, m.temperatureC, m.model).pH;
      expect(after).toBeGreaterThanOrEqual(before - 1e-9);
    }), { numRuns: 200, seed: 9 });
  });

  test('a titrant amount fed back gives the target pH within 1e-6', () => {
    fc.assert(fc.property(mixture, fc.double({ min: 0.05, max: 2, noNaN: true }), fc.constantFrom('1 M NaOH', '0.5 M HCl', 'NaOH', '2 M KOH'), (m, shift, titrant) => {
      const contents = contentsOf(m);
      const spec = parseReagentSpec(titrant, 'titrant');
      const start = withTitrant(contents, spec, 0, m.temperatureC, m.model).pH;
      const up = titrant.includes('OH');
      const target = start + (up ? shift : -shift);
      if (target > 12.5 || target < 1.5) return;
      const result = titrantForTarget(target, contents, spec, m.temperatureC, m.model);
      const check = withTitrant(contents, spec, result.moles, m.temperatureC, m.model).pH;
      expect(Math.abs(check - target)).toBeLessThan(1e-6);
    }), { numRuns: 150, seed: 10 });
  });

  test('a recipe fed back gives its target within 1e-6', () => {
    const pairs: [string, string, number, number][] = [
      ['NaH2PO4·H2O', 'Na2HPO4·7H2O', 6.0, 8.0], ['citric acid monohydrate', 'trisodium citrate dihydrate', 3.2, 6.0],
      ['acetic acid', 'sodium acetate trihydrate', 3.9, 5.5], ['Tris hydrochloride', 'Tris', 7.2, 8.8], ['HEPES', 'HEPES sodium salt', 6.8, 8.2],
      // liquids as sold, measured by volume: the recipe's mL and the mixture's mL must use the same density and assay
      ['phosphoric acid 85%', 'sodium dihydrogen phosphate', 2.5, 3.0], ['glacial acetic acid', 'sodium acetate', 3.9, 5.5],
    ];
    fc.assert(fc.property(fc.constantFrom(...pairs), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0.005, max: 0.2, noNaN: true }), fc.double({ min: 0, max: 0.2, noNaN: true }), fc.constantFrom(...MODELS), (pair, where, conc, salt, model) => {
      const [acidName, baseName, lo, hi] = pair;
      const target = lo + where * (hi - lo);
      const others = buildContents([{ reagent: 'NaCl', amount: salt, unit: 'M', row: 1 }], 0.5);
      const lines = recipeForTarget(parseReagentSpec(acidName, 'acidForm'), parseReagentSpec(baseName, 'baseForm'), target, conc, 0.5, others, 25, model);
      const rows = [
        { reagent: acidName, amount: lines[0].amount, unit: lines[0].unit, row: 1 },
        { reagent: baseName, amount: lines[1].amount, unit: lines[1].unit, row: 2 },
        { reagent: 'NaCl', amount: salt, unit: 'M', row: 3 },
      ];
      const eq = solve(prepareProblem(buildContents(rows, 0.5), 25, model));
      expect(Math.abs(eq.pH - target)).toBeLessThan(1e-6);
    }), { numRuns: 150, seed: 11 });
  });
});

describe('edge magnitudes', () => {
  test.each([
    [[['HCl', 1e-10]], 6.99, 0.02, 'very dilute strong acid stays near neutral, common practice'],
    [[['HCl', 0.01]], 2.04, 0.01, 'Davies: −log(0.01·γ), γ≈0.90, common practice'],
    [[['NaOH', 0.01]], 11.95, 0.02, 'Davies at 25 °C, common practice'],
    [[['acetic acid', 0.1]], 2.88, 0.02, '0.1 M acetic acid, common practice'],
    [[['Tris', 5]], 11.2, 0.6, 'a 5 mol/L total stays finite (the model is outside its range)'],
  ] as [[string, number][], number, number, string][])('%j', (rows, ref, tol) => {
    const contents = buildContents(rows.map(([r, c], i) => ({ reagent: r, amount: c, unit: 'M', row: i + 1 })), undefined);
    const eq = solve(prepareProblem(contents, 25, 'davies'));
    expect(Math.abs(eq.pH - ref)).toBeLessThan(tol);
  });
  test('pH −1 and 15 are reachable without NaN', () => {
    for (const [r, c] of [['HCl', 5], ['NaOH', 5], ['HCl', 1e-12], ['phosphoric acid', 5]] as [string, number][]) {
      const eq = solve(prepareProblem(buildContents([{ reagent: r, amount: c, unit: 'M', row: 1 }], undefined), 25, 'ideal'));
      expect(Number.isFinite(eq.pH)).toBe(true);
      expect(eq.residualRelative).toBeLessThan(1e-10);
    }
  });
});
