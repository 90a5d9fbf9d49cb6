import { ACID_SYSTEMS, SIT_EPSILON, STRONG_IONS, sitEstimate } from '../src/catalogue';
import { sitEpsilonCsv } from '../scripts/catalogue';
import { parseCsv } from '../scripts/lib/csv';

// The sit ε table as catalogue data: every row names species the engine makes, a cation and an anion, once,
// with a source; `npm run catalogue -- sit` lists it for a reviewer.

/** The charge of a species key (`Na+`, `H+`, `phosphate/2`), or undefined when the catalogue has no such species. */
function chargeOf(key: string): number | undefined {
  if (key === 'H+') return 1;
  if (key === 'OH-') return -1;
  const ion = STRONG_IONS.find((x) => x.id === key);
  if (ion) return ion.charge;
  const [id, index] = key.split('/');
  const system = ACID_SYSTEMS.find((s) => s.id === id);
  const j = Number(index);
  return system && Number.isInteger(j) && j >= 0 && j <= system.steps.length ? system.chargeMostProtonated - j : undefined;
}

describe('the sit ε table', () => {
  test.each(SIT_EPSILON.map((r) => [r.cation, r.anion, r]))('%s with %s: species that exist, cation and anion, sourced', (_, __, row) => {
    expect(chargeOf(row.cation)).toBeGreaterThan(0);
    expect(chargeOf(row.anion)).toBeLessThan(0);
    expect(Math.abs(row.epsilon)).toBeLessThan(0.5);
    expect(row.uncertainty).toBeGreaterThan(0);
    expect(row.source.length).toBeGreaterThan(20);
  });

  test('each pair once', () => {
    const pairs = SIT_EPSILON.map((r) => `${r.cation}|${r.anion}`);
    expect(new Set(pairs).size).toBe(pairs.length);
  });

  test('the charge-type estimates follow the stated rules (Hummel 2009)', () => {
    expect(sitEstimate(1, -2, 'citrate/2')).toBeCloseTo(-0.10, 12); // ε(Na⁺, X²⁻) = 0.05 z
    expect(sitEstimate(1, -1, 'Cl-')).toBeCloseTo(0.05, 12); // ε(M⁺, Cl⁻) = −0.05 + 0.1 z
    expect(sitEstimate(2, -1, 'Cl-')).toBeCloseTo(0.15, 12);
    expect(sitEstimate(2, -1, 'ClO4-')).toBeCloseTo(0.4, 12); // ε(M²⁺, ClO4⁻) = 0.2 z
  });

  test('npm run catalogue -- sit: one row per pair and the estimate rule', () => {
    const [header, ...rows] = parseCsv(sitEpsilonCsv().trimEnd());
    expect(header.slice(1)).toEqual(['cation', 'anion', 'ε at 25 °C (kg/mol)', '± (kg/mol)', 'source']);
    expect(rows).toHaveLength(SIT_EPSILON.length + 1);
    expect(rows.find((r) => r[1] === 'Na+' && r[2] === 'Cl-')?.slice(3, 5)).toEqual(['0.03', '0.01']);
    expect(rows[rows.length - 1][5]).toMatch(/Hummel 2009/);
  });
});
