// TITRANT, RECIPE, SALTDOSE and PHTEMP cost as a multiple of one PHMIX solve of the same mixture, in one
// run: the inverse solve includes its verification (the forward solve at the amount it returns).
import { performance } from 'perf_hooks';
import {
  addReagent, buildContents, cloneContents, parseReagentSpec, prepareProblem, recipeForTarget, saltForIonicStrength, solve, temperatureForPH, titrantForTarget, withTitrant,
} from '../../src/engine';
import type { ActivityModel, Contents, MixtureRow } from '../../src/engine';

interface Case { name: string; rows: MixtureRow[]; volumeL: number; titrant: string; targetPH: number; model: ActivityModel; finalVolumeL?: number; temperatureC?: number }

const PHOSPHATE: MixtureRow[] = [{ reagent: 'KH2PO4', amount: 3.4, unit: 'g', row: 1 }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g', row: 2 }];
const TITRANT_CASES: Case[] = [
  { name: 'phosphate, 1 M NaOH to 7.4', rows: PHOSPHATE, volumeL: 1, titrant: '1 M NaOH', targetPH: 7.4, model: 'davies' },
  { name: 'phosphate, solid NaOH to 7.4', rows: PHOSPHATE, volumeL: 1, titrant: 'NaOH', targetPH: 7.4, model: 'davies' },
  { name: 'phosphate, Na2HPO4·7H2O to 7.1 (weak)', rows: PHOSPHATE, volumeL: 1, titrant: 'Na2HPO4·7H2O', targetPH: 7.1, model: 'davies' },
  { name: 'Tris, 1 M HCl to 8.0, made up to 1 L', rows: [{ reagent: 'Tris', amount: 12.1, unit: 'g', row: 1 }], volumeL: 0.8, titrant: '1 M HCl', targetPH: 8, model: 'davies', finalVolumeL: 1 },
  { name: 'citrate, 5 M NaOH to 5.0, bates-guggenheim', rows: [{ reagent: 'citric acid monohydrate', amount: 21, unit: 'g', row: 1 }], volumeL: 1, titrant: '5 M NaOH', targetPH: 5, model: 'bates-guggenheim' },
  { name: 'Tris 0.8 L, trisodium citrate dihydrate to 10.83', rows: [{ reagent: 'Tris', amount: 6.057, unit: 'g', row: 1 }], volumeL: 0.8, titrant: 'trisodium citrate dihydrate', targetPH: 10.83, model: 'davies' },
];
// where the linear-at-target guess does not settle (under 2 % of the battery's answers), the bracketed search
const BRACKETED_CASES: Case[] = [
  { name: 'HEPES, KH2PO4 to 6.854 at 5 °C (bracketed)', rows: [{ reagent: 'HEPES', amount: 10, unit: 'g', row: 1 }], volumeL: 0.352, titrant: 'KH2PO4', targetPH: 6.854, model: 'davies', temperatureC: 5 },
  { name: 'glycine, NaHCO3 to 8.707 at 43 °C, made up (bracketed)', rows: [{ reagent: 'glycine', amount: 5, unit: 'g', row: 1 }], volumeL: 0.578, titrant: 'sodium bicarbonate', targetPH: 8.707, model: 'davies', temperatureC: 43, finalVolumeL: 1.104 },
];

/** µs per call of `run`, one batch. */
function batchUs(run: () => void, perBatch: number): number {
  const t0 = performance.now();
  for (let i = 0; i < perBatch; i++) run();
  return ((performance.now() - t0) * 1000) / perBatch;
}

export interface InverseFigure { case: string; inverseUs: number; solveUs: number; ratio: number; forwardSolves?: number }

/**
 * Batches of the inverse and of one solve alternate, so a machine shared with other work slows
 * both alike; each figure is the fastest batch (interference only ever adds time), after a
 * warm-up of both, and the ratio is of those.
 */
function figureFor(name: string, inverse: () => void, oneSolve: () => void, pairs = 41): InverseFigure {
  for (let i = 0; i < 300; i++) { inverse(); oneSolve(); }
  // about 5 ms per batch of the inverse; the solve gets as many calls per batch in proportion
  const perInverse = Math.max(20, Math.round(5000 / Math.max(1, batchUs(inverse, 50))));
  const perSolve = Math.max(100, Math.round(5000 / Math.max(0.2, batchUs(oneSolve, 200))));
  let inv = Infinity, one = Infinity;
  for (let b = 0; b < pairs; b++) {
    inv = Math.min(inv, batchUs(inverse, perInverse));
    one = Math.min(one, batchUs(oneSolve, perSolve));
  }
  return { case: name, inverseUs: inv, solveUs: one, ratio: inv / one };
}

/** Runs the inverse benchmarks; returns the lines to print and the figures for bench/results.json. */
export function inverseBench(): { lines: string[]; results: { titrant: InverseFigure[]; bracketed: InverseFigure[]; worstTitrantRatio: number; recipe: InverseFigure; saltDose: InverseFigure; phTemp: InverseFigure; titrantWithin15x: boolean } } {
  const titrantFigure = (c: Case): InverseFigure => {
    const contents = buildContents(c.rows, c.volumeL);
    const spec = parseReagentSpec(c.titrant, 'titrant');
    const t = c.temperatureC ?? 25;
    const answer = titrantForTarget(c.targetPH, contents, spec, t, c.model, { finalVolumeL: c.finalVolumeL });
    // one PHMIX solve: the mixture with the answer in it, prepared and solved as PHMIX does
    const figure = figureFor(c.name, () => titrantForTarget(c.targetPH, contents, spec, t, c.model, { finalVolumeL: c.finalVolumeL }),
      () => withTitrant(contents, spec, answer.moles, t, c.model, c.finalVolumeL));
    return { ...figure, forwardSolves: answer.forwardSolves };
  };
  const titrant = TITRANT_CASES.map(titrantFigure);
  const bracketed = BRACKETED_CASES.map(titrantFigure);
  const acid = parseReagentSpec('NaH2PO4·H2O', 'acidForm'), base = parseReagentSpec('Na2HPO4·7H2O', 'baseForm');
  const none: Contents = { systemMoles: new Map(), ionMoles: new Map(), volumeL: 1, rows: [] };
  const lines0 = recipeForTarget(acid, base, 7.4, 0.1, 1, none, 25, 'davies');
  const recipe = figureFor('RECIPE NaH2PO4·H2O / Na2HPO4·7H2O, pH 7.4, 0.1 M', () => recipeForTarget(acid, base, 7.4, 0.1, 1, none, 25, 'davies'), () => {
    const mixed = cloneContents(none);
    addReagent(mixed, acid.resolved.reagent, lines0[0].moles);
    addReagent(mixed, base.resolved.reagent, lines0[1].moles);
    solve(prepareProblem(mixed, 25, 'davies'));
  });
  const phosphate = buildContents(PHOSPHATE, 1);
  const nacl = parseReagentSpec('NaCl', 'salt');
  const dose = saltForIonicStrength(0.15, phosphate, nacl, 25, 'davies');
  const saltDose = figureFor('SALTDOSE NaCl to 0.15 mol/L in the phosphate buffer', () => saltForIonicStrength(0.15, phosphate, nacl, 25, 'davies'),
    () => withTitrant(phosphate, nacl, dose.moles, 25, 'davies', 1));
  const tris = buildContents([{ reagent: 'Tris', amount: 50, unit: 'mM', row: 1 }, { reagent: 'Tris hydrochloride', amount: 50, unit: 'mM', row: 2 }], undefined);
  const crossing = temperatureForPH(8.3, tris, 'davies');
  const phTemp = { ...figureFor('PHTEMP 50 mM Tris + 50 mM Tris-HCl, pH 8.3, 0–60 °C', () => temperatureForPH(8.3, tris, 'davies'),
    () => solve(prepareProblem(tris, crossing.temperatureC, 'davies')), 11), forwardSolves: crossing.evaluations };
  const worst = Math.max(...titrant.map((f) => f.ratio));
  const lines = [
    'inverse solves: cost as a multiple of one PHMIX solve of the same mixture (verification included; fastest of 41 alternating batches of about 5 ms each)',
    ...[...titrant, ...bracketed].map((f) => `  TITRANT ${f.case.padEnd(54)} ${f.inverseUs.toFixed(1)} µs / ${f.solveUs.toFixed(1)} µs = ${f.ratio.toFixed(1)}× (${f.forwardSolves} forward solve${f.forwardSolves === 1 ? '' : 's'} + the starting mixture)`),
    `  ${recipe.case.padEnd(62)} ${recipe.inverseUs.toFixed(1)} µs / ${recipe.solveUs.toFixed(1)} µs = ${recipe.ratio.toFixed(1)}×`,
    `  ${saltDose.case.padEnd(62)} ${saltDose.inverseUs.toFixed(1)} µs / ${saltDose.solveUs.toFixed(1)} µs = ${saltDose.ratio.toFixed(1)}×`,
    `  ${phTemp.case.padEnd(62)} ${phTemp.inverseUs.toFixed(1)} µs / ${phTemp.solveUs.toFixed(1)} µs = ${phTemp.ratio.toFixed(1)}× (${phTemp.forwardSolves} forward solves: the scan, then the crossing)`,
    `  worst TITRANT ratio ${worst.toFixed(1)}× (target ≤ 15×); bracketed search ${Math.max(...bracketed.map((f) => f.ratio)).toFixed(1)}× at worst`,
  ];
  return { lines, results: { titrant, bracketed, worstTitrantRatio: worst, recipe, saltDose, phTemp, titrantWithin15x: worst <= 15 } };
}

if (require.main === module) process.stdout.write(inverseBench().lines.join('\n') + '\n');
