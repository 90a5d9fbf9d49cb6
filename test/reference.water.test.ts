import { debyeHuckelA, pKw, waterDensityKgPerL } from '../src/engine';

describe('pKw at 0.1 MPa', () => {
  test.each([
    // °C, pKw, tolerance, source
    [0, 14.946, 0.002, 'IAPWS R11-07 (Bandura & Lvov 2006), table at 0.1 MPa (from memory)'],
    [25, 13.995, 0.002, 'IAPWS R11-07 (Bandura & Lvov 2006), table at 0.1 MPa (from memory)'],
    [50, 13.264, 0.002, 'IAPWS R11-07 (Bandura & Lvov 2006), table at 0.1 MPa (from memory)'],
    [100, 12.252, 0.002, 'IAPWS R11-07 (Bandura & Lvov 2006), table at 0.1 MPa (from memory)'],
  ])('%d °C: %d', (t, ref, tol) => {
    expect(Math.abs(pKw(t) - ref)).toBeLessThan(tol);
  });
});

describe('water density and the Debye–Hückel A', () => {
  test.each([
    [4, 0.99997, 0.00002, 'density maximum near 4 °C, CRC Handbook (from memory)'],
    [25, 0.997047, 0.00001, 'CRC Handbook, density of water (from memory)'],
    [50, 0.98804, 0.00002, 'CRC Handbook, density of water (from memory)'],
  ])('density at %d °C: %d kg/L', (t, ref, tol) => {
    expect(Math.abs(waterDensityKgPerL(t) - ref)).toBeLessThan(tol);
  });
  // Robinson & Stokes tabulate A = 1.8246e6 (εT)^−3/2, the form for concentrations in mol/L (no density term):
  // it is the engine's molal A divided by √ρw, and the 25 °C entry (0.5115, not the molal 0.5108) says so.
  const molarScaleA = (t: number): number => debyeHuckelA(t) / Math.sqrt(waterDensityKgPerL(t));
  test.each([
    [0, 0.4918, 'Robinson & Stokes, Electrolyte Solutions, Debye–Hückel A on the mol/L scale (from memory)'],
    [25, 0.5115, 'Robinson & Stokes, Electrolyte Solutions, Debye–Hückel A on the mol/L scale (from memory)'],
    [50, 0.5373, 'Robinson & Stokes, Electrolyte Solutions, Debye–Hückel A on the mol/L scale (from memory)'],
  ])('A (mol/L scale) at %d °C: %d (%s)', (t, ref) => {
    expect(Math.abs(molarScaleA(t) - ref)).toBeLessThan(0.0005); // the table's last digit, and permittivity data
  });
  test('A (molal) at 25 °C: 0.5108 (common practice)', () => {
    expect(Math.abs(debyeHuckelA(25) - 0.5108)).toBeLessThan(0.0005);
  });
});
