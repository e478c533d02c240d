import type * as Y from 'yjs';
import type { Bond, CentreRule, MeasuredPartition } from '../../../shared/chem';
import { docToMapping } from '../../../shared/mapping-doc';
import { assignBeadColours, atomBeadsOf, beadLinks } from '../../../shared/drawing/palette';

export { beadLinks };

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
  const atomBeads = atomBeadsOf(mapping.beads);
  const links = beadLinks(atomBeads, bonds);
  const colourOf = assignBeadColours(mapping.beads.map((b) => b.id), links);
  const beads: BeadView[] = mapping.beads.map((b) => ({ id: b.id, name: b.name, type: b.type ?? null, centre: b.centre, atoms: b.atoms, colour: colourOf.get(b.id)!, measured: b.measured ?? null }));
  return { beads, byId: new Map(beads.map((b) => [b.id, b])), atomBeads, links };
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
