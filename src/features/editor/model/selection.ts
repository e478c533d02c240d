import type { Point } from '../../../shared/drawing/hull';

/**
 * Atom selection as plain set operations. A plain click replaces the selection; shift adds or
 * toggles; a box selects what it encloses (shift: adds to the selection).
 */
export type Selection = ReadonlySet<number>;

export const EMPTY: Selection = new Set();

export function clickAtom(selection: Selection, atom: number, additive: boolean): Selection {
  if (!additive) return selection.size === 1 && selection.has(atom) ? selection : new Set([atom]);
  const next = new Set(selection);
  if (next.has(atom)) next.delete(atom);
  else next.add(atom);
  return next;
}

export function selectMany(selection: Selection, atoms: Iterable<number>, additive: boolean): Selection {
  const next = new Set(additive ? selection : []);
  for (const a of atoms) next.add(a);
  return next;
}

export interface Box {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

/** Indices of the points inside the box (corners in any order). */
export function atomsInBox(points: readonly (Point & { index: number })[], box: Box): number[] {
  const minX = Math.min(box.x1, box.x2);
  const maxX = Math.max(box.x1, box.x2);
  const minY = Math.min(box.y1, box.y2);
  const maxY = Math.max(box.y1, box.y2);
  return points.filter((p) => p.x >= minX && p.x <= maxX && p.y >= minY && p.y <= maxY).map((p) => p.index);
}

export function sameSelection(a: Selection, b: Selection): boolean {
  if (a.size !== b.size) return false;
  for (const x of a) if (!b.has(x)) return false;
  return true;
}

export const sorted = (selection: Selection): number[] => [...selection].sort((a, b) => a - b);
