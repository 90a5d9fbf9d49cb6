import { ProticError, buildContents, parseReagentSpec, titrantLimit } from '../src/engine';
import * as impl from '../src/functions/impl';
import { evaluateSheet } from '../scripts/lib/sheetEngine';
import { drawCases, runCase, withinTolerance } from './inverseBattery';
import type { Case, Kind, Outcome } from './inverseBattery';

// 20,000 seeded random inverse problems (TITRANT with strong and weak titrants, solids, stocks and
// liquids as sold, with and without finalVolume; RECIPE; SALTDOSE; 0–4 M added salt; 0–50 °C; every
// model). Each answer is a coded refusal or, fed back, within 1e-6 pH (1e-9 relative ionic
// strength) of its target. Every answer is fed back through the cell functions (impl.ph /
// impl.ionicStrength); one answer in 100 also through the spreadsheet engine, with PHMIX or
// IONICSTRENGTH reading the cell the inverse function filled. A sample of refusals is checked
// by a dense scan of the forward function for a crossing the refusal would have missed.

const COUNTS: Record<Kind, number> = { titrant: 10000, recipe: 6000, saltdose: 4000 };
const cases = drawCases({ seed: 20261201, counts: COUNTS, finalVolume: true });
const outcomes: [Case, Outcome][] = cases.map((c) => [c, runCase(c)]);

const cell = (x: unknown): string => (typeof x === 'string' ? `"${x.replace(/"/g, '""')}"` : String(x));

/** The case as a sheet: mixture rows, the inverse function in a cell, the forward function reading it. Returns the forward value. */
function throughSheet(c: Case): number | { error: string; message: string } {
  const a = c.args;
  if (c.kind === 'recipe') {
    const [acid, base, target, conc, volumeL, t, model, others, otherAmounts, otherUnits] = a as [string, string, number, number, number, number, string, string[][]?, number[][]?, string[][]?];
    const grid: (string | number | null)[][] = [
      [`=PROTIC.RECIPE(${cell(acid)},${cell(base)},${target},${conc},${volumeL},${t},${cell(model)}${others ? ',E1:E1,F1:F1,G1:G1' : ''})`, null, null, null, others?.[0][0] ?? null, otherAmounts?.[0][0] ?? null, otherUnits?.[0][0] ?? null],
      [null, null, null],
      [others ? 'NaCl' : null, others ? (otherAmounts as number[][])[0][0] * volumeL : null, others ? 'mol' : null],
      [`=PROTIC.PHMIX(A1:A${others ? 3 : 2},B1:B${others ? 3 : 2},C1:C${others ? 3 : 2},${volumeL},${t},${cell(model)})`],
    ];
    const v = evaluateSheet(grid);
    return v[3][0] as number;
  }
  const rows = (c.kind === 'titrant' ? a.slice(1, 4) : a.slice(2, 5)) as [string[][], number[][], string[][]];
  const n = rows[0].length;
  const grid: (string | number | null)[][] = rows[0].map((r, i) => [r[0], rows[1][i][0], rows[2][i][0]]);
  if (c.kind === 'titrant') {
    const [target, , , , v0, titrant, t, model, unit, finalVolumeL] = a as [number, unknown, unknown, unknown, number, string, number, string, string, number?];
    grid.push([titrant, `=PROTIC.TITRANT(${target},A1:A${n},B1:B${n},C1:C${n},${v0},${cell(titrant)},${t},${cell(model)},${cell(unit)}${finalVolumeL !== undefined ? `,${finalVolumeL}` : ''})`, unit]);
    const volume = finalVolumeL !== undefined ? String(finalVolumeL) : unit === 'mL' ? `${v0}+B${n + 1}/1000` : String(v0);
    grid.push([`=PROTIC.PHMIX(A1:A${n + 1},B1:B${n + 1},C1:C${n + 1},${volume},${t},${cell(model)})`]);
  } else {
    const [target, salt, , , , volumeL, t, model, unit] = a as [number, string, unknown, unknown, unknown, number, number, string, string];
    grid.push([salt, `=PROTIC.SALTDOSE(${target},${cell(salt)},A1:A${n},B1:B${n},C1:C${n},${volumeL},${t},${cell(model)},${cell(unit)})`, unit]);
    grid.push([`=PROTIC.IONICSTRENGTH(A1:A${n + 1},B1:B${n + 1},C1:C${n + 1},${volumeL},${t},${cell(model)})`]);
  }
  return evaluateSheet(grid)[n + 1][0] as number | { error: string; message: string };
}

describe('the inverse battery: 20,000 random problems, each answer exact or refused', () => {
  test.each(Object.keys(COUNTS) as Kind[])('%s: no wrong or silent answer, no internal error, and most problems answered', (kind) => {
    const mine = outcomes.filter(([c]) => c.kind === kind);
    const bad = mine.filter(([, o]) => o.verdict === 'wrong' || o.verdict === 'internal').map(([c, o]) => `${c.label}: ${o.detail}`);
    expect(bad.slice(0, 10)).toEqual([]);
    expect(mine).toHaveLength(COUNTS[kind]);
    // the battery must exercise answers, not only refusals
    expect(mine.filter(([, o]) => o.verdict === 'ok').length).toBeGreaterThan(COUNTS[kind] * 0.4);
  });

  test('refusals are coded: unreachable targets are #N/A, never a number, NaN or a silent 0', () => {
    for (const [, o] of outcomes) if (o.verdict === 'refused') expect(o.detail).toMatch(/^[a-z_]+$/);
    const codes = new Set(outcomes.filter(([, o]) => o.verdict === 'refused').map(([, o]) => o.detail));
    expect(codes.has('unreachable_target')).toBe(true);
  });

  test('one answer in 100, fed back through the spreadsheet engine (PHMIX or IONICSTRENGTH reading the inverse cell)', () => {
    const answered = outcomes.filter(([, o]) => o.verdict === 'ok');
    const sample = answered.filter((_, i) => i % 100 === 0);
    expect(sample.length).toBeGreaterThan(100);
    const misses: string[] = [];
    for (const [c] of sample) {
      const value = throughSheet(c);
      if (typeof value !== 'number' || !withinTolerance(c.kind, c.target, value)) misses.push(`${c.label}: ${JSON.stringify(value)}`);
    }
    expect(misses).toEqual([]);
  });

  test('a sample of TITRANT refusals: a dense scan of PHMIX from none to the titrant\'s limit never crosses the target', () => {
    const refused = outcomes.filter(([c, o]) => c.kind === 'titrant' && o.detail === 'unreachable_target' && o.argument === 'targetPH' && c.args.length === 9).filter((_, i) => i % 20 === 0);
    expect(refused.length).toBeGreaterThan(30);
    const crossings: string[] = [];
    for (const [c] of refused) {
      const [target, reagents, amounts, units, v0, titrant, t, model, unit] = c.args as [number, string[][], number[][], string[][], number, string, number, string, string];
      const contents = buildContents(reagents.map((r, i) => ({ reagent: r[0], amount: amounts[i][0], unit: units[i][0], row: i + 1 })), v0);
      const spec = parseReagentSpec(titrant, 'titrant');
      const limitMol = titrantLimit(contents, spec).moles;
      const mLPerMol = unit === 'mL' ? (spec.stockM !== undefined ? 1000 / spec.stockM : 1 / molesPerMl(spec)) : 0;
      let side = 0;
      for (let k = 0; k <= 80; k++) {
        const moles = k === 0 ? 0 : limitMol * 10 ** (-12 + (12 * k) / 80);
        const amount = unit === 'mL' ? moles * mLPerMol : moles * spec.resolved.molarMassGPerMol;
        let pH: number;
        try {
          pH = impl.ph([...reagents, [titrant]], [...amounts, [amount]], [...units, [unit]], unit === 'mL' ? v0 + amount / 1000 : v0, t, model);
        } catch (e) {
          if (e instanceof ProticError) continue;
          throw e;
        }
        const s = Math.sign(pH - target);
        if (side !== 0 && s !== 0 && s !== side) { crossings.push(`${c.label}: crosses near ${amount} ${unit}`); break; }
        if (s !== 0) side = s;
      }
    }
    expect(crossings).toEqual([]);
  });
});

describe('the inverse battery: RECIPE refusals', () => {
  test('a sample of RECIPE refusals: a dense scan of PHMIX over the base form\'s share never crosses the target', () => {
    // the pH refusals; a stock that does not fit in the volume is refused on the concentration, a rule of volumes, not of pH
    const refused = outcomes.filter(([c, o]) => c.kind === 'recipe' && o.detail === 'unreachable_target' && o.argument === 'targetPH').filter((_, i) => i % 10 === 0);
    const crossings: string[] = [];
    let scanned = 0;
    // shares from 1e-12 to 1 − 1e-12, logarithmic towards both ends
    const shares = [0, ...Array.from({ length: 40 }, (_, k) => 0.5 * 10 ** (-12 + (12 * k) / 39)), ...Array.from({ length: 39 }, (_, k) => 1 - 0.5 * 10 ** (-(12 * (38 - k)) / 38 - 0)), 1];
    for (const [c] of refused) {
      const [acid, base, target, conc, volumeL, t, model, , otherAmounts] = c.args as [string, string, number, number, number, number, string, unknown, number[][]?];
      const sA = parseReagentSpec(acid, 'acidForm').resolved.reagent.systems[0]?.count ?? 0;
      const sB = parseReagentSpec(base, 'baseForm').resolved.reagent.systems[0]?.count ?? 0;
      if (!(sA > 0 && sB > 0)) continue;
      scanned++;
      let side = 0;
      for (const share of shares) {
        const reagents = [[acid], [base]], amounts = [[(1 - share) * conc * volumeL / sA], [share * conc * volumeL / sB]], units = [['mol'], ['mol']];
        if (otherAmounts) { reagents.push(['NaCl']); amounts.push([otherAmounts[0][0] * volumeL]); units.push(['mol']); }
        let pH: number;
        try {
          pH = impl.ph(reagents, amounts, units, volumeL, t, model);
        } catch (e) {
          if (e instanceof ProticError) continue;
          throw e;
        }
        const s = Math.sign(pH - target);
        if (side !== 0 && s !== 0 && s !== side) { crossings.push(`${c.label}: crosses near a base share of ${share}`); break; }
        if (s !== 0) side = s;
      }
    }
    expect(scanned).toBeGreaterThan(50);
    expect(crossings).toEqual([]);
  });
});

describe('the inverse battery: stocks that do not fit', () => {
  test('equal stocks of one system: a buffer more concentrated than they are is refused, a leaner one never on the volume', () => {
    let checked = 0;
    const wrong: string[] = [];
    for (const [c, o] of outcomes) {
      if (c.kind !== 'recipe') continue;
      const [acid, base, , conc] = c.args as [string, string, number, number];
      const ma = /^([\d.]+) M /.exec(acid), mb = /^([\d.]+) M /.exec(base);
      if (!ma || !mb || ma[1] !== mb[1]) continue;
      checked++;
      const refusedOnVolume = o.verdict === 'refused' && o.argument === 'concentration';
      // both forms count one of the system per formula unit: the stocks take conc/stockM of the volume at any ratio,
      // so a richer buffer is refused (on the volume, or on the pH when the forms cannot reach it either) and a leaner one never on the volume
      const over = conc > Number(ma[1]);
      if (over ? o.verdict !== 'refused' : refusedOnVolume) wrong.push(`${c.label}: ${o.verdict} ${o.argument ?? ''}`);
    }
    expect(checked).toBeGreaterThan(300);
    expect(wrong).toEqual([]);
  });
});

/** Moles per mL of a liquid as sold, from its density and assay. */
function molesPerMl(spec: ReturnType<typeof parseReagentSpec>): number {
  const liquid = spec.resolved.reagent.liquid;
  if (!liquid) throw new Error(`${spec.resolved.reagent.name} is not dispensed by volume`);
  return (liquid.densityGPerML * liquid.massFraction) / spec.resolved.molarMassGPerMol;
}
