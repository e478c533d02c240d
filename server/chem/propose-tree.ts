/**
 * Joining the proposal's nodes (ring pieces, units and lone atoms) into beads (propose.ts).
 *
 * The nodes and the bonds between them form a forest once bonds between two ring pieces are left out
 * (two ring pieces never share a bead; every cycle of the molecule lies inside its ring systems). On
 * each tree, dynamic programming finds the cheapest way to cut it into connected beads: a node's
 * table holds, for each size (heavy atoms) of the bead still open at that node and whether it holds a
 * ring piece, the least cost of everything closed below it. Bead cost (propose-cost.ts) plus, per
 * bond cut, CUT_COST, and per node joined to its parent, LOGP_COST × the difference of their mean
 * atom logP (so among equally sized cuts, atoms of similar partition go together).
 *
 * Symmetry by construction: children of one node with the same composition (their atoms' symmetry
 * classes) must all be cut off or all joined in the same way, and a tree whose centre is a bond
 * between two equivalent nodes is either cut there or joined there with both halves alike. Children
 * are visited in order of composition and ties keep the first option (cut before join, smaller before
 * larger), so the result depends on the molecule, not on its atom order.
 */
import { beadSizeCost, CUT_COST, LOGP_COST, ringBeadCost, type SizeLimits } from './propose-cost';

export interface TreeNode {
  atoms: number[];
  ring: boolean;
  size: number;
  logP: number;
  key: string;
}

interface Entry {
  cost: number;
  /** Per child group: -1 cut off, else the child's state joined into this bead. */
  picks: number[];
}

const EPS = 1e-9;

export function joinNodes(nodes: TreeNode[], edges: [number, number][], limits: SizeLimits): number[][] {
  const nbrs: number[][] = nodes.map(() => []);
  for (const [a, b] of edges) {
    if (nodes[a].ring && nodes[b].ring) continue;
    nbrs[a].push(b);
    nbrs[b].push(a);
  }
  const state = (size: number, ring: number) => size * 2 + ring;
  const capOf = (_ring: number, own: number) => Math.max(own, limits.max);
  const mean = (i: number) => nodes[i].logP / Math.max(1, nodes[i].size);
  const closeCost = (st: number) => (st & 1 ? ringBeadCost(st >> 1, limits) : beadSizeCost(st >> 1, limits));

  const seen = new Uint8Array(nodes.length);
  const beads: number[][] = [];
  const orderOfAll = nodes.map((_, i) => i).sort((x, y) => cmpKey(nodes[x].key, nodes[y].key) || x - y);
  for (const start of orderOfAll) {
    if (seen[start]) continue;
    // The tree: breadth-first spanning tree of this component (extra edges, if any, are ignored).
    const members: number[] = [start];
    seen[start] = 1;
    for (let q = 0; q < members.length; q++) {
      for (const b of nbrs[members[q]]) {
        if (seen[b]) continue;
        seen[b] = 1;
        members.push(b);
      }
    }
    const { roots } = centreOf(members, nbrs);
    const [r1, r2] = roots;
    const symmetricEdge = roots.length === 2 && nbrs[r1].includes(r2) && nodes[r1].key === nodes[r2].key;
    const root = r2 !== undefined && !symmetricEdge && cmpKey(nodes[r2].key, nodes[r1].key) < 0 ? r2 : r1;
    const parentOf = new Map<number, number>([[root, -1]]);
    if (symmetricEdge) parentOf.set(r2, -1);
    const post: number[] = [];
    const stack = symmetricEdge ? [r1, r2] : [root];
    const visitOrder: number[] = [];
    while (stack.length) {
      const v = stack.pop()!;
      visitOrder.push(v);
      for (const c of nbrs[v]) {
        if (parentOf.has(c)) continue;
        parentOf.set(c, v);
        stack.push(c);
      }
    }
    for (let i = visitOrder.length - 1; i >= 0; i--) post.push(visitOrder[i]);
    const childGroups = new Map<number, number[][]>();
    const table = new Map<number, Map<number, Entry>>();
    const closed = new Map<number, { cost: number; state: number }>();
    for (const v of post) {
      const children = nbrs[v].filter((c) => parentOf.get(c) === v);
      children.sort((x, y) => cmpKey(nodes[x].key, nodes[y].key) || x - y);
      const groups: number[][] = [];
      for (const c of children) {
        const last = groups[groups.length - 1];
        if (last && nodes[last[0]].key === nodes[c].key) last.push(c);
        else groups.push([c]);
      }
      childGroups.set(v, groups);
      let cur = new Map<number, Entry>([[state(nodes[v].size, nodes[v].ring ? 1 : 0), { cost: 0, picks: [] }]]);
      for (const group of groups) {
        const next = new Map<number, Entry>();
        const put = (st: number, e: Entry) => {
          const old = next.get(st);
          if (!old || e.cost < old.cost - EPS) next.set(st, e);
        };
        const childStates = [...table.get(group[0])!.keys()].sort((x, y) => x - y);
        for (const st of [...cur.keys()].sort((x, y) => x - y)) {
          const e = cur.get(st)!;
          let cut = e.cost;
          for (const c of group) cut += closed.get(c)!.cost + CUT_COST;
          put(st, { cost: cut, picks: [...e.picks, -1] });
          for (const cs of childStates) {
            const size = (st >> 1) + group.length * (cs >> 1);
            const ring = (st & 1) + group.length * (cs & 1);
            if (ring > 1 || size > capOf(ring, nodes[v].size)) continue;
            let cost = e.cost;
            let ok = true;
            for (const c of group) {
              const child = table.get(c)!.get(cs);
              if (!child) ok = false;
              else cost += child.cost + LOGP_COST * Math.abs(mean(v) - mean(c));
            }
            if (ok) put(state(size, ring), { cost, picks: [...e.picks, cs] });
          }
        }
        cur = next;
      }
      table.set(v, cur);
      let bestClosed = { cost: Infinity, state: -1 };
      for (const st of [...cur.keys()].sort((x, y) => x - y)) {
        const c = cur.get(st)!.cost + closeCost(st);
        if (c < bestClosed.cost - EPS) bestClosed = { cost: c, state: st };
      }
      closed.set(v, bestClosed);
    }

    const emit = (v: number, st: number, bead: number[]) => {
      const todo: [number, number, number[]][] = [[v, st, bead]];
      while (todo.length) {
        const [x, s, into] = todo.pop()!;
        into.push(...nodes[x].atoms);
        const picks = table.get(x)!.get(s)!.picks;
        childGroups.get(x)!.forEach((group, g) => {
          for (const c of group) {
            if (picks[g] === -1) {
              const own: number[] = [];
              beads.push(own);
              todo.push([c, closed.get(c)!.state, own]);
            } else todo.push([c, picks[g], into]);
          }
        });
      }
    };
    if (symmetricEdge) {
      let best = { cost: closed.get(r1)!.cost + closed.get(r2)!.cost + CUT_COST, join: -1 };
      for (const st of [...table.get(r1)!.keys()].sort((x, y) => x - y)) {
        const other = table.get(r2)!.get(st);
        if (!other) continue;
        const size = 2 * (st >> 1);
        const ring = 2 * (st & 1);
        if (ring > 1 || size > capOf(ring, 0)) continue;
        const cost = table.get(r1)!.get(st)!.cost + other.cost + closeCost(state(size, ring));
        if (cost < best.cost - EPS) best = { cost, join: st };
      }
      if (best.join === -1) {
        for (const r of [r1, r2]) {
          const own: number[] = [];
          beads.push(own);
          emit(r, closed.get(r)!.state, own);
        }
      } else {
        const own: number[] = [];
        beads.push(own);
        emit(r1, best.join, own);
        emit(r2, best.join, own);
      }
    } else {
      const own: number[] = [];
      beads.push(own);
      emit(root, closed.get(root)!.state, own);
    }
  }
  return beads.map((b) => b.sort((x, y) => x - y));
}

/** The centre of a tree (one node, or the two ends of its central bond), by peeling leaves. */
function centreOf(members: number[], nbrs: number[][]): { roots: number[] } {
  if (members.length <= 2) return { roots: [...members].sort((a, b) => a - b) };
  const inTree = new Set(members);
  const degree = new Map(members.map((v) => [v, nbrs[v].filter((b) => inTree.has(b)).length]));
  let leaves = members.filter((v) => degree.get(v)! <= 1);
  let left = members.length;
  while (left > 2) {
    left -= leaves.length;
    const next: number[] = [];
    for (const v of leaves) {
      degree.set(v, -1);
      for (const b of nbrs[v]) {
        if (!inTree.has(b) || degree.get(b)! < 0) continue;
        degree.set(b, degree.get(b)! - 1);
        if (degree.get(b) === 1) next.push(b);
      }
    }
    if (left <= 2 || next.length === 0) {
      const rest = members.filter((v) => degree.get(v)! >= 0);
      return { roots: rest.length ? rest : leaves };
    }
    leaves = next;
  }
  return { roots: members.filter((v) => degree.get(v)! >= 0) };
}

function cmpKey(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
