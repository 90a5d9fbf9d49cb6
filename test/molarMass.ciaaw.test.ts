import { ATOMIC_WEIGHTS_G_PER_MOL, REAGENTS } from '../src/catalogue';
import { molarMassOfReagent } from '../src/engine';

// CIAAW, Standard Atomic Weights 2021 (ciaaw.org/atomic-weights.htm; Prohaska et al., Pure Appl. Chem. 94, 573
// (2022)), typed from the table: an interval [a, b] for elements whose weight varies in nature, else value ± U.
// Only the elements the catalogue's reagents use.
const CIAAW_2021: Record<string, [number, number]> = {
  H: [1.00784, 1.00811], Li: [6.938, 6.997], B: [10.806, 10.821], C: [12.0096, 12.0116], N: [14.00643, 14.00728],
  O: [15.99903, 15.99977], Na: [22.98976926, 22.9897693], Mg: [24.304, 24.307], P: [30.973761993, 30.973762003],
  S: [32.059, 32.076], Cl: [35.446, 35.457], K: [39.0982, 39.0984], Ca: [40.074, 40.082], Br: [79.901, 79.907],
};

/** Element counts of a catalogue formula: its own small parser (groups in parentheses, ·-adducts), not the engine's. */
function countAtoms(formula: string): Record<string, number> {
  const out: Record<string, number> = {};
  for (const part of formula.split('·')) {
    const lead = /^(\d+)(.*)$/.exec(part);
    const times = lead ? Number(lead[1]) : 1;
    const body = lead ? lead[2] : part;
    const stack: Record<string, number>[] = [{}];
    const re = /([A-Z][a-z]?)(\d*)|([([])|([)\]])(\d*)/g;
    let m: RegExpExecArray | null;
    while ((m = re.exec(body))) {
      if (m[1]) { const top = stack[stack.length - 1]; top[m[1]] = (top[m[1]] ?? 0) + Number(m[2] || 1); }
      else if (m[3]) stack.push({});
      else { const group = stack.pop()!; const top = stack[stack.length - 1]; for (const [e, n] of Object.entries(group)) top[e] = (top[e] ?? 0) + n * Number(m[5] || 1); }
    }
    for (const [e, n] of Object.entries(stack[0])) out[e] = (out[e] ?? 0) + n * times;
  }
  return out;
}

/** Half a unit in the last digit of a conventional value: CIAAW rounds each to a few digits (O: 15.999 lies 0.00003 below its interval). */
const halfUnit = (w: number): number => 0.5 * 10 ** -((String(w).split('.')[1] ?? '').length);

describe('molar masses against CIAAW 2021 atomic weights', () => {
  test.each(Object.entries(CIAAW_2021))('%s: the conventional value in elements.ts lies in the CIAAW 2021 interval %p, to its rounding', (el, [lo, hi]) => {
    const w = ATOMIC_WEIGHTS_G_PER_MOL[el];
    expect(w).toBeGreaterThanOrEqual(lo - halfUnit(w));
    expect(w).toBeLessThanOrEqual(hi + halfUnit(w));
  });

  // Bound: the engine and this test sum the same conventional weights, so they may differ only by floating-point
  // rounding (1e-9 g/mol); the CIAAW intervals bound what any sample's true molar mass can be, which the
  // conventional sum must lie in, up to the rounding of each conventional value (checked too).
  test.each(REAGENTS.map((r) => [r.name, r] as const))('%s', (_, r) => {
    const atoms = countAtoms(r.formula);
    atoms.H = (atoms.H ?? 0) + 2 * r.hydrateWater;
    atoms.O = (atoms.O ?? 0) + r.hydrateWater;
    let sum = 0, lo = 0, hi = 0;
    for (const [e, n] of Object.entries(atoms)) {
      const [a, b] = CIAAW_2021[e];
      sum += n * ATOMIC_WEIGHTS_G_PER_MOL[e];
      const r = halfUnit(ATOMIC_WEIGHTS_G_PER_MOL[e]);
      lo += n * (a - r); hi += n * (b + r);
    }
    const engine = molarMassOfReagent(r);
    expect(Math.abs(engine - sum)).toBeLessThan(1e-9);
    expect(engine).toBeGreaterThanOrEqual(lo);
    expect(engine).toBeLessThanOrEqual(hi);
  });
});
