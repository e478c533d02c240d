import type { Topology } from '../../../shared/chem';
import { termKey, type BondedParams } from '../../../shared/bonded-terms';

// "Make ring rigid" (docs/exports.md, ring handling): a ring of beads whose bonds are all constraints
// is rigid; the exports then exclude all its pairs. The angles and proper dihedrals whose beads all lie
// in the ring add nothing a rigid ring does not already hold, so they are left out (`omit`). Undoing
// it clears both marks. Values already typed stay; a constraint without a length is still a check.

type Terms = Pick<Topology, 'angles' | 'dihedrals'>;

const EMPTY: BondedParams = { function: 'harmonic', value: null, k: null };

/** The ring's bonds, in ring order (a ring lists its beads in order, closing on itself). */
export const ringBonds = (ring: readonly string[]) => ring.map((id, i) => [id, ring[(i + 1) % ring.length]]);

export function isRigid(ring: readonly string[], stored: Readonly<Record<string, BondedParams>>): boolean {
  return ringBonds(ring).every((ids) => stored[termKey('bond', ids)]?.constraint === true);
}

/** The entries that make the ring rigid (or, with rigid = false, undo it), for one setBonded transaction. */
export function rigidRingEntries(topology: Terms, ring: readonly string[], stored: Readonly<Record<string, BondedParams>>, rigid: boolean): Record<string, BondedParams> {
  const inRing = new Set(ring);
  const out: Record<string, BondedParams> = {};
  const mark = (key: string, flag: 'constraint' | 'omit', base: BondedParams) => {
    const { [flag]: _old, ...rest } = stored[key] ?? base;
    out[key] = rigid ? { ...rest, [flag]: true } : rest;
  };
  for (const ids of ringBonds(ring)) mark(termKey('bond', ids), 'constraint', EMPTY);
  for (const ids of topology.angles) if (ids.every((id) => inRing.has(id))) mark(termKey('angle', ids), 'omit', EMPTY);
  for (const ids of topology.dihedrals) if (ids.every((id) => inRing.has(id))) mark(termKey('dihedral', ids), 'omit', { function: 'periodic', value: null, k: null });
  return out;
}
