import { ACID_SYSTEMS, REAGENTS } from '../src/catalogue';
import { reagentsCsv, systemsCsv } from '../scripts/catalogue';
import { parseCsv } from '../scripts/lib/csv';

describe('npm run catalogue: every value with its source, as CSV', () => {
  test('one row per protonation step, each with its constants and a source', () => {
    const [header, ...rows] = parseCsv(systemsCsv().trimEnd());
    expect(header[5]).toBe('pKa (25 °C, I = 0)');
    expect(rows).toHaveLength(ACID_SYSTEMS.reduce((n, s) => n + s.steps.length, 0));
    const phosphate2 = rows.find((r) => r[1] === 'phosphate' && r[2] === '2')!;
    expect(Number(phosphate2[5])).toBe(ACID_SYSTEMS[0].steps[1].pKa);
    for (const r of rows) expect(r[10].length).toBeGreaterThan(10);
    // the provenance level of each constant, appended after the original columns
    expect(header.slice(12)).toEqual(['pKa provenance', 'ΔrH° provenance', 'ΔrCp° provenance', 'measured range (°C)', 'alternative pKa', 'alternative source and rule']);
    const taps = rows.find((r) => r[1] === 'TAPS')!;
    expect(taps[12]).toMatch(/^checked: abstract/);
    expect(rows.find((r) => r[1] === 'acetate')![12]).toBe('recalled, not checked');
    expect(rows.find((r) => r[1] === 'EDTA')![15]).toBe('5–45');
    expect(rows.find((r) => r[1] === 'maleate' && r[2] === '1')![16]).toBe('2.038');
    expect(rows.find((r) => r[1] === 'borate')![11]).toMatch(/total above 0\.025 mol\/L \(common practice\); B\(OH\)3 above 0\.92 mol\/L/);
  });

  test('one row per reagent, with the molar mass from its formula and the handbook value beside it', () => {
    const [, ...rows] = parseCsv(reagentsCsv().trimEnd());
    expect(rows).toHaveLength(REAGENTS.length);
    const hepta = rows.find((r) => r[1] === 'disodium hydrogen phosphate heptahydrate')!;
    expect(Number(hepta[6])).toBeCloseTo(268.06, 2);
    expect(Number(hepta[7])).toBeCloseTo(268.07, 2);
    for (const r of rows.filter((x) => x[9] === '')) expect(r[8].length).toBeGreaterThan(10); // every solid has a handbook source
  });
});
