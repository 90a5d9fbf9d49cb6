import type { StrongIon } from './types';

// Ions taken as fully dissociated in dilute aqueous solution (common practice).
export const STRONG_IONS: readonly StrongIon[] = [
  { id: 'Na+', charge: 1 },
  { id: 'K+', charge: 1 },
  { id: 'Li+', charge: 1 },
  { id: 'Cs+', charge: 1 },
  { id: 'Ca2+', charge: 2 },
  { id: 'Mg2+', charge: 2 },
  { id: 'Cl-', charge: -1 },
  { id: 'Br-', charge: -1 },
  { id: 'NO3-', charge: -1 },
  { id: 'ClO4-', charge: -1 },
];

const ION_BY_ID = new Map<string, StrongIon>(STRONG_IONS.map((ion) => [ion.id, ion]));

export function strongIonById(id: string): StrongIon | undefined {
  return ION_BY_ID.get(id);
}
