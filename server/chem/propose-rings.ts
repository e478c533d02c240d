/**
 * Ring systems of the mapping proposal, cut into ring pieces (propose.ts).
 *
 * A ring system is a set of ring atoms joined by ring bonds (fused and spiro rings are one system),
 * together with any unit (propose-units.ts) that holds its ring atoms. It is cut into connected
 * pieces, each holding whole units:
 *  - a piece in a small ring holds 2 or 3 ring atoms (benzene → three pieces of two); a ring atom is
 *    alone only when no neighbour is left for it, or when it carries a group outside the ring (a
 *    methyl, a carbonyl O) to form a bead with — p-xylene at 2:1 is symmetric only as CH3–C, CH–CH,
 *    C–CH3, CH–CH;
 *  - atoms only in large rings (macrocycles) go in pieces of up to the resolution's target size;
 *  - a lone four- or five-membered ring whose atoms all fit one bead may also be one piece;
 *  - pieces never share atoms; where no cut is symmetric, propose.ts tries a symmetric cut with shared
 *    atoms for the whole part (propose-shared.ts).
 * Cost of a cut (lower is better): per piece 0 for 2 ring atoms, 0.5 for 3, 4 for a lone ring atom
 * with a group, 8 for another lone atom, 3 for a whole small ring, (r − target)²/4 for a macrocycle
 * piece of r atoms; +20 per heavy atom above the resolution's maximum; +SYMMETRY_COST per symmetry
 * class whose atoms end in pieces of different composition; +5 per atom by which the piece and the
 * terminal substituent atoms on it (methyl, hydroxyl, halogen: they will join its bead) exceed the
 * maximum.
 * Searched exhaustively (branch and bound, cheapest pieces first) up to a step budget,
 * then the best cut found so far; ties go to the cut whose sorted piece compositions come first, so
 * the answer does not depend on the atom order.
 */
import type { Prepared } from './prepared';
import { asymmetricClasses, compositionOf, SYMMETRY_COST } from './propose-cost';
import type { RingBonds } from './propose-ring-bonds';
import type { Units } from './propose-units';

export interface RingPiece {
  /** All atoms of the piece: ring atoms and the rest of their units. */
  atoms: number[];
  ringAtoms: number;
  /** The piece's cost with the standard 3-atom cost (0.5), for comparing variants. */
  cost: number;
}

export interface RingOptions {
  target: number;
  max: number;
  /**
   * Costs of a piece of 2 and of 3 small-ring atoms (0 and 0.5 by default; an alternative flips them).
   * Never negative: the search prunes on partial cost.
   */
  twoCost: number;
  threeCost: number;
  classes: Int32Array;
}

const STEP_BUDGET = 60_000;
/**
 * A lone ring atom that carries a group outside the ring (a methyl, a carbonyl O): dearer than any
 * 2–3-atom piece, cheaper than a broken symmetry class (SYMMETRY_COST), so it is chosen only when it
 * keeps the cut symmetric.
 */
const GROUP_PIECE_COST = 4;

interface Node {
  atoms: number[];
  ring: number;
  small: boolean;
  key: string;
  nbrs: number[];
  load: number;
  /** The node carries a group outside the ring system (an atom of its unit or a bonded heavy atom). */
  group: boolean;
}

export function cutRingSystems(p: Prepared, rings: RingBonds, units: Units, free: Uint8Array, o: RingOptions): RingPiece[] {
  const unitHasRing = units.atoms.map((atoms) => atoms.some((a) => rings.ringAtom[a]));
  // Ring systems over units: two ring-holding units joined by a ring bond are in one system.
  const parent = units.atoms.map((_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  for (let a = 0; a < p.n; a++) {
    if (!free[a] || !rings.ringAtom[a]) continue;
    for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
      const b = p.adj[k];
      if (rings.inRing[k] && free[b]) parent[find(units.unitOf[a])] = find(units.unitOf[b]);
    }
  }
  const systems = new Map<number, number[]>();
  units.atoms.forEach((_, u) => {
    if (!unitHasRing[u]) return;
    const r = find(u);
    systems.set(r, [...(systems.get(r) ?? []), u]);
  });
  const pieces: RingPiece[] = [];
  for (const members of systems.values()) pieces.push(...cutSystem(p, rings, units, members, o));
  return pieces;
}

function cutSystem(p: Prepared, rings: RingBonds, units: Units, members: number[], o: RingOptions): RingPiece[] {
  const index = new Map(members.map((u, i) => [u, i]));
  const nodes: Node[] = members.map((u) => {
    const atoms = units.atoms[u];
    const ringAtoms = atoms.filter((a) => rings.ringAtom[a]);
    // Terminal substituent atoms (methyl, hydroxyl, halogen) that will want to join this node's bead.
    let load = 0;
    let group = atoms.length > ringAtoms.length;
    for (const a of atoms) {
      for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
        const b = p.adj[k];
        if (units.unitOf[b] >= 0 && units.unitOf[b] !== u && p.adjStart[b + 1] - p.adjStart[b] === 1) load++;
        if (units.unitOf[b] >= 0 && !rings.ringAtom[b] && p.heavy[b]) group = true;
      }
    }
    return { atoms, ring: ringAtoms.length, small: ringAtoms.some((a) => rings.smallRingAtom[a]), key: atoms.map((a) => o.classes[a]).sort((x, y) => x - y).join('.'), nbrs: [], load, group };
  });
  nodes.forEach((node, i) => {
    const seen = new Set<number>();
    for (const a of node.atoms) {
      for (let k = p.adjStart[a]; k < p.adjStart[a + 1]; k++) {
        const j = index.get(units.unitOf[p.adj[k]]);
        if (rings.inRing[k] && j !== undefined && j !== i && !seen.has(j)) {
          seen.add(j);
          node.nbrs.push(j);
        }
      }
    }
  });
  // Visit order by composition, so equivalent systems are searched alike (atom order only among equals).
  const order = nodes.map((_, i) => i).sort((x, y) => (nodes[x].key < nodes[y].key ? -1 : nodes[x].key > nodes[y].key ? 1 : x - y));
  const size = (set: number[]) => set.reduce((s, i) => s + nodes[i].atoms.length, 0);
  const ringCount = (set: number[]) => set.reduce((s, i) => s + nodes[i].ring, 0);
  const capOf = (set: number[]) => (set.some((i) => nodes[i].small) ? 3 : Math.max(3, o.target));
  const totalRing = ringCount(nodes.map((_, i) => i));
  const simpleSmallRing = totalRing >= 4 && totalRing <= 5 && nodes.every((n) => n.nbrs.length === 2) && size(nodes.map((_, i) => i)) <= o.max;

  const pieceCost = (set: number[], whole: boolean, twoCost = o.twoCost, threeCost = o.threeCost): number => {
    const r = ringCount(set);
    const small = set.some((i) => nodes[i].small);
    let c = whole ? 3 : r <= 1 ? (set.length === 1 && nodes[set[0]].group ? GROUP_PIECE_COST : 8) : small ? (r === 2 ? twoCost : r === 3 ? threeCost : 4 * (r - 3)) : ((r - o.target) * (r - o.target)) / 4;
    const s = size(set);
    if (s > o.max && set.length > 1) c += 20 * (s - o.max);
    const loaded = s + set.reduce((t, i) => t + nodes[i].load, 0);
    if (loaded > o.max && set.length > 1) c += 5 * (loaded - o.max);
    return c;
  };

  const taken = new Uint8Array(nodes.length);
  const current: number[][] = [];
  let best: { cost: number; key: string; pieces: number[][]; whole: boolean } | null = null;
  let steps = 0;
  let wholeChosen = false;

  const candidates = (start: number): { set: number[]; cost: number; whole: boolean }[] => {
    const found = new Map<string, number[]>();
    const grow = (set: number[]): void => {
      const id = [...set].sort((x, y) => x - y).join(',');
      if (found.has(id)) return;
      found.set(id, set);
      for (const i of set) {
        for (const j of nodes[i].nbrs) {
          if (taken[j] || set.includes(j)) continue;
          const next = [...set, j];
          if (ringCount(next) <= capOf(next)) grow(next);
        }
      }
    };
    grow([start]);
    let list = [...found.values()];
    // A lone ring atom is a candidate only when no larger piece is left, or when it carries a group
    // of its own to form a bead with (p-xylene's ring carbons under the methyls at 2:1).
    const multi = list.filter((s) => s.length > 1 || nodes[s[0]].ring >= 2 || nodes[s[0]].group);
    if (multi.length) list = multi;
    const out = list.map((set) => ({ set, cost: pieceCost(set, false), whole: false }));
    if (simpleSmallRing && current.length === 0) out.push({ set: nodes.map((_, i) => i), cost: pieceCost(nodes.map((_, i) => i), true), whole: true });
    return out.sort((x, y) => x.cost - y.cost || x.set.length - y.set.length);
  };

  const search = (partial: number): void => {
    if (steps++ > STEP_BUDGET && best) return;
    if (best && partial > best.cost + 1e-9) return;
    const next = order.find((i) => !taken[i]);
    if (next === undefined) {
      const beads = current.map((set) => set.flatMap((i) => nodes[i].atoms));
      const total = partial + SYMMETRY_COST * asymmetricClasses(beads, o.classes).length;
      const key = beads.map((atoms) => compositionOf(atoms, o.classes)).sort().join('|');
      if (!best || total < best.cost - 1e-9 || (Math.abs(total - best.cost) <= 1e-9 && key < best.key)) best = { cost: total, key, pieces: current.map((s) => [...s]), whole: wholeChosen };
      return;
    }
    for (const { set, cost, whole } of candidates(next)) {
      wholeChosen = whole;
      for (const i of set) taken[i] = 1;
      current.push(set);
      search(partial + cost);
      current.pop();
      for (const i of set) taken[i] = 0;
    }
  };
  search(0);
  const chosen = best!;
  return chosen.pieces.map((set) => ({ atoms: set.flatMap((i) => nodes[i].atoms).sort((x, y) => x - y), ringAtoms: ringCount(set), cost: pieceCost(set, chosen.whole, 0, 0.5) }));
}
