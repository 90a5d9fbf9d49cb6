import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { PHSensitivity, ProticError, buildContents, parseModel, prepareProblem, sitDeparture, solve } from '../src/engine';
import * as impl from '../src/functions/impl';
import { uncertaintyBudget } from '../src/functions/uncertainty';
import * as sitModule from '../src/engine/sit';
import * as chargeBalanceModule from '../src/engine/chargeBalance';
import { molarForMolal } from './helpers';

// WARNINGS under and about sit, through the cell functions: a Davies or Bates–Guggenheim result is flagged
// where it departs from the sit pH of the same mixture by more than 0.02, not from a fixed ionic strength;
// sit names the ions whose ε is a charge-type estimate, and its 25 °C ε away from 25 °C.

const PHOSPHATE = [['NaH2PO4'], ['Na2HPO4'], ['NaCl']];
const UNITS = [['M'], ['M'], ['M']];
const amounts = (nacl: number): number[][] => [[0.02], [0.03], [nacl]];

describe('parseModel', () => {
  test.each(['sit', 'SIT', ' Sit '])('%j is sit', (text) => expect(parseModel(text)).toBe('sit'));
});

describe('the departure warning follows the difference from sit', () => {
  // 50 mM phosphate (pH ≈ 7) with NaCl from 0 to 2 M: flagged exactly where |pH(model) − pH(sit)| > 0.02
  const grid = [0, 0.02, 0.05, 0.1, 0.15, 0.2, 0.3, 0.5, 0.75, 1, 1.5, 2];
  test.each(['davies', 'bates-guggenheim'])('%s', (model) => {
    for (const nacl of grid) {
      const pH = impl.ph(PHOSPHATE, amounts(nacl), UNITS, 1, 25, model) as number;
      const sit = impl.ph(PHOSPHATE, amounts(nacl), UNITS, 1, 25, 'sit') as number;
      const warning = impl.warnings(PHOSPHATE, amounts(nacl), UNITS, 1, 25, model);
      const flagged = /departs from the SIT model's/.test(warning);
      expect([nacl, flagged]).toEqual([nacl, Math.abs(pH - sit) > 0.02]);
      if (flagged) expect(warning).toContain(`(${sit.toFixed(3)}) by ${Math.abs(pH - sit).toFixed(3)}`);
    }
  });

  test('the departure check\'s sit pH (stopped where its Newton step and offsets\' move are below 1e-6) is the full sit solve\'s within 1e-6, and prints the same', () => {
    // the full solve here is PHMIX's own under sit (residual 1e-12, offsets to 1e-12), an evaluation apart from the check's
    const buffers: [string, number][][] = [
      [['NaH2PO4', 0.02], ['Na2HPO4', 0.03]], [['acetic acid', 0.1], ['sodium acetate', 0.1]], [['Tris', 0.05], ['HCl', 0.025]],
      [['citric acid', 0.05], ['NaOH', 0.1]], [['NaHCO3', 0.05], ['Na2CO3', 0.02]], [['ammonium sulfate', 0.5], ['NaH2PO4', 0.02], ['Na2HPO4', 0.03]],
      [['HCl', 0.01]], [['NaOH', 0.01]], [['disodium EDTA dihydrate', 0.05]],
    ];
    let checked = 0;
    for (const buffer of buffers) {
      for (const nacl of [0.05, 0.3, 1, 2, 2.5]) {
        const rows = [...buffer, ['NaCl', nacl] as [string, number]].map(([reagent, amount], i) => ({ reagent, amount, unit: 'M', row: i + 1 }));
        const contents = buildContents(rows, 1);
        for (const model of ['davies', 'bates-guggenheim'] as const) {
          const departure = sitDeparture(solve(prepareProblem(contents, 25, model)));
          if (departure === undefined) continue;
          const full = solve(prepareProblem(contents, 25, 'sit')).pH;
          expect([buffer[0][0], nacl, model, Math.abs(departure.pH - full) < 1e-6]).toEqual([buffer[0][0], nacl, model, true]);
          // the 0.001 it is printed to: the same digits, unless the full pH lies within 1e-6 of a rounding edge
          const edge = Math.abs(((full * 1000) % 1) - 0.5) < 1e-3;
          if (!edge) expect(departure.pH.toFixed(3)).toBe(full.toFixed(3));
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(60);
  });

  test('the departure check takes 2 evaluations where a full sit solve takes 4 (50 mM phosphate, 0.05–1 M NaCl)', () => {
    const rows = (nacl: number) => [{ reagent: 'NaH2PO4', amount: 0.02, unit: 'M', row: 1 }, { reagent: 'Na2HPO4', amount: 0.03, unit: 'M', row: 2 }, { reagent: 'NaCl', amount: nacl, unit: 'M', row: 3 }];
    const spy = jest.spyOn(chargeBalanceModule, 'chargeBalanceJacobian');
    try {
      for (const nacl of [0.05, 0.3, 1]) {
        const contents = buildContents(rows(nacl), 1);
        const full = prepareProblem(contents, 25, 'sit');
        solve(full);
        const davies = solve(prepareProblem(contents, 25, 'davies'));
        spy.mockClear();
        sitDeparture(davies);
        expect([nacl, spy.mock.calls.length]).toEqual([nacl, 2]);
        expect([nacl, full.evaluations]).toEqual([nacl, 4]);
      }
    } finally {
      spy.mockRestore();
    }
  });

  test('Davies is flagged from about 0.05 M NaCl in this buffer, far below the old fixed 0.5 mol/kg', () => {
    expect(impl.warnings(PHOSPHATE, amounts(0.05), UNITS, 1, 25, 'davies')).toMatch(/departs from the SIT model's/);
    expect(impl.warnings(PHOSPHATE, amounts(0), UNITS, 1, 25, 'davies')).toBe('none');
  });

  test('a dilute buffer (I ≈ 5 mmol/kg) is below the bound where the sit solve is skipped, and reads none', () => {
    const spy = jest.spyOn(sitModule, 'prepareSit');
    try {
      expect(impl.warnings([['NaH2PO4'], ['Na2HPO4']], [[0.002], [0.001]], [['M'], ['M']], 1, 25, 'davies')).toBe('none');
      expect(spy).not.toHaveBeenCalled();
      impl.warnings(PHOSPHATE, amounts(0.01), UNITS, 1, 25, 'davies');
      expect(spy).toHaveBeenCalled();
    } finally {
      spy.mockRestore();
    }
  });

  test('beyond sit\'s own 3 mol/kg the fixed range warning stands', () => {
    const w = impl.warnings([['NaCl']], [[4]], [['M']], 1, 25, 'davies');
    expect(w).toMatch(/above the Davies model's range/);
    expect(impl.warnings([['NaCl']], [[4]], [['M']], 1, 25, 'sit')).toMatch(/above the SIT model's range \(about 2\.7\d mol\/L here\)/); // 3 mol/kg times this solution's kg of water per litre (about 0.91)
  });
});

describe('sit\'s own warnings', () => {
  test('ions without a published ε are named, with the estimate used', () => {
    const w = impl.warnings([['citric acid'], ['NaOH'], ['NaCl']], [[0.05], [0.1], [0.5]], UNITS, 1, 25, 'sit');
    expect(w).toMatch(/no published ε for .*Na⁺–HCit²⁻ −0\.10/);
    // phosphate with Na⁺ has published ε: no such line
    expect(impl.warnings(PHOSPHATE, amounts(0.5), UNITS, 1, 25, 'sit')).toBe('none');
  });

  test('the 25 °C ε away from 25 °C: warned beyond 15–35 °C', () => {
    expect(impl.warnings(PHOSPHATE, amounts(0.5), UNITS, 1, 40, 'sit')).toMatch(/25 °C values .* at 40 °C/);
    expect(impl.warnings(PHOSPHATE, amounts(0.5), UNITS, 1, 30, 'sit')).toBe('none');
  });

  test('SPECIES states the sit basis and the water activity it put in Kw', () => {
    const [[, c]] = molarForMolal([['NaCl', 2]]);
    const v = evaluateSheet([['NaCl', c, 'M', '=PROTIC.SPECIES(A1,B1,C1,1,25,"sit")']]);
    const model = v.find((r) => r[3] === 'model')?.[4] as string;
    expect(model).toMatch(/^sit, 25 °C; .*Σ ε·m \(SIT.*water activity 0\.93\d{3} in Kw/);
  });

  test('the implicit sensitivities refuse sit with a coded failure (UNCERTAINTY under sit differences full solves instead)', () => {
    let error: unknown;
    const eq = solve(prepareProblem(buildContents([{ reagent: 'NaCl', amount: 0.5, unit: 'M', row: 1 }], 1), 25, 'sit'));
    try { new PHSensitivity(eq); } catch (e) { error = e; }
    expect(error).toBeInstanceOf(ProticError);
    expect((error as ProticError).failure).toMatchObject({ code: 'bad_model', argument: 'model' });
    expect(uncertaintyBudget(PHOSPHATE, amounts(0.5), UNITS, 1, 25, 'sit').method).toContain('central differences of full sit solves');
  });
});

describe('water activity (SIT osmotic coefficient)', () => {
  // 2 mol/kg NaCl: φ = 0.9833 (Hamer & Wu 1972, from memory), ln aw = −2·2·0.018015·φ → aw = 0.9316
  test('aw of 2 mol/kg NaCl within 0.001 of the value from the measured osmotic coefficient', () => {
    const [[, c]] = molarForMolal([['NaCl', 2]]);
    const v = evaluateSheet([['NaCl', c, 'M', '=PROTIC.SPECIES(A1,B1,C1,1,25,"sit")']]);
    const aw = Number(/water activity (\d\.\d+)/.exec(v.find((r) => r[3] === 'model')?.[4] as string)?.[1]);
    expect(Math.abs(aw - Math.exp(-4 * 0.018015268 * 0.9833))).toBeLessThan(0.001);
  });
});
