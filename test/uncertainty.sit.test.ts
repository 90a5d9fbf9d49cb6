import { solutionDensity } from '../src/engine';
import { debyeHuckelA } from '../src/engine/water';
import { sitEpsilonRow } from '../src/catalogue';
import { uncertaintyBudget } from '../src/functions/uncertainty';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import type { Case } from './uncertaintyCases';
import { linearU, monteCarlo } from './uncertaintyCases';

// UNCERTAINTY under sit: its sensitivities are central differences of full sit solves, so they are checked here
// against what the solver does not use: a closed form of the SIT equations for a strong acid in NaCl, and a JCGM 101
// Monte Carlo of the sit solve itself (sampling, not differences).

/**
 * pH of a mol/L of HCl in c mol/L of NaCl under the SIT, written out: m = c/w (w the solution's kg of water per litre,
 * from the density formula), I = m(HCl) + m(NaCl), log10 γH = −A√I/(1 + 1.5√I) + ε(H⁺, Cl⁻) m(Cl⁻) (Grenthe et al.
 * 1997); OH⁻ is left out (about 1e-12 mol/kg at pH 2, so it moves the pH by less than 1e-10).
 */
function closedFormPH(acidM: number, saltM: number): number {
  const w = solutionDensity([
    { part: 'Cl-', label: 'Cl⁻', charge: -1, concentrationM: acidM + saltM, molarMassGPerMol: 35.45, organic: false },
    { part: 'Na+', label: 'Na⁺', charge: 1, concentrationM: saltM, molarMassGPerMol: 22.98976928, organic: false },
    { part: 'H+', label: 'H⁺', charge: 1, concentrationM: acidM, molarMassGPerMol: 1.008, organic: false }], 25).waterKgPerL;
  const ionic = (acidM + saltM) / w, A = debyeHuckelA(25), epsilon = sitEpsilonRow('H+', 'Cl-')!.epsilon;
  const logGammaH = (-A * Math.sqrt(ionic)) / (1 + 1.5 * Math.sqrt(ionic)) + epsilon * ((acidM + saltM) / w);
  return -logGammaH - Math.log10(acidM / w);
}

describe('UNCERTAINTY under sit', () => {
  test.each([[0.01, 0.5], [0.01, 1], [0.02, 2], [0.005, 3]])('HCl %p M in NaCl %p M: pH and each amount\'s sensitivity match the closed form', (acidM, saltM) => {
    const b = uncertaintyBudget([['HCl'], ['NaCl']], [[acidM * 1000], [saltM]], [['mM'], ['M']], 1, 25, 'sit', [[0.1], [0.01]], 0.001, 0.5);
    expect(Math.abs(b.pH - closedFormPH(acidM, saltM))).toBeLessThan(1e-9);
    // the closed form's own derivative, by a central difference of that formula (h = 1e-6 relative); they agree to about 1e-8
    const dAcid = (closedFormPH(acidM * (1 + 1e-6), saltM) - closedFormPH(acidM * (1 - 1e-6), saltM)) / (2e-6 * acidM) / 1000; // per mM
    const dSalt = (closedFormPH(acidM, saltM * (1 + 1e-6)) - closedFormPH(acidM, saltM * (1 - 1e-6))) / (2e-6 * saltM); // per M
    expect(Math.abs(b.lines[0].sensitivity / dAcid - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b.lines[1].sensitivity / dSalt - 1)).toBeLessThan(1e-6);
    // concentrations: the volume does not enter; a strong acid's pH does not depend on pKw to first order here
    expect(b.lines.find((l) => l.input === 'final volume')!.sensitivity).toBe(0);
    expect(Math.abs(b.lines.find((l) => l.input === 'pKw')!.sensitivity)).toBeLessThan(1e-6);
  });

  test('a row at amount 0 has its slope too (NaCl 0 M beside 10 mM HCl), against the closed form\'s forward derivative', () => {
    const b = uncertaintyBudget([['HCl'], ['NaCl']], [[10], [0]], [['mM'], ['M']], 1, 25, 'sit', [[0.1], [0.01]], 0, 0);
    const h = 1e-5; // Richardson-extrapolated forward difference of the closed form, error of order h²
    const dSalt = (4 * closedFormPH(0.01, h) - closedFormPH(0.01, 2 * h) - 3 * closedFormPH(0.01, 0)) / (2 * h);
    expect(Math.abs(b.lines[1].sensitivity / dSalt - 1)).toBeLessThan(1e-6);
    expect(b.lines[1].note).toContain('at amount 0, forward');
    // a tolerance on a row at 0 counts: its contribution is no silent 0
    expect(Math.abs(b.lines[1].sensitivity) * b.lines[1].u).toBeGreaterThan(1e-4);
  });

  // salty mixtures of our own, as a process table holds them
  const SALTY: Case[] = [
    ['phosphate in 1 M NaCl', ['KH2PO4', 'Na2HPO4', 'NaCl'], [3.4, 3.55, 58.44], ['g', 'g', 'g'], 1, 25, [0.01, 0.01, 0.1], 0.002, 0.5],
    ['acetate + NaOH in 2 M NaCl', ['acetic acid', 'NaOH', 'NaCl'], [6.0, 2.0, 116.9], ['g', 'g', 'g'], 1, 20, [0.05, 0.02, 0.2], 0.004, 1],
    ['Tris + HCl in 0.5 M NaCl', ['Tris', '1 M HCl', 'NaCl'], [12.11, 50, 500], ['g', 'mL', 'mM'], 1, 25, [0.02, 0.1, 2], 0.002, 1],
  ];
  test.each(SALTY)('%s: linear u(pH) within 5 %% of 50,000 seeded draws of the sit solve', (...c) => {
    const mc = monteCarlo(c, 50_000, 20261203, 'sit');
    expect(Math.abs(linearU(c, 'sit') / mc - 1)).toBeLessThan(0.05);
  });

  test('through the sheet: a sit budget, not a refusal, and its note says how the sensitivities were found', () => {
    const v = evaluateSheet([
      ['KH2PO4', 3.4, 'g', 0.01], ['Na2HPO4', 3.55, 'g', 0.01], ['NaCl', 58.44, 'g', 0.1],
      ['=PROTIC.UNCERTAINTY(A1:A3,B1:B3,C1:C3,1,25,"sit",D1:D3,0.002,0.5)'],
    ]);
    const rows = v.slice(3).filter((r) => typeof r[0] === 'string' && r[0] !== '');
    const combined = rows.find((r) => r[0] === 'combined standard uncertainty u(pH)')!;
    expect(typeof combined[1]).toBe('number');
    expect(String(combined[8])).toContain('central differences of full sit solves');
    const pH = rows.find((r) => r[0] === 'pH')![1] as number;
    const direct = evaluateSheet([['KH2PO4', 3.4, 'g'], ['Na2HPO4', 3.55, 'g'], ['NaCl', 58.44, 'g'], ['=PROTIC.PHMIX(A1:A3,B1:B3,C1:C3,1,25,"sit")']])[3][0] as number;
    expect(pH).toBe(direct);
  });

  test('at the edge of the data\'s temperature range the temperature line is a one-sided difference, and says so', () => {
    const b = uncertaintyBudget([['Tris'], ['HCl'], ['NaCl']], [[50], [25], [0.5]], [['mM'], ['mM'], ['M']], 1, 0, 'sit', [[0.1], [0.1], [0.005]], 0.001, 0.5);
    const t = b.lines.find((l) => l.input === 'temperature')!;
    expect(t.note).toContain('one-sided');
    // against a central difference one step inside the range, where both sides exist
    const inside = uncertaintyBudget([['Tris'], ['HCl'], ['NaCl']], [[50], [25], [0.5]], [['mM'], ['mM'], ['M']], 1, 0.02, 'sit', [[0.1], [0.1], [0.005]], 0.001, 0.5);
    expect(Math.abs(t.sensitivity / inside.lines.find((l) => l.input === 'temperature')!.sensitivity - 1)).toBeLessThan(1e-3);
  });
});
