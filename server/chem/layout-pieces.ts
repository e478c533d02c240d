/**
 * 2D layout of a large molecule from the layouts of its pieces (layout-chunks.ts cuts it at chain
 * bonds). Each piece is laid out on its own with a stub atom on every cut bond, standing where the
 * atom across the cut should go. Then, in breadth-first order, each piece is turned and moved rigidly
 * so that its end of a cut bond sits on the placed piece's stub and its own stub on the placed atom.
 * That leaves one free choice per piece: the piece or its mirror image across the cut bond (both keep
 * every bond length and angle). The one that crowds the atoms already placed less is taken, so a long
 * chain keeps going outwards instead of curling back onto itself; layout-cleanup.ts then separates
 * whatever still overlaps. Pure: the layout of one piece is passed in.
 */
import type { Atom, Bond } from '../../src/shared/chem';
import { chunkAtoms } from './layout-chunks';
import { PointGrid, type XY } from './layout-grid';

/** Lays out a small model (atoms numbered 0…n−1); bonds come out about 1 long. */
export type PieceLayout = (model: { atoms: Atom[]; bonds: Bond[] }) => XY[];

/** Bends tried at a join, about v (the piece's own end) and then about u (the placed end). */
const BENDS = [0, 1, -1, 2, -2, 3, -3, 4, -4].map((k) => (k * Math.PI) / 12).flatMap((angle) => [{ angle, aboutU: false }, { angle, aboutU: true }]).filter((b) => b.angle !== 0 || !b.aboutU);

/**
 * Length of the dummy chain hung on each stub: the inventor then draws the cut as the start of a long
 * chain running out of the piece, not as a methyl tucked into a bend (which made hairpins at joins).
 */
const TAIL = 8;

interface Piece {
  /** Global atom numbers of the piece's own atoms, in layout order. */
  atoms: number[];
  /** Own atoms' positions in the piece's layout. */
  local: XY[];
  /** Global atom across a cut bond → its stub's position in the piece's layout. */
  stubs: Map<number, XY>;
}

export function piecewiseLayout(
  model: { atoms: Atom[]; bonds: Bond[] },
  ringBond: (a: number, b: number) => boolean,
  limit: number,
  layOut: PieceLayout,
): XY[] {
  const n = model.atoms.length;
  const piece = chunkAtoms(n, model.bonds, ringBond, limit);
  const count = Math.max(...piece) + 1;
  const pieces = Array.from({ length: count }, (_, p) => layOutPiece(model, piece, p, layOut));
  const slot = new Int32Array(n);
  for (const pc of pieces) pc.atoms.forEach((g, k) => (slot[g] = k));

  const out: XY[] = Array.from({ length: n }, () => ({ x: 0, y: 0 }));
  const placed = new Uint8Array(count);
  const grid = new PointGrid(0.8);
  const sum = { x: 0, y: 0, n: 0 };
  const put = (p: number, at: XY[]) => {
    pieces[p].atoms.forEach((g, k) => {
      out[g] = at[k];
      grid.add(at[k], g);
      sum.x += at[k].x;
      sum.y += at[k].y;
      sum.n++;
    });
    placed[p] = 1;
  };
  // A piece's atom → global position, and its stubs with it, under the move that is chosen.
  const moveOf = new Map<number, (q: XY) => XY>();
  const identity = (q: XY) => q;
  put(0, pieces[0].local);
  moveOf.set(0, identity);
  const cuts = model.bonds.filter((b) => piece[b.a] !== piece[b.b]);
  const queue = [0];
  for (let k = 0; k < queue.length; k++) {
    const p = queue[k];
    for (const b of cuts) {
      const [u, v] = piece[b.a] === p ? [b.a, b.b] : piece[b.b] === p ? [b.b, b.a] : [-1, -1];
      if (u < 0 || placed[piece[v]]) continue;
      const c = piece[v];
      // v goes where the placed piece's stub for v went; c's own stub for u goes onto u.
      const vAt = moveOf.get(p)!(pieces[p].stubs.get(v)!);
      const vLocal = pieces[c].local[slot[v]];
      const uStub = pieces[c].stubs.get(u)!;
      // Both mirror images, each also bent at v by up to 60° (a bond angle off, never a bond length)
      // when the straight join would crowd atoms already placed. Score: crowding, plus how far c's
      // neighbours of v land from where p's second-shell stubs expected them, plus the bend.
      // Among equally good joins, the one reaching farthest from what is placed, so that a long
      // chain runs on instead of winding back.
      let best: { at: XY[]; move: (q: XY) => XY; score: number; crowding: number } | null = null;
      const centre = { x: sum.x / sum.n, y: sum.y / sum.n };
      for (const bend of BENDS) {
        if (best && best.crowding < 1e-9) break;
        for (const mirrored of [false, true]) {
          const join = joinMove(vLocal, uStub, vAt, out[u], mirrored, bend.aboutU ? 0 : bend.angle);
          const move = bend.aboutU && bend.angle !== 0 ? (q: XY) => turnAbout(join(q), out[u], bend.angle) : join;
          const at = pieces[c].local.map(move);
          let mismatch = 0;
          for (const [g, q] of pieces[p].stubs) {
            if (g === v || piece[g] !== c) continue;
            const want = moveOf.get(p)!(q);
            const got = at[slot[g]];
            mismatch += Math.hypot(want.x - got.x, want.y - got.y) < 0.5 ? 0 : 0.05;
          }
          const crowding = grid.crowding(at);
          const far = Math.hypot(at.reduce((t, q) => t + q.x, 0) / at.length - centre.x, at.reduce((t, q) => t + q.y, 0) / at.length - centre.y);
          const score = crowding + mismatch + Math.abs(bend.angle) * 0.2 - 1e-3 * far;
          if (!best || score < best.score - 1e-9) best = { at, move, score, crowding };
        }
      }
      put(c, best!.at);
      moveOf.set(c, best!.move);
      queue.push(c);
    }
  }
  // Pieces of other components (a salt's ions) keep their own layouts, set beside the rest.
  let right = Math.max(...out.map((q) => q.x));
  for (let p = 0; p < count; p++) {
    if (placed[p]) continue;
    const left = Math.min(...pieces[p].local.map((q) => q.x));
    put(p, pieces[p].local.map((q) => ({ x: q.x - left + right + 2, y: q.y })));
    right = Math.max(right, ...pieces[p].atoms.map((g) => out[g].x));
  }
  return out;
}

function layOutPiece(model: { atoms: Atom[]; bonds: Bond[] }, piece: number[], p: number, layOut: PieceLayout): Piece {
  const atoms = model.atoms.filter((_, i) => piece[i] === p).map((a) => a.index);
  const index = new Map(atoms.map((g, k) => [g, k]));
  // Stubs: the atoms across each cut bond and, one bond further, their other neighbours, so that the
  // piece leaves room for what really joins it there (a side ring next to the cut, say).
  const first = model.bonds.filter((b) => (piece[b.a] === p) !== (piece[b.b] === p));
  const stubOf = new Map<number, number>();
  const stubBonds: Bond[] = [];
  const stub = (g: number): number => {
    if (!stubOf.has(g)) stubOf.set(g, atoms.length + stubOf.size);
    return stubOf.get(g)!;
  };
  for (const b of first) stubBonds.push({ a: index.get(piece[b.a] === p ? b.a : b.b)!, b: stub(piece[b.a] === p ? b.b : b.a), order: 1, aromatic: false });
  const firstShell = [...stubOf.keys()];
  let extra = atoms.length + stubOf.size;
  for (const g of firstShell) {
    for (let k = 0, prev = stubOf.get(g)!; k < TAIL; k++, prev = extra++) stubBonds.push({ a: prev, b: extra, order: 1, aromatic: false });
  }
  const carbon = (index: number): Atom => ({ index, element: 'C', charge: 0, isotope: null, aromatic: false, radical: 0, hydrogens: 0, hydrogenIsotopes: [], x: 0, y: 0 });
  const stubAtoms = Array.from({ length: extra - atoms.length }, (_, k) => carbon(atoms.length + k));
  const bonds: Bond[] = model.bonds.filter((b) => piece[b.a] === p && piece[b.b] === p).map((b) => ({ ...b, a: index.get(b.a)!, b: index.get(b.b)! }));
  const pos = layOut({ atoms: [...atoms.map((g, k) => ({ ...model.atoms[g], index: k })), ...stubAtoms], bonds: [...bonds, ...stubBonds] });
  return { atoms, local: pos.slice(0, atoms.length), stubs: new Map([...stubOf].map(([g, k]) => [g, pos[k]])) };
}

/**
 * The rigid move (optionally mirrored across the line from `from` to `stub`) that puts `from` on
 * `to` and turns the direction from → stub onto to → target, then `bend` further about `to`.
 */
function joinMove(from: XY, stub: XY, to: XY, target: XY, mirrored: boolean, bend: number): (q: XY) => XY {
  const s = mirrored ? -1 : 1;
  const base = Math.atan2(stub.y - from.y, stub.x - from.x);
  const angle = Math.atan2(target.y - to.y, target.x - to.x) - s * base + bend;
  const [cos, sin] = [Math.cos(angle), Math.sin(angle)];
  return (q) => {
    const dx = q.x - from.x;
    const dy = s * (q.y - from.y);
    return { x: to.x + dx * cos - dy * sin, y: to.y + dx * sin + dy * cos };
  };
}

function turnAbout(q: XY, c: XY, angle: number): XY {
  const [cos, sin] = [Math.cos(angle), Math.sin(angle)];
  const dx = q.x - c.x;
  const dy = q.y - c.y;
  return { x: c.x + dx * cos - dy * sin, y: c.y + dx * sin + dy * cos };
}
