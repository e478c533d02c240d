import type { BeadView, MappingView } from './bead-view';

/**
 * The next view with every unchanged part taken from the previous one. A transaction touches one or
 * a few beads, so after this only their view objects are new: memoised components (a bead's hull,
 * tag, table row, graph node) compare by identity and redraw just the beads that changed.
 */
export function keepUnchanged(previous: MappingView, next: MappingView): MappingView {
  let same = previous.beads.length === next.beads.length;
  const beads = next.beads.map((b, i) => {
    const old = previous.byId.get(b.id);
    const kept = old && sameBead(old, b) ? old : b;
    if (kept !== previous.beads[i]) same = false;
    return kept;
  });
  const links = sameLinks(previous.links, next.links) ? previous.links : next.links;
  if (same && links === previous.links && sameAtomBeads(previous.atomBeads, next.atomBeads)) return previous;
  return { beads, byId: new Map(beads.map((b) => [b.id, b])), atomBeads: next.atomBeads, links };
}

function sameBead(a: BeadView, b: BeadView): boolean {
  if (a.name !== b.name || a.type !== b.type || a.centre !== b.centre || a.colour !== b.colour || a.atoms.length !== b.atoms.length) return false;
  if (JSON.stringify(a.measured) !== JSON.stringify(b.measured)) return false;
  return a.atoms.every((x, i) => x.index === b.atoms[i].index && x.weight === b.atoms[i].weight);
}

function sameLinks(a: readonly [string, string][], b: readonly [string, string][]): boolean {
  return a.length === b.length && a.every(([p, q], i) => p === b[i][0] && q === b[i][1]);
}

function sameAtomBeads(a: ReadonlyMap<number, readonly string[]>, b: ReadonlyMap<number, readonly string[]>): boolean {
  if (a.size !== b.size) return false;
  for (const [atom, ids] of a) {
    const other = b.get(atom);
    if (!other || other.length !== ids.length || ids.some((id, i) => id !== other[i])) return false;
  }
  return true;
}
