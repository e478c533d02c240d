/**
 * Which atom of one molecule graph is which atom of another: a graph isomorphism over heavy atoms
 * (element, isotope, formal charge and hydrogen count per atom; bond order, or "aromatic", per bond),
 * the hydrogens folded into their heavy atoms as in the atom-index contract (docs/chemistry.md).
 *
 * Method: colour refinement (the 1-dimensional Weisfeiler–Leman procedure) over both graphs at once
 * gives every atom a colour that only atoms with the same surroundings share; then a depth-first
 * search places the first graph's atoms in breadth-first order, each on an unused atom of its colour
 * bonded like it to the atoms already placed (the VF2 idea: Cordella et al., IEEE TPAMI 26 (2004)
 * 1367). Candidates are tried with the same atom number first, then in number order, so a file of
 * the very same molecule maps onto itself and a symmetric choice is always the lowest numbers.
 * Atoms that share a colour after refinement are reported as structurally equivalent; whether
 * another correspondence really exists is checked by searching again with the first such choice
 * forbidden. The search has a step budget, so a pathological graph answers "too hard", not a hang.
 */

export interface GraphAtom {
  element: string;
  charge: number;
  hydrogens: number;
  isotope?: number | null;
}

export interface GraphBond {
  /** 0-based atom indices. */
  a: number;
  b: number;
  order: number;
  aromatic: boolean;
}

export interface MoleculeGraph {
  atoms: readonly GraphAtom[];
  bonds: readonly GraphBond[];
}

export interface Correspondence {
  /** map[i] = the target atom (0-based) that source atom i is. */
  map: number[];
  /** Groups (size ≥ 2) of target atoms that the structure cannot tell apart, ascending. */
  equivalent: number[][];
  /** A second, different correspondence exists (found with `map`'s first symmetric choice forbidden). */
  alternative: number[] | null;
}

export type CorrespondenceResult = { ok: true; value: Correspondence } | { ok: false; reason: 'different' | 'too_hard' };

const STEP_BUDGET = 2_000_000;

interface Adjacent {
  atom: number;
  label: number;
}

const bondLabel = (b: GraphBond) => (b.aromatic ? 4 : b.order);

function adjacency(g: MoleculeGraph): Adjacent[][] {
  const adj: Adjacent[][] = g.atoms.map(() => []);
  for (const b of g.bonds) {
    adj[b.a].push({ atom: b.b, label: bondLabel(b) });
    adj[b.b].push({ atom: b.a, label: bondLabel(b) });
  }
  return adj;
}

/** Colours of the source atoms then the target atoms, refined until the number of classes is stable. */
function refine(adj: Adjacent[][], initial: string[]): number[] {
  const ids = new Map<string, number>();
  let colour = initial.map((s) => ids.get(s) ?? (ids.set(s, ids.size), ids.size - 1));
  let classes = ids.size;
  for (;;) {
    const next = new Map<string, number>();
    const refined = colour.map((c, i) => {
      const key = `${c}|${adj[i].map((n) => `${n.label}:${colour[n.atom]}`).sort().join(',')}`;
      return next.get(key) ?? (next.set(key, next.size), next.size - 1);
    });
    colour = refined;
    if (next.size === classes) return colour;
    classes = next.size;
  }
}

export function findCorrespondence(source: MoleculeGraph, target: MoleculeGraph): CorrespondenceResult {
  const ns = source.atoms.length;
  const nt = target.atoms.length;
  if (ns !== nt || source.bonds.length !== target.bonds.length) return { ok: false, reason: 'different' };
  const adj = [...adjacency(source), ...adjacency(target).map((list) => list.map((n) => ({ atom: n.atom + ns, label: n.label })))];
  const label = (a: GraphAtom) => `${a.element}/${a.isotope ?? 0}/${a.charge}/${a.hydrogens}`;
  const colour = refine(adj, [...source.atoms.map(label), ...target.atoms.map(label)]);
  const sColour = colour.slice(0, ns);
  const tColour = colour.slice(ns);

  const byColour = new Map<number, number[]>();
  tColour.forEach((c, t) => byColour.set(c, [...(byColour.get(c) ?? []), t]));
  const count = new Map<number, number>();
  for (const c of sColour) count.set(c, (count.get(c) ?? 0) + 1);
  for (const [c, ts] of byColour) if (count.get(c) !== ts.length) return { ok: false, reason: 'different' };
  if ([...count.keys()].some((c) => !byColour.has(c))) return { ok: false, reason: 'different' };

  const order = searchOrder(adj.slice(0, ns), sColour, byColour);
  const tAdj = adjacency(target);
  const first = search(order, adj.slice(0, ns), tAdj, sColour, tColour, byColour, null);
  if (first === 'too_hard') return { ok: false, reason: 'too_hard' };
  if (!first) return { ok: false, reason: 'different' };

  const equivalent = [...byColour.values()].filter((ts) => ts.length > 1).map((ts) => [...ts].sort((x, y) => x - y)).sort((x, y) => x[0] - y[0]);
  let alternative: number[] | null = null;
  const pivot = order.find((s) => byColour.get(sColour[s])!.length > 1);
  if (pivot !== undefined) {
    const again = search(order, adj.slice(0, ns), tAdj, sColour, tColour, byColour, { atom: pivot, not: first[pivot] });
    alternative = Array.isArray(again) ? again : null;
  }
  return { ok: true, value: { map: first, equivalent, alternative } };
}

/** Breadth-first from the atom of the rarest colour, one connected component after another. */
function searchOrder(adj: Adjacent[][], colour: number[], byColour: Map<number, number[]>): number[] {
  const seen = new Uint8Array(adj.length);
  const order: number[] = [];
  const rarity = (i: number) => byColour.get(colour[i])!.length;
  const starts = [...adj.keys()].sort((x, y) => rarity(x) - rarity(y) || x - y);
  for (const start of starts) {
    if (seen[start]) continue;
    seen[start] = 1;
    const queue = [start];
    for (let q = 0; q < queue.length; q++) {
      order.push(queue[q]);
      for (const n of adj[queue[q]]) {
        if (!seen[n.atom]) {
          seen[n.atom] = 1;
          queue.push(n.atom);
        }
      }
    }
  }
  return order;
}

function search(order: number[], sAdj: Adjacent[][], tAdj: Adjacent[][], sColour: number[], tColour: number[], byColour: Map<number, number[]>, forbid: { atom: number; not: number } | null): number[] | null | 'too_hard' {
  const n = order.length;
  const map = new Int32Array(n).fill(-1);
  const inverse = new Int32Array(n).fill(-1);
  let steps = 0;

  const fits = (s: number, t: number): boolean => {
    if (inverse[t] !== -1 || (forbid && forbid.atom === s && forbid.not === t)) return false;
    // Every placed neighbour of s must sit on a neighbour of t with the same bond, and vice versa.
    let placed = 0;
    for (const e of sAdj[s]) {
      if (map[e.atom] === -1) continue;
      placed++;
      if (!tAdj[t].some((f) => f.atom === map[e.atom] && f.label === e.label)) return false;
    }
    let placedT = 0;
    for (const f of tAdj[t]) if (inverse[f.atom] !== -1) placedT++;
    return placed === placedT;
  };

  const candidates = (s: number): number[] => {
    const anchor = sAdj[s].find((e) => map[e.atom] !== -1);
    const pool = anchor ? tAdj[map[anchor.atom]].map((f) => f.atom).filter((t) => tColour[t] === sColour[s]) : byColour.get(sColour[s])!;
    const sorted = [...new Set(pool)].sort((x, y) => x - y);
    const same = sorted.indexOf(s);
    if (same > 0) sorted.unshift(...sorted.splice(same, 1));
    return sorted;
  };

  const place = (k: number): boolean | 'too_hard' => {
    if (k === n) return true;
    const s = order[k];
    for (const t of candidates(s)) {
      if (++steps > STEP_BUDGET) return 'too_hard';
      if (!fits(s, t)) continue;
      map[s] = t;
      inverse[t] = s;
      const r = place(k + 1);
      if (r) return r;
      map[s] = -1;
      inverse[t] = -1;
    }
    return false;
  };

  const r = place(0);
  if (r === 'too_hard') return 'too_hard';
  return r ? Array.from(map) : null;
}
