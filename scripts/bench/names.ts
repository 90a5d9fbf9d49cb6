// Name lookup: what one reagent text costs to resolve, as a multiple of one PHMIX solve in the same run.
import { performance } from 'perf_hooks';
import { ProticError, buildContents, parseReagentSpec, prepareProblem, resolveReagent, solve } from '../../src/engine';

const TEXTS: Record<string, string[]> = {
  'catalogue names': ['sodium chloride', 'Tris', 'disodium hydrogen phosphate heptahydrate', 'L-arginine monohydrochloride', 'sucrose'],
  'formulas and hydrate styles': ['Na2HPO4·7H2O', 'KH2PO4', 'Na2HPO4 7H2O', 'Na₂HPO₄·7H₂O', 'NACL'],
  'trade spellings': ['Tris·HCl', 'citric acid, monohydrate', 'NaOH pellets', 'sodium chloride (NaCl)', 'H3PO4 85%'],
  'refused (suggestions, choices)': ['Trsi', 'Glycin', 'unobtainium', 'EDTA', 'Phosphate'],
};

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function microsPer(run: () => void, repeat: number): number {
  const batches: number[] = [];
  for (let b = 0; b < 15; b++) {
    const t0 = performance.now();
    for (let i = 0; i < repeat; i++) run();
    batches.push(((performance.now() - t0) * 1000) / repeat);
  }
  return median(batches);
}

export function nameLookupBench(): { lines: string[]; figures: Record<string, number> } {
  const contents = buildContents([{ reagent: 'KH2PO4', amount: 3.4, unit: 'g', row: 1 }, { reagent: 'Na2HPO4', amount: 3.55, unit: 'g', row: 2 }], 1);
  const solveUs = microsPer(() => { solve(prepareProblem(contents, 25, 'davies')); }, 200);
  const figures: Record<string, number> = { phmixSolveUs: solveUs };
  const lines = ['names: one reagent text resolved without the parse cache, median of 15 batches; as a multiple of one PHMIX solve'];
  for (const [group, texts] of Object.entries(TEXTS)) {
    const us = microsPer(() => {
      for (const text of texts) {
        try {
          resolveReagent(text, 'reagents');
        } catch (error) {
          if (!(error instanceof ProticError)) throw error;
        }
      }
    }, 40) / texts.length;
    figures[group] = us;
    lines.push(`  ${group.padEnd(34)} ${us.toFixed(1)} µs  (${(us / solveUs).toFixed(1)}× a solve)`);
  }
  const cachedUs = microsPer(() => { parseReagentSpec('Na2HPO4·7H2O', 'reagents', 1); }, 2000);
  figures.cachedParseUs = cachedUs;
  lines.push(`  a repeated text (the parse cache)   ${cachedUs.toFixed(2)} µs`);
  return { lines, figures };
}
