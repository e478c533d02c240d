import type { CentreRule, Mapping, Molecule } from '../../../src/shared/chem';

/** A mapping from lists of atom indices, every atom with weight 1. */
export function beadsFrom(groups: number[][], centre: CentreRule = 'mass'): Mapping {
  return { beads: groups.map((atoms, i) => ({ id: `b${i}`, name: `B${i}`, centre, atoms: atoms.map((index) => ({ index, weight: 1 })) })) };
}

/** Atoms in ring order for a molecule that is one simple ring (walks the bond list). */
export function ringOrder(m: Molecule): number[] {
  const nb = m.atoms.map(() => [] as number[]);
  for (const b of m.bonds) {
    nb[b.a].push(b.b);
    nb[b.b].push(b.a);
  }
  const order = [0];
  while (order.length < m.atoms.length) {
    const last = order[order.length - 1];
    order.push(nb[last].find((x) => !order.includes(x))!);
  }
  return order;
}

/** Coordinates in contract order with heavy atoms where given and every hydrogen at `hydrogenAt`. */
export function coordinatesFor(m: Molecule, heavy: number[][], hydrogenAt: (parent: number, k: number) => number[]): number[][] {
  const out = heavy.map((p) => [...p]);
  m.atoms.forEach((a, i) => {
    for (let k = 0; k < a.hydrogens; k++) out.push(hydrogenAt(i, k));
  });
  return out;
}
