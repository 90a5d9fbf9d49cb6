import { CASES, linearU, monteCarlo } from './uncertaintyCases';

// The JCGM 101 comparison in two files, so the two test workers share its cost.
describe('UNCERTAINTY: GUM budget against a JCGM 101 Monte Carlo', () => {
  test.each(CASES.slice(0, 5))('%s: linear u(pH) within 5 %% of 100,000 seeded draws', (...c) => {
    const mc = monteCarlo(c, 100_000, 20261201);
    expect(Math.abs(linearU(c) / mc - 1)).toBeLessThan(0.05);
  });
});
