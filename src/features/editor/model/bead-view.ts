import type * as Y from 'yjs';
import type { Bond, CentreRule, MeasuredPartition } from '../../../shared/chem';
import { docToMapping } from '../../../shared/mapping-doc';
import { BEAD_COLOURS } from './palette';

/**
 * What the canvas, graph and table draw from the live document: beads in the document's stable
 * order with a colour each, and which beads hold each atom. Every peer computes the same view from
 * the same document, so "the orange bead" means one bead to everyone.
 *
 * Colours: bead n prefers palette colour n (mod 7, black kept for overflow) but skips any colour
 * already taken by a bead it is bonded to, so neighbouring hulls are always told apart.
 */
export interface BeadView {
  id: string;
  name: string;
  type: string | null;
  centre: CentreRule;
  atoms: { index: number; weight: number }[];
  colour: string;
  /** The modeller's measured or literature partition value, if any. */
  measured: MeasuredPartition | null;
}

export interface MappingView {
  beads: BeadView[];
  byId: Map<string, BeadView>;
  /** Atom index → ids of the beads holding it (only beads that exist). */
  atomBeads: Map<number, string[]>;
  /** Bead–bead links: an atomistic bond across two beads, or an atom shared by both. */
  links: [string, string][];
}

export function mappingView(doc: Y.Doc, bonds: readonly Bond[]): MappingView {
  const mapping = docToMapping(doc);
  const atomBeads = new Map<number, string[]>();
  for (const b of mapping.beads) {
    for (const a of b.atoms) atomBeads.set(a.index, [...(atomBeads.get(a.index) ?? []), b.id]);
  }
  const links = beadLinks(atomBeads, bonds);
  const neighbours = new Map<string, Set<string>>();
  for (const [p, q] of links) {
    if (!neighbours.has(p)) neighbours.set(p, new Set());
    if (!neighbours.has(q)) neighbours.set(q, new Set());
    neighbours.get(p)!.add(q);
    neighbours.get(q)!.add(p);
  }
  const colourOf = new Map<string, string>();
  const chromatic = BEAD_COLOURS.length - 1;
  const beads: BeadView[] = mapping.beads.map((b, n) => {
    const taken = new Set([...(neighbours.get(b.id) ?? [])].map((id) => colourOf.get(id)).filter(Boolean));
    let colour = BEAD_COLOURS[BEAD_COLOURS.length - 1];
    for (let k = 0; k < chromatic; k++) {
      const candidate = BEAD_COLOURS[(n + k) % chromatic];
      if (!taken.has(candidate)) {
        colour = candidate;
        break;
      }
    }
    colourOf.set(b.id, colour);
    return { id: b.id, name: b.name, type: b.type ?? null, centre: b.centre, atoms: b.atoms, colour, measured: b.measured ?? null };
  });
  return { beads, byId: new Map(beads.map((b) => [b.id, b])), atomBeads, links };
}

export function beadLinks(atomBeads: ReadonlyMap<number, readonly string[]>, bonds: readonly Bond[]): [string, string][] {
  const seen = new Set<string>();
  const out: [string, string][] = [];
  const add = (p: string, q: string) => {
    if (p === q) return;
    const [x, y] = p < q ? [p, q] : [q, p];
    const key = `${x}|${y}`;
    if (seen.has(key)) return;
    seen.add(key);
    out.push([x, y]);
  };
  for (const ids of atomBeads.values()) for (let i = 0; i < ids.length; i++) for (let j = i + 1; j < ids.length; j++) add(ids[i], ids[j]);
  for (const bond of bonds) {
    for (const p of atomBeads.get(bond.a) ?? []) for (const q of atomBeads.get(bond.b) ?? []) add(p, q);
  }
  return out;
}

/** Beads that hold any of the atoms, in view order. */
export function beadsTouching(view: MappingView, atoms: Iterable<number>): string[] {
  const hit = new Set<string>();
  for (const a of atoms) for (const id of view.atomBeads.get(a) ?? []) hit.add(id);
  return view.beads.filter((b) => hit.has(b.id)).map((b) => b.id);
}

export function unassignedAtoms(view: MappingView, atomCount: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < atomCount; i++) if (!view.atomBeads.has(i)) out.push(i);
  return out;
}
