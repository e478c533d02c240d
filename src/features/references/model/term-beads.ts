import type { Atom, Bond, Mapping } from '../../../shared/chem';

// What a picked term of an analysis points at: its beads in the analysed state of the mapping, the
// atoms to ring on the drawing, and a small bead graph (a node per bead at its atoms' 2D centroid, an
// edge per pair of beads joined by a bond) with the term's beads and bonds marked.

export interface TermGraphNode {
  id: string;
  name: string;
  x: number;
  y: number;
  picked: boolean;
}

export interface TermGraphEdge {
  a: string;
  b: string;
  /** A bond of the picked term (consecutive beads of the term). */
  picked: boolean;
}

export interface TermBeads {
  /** The term's atoms (0-based), each once, in index order. */
  atoms: number[];
  /** Term bead ids the analysed state does not have (a draft edited since the analysis). */
  missing: string[];
  nodes: TermGraphNode[];
  edges: TermGraphEdge[];
}

const pairKey = (a: string, b: string) => (a < b ? `${a}|${b}` : `${b}|${a}`);

export function termBeads(mapping: Mapping, molecule: { atoms: Pick<Atom, 'x' | 'y'>[]; bonds: Pick<Bond, 'a' | 'b'>[] }, beadIds: readonly string[]): TermBeads {
  const picked = new Set(beadIds);
  const byId = new Map(mapping.beads.map((b) => [b.id, b]));
  const atoms = [...new Set(beadIds.flatMap((id) => byId.get(id)?.atoms.map((a) => a.index) ?? []))].sort((a, b) => a - b);
  const nodes = mapping.beads
    .filter((b) => b.atoms.length > 0)
    .map((b) => {
      const at = b.atoms.map((a) => molecule.atoms[a.index]).filter(Boolean);
      const x = at.reduce((s, a) => s + a.x, 0) / (at.length || 1);
      const y = at.reduce((s, a) => s + a.y, 0) / (at.length || 1);
      return { id: b.id, name: b.name, x, y, picked: picked.has(b.id) };
    });
  // Beads of each atom (an atom may be shared), then every bond between atoms of different beads.
  const owners = new Map<number, string[]>();
  for (const b of mapping.beads) for (const a of b.atoms) owners.set(a.index, [...(owners.get(a.index) ?? []), b.id]);
  const termBonds = new Set(beadIds.slice(1).map((id, i) => pairKey(beadIds[i], id)));
  const edges = new Map<string, TermGraphEdge>();
  for (const bond of molecule.bonds) {
    for (const p of owners.get(bond.a) ?? []) {
      for (const q of owners.get(bond.b) ?? []) {
        if (p === q) continue;
        const key = pairKey(p, q);
        if (!edges.has(key)) edges.set(key, { a: p < q ? p : q, b: p < q ? q : p, picked: termBonds.has(key) });
      }
    }
  }
  return { atoms, missing: beadIds.filter((id) => !byId.has(id)), nodes, edges: [...edges.values()] };
}
