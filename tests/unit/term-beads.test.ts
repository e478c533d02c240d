import { describe, expect, it } from 'vitest';
import { termBeads } from '../../src/features/references/model/term-beads';
import type { Mapping } from '../../src/shared/chem';

// A hand-made chain of six atoms in three beads (A: 0–1, B: 2–3, C: 4–5), atoms 1 apart on a line.
const molecule = {
  atoms: [0, 1, 2, 3, 4, 5].map((i) => ({ x: i, y: 0 })),
  bonds: [0, 1, 2, 3, 4].map((i) => ({ a: i, b: i + 1 })),
};
const bead = (id: string, atoms: number[]) => ({ id, name: id.toUpperCase(), centre: 'mass' as const, atoms: atoms.map((index) => ({ index, weight: 1 })) });
const mapping: Mapping = { beads: [bead('a', [0, 1]), bead('b', [2, 3]), bead('c', [4, 5])] };

describe('the beads of a picked term', () => {
  it('rings the atoms of the term’s beads and marks its beads and bonds in the bead graph', () => {
    const t = termBeads(mapping, molecule, ['a', 'b']);
    expect(t.atoms).toEqual([0, 1, 2, 3]);
    expect(t.missing).toEqual([]);
    // Centroids by hand: (0 + 1) / 2, (2 + 3) / 2, (4 + 5) / 2.
    expect(t.nodes.map((n) => [n.name, n.x, n.picked])).toEqual([['A', 0.5, true], ['B', 2.5, true], ['C', 4.5, false]]);
    expect(t.edges).toEqual([{ a: 'a', b: 'b', picked: true }, { a: 'b', b: 'c', picked: false }]);
  });

  it('marks both bonds of an angle, and names beads the analysed state no longer has', () => {
    const t = termBeads(mapping, molecule, ['a', 'b', 'c']);
    expect(t.edges.every((e) => e.picked)).toBe(true);
    const gone = termBeads({ beads: mapping.beads.slice(0, 2) }, molecule, ['b', 'c']);
    expect(gone.missing).toEqual(['c']);
    expect(gone.atoms).toEqual([2, 3]);
  });
});
