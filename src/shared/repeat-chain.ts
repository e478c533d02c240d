/**
 * Chains of a repeat unit (a molecule with two attachment points, see src/shared/chem.ts): unit k's
 * tail bead (the bead holding the atom bonded to the second attachment point) bonds to unit k+1's
 * head bead (the bead holding the atom bonded to the first). The bonded terms across a junction are
 * named with the next units' beads marked by '+' per unit ("B", "A+", "B++"), both in bead ids (the
 * draft's term keys) and in bead names (the API), and are found by enumerating bonds, angles and
 * proper dihedrals over four units and keeping those that start in unit 0 and reach past it.
 */
import type { Molecule, Topology } from './chem';
import type { TermKind } from './bonded-terms';

export interface Junction {
  head: string;
  tail: string;
}

/** The head and tail beads of a repeat unit's mapping, or null when it has none (not two attachment points, or an end atom unmapped). */
export function junctionOf(model: Pick<Molecule, 'atoms' | 'bonds' | 'attachmentPoints'>, beads: readonly { id: string; atoms: readonly { index: number }[] }[]): Junction | null {
  const points = model.attachmentPoints ?? [];
  if (points.length !== 2) return null;
  const neighbour = (a: number) => model.bonds.find((b) => b.a === a || b.b === a);
  const endAtom = (p: number) => {
    const b = neighbour(p);
    return b ? (b.a === p ? b.b : b.a) : -1;
  };
  const beadOf = (atom: number) => beads.find((b) => b.atoms.some((x) => x.index === atom))?.id ?? null;
  const head = beadOf(endAtom(points[0]));
  const tail = beadOf(endAtom(points[1]));
  return head && tail ? { head, tail } : null;
}

/** A bead of unit `u` (0-based) as a chain reference: its id (or name) followed by u '+'. */
export const unitRef = (id: string, u: number) => `${id}${'+'.repeat(u)}`;
export function parseUnitRef(ref: string): { id: string; unit: number } {
  const m = /^(.*?)(\+*)$/.exec(ref)!;
  return { id: m[1], unit: m[2].length };
}

const UNITS = 4;

/** The terms across junctions, as references (id + '+' per unit), in a stable order. */
export function junctionTerms(topology: Pick<Topology, 'bonds'>, beadIds: readonly string[], junction: Junction): { kind: TermKind; ids: string[] }[] {
  const adj = new Map<string, Set<string>>();
  const link = (a: string, b: string) => {
    if (!adj.has(a)) adj.set(a, new Set());
    if (!adj.has(b)) adj.set(b, new Set());
    adj.get(a)!.add(b);
    adj.get(b)!.add(a);
  };
  for (let u = 0; u < UNITS; u++) {
    for (const id of beadIds) if (!adj.has(unitRef(id, u))) adj.set(unitRef(id, u), new Set());
    for (const [a, b] of topology.bonds) link(unitRef(a, u), unitRef(b, u));
    if (u + 1 < UNITS) link(unitRef(junction.tail, u), unitRef(junction.head, u + 1));
  }
  const out: { kind: TermKind; ids: string[] }[] = [];
  const seen = new Set<string>();
  const keep = (kind: TermKind, ids: string[]) => {
    const units = ids.map((r) => parseUnitRef(r).unit);
    if (Math.min(...units) !== 0 || Math.max(...units) === 0) return;
    const canon = ids[0] <= ids[ids.length - 1] ? ids : [...ids].reverse();
    const key = `${kind}:${canon.join(',')}`;
    if (seen.has(key)) return;
    seen.add(key);
    out.push({ kind, ids: canon });
  };
  const nodes = [...adj.keys()];
  for (const a of nodes) for (const b of adj.get(a)!) keep('bond', [a, b]);
  for (const j of nodes) {
    const nb = [...adj.get(j)!];
    for (let x = 0; x < nb.length; x++) for (let y = x + 1; y < nb.length; y++) keep('angle', [nb[x], j, nb[y]]);
  }
  for (const j of nodes) {
    for (const k of adj.get(j)!) {
      for (const i of adj.get(j)!) {
        if (i === k) continue;
        for (const l of adj.get(k)!) if (l !== j && l !== i) keep('dihedral', [i, j, k, l]);
      }
    }
  }
  const order: Record<TermKind, number> = { bond: 0, angle: 1, dihedral: 2, improper: 3 };
  return out.sort((p, q) => order[p.kind] - order[q.kind] || (p.ids.join(',') < q.ids.join(',') ? -1 : 1));
}
