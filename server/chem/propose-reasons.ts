/**
 * The one-line reason shown with each proposed bead: which rule made it (free ion, charged or listed
 * group kept whole, ring piece, chain atoms to the target size).
 */
import type { Molecule } from '../../src/shared/chem';
import type { RingBonds } from './propose-ring-bonds';
import type { Units } from './propose-units';

export function describeBead(molecule: Molecule, units: Units, rings: RingBonds, atoms: number[], ion: boolean): string {
  if (ion) return 'free ion: a bead of its own';
  const parts: string[] = [];
  const groups = new Set<string>();
  for (const a of atoms) {
    const u = units.unitOf[a];
    if (u >= 0 && units.reason[u]) for (const r of units.reason[u].split(', ')) groups.add(r);
  }
  if (groups.size) parts.push(`keeps the ${[...groups].join(', ')} whole`);
  const ring = atoms.filter((a) => rings.ringAtom[a]);
  if (ring.length) {
    const aromatic = ring.some((a) => molecule.atoms[a].aromatic);
    parts.push(`${ring.length} ${aromatic ? 'aromatic' : 'aliphatic'} ring atom${ring.length === 1 ? '' : 's'}`);
  }
  const rest = atoms.length - ring.length;
  if (!ring.length || rest > 0) parts.push(`${ring.length ? `${rest} more` : atoms.length} heavy atom${(ring.length ? rest : atoms.length) === 1 ? '' : 's'}`);
  return parts.join('; ');
}
