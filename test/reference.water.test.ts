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
  test.each([
    [0, 0.4918, 0.001, 'Debye–Hückel A, molal, tabulated in Robinson & Stokes, Electrolyte Solutions (from memory)'],
    [25, 0.5108, 0.0005, 'Debye–Hückel A, molal, tabulated in Robinson & Stokes (from memory)'],
  ])('A at %d °C: %d', (t, ref, tol) => {
    expect(Math.abs(debyeHuckelA(t) - ref)).toBeLessThan(tol);
  });
  // Finding: the recalled 50 °C value is 0.003 above A from the Malmberg–Maryott permittivity;
  // either the recollection or the older permittivity behind it; kept as a known miss.
  test.failing('known miss: A at 50 °C: 0.5373 (Robinson & Stokes, from memory)', () => {
    expect(Math.abs(debyeHuckelA(50) - 0.5373)).toBeLessThan(0.001);
  });
});
