/**
 * Single-bond covalent radii (Å) for bond perception, from Cordero et al., "Covalent radii
 * revisited", Dalton Trans. 2008, 2832–2838 (carbon: its sp3 value). Values written from memory of
 * that table. Two atoms are bonded when their distance is below r₁ + r₂ + BOND_TOLERANCE (the
 * tolerance is common practice, no source) and above MIN_BOND (closer atoms are an overlap, not a bond).
 * Alkali and alkaline-earth atoms are never bonded: in simulations they are free ions.
 */
export const COVALENT_RADII: Readonly<Record<string, number>> = {
  H: 0.31, B: 0.84, C: 0.76, N: 0.71, O: 0.66, F: 0.57, Si: 1.11, P: 1.07, S: 1.05, Cl: 1.02,
  Se: 1.2, Br: 1.2, I: 1.39, As: 1.19, Ge: 1.2, Sn: 1.39, Zn: 1.22, Fe: 1.32, Cu: 1.32,
};

export const BOND_TOLERANCE = 0.4;
export const MIN_BOND = 0.4;

const IONIC = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Mg', 'Ca', 'Sr', 'Ba']);

/** The radius to use, or null when the element never bonds here (free ions, unknown elements). */
export function bondRadius(element: string): number | null {
  if (IONIC.has(element)) return null;
  return COVALENT_RADII[element] ?? null;
}
