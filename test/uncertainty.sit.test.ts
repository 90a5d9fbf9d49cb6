import { buildContents, lnKaAt, prepareProblem, solutionDensity, solve, systemFor } from '../src/engine';
import type { MixtureRow } from '../src/engine';
import { debyeHuckelA, pKw } from '../src/engine/water';
import { sitEpsilonRow, sitEstimate } from '../src/catalogue';
import * as impl from '../src/functions/impl';
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
function closedFormPH(acidM: number, saltM: number, temperatureC = 25): number {
  const w = solutionDensity([
    { part: 'Cl-', label: 'Cl⁻', charge: -1, concentrationM: acidM + saltM, molarMassGPerMol: 35.45, organic: false },
    { part: 'Na+', label: 'Na⁺', charge: 1, concentrationM: saltM, molarMassGPerMol: 22.98976928, organic: false },
    { part: 'H+', label: 'H⁺', charge: 1, concentrationM: acidM, molarMassGPerMol: 1.008, organic: false }], temperatureC).waterKgPerL;
  const ionic = (acidM + saltM) / w, A = debyeHuckelA(temperatureC), epsilon = sitEpsilonRow('H+', 'Cl-')!.epsilon;
  const logGammaH = (-A * Math.sqrt(ionic)) / (1 + 1.5 * Math.sqrt(ionic)) + epsilon * ((acidM + saltM) / w);
  return -logGammaH - Math.log10(acidM / w);
}

/** ε of a cation–anion pair as the catalogue gives it, or its charge-type estimate (both catalogue data). */
const epsilonOf = (cation: string, anion: string, zc: number, za: number): number => sitEpsilonRow(cation, anion)?.epsilon ?? sitEstimate(zc, za, anion);

/**
 * pH of acetic acid + NaOH + NaCl (mol/L; w kg of water per L) under the SIT, solved here on its own: bisection on
 * m(H⁺) of the charge balance m(H⁺) + m(Na⁺) = m(Cl⁻) + m(Ac⁻) + m(OH⁻), with the γ and the acetate split iterated
 * to consistency at each trial; Ka and Kw thermodynamic (molal), HAc's γ 1, ln aw left out (it enters through OH⁻
 * only, below 1e-9 mol/kg here).
 */
function acetatePH(acidM: number, naohM: number, naclM: number, w: number, temperatureC: number, pKaShift = 0): number {
  const A = debyeHuckelA(temperatureC), Ka = Math.exp(lnKaAt(systemFor('acetate'), temperatureC)[0]) * 10 ** -pKaShift, Kw = 10 ** -pKw(temperatureC);
  const c = acidM / w, mNa = (naohM + naclM) / w, mCl = naclM / w;
  const eHCl = epsilonOf('H+', 'Cl-', 1, -1), eHAc = epsilonOf('H+', 'acetate/1', 1, -1), eNaAc = epsilonOf('Na+', 'acetate/1', 1, -1), eNaOH = epsilonOf('Na+', 'OH-', 1, -1);
  let pH = 7;
  const balance = (mH: number): number => {
    let mAc = c / 2, mOH = 0, gH = 1;
    for (let k = 0; k < 200; k++) {
      const I = (mH + mNa + mCl + mAc + mOH) / 2, D = (A * Math.sqrt(I)) / (1 + 1.5 * Math.sqrt(I));
      gH = 10 ** (-D + eHCl * mCl + eHAc * mAc);
      const gAc = 10 ** (-D + eNaAc * mNa + eHAc * mH), gOH = 10 ** (-D + eNaOH * mNa);
      const next = (c * Ka) / (Ka + gH * gAc * mH);
      mOH = Kw / (gH * mH * gOH);
      if (Math.abs(next - mAc) <= 1e-16 * c) { mAc = next; break; }
      mAc = next;
    }
    pH = -Math.log10(gH * mH);
    return mH + mNa - mCl - mAc - mOH;
  };
  let lo = -14, hi = 0;
  for (let k = 0; k < 200 && hi - lo > 1e-15; k++) { const mid = (lo + hi) / 2; if (balance(10 ** mid) > 0) hi = mid; else lo = mid; }
  balance(10 ** ((lo + hi) / 2));
  return pH;
}

describe('UNCERTAINTY under sit against an acetate buffer solved on its own', () => {
  // acetic acid 6.0 g, NaOH 2.0 g, NaCl 58.44 g in 1 L (about 1 M NaCl): pH, each amount, the pKa and the temperature
  const reagents = ['acetic acid', 'NaOH', 'NaCl'], units = ['g', 'g', 'g'];
  const molarMass = reagents.map((r) => impl.molarMass(r) as number); // the catalogue's (checked against CIAAW in molarMass.ciaaw.test.ts)
  const rowsOf = (amounts: number[]): MixtureRow[] => reagents.map((reagent, i) => ({ reagent, amount: amounts[i], unit: units[i], row: i + 1 }));
  // the kg of water per litre from the density formula (checked against handbook tables in density.test.ts), no solve
  const waterKgPerL = (amounts: number[], t: number): number => Math.exp(prepareProblem(buildContents(rowsOf(amounts), 1), t, 'sit').lnWaterDensity);
  const independentPH = (amounts: number[], t = 25, shift = 0): number => {
    const [acid, naoh, nacl] = amounts.map((a, i) => a / molarMass[i]);
    return acetatePH(acid, naoh, nacl, waterKgPerL(amounts, t), t, shift);
  };
  test.each([[25], [35]])('at %p °C', (t) => {
    const amounts = [6.0, 2.0, 58.44];
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), 1, t, 'sit', null, 0, 0);
    expect(Math.abs(b.pH - independentPH(amounts, t))).toBeLessThan(1e-8);
    amounts.forEach((a, i) => {
      const h = a * 1e-5, at = (d: number) => independentPH(amounts.map((x, k) => (k === i ? x + d : x)), t);
      expect(Math.abs(b.lines[i].sensitivity / ((at(h) - at(-h)) / (2 * h)) - 1)).toBeLessThan(1e-5);
    });
    const pKaLine = b.lines.find((l) => l.input === 'pKa acetate 1')!;
    expect(Math.abs(pKaLine.sensitivity / ((independentPH(amounts, t, 1e-4) - independentPH(amounts, t, -1e-4)) / 2e-4) - 1)).toBeLessThan(1e-5);
    const tLine = b.lines.find((l) => l.input === 'temperature')!;
    expect(Math.abs(tLine.sensitivity / ((independentPH(amounts, t + 0.01) - independentPH(amounts, t - 0.01)) / 0.02) - 1)).toBeLessThan(1e-4);
  });
});

describe('UNCERTAINTY under sit', () => {
  test.each([[0.01, 0.5], [0.01, 1], [0.02, 2], [0.005, 3]])('HCl %p M in NaCl %p M: pH and each amount\'s sensitivity match the closed form', (acidM, saltM) => {
    const b = uncertaintyBudget([['HCl'], ['NaCl']], [[acidM * 1000], [saltM]], [['mM'], ['M']], 1, 25, 'sit', [[0.1], [0.01]], 0.001, 0.5);
    expect(Math.abs(b.pH - closedFormPH(acidM, saltM))).toBeLessThan(1e-9);
    // the closed form's own derivative, by a central difference of that formula (h = 1e-6 relative); they agree to about 1e-8
    const dAcid = (closedFormPH(acidM * (1 + 1e-6), saltM) - closedFormPH(acidM * (1 - 1e-6), saltM)) / (2e-6 * acidM) / 1000; // per mM
    const dSalt = (closedFormPH(acidM, saltM * (1 + 1e-6)) - closedFormPH(acidM, saltM * (1 - 1e-6))) / (2e-6 * saltM); // per M
    expect(Math.abs(b.lines[0].sensitivity / dAcid - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b.lines[1].sensitivity / dSalt - 1)).toBeLessThan(1e-6);
    // the temperature, through A and the density (the ε are 25 °C values at every temperature)
    const dT = (closedFormPH(acidM, saltM, 25.01) - closedFormPH(acidM, saltM, 24.99)) / 0.02;
    expect(Math.abs(b.lines.find((l) => l.input === 'temperature')!.sensitivity / dT - 1)).toBeLessThan(1e-4);
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

  test('stocks that fill the final volume: each amount and the volume against the closed form', () => {
    // 100 mL of 0.1 M HCl and 900 mL of 1 M NaCl made up to 1 L: the stocks are the whole volume
    const b = uncertaintyBudget([['0.1 M HCl'], ['1 M NaCl']], [[100], [900]], [['mL'], ['mL']], 1, 25, 'sit', [[0.5], [2]], 0.001, 0);
    const at = (acidML: number, saltML: number, volumeL: number) => closedFormPH((0.1 * acidML) / 1000 / volumeL, (1 * saltML) / 1000 / volumeL);
    expect(Math.abs(b.pH - at(100, 900, 1))).toBeLessThan(1e-9);
    const central = (f: (d: number) => number, h: number) => (f(h) - f(-h)) / (2 * h);
    expect(Math.abs(b.lines[0].sensitivity / central((d) => at(100 + d, 900, 1), 1e-3) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b.lines[1].sensitivity / central((d) => at(100, 900 + d, 1), 1e-3) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b.lines.find((l) => l.input === 'final volume')!.sensitivity / central((d) => at(100, 900, 1 + d), 1e-6) - 1)).toBeLessThan(1e-6);
  });

  test('a row at amount 0 in litres of stock, in half a litre (one litre of it would not fit): its slope from the closed form', () => {
    const b = uncertaintyBudget([['HCl'], ['1 M NaCl']], [[10], [0]], [['mM'], ['L']], 0.5, 25, 'sit', [[0.1], [0.001]], 0, 0);
    const h = 1e-6; // L of stock; 1 mol per L of it in 0.5 L
    const dSalt = (4 * closedFormPH(0.01, (1 * h) / 0.5) - closedFormPH(0.01, (2 * h) / 0.5) - 3 * closedFormPH(0.01, 0)) / (2 * h);
    expect(Math.abs(b.lines[1].sensitivity / dSalt - 1)).toBeLessThan(1e-6);
  });

  test('at an equivalence point the amount steps follow the pH\'s own scale (0.1 M HCl and 0.1 M NaOH, 500 mL each)', () => {
    const reagents = ['0.1 M HCl', '0.1 M NaOH'], units = ['mL', 'mL'];
    const b = uncertaintyBudget(reagents.map((r) => [r]), [[500], [500]], units.map((u) => [u]), 1.1, 25, 'sit', null, 0, 0);
    const pHAt = (naohML: number) => solve(prepareProblem(buildContents([{ reagent: reagents[0], amount: 500, unit: 'mL', row: 1 }, { reagent: reagents[1], amount: naohML, unit: 'mL', row: 2 }], 1.1), 25, 'sit')).pH;
    // the slope by central differences of the full solve, the step shrunk until two successive estimates agree to 1e-7
    let h = 0.5, previous = NaN, estimate = NaN;
    for (let k = 0; k < 30 && !(Math.abs(estimate / previous - 1) < 1e-7); k++) { previous = estimate; estimate = (pHAt(500 + h) - pHAt(500 - h)) / (2 * h); h /= 4; }
    expect(Math.abs(b.lines[1].sensitivity / estimate - 1)).toBeLessThan(1e-5);
    expect(estimate).toBeGreaterThan(100); // pH per mL: the equivalence point's steep slope
  });

  // a reference slope by central differences of the full solve, the step shrunk until two successive estimates agree,
  // or until the pH difference falls below 1e-9, the last estimate above that kept: nearer the solves' scatter (1e-15 to
  // 1e-11 pH) two estimates can agree on noise (0.01 g NaCl in near-pure water did once, at differences of 1e-13, 1.4 % off)
  const converged = (at: (d: number) => number, h0: number): number => {
    let h = h0, previous = NaN, estimate = NaN;
    for (let k = 0; k < 40 && !(Math.abs(estimate / previous - 1) < 1e-7); k++) {
      const difference = at(h) - at(-h);
      if (Math.abs(difference) < 1e-9 && Number.isFinite(estimate)) break;
      previous = estimate;
      estimate = difference / (2 * h);
      h /= 3;
    }
    return estimate;
  };
  const pHOf = (reagents: string[], amounts: number[], units: string[], volumeL: number): number =>
    solve(prepareProblem(buildContents(reagents.map((reagent, i) => ({ reagent, amount: amounts[i], unit: units[i], row: i + 1 })), volumeL), 25, 'sit')).pH;

  test.each([[0], [5.55e-17], [1e-12]])('an amount of %p (0.1 + 0.2 − 0.3 in a cell is 5.55e-17) has the slope of the row at 0, not a silent 0', (tiny) => {
    const reagents = ['Tris', '1 M HCl', '0.01 M NaOH'], units = ['g', 'mL', 'mL'];
    const b = uncertaintyBudget(reagents.map((r) => [r]), [[1.2114], [10], [tiny]], units.map((u) => [u]), 1, 25, 'sit', null, 0, 0);
    const h = 1e-3; // mL; Richardson forward difference of the full solve from 0
    const at = (d: number) => pHOf(reagents, [1.2114, 10, d], units, 1);
    expect(Math.abs(b.lines[2].sensitivity / ((4 * at(h / 8) - at(h / 4) - 3 * at(0)) / (h / 4)) - 1)).toBeLessThan(1e-5);
  });

  test.each([
    [['1 M HCl', 'NaOH'], [10, 99.99], ['mL', 'mM'], 0.1],
    [['1 M HCl', 'NaOH'], [10, 100], ['mL', 'mM'], 0.1],
    [['NaOH', 'HCl'], [0.39997, 10], ['g', 'mM'], 1],
  ])('the volume near an equivalence point (%j %j %j in %p L): the step follows the pH\'s own scale', (reagents, amounts, units, volumeL) => {
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), volumeL, 25, 'sit', null, 0, 0);
    const reference = converged((d) => pHOf(reagents, amounts, units, volumeL + d), volumeL * 1e-3);
    expect(Math.abs(b.lines.find((l) => l.input === 'final volume')!.sensitivity / reference - 1)).toBeLessThan(1e-5);
  });

  test('rows that barely act in an unbuffered solution (KCl, sucrose beside NaCl in water): steps above the solves\' noise', () => {
    const reagents = ['NaCl', 'sucrose', 'KCl', 'water'], amounts = [0.5844, 50, 0.1, 1000], units = ['g', 'g', 'g', 'mL'];
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), 1, 25, 'sit', null, 0, 0);
    [0, 1, 2].forEach((i) => {
      const reference = converged((d) => pHOf(reagents, amounts.map((x, k) => (k === i ? x + d : x)), units, 1), amounts[i] * 1e-2);
      expect([i, Math.abs(b.lines[i].sensitivity / reference - 1) < 1e-4]).toEqual([i, true]);
    });
  });

  test('a row at 0 that barely acts (sucrose beside a trace of NaCl in water) is differenced within the data, not refused', () => {
    const reagents = ['water', 'NaCl', 'sucrose'], amounts = [1000, 0.000125, 0], units = ['mL', 'g', 'g'];
    expect(Number.isFinite(pHOf(reagents, amounts, units, 1))).toBe(true); // PHMIX solves it
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), 1, 25, 'sit', [[0], [0.001], [0.5]], 0, 0);
    expect(Math.abs(b.lines[2].sensitivity)).toBeLessThan(1e-6); // about −1e-10 pH/g
  });

  test('a salt at 0.01 g in nearly pure water: the step stays within the amount and the slope matches the full solve', () => {
    const reagents = ['HCl', 'NaCl'], amounts = [1e-6, 0.01], units = ['mM', 'g'];
    const b = uncertaintyBudget(reagents.map((r) => [r]), amounts.map((a) => [a]), units.map((u) => [u]), 1, 25, 'sit', null, 0, 0);
    const reference = converged((d) => pHOf(reagents, [1e-6, 0.01 + d], units, 1), 1e-3);
    expect(Math.abs(b.lines[1].sensitivity / reference - 1)).toBeLessThan(1e-3);
  });

  test('two rows of one reagent keep their own notes (the one at 0 is the forward one)', () => {
    const b = uncertaintyBudget([['NaCl'], ['HCl'], ['NaCl']], [[5.8], [10], [0]], [['g'], ['mM'], ['g']], 1, 25, 'sit', null, 0, 0);
    expect(b.lines[0].note).not.toContain('one-sided');
    expect(b.lines[2].note).toContain('at amount 0, forward');
  });

  // salty mixtures of our own, as a process table holds them
  const SALTY: Case[] = [
    // the NaCl weighing's ± 5 g carries about 40 % of the variance here, and its sit sensitivity has the opposite sign to Davies's
    ['phosphate in 1 M NaCl', ['KH2PO4', 'Na2HPO4', 'NaCl'], [3.4, 3.55, 58.44], ['g', 'g', 'g'], 1, 25, [0.01, 0.01, 5], 0.002, 0.5],
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
