import type { Atom, Bond, Molecule } from '../chem';
import { centroid, type Point } from './hull';
import { hydrogenDirections } from './hydrogens';
import { smallRings } from './rings';

/**
 * The molecule drawing as plain geometry, from the server's canonical 2D coordinates (one bond
 * ≈ one unit there, BOND drawing units here). Skeletal-formula conventions: carbons are bare
 * vertices unless charged, labelled or alone; hetero atoms carry their symbol (with their
 * hydrogens, "OH", while hydrogens are hidden); aromatic rings get an inner circle; a ring's
 * double bond has its second line inside the ring.
 */

export const BOND = 40;
const LABEL_GAP = 0.32 * BOND;
const DOUBLE_GAP = 0.16 * BOND;
const H_DISTANCE = 0.72 * BOND;

export interface DrawnAtom extends Point {
  index: number;
  element: string;
  label: string | null;
  charge: string | null;
  /** An attachment point (`*` in a repeat unit): drawn as an attachment mark, not as an element symbol. */
  attachment: boolean;
  /** For an attachment point: the unit direction of its bond, from its neighbour towards it (null when unbonded). */
  bondDirection?: Point | null;
}

export interface DrawnLine {
  bond: number;
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

export interface DrawnHydrogen extends Point {
  parent: number;
  /** Where the short bond line to the hydrogen starts. */
  from: Point;
}

export interface Drawing {
  atoms: DrawnAtom[];
  lines: DrawnLine[];
  aromaticRings: { x: number; y: number; r: number }[];
  hydrogens: DrawnHydrogen[];
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
}

/** `*` in a repeat unit's SMILES: the model marks it `attachment` (or leaves the element '*'). */
export const isAttachmentAtom = (a: Atom) => a.attachment === true || a.element === '*';

export function chargeLabel(charge: number): string | null {
  if (charge === 0) return null;
  const size = Math.abs(charge) === 1 ? '' : String(Math.abs(charge));
  return size + (charge > 0 ? '+' : '−');
}

function atomLabel(atom: Atom, degree: number, showHydrogens: boolean): string | null {
  const bare = atom.element === 'C' && atom.isotope === null && atom.charge === 0 && degree > 0;
  if (bare) return null;
  const iso = atom.isotope === null ? '' : String(atom.isotope);
  const h = showHydrogens || atom.hydrogens === 0 ? '' : atom.hydrogens === 1 ? 'H' : `H${subscript(atom.hydrogens)}`;
  return iso + atom.element + h;
}

const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';
const subscript = (n: number) => String(n).replace(/\d/g, (d) => SUBSCRIPTS[Number(d)]);

export function layoutMolecule(molecule: Pick<Molecule, 'atoms' | 'bonds'>, showHydrogens: boolean): Drawing {
  const { atoms, bonds } = molecule;
  const pos: Point[] = atoms.map((a) => ({ x: a.x * BOND, y: a.y * BOND }));
  const neighbours: number[][] = atoms.map(() => []);
  for (const b of bonds) {
    neighbours[b.a].push(b.b);
    neighbours[b.b].push(b.a);
  }
  const drawnAtoms: DrawnAtom[] = atoms.map((a, i) => {
    const attachment = isAttachmentAtom(a);
    return {
      index: i,
      element: a.element,
      ...pos[i],
      label: attachment ? null : atomLabel(a, neighbours[i].length, showHydrogens),
      charge: chargeLabel(a.charge),
      attachment,
      ...(attachment ? { bondDirection: awayFrom(pos[i], neighbours[i].map((j) => pos[j])) } : {}),
    };
  });
  // An attachment point's bond runs right up to its mark (attachment-mark.ts), so only labels leave a gap.
  const gapAt = (i: number) => drawnAtoms[i].label !== null;

  const rings = smallRings(atoms.length, bonds);
  const ringOf = (b: Bond) => rings.find((r) => r.includes(b.a) && r.includes(b.b) && Math.abs(r.indexOf(b.a) - r.indexOf(b.b)) % (r.length - 1) <= 1);
  const lines: DrawnLine[] = [];
  bonds.forEach((b, k) => {
    const [p, q] = trimmed(pos[b.a], pos[b.b], gapAt(b.a), gapAt(b.b));
    lines.push({ bond: k, x1: p.x, y1: p.y, x2: q.x, y2: q.y });
    if (b.aromatic || b.order < 2) return;
    const ring = ringOf(b);
    if (ring && b.order === 2) {
      lines.push({ bond: k, ...innerLine(p, q, centroid(ring.map((i) => pos[i]))) });
      return;
    }
    // Outside rings: the lines straddle the bond (two for double, a centre and two for triple).
    const n = normal(p, q);
    const offsets = b.order === 2 ? [DOUBLE_GAP / 2, -DOUBLE_GAP / 2] : [DOUBLE_GAP, -DOUBLE_GAP];
    if (b.order === 2) lines.pop();
    for (const o of offsets) lines.push({ bond: k, x1: p.x + n.x * o, y1: p.y + n.y * o, x2: q.x + n.x * o, y2: q.y + n.y * o });
  });

  const aromaticRings = smallRings(atoms.length, bonds, (b) => b.aromatic).map((ring) => {
    const c = centroid(ring.map((i) => pos[i]));
    const inner = Math.min(...ring.map((i) => Math.hypot(pos[i].x - c.x, pos[i].y - c.y)));
    return { ...c, r: inner * 0.58 };
  });

  const hydrogens: DrawnHydrogen[] = [];
  if (showHydrogens) {
    atoms.forEach((a, i) => {
      if (drawnAtoms[i].attachment) return;
      const dirs = hydrogenDirections(pos[i], neighbours[i].map((j) => pos[j]), a.hydrogens);
      const gap = drawnAtoms[i].label ? LABEL_GAP : 0;
      for (const d of dirs) {
        hydrogens.push({
          parent: i,
          x: pos[i].x + d.x * H_DISTANCE,
          y: pos[i].y + d.y * H_DISTANCE,
          from: { x: pos[i].x + d.x * gap, y: pos[i].y + d.y * gap },
        });
      }
    });
  }

  const all = [...pos, ...hydrogens];
  const xs = all.map((p) => p.x);
  const ys = all.map((p) => p.y);
  const bounds = all.length
    ? { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) }
    : { minX: 0, minY: 0, maxX: 0, maxY: 0 };
  return { atoms: drawnAtoms, lines, aromaticRings, hydrogens, bounds };
}

/** The mean unit direction from an atom's neighbours to the atom (null without neighbours). */
function awayFrom(p: Point, neighbours: Point[]): Point | null {
  let x = 0;
  let y = 0;
  for (const q of neighbours) {
    const len = Math.hypot(p.x - q.x, p.y - q.y) || 1;
    x += (p.x - q.x) / len;
    y += (p.y - q.y) / len;
  }
  const len = Math.hypot(x, y);
  return len > 1e-9 ? { x: x / len, y: y / len } : null;
}

function normal(p: Point, q: Point): Point {
  const len = Math.hypot(q.x - p.x, q.y - p.y) || 1;
  return { x: -(q.y - p.y) / len, y: (q.x - p.x) / len };
}

/** The bond's ends pulled back from labelled atoms so lines do not run through the symbols. */
function trimmed(p: Point, q: Point, labelP: boolean, labelQ: boolean): [Point, Point] {
  const len = Math.hypot(q.x - p.x, q.y - p.y) || 1;
  const ux = (q.x - p.x) / len;
  const uy = (q.y - p.y) / len;
  const a = labelP ? LABEL_GAP : 0;
  const b = labelQ ? LABEL_GAP : 0;
  return [
    { x: p.x + ux * a, y: p.y + uy * a },
    { x: q.x - ux * b, y: q.y - uy * b },
  ];
}

/** A ring double bond's second line: shifted toward the ring's centre and shortened at both ends. */
function innerLine(p: Point, q: Point, centre: Point): Omit<DrawnLine, 'bond'> {
  let n = normal(p, q);
  const mid = { x: (p.x + q.x) / 2, y: (p.y + q.y) / 2 };
  if ((centre.x - mid.x) * n.x + (centre.y - mid.y) * n.y < 0) n = { x: -n.x, y: -n.y };
  const shrink = 0.15;
  const dx = q.x - p.x;
  const dy = q.y - p.y;
  return {
    x1: p.x + dx * shrink + n.x * DOUBLE_GAP,
    y1: p.y + dy * shrink + n.y * DOUBLE_GAP,
    x2: q.x - dx * shrink + n.x * DOUBLE_GAP,
    y2: q.y - dy * shrink + n.y * DOUBLE_GAP,
  };
}
