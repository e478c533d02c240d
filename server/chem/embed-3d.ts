/**
 * A 3D structure from the 2D drawing: the molecule's own 2D layout, lifted into space with a little
 * seeded noise (hydrogens put out of the plane), then relaxed with a simple geometric force field of
 * our own until bonds, angles and planarity match typical values (typical-geometry.ts).
 *
 * Terms, all harmonic in Å (weights chosen by us): bond lengths (k 100); 1–3 distances from the ideal
 * angle by the law of cosines (k 20); planarity of trigonal centres and of the atoms around a double or
 * aromatic bond as signed volumes (k 5), and the volume of a regular tetrahedron at four-neighbour centres (k 5); a staggered three-fold torsion on single bonds between two
 * tetrahedral centres (k 0.3 × (1 + cos 3φ)); repulsion of atoms three or more bonds apart when closer
 * than a contact distance (k 10: heavy–heavy 3.0 Å, heavy–H 2.6, H–H 2.2; two thirds of a typical van der
 * Waals contact, 2.6 / 2.3 / 2.0 Å for atoms exactly three bonds apart; common practice, no source).
 * The minimiser is FIRE (E. Bitzek et al., Phys. Rev. Lett. 2006, 97, 170201). Every step is
 * deterministic, so a seed gives the same structure every time. The model carries no stereochemistry,
 * so centres come out with whichever configuration the drawing and the noise lead to.
 */
import type { Atom, Bond } from '../../src/shared/chem';
import { bondLength, hybridisation, hydrogenBondLength, idealAngle, type Hybrid } from './typical-geometry';

interface Term2 { i: number; j: number; d: number; k: number }
interface Term4 { a: number; b: number; c: number; d: number; k: number; v0?: number }

export interface EmbedResult {
  /** Heavy atoms in index order, then each heavy atom's hydrogens in order (the contract's order). */
  xyz: number[][];
  iterations: number;
  /** Largest deviation of a bond from its typical length (Å). */
  worstBond: number;
  /** Largest deviation of a 1–3 distance from its ideal angle's (Å). */
  worstAngle: number;
  /** Deepest overlap of two atoms three or more bonds apart, below their contact distance (Å). */
  worstContact: number;
}

export function embed3d(model: { atoms: Atom[]; bonds: Bond[] }, seed: number, maxIterations = 4000): EmbedResult {
  const { atoms, bonds } = model;
  const n = atoms.length;
  const parent: number[] = [];
  atoms.forEach((a, i) => {
    for (let k = 0; k < a.hydrogens; k++) parent.push(i);
  });
  const total = n + parent.length;
  const isH = (i: number) => i >= n;
  const neighbours: number[][] = Array.from({ length: total }, () => []);
  for (const b of bonds) {
    neighbours[b.a].push(b.b);
    neighbours[b.b].push(b.a);
  }
  parent.forEach((p, k) => {
    neighbours[p].push(n + k);
    neighbours[n + k].push(p);
  });
  const hybrid = hybridisation(atoms, bonds);
  const hyb = (i: number): Hybrid => (isH(i) ? 'other' : hybrid[i]);

  // Bonds.
  const length = new Map<number, number>();
  const key = (i: number, j: number) => (i < j ? i * total + j : j * total + i);
  const stretch: Term2[] = [];
  for (const b of bonds) {
    const d = bondLength(atoms, hybrid, b);
    length.set(key(b.a, b.b), d);
    stretch.push({ i: b.a, j: b.b, d, k: 100 });
  }
  parent.forEach((p, k) => {
    const d = hydrogenBondLength(atoms[p].element);
    length.set(key(p, n + k), d);
    stretch.push({ i: p, j: n + k, d, k: 100 });
  });

  // Topological distances up to 3 (1–2, 1–3, 1–4), for angles and the repulsion exclusions.
  const near = new Map<number, number>();
  for (let i = 0; i < total; i++) {
    for (const j of neighbours[i]) {
      near.set(key(i, j), 1);
      for (const k of neighbours[j]) {
        if (k === i) continue;
        const k2 = key(i, k);
        if ((near.get(k2) ?? 9) > 2) near.set(k2, 2);
        for (const l of neighbours[k]) if (l !== j && l !== i && !near.has(key(i, l))) near.set(key(i, l), 3);
      }
    }
  }

  // Angles as 1–3 distances; the ring's own angle in rings of 3 to 5 atoms.
  const ringSize = (a: number, centre: number, c: number): number => {
    // Shortest path a → c not through the centre, up to 3 bonds: the ring holds it plus the centre.
    let frontier = [a];
    const seen = new Set([a, centre]);
    for (let depth = 1; depth <= 3; depth++) {
      const next: number[] = [];
      for (const u of frontier) for (const v of neighbours[u]) {
        if (v === c) return depth + 2;
        if (!seen.has(v) && !isH(v)) {
          seen.add(v);
          next.push(v);
        }
      }
      frontier = next;
    }
    return 0;
  };
  const angles: Term2[] = [];
  for (let j = 0; j < n; j++) {
    const nb = neighbours[j];
    const ideal = idealAngle(hyb(j));
    for (let x = 0; x < nb.length; x++) for (let y = x + 1; y < nb.length; y++) {
      const [a, c] = [nb[x], nb[y]];
      const ring = isH(a) || isH(c) ? 0 : ringSize(a, j, c);
      const theta = ring >= 3 && ring <= 5 ? ((ring - 2) * 180) / ring : ideal;
      const r1 = length.get(key(a, j))!;
      const r2 = length.get(key(c, j))!;
      if (theta === null) {
        // More than four neighbours: keep them apart (at least 90°), no fixed angle.
        angles.push({ i: a, j: c, d: Math.hypot(r1, r2), k: -20 });
        continue;
      }
      const t = (theta * Math.PI) / 180;
      angles.push({ i: a, j: c, d: Math.sqrt(r1 * r1 + r2 * r2 - 2 * r1 * r2 * Math.cos(t)), k: 20 });
    }
  }

  // Planarity: trigonal centres, and the atoms around double and aromatic bonds.
  const planes: Term4[] = [];
  for (let j = 0; j < n; j++) {
    if (hyb(j) === 'sp2' && neighbours[j].length === 3) planes.push({ a: j, b: neighbours[j][0], c: neighbours[j][1], d: neighbours[j][2], k: 5 });
  }
  for (const b of bonds) {
    if (!(b.aromatic || b.order === 2)) continue;
    for (const a of neighbours[b.a]) for (const d of neighbours[b.b]) {
      if (a !== b.b && d !== b.a && a !== d) planes.push({ a, b: b.a, c: b.b, d, k: 5 });
    }
  }

  // Staggered torsions about single bonds between two tetrahedral centres.
  const torsions: Term4[] = [];
  for (const b of bonds) {
    if (b.order !== 1 || b.aromatic || hyb(b.a) !== 'sp3' || hyb(b.b) !== 'sp3') continue;
    for (const a of neighbours[b.a]) for (const d of neighbours[b.b]) {
      if (a !== b.b && d !== b.a && a !== d) torsions.push({ a, b: b.a, c: b.b, d, k: 0.3 });
    }
  }

  const contact = (i: number, j: number): number => {
    const h = (isH(i) ? 1 : 0) + (isH(j) ? 1 : 0);
    return near.get(key(i, j)) === 3 ? [2.6, 2.3, 2.0][h] : [3.0, 2.6, 2.2][h];
  };

  const pos = start(atoms, parent, neighbours, seed);
  // Tetrahedral centres: the signed volume of each three of the four neighbours about the centre held at
  // a regular tetrahedron's, 0.7698 r1 r2 r3 (three unit vectors 109.47° apart). With a + b + c + d = 0
  // the four volumes alternate in sign (abc, −abd, acd, −bcd); the handedness is the one the start
  // leans to (summed over the four). It lifts centres the flat drawing left square-planar.
  const volume = (c: number, x: number, y: number, z: number) => dot(sub(pos, x, c), cross(sub(pos, y, c), sub(pos, z, c)));
  for (let j = 0; j < n; j++) {
    if (hyb(j) !== 'sp3' || neighbours[j].length !== 4) continue;
    const [a, b, c, d] = neighbours[j];
    const triples: [number, number, number, number][] = [[a, b, c, 1], [a, b, d, -1], [a, c, d, 1], [b, c, d, -1]];
    const lean = triples.reduce((sum, [x, y, z, s]) => sum + s * volume(j, x, y, z), 0);
    const hand = lean < 0 ? -1 : 1;
    for (const [x, y, z, s] of triples) {
      const r = length.get(key(j, x))! * length.get(key(j, y))! * length.get(key(j, z))!;
      planes.push({ a: j, b: x, c: y, d: z, k: 2, v0: hand * s * 0.7698 * r });
    }
  }

  let pairs = pairList(pos, total, near, key, contact);
  const grad = new Float64Array(3 * total);
  const vel = new Float64Array(3 * total);
  let dt = 0.02;
  let alpha = 0.1;
  let positiveSteps = 0;
  let it = 0;
  for (; it < maxIterations; it++) {
    if (it % 20 === 0) pairs = pairList(pos, total, near, key, contact);
    grad.fill(0);
    energy(pos, grad, { stretch, angles, planes, torsions, pairs });
    let maxForce = 0;
    let power = 0;
    let vNorm = 0;
    let fNorm = 0;
    for (let k = 0; k < grad.length; k++) {
      const f = -grad[k];
      maxForce = Math.max(maxForce, Math.abs(f));
      power += f * vel[k];
      vNorm += vel[k] * vel[k];
      fNorm += f * f;
    }
    // 0.1 per Å is a bond 0.0005 Å or a 1–3 distance 0.003 Å off its target: converged for geometry;
    // what still moves then is slow torsional drift.
    if (maxForce < 0.1 && it > 50) break;
    vNorm = Math.sqrt(vNorm);
    fNorm = Math.sqrt(fNorm) || 1;
    for (let k = 0; k < grad.length; k++) vel[k] = (1 - alpha) * vel[k] + (alpha * -grad[k] * vNorm) / fNorm;
    if (power > 0) {
      if (++positiveSteps > 5) {
        dt = Math.min(dt * 1.1, 0.08);
        alpha *= 0.99;
      }
    } else {
      positiveSteps = 0;
      dt *= 0.5;
      alpha = 0.1;
      vel.fill(0);
    }
    for (let k = 0; k < grad.length; k++) {
      vel[k] += -grad[k] * dt;
      pos[k] += vel[k] * dt;
    }
  }
  const xyz: number[][] = [];
  for (let i = 0; i < total; i++) xyz.push([pos[3 * i], pos[3 * i + 1], pos[3 * i + 2]]);
  const off = (t: Term2) => Math.hypot(xyz[t.i][0] - xyz[t.j][0], xyz[t.i][1] - xyz[t.j][1], xyz[t.i][2] - xyz[t.j][2]) - t.d;
  return {
    xyz,
    iterations: it,
    // reduce, not Math.max(...list): a large molecule has more pairs than a call may take arguments.
    worstBond: stretch.reduce((w, t) => Math.max(w, Math.abs(off(t))), 0),
    worstAngle: angles.reduce((w, t) => Math.max(w, t.k >= 0 ? Math.abs(off(t)) : -off(t)), 0),
    worstContact: pairList(pos, total, near, key, contact).reduce((w, t) => Math.max(w, -off(t)), 0),
  };
}

/** mulberry32: a small seeded generator, so the same seed lifts the drawing the same way. */
function random(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The drawing scaled to 1.5 Å per bond, heavy atoms nudged off the plane, hydrogens set out around their atom. */
function start(atoms: readonly Atom[], parent: readonly number[], neighbours: readonly number[][], seed: number): Float64Array {
  const n = atoms.length;
  const rnd = random(seed);
  const pos = new Float64Array(3 * (n + parent.length));
  const lengths: number[] = [];
  for (let i = 0; i < n; i++) for (const j of neighbours[i]) if (j < n && j > i) lengths.push(Math.hypot(atoms[i].x - atoms[j].x, atoms[i].y - atoms[j].y));
  lengths.sort((a, b) => a - b);
  const scale = 1.5 / (lengths[Math.floor(lengths.length / 2)] || 1);
  atoms.forEach((a, i) => {
    pos[3 * i] = a.x * scale;
    pos[3 * i + 1] = a.y * scale;
    pos[3 * i + 2] = (rnd() - 0.5) * 0.6;
  });
  parent.forEach((p, k) => {
    // Away from the heavy neighbours in the plane, alternately above and below it.
    let dx = 0;
    let dy = 0;
    for (const j of neighbours[p]) if (j < n) {
      dx += pos[3 * p] - pos[3 * j];
      dy += pos[3 * p + 1] - pos[3 * j + 1];
    }
    const len = Math.hypot(dx, dy) || 1;
    const up = (k % 2 === 0 ? 1 : -1) * (0.5 + rnd());
    const h = 3 * (n + k);
    pos[h] = pos[3 * p] + dx / len + (rnd() - 0.5) * 0.4;
    pos[h + 1] = pos[3 * p + 1] + dy / len + (rnd() - 0.5) * 0.4;
    pos[h + 2] = pos[3 * p + 2] + up;
  });
  return pos;
}

/** Pairs three or more bonds apart that are within reach of their contact distance (a cell grid, 4 Å cells). */
function pairList(pos: Float64Array, total: number, near: Map<number, number>, key: (i: number, j: number) => number, contact: (i: number, j: number) => number): Term2[] {
  const cell = 4;
  const grid = new Map<number, number[]>();
  // Cell coordinates packed into one number (molecules span far less than 2,000 cells a side).
  const cellKey = (x: number, y: number, z: number) => ((x + 1000) * 2048 + (y + 1000)) * 2048 + (z + 1000);
  const at = (i: number) => [Math.floor(pos[3 * i] / cell), Math.floor(pos[3 * i + 1] / cell), Math.floor(pos[3 * i + 2] / cell)];
  for (let i = 0; i < total; i++) {
    const k = cellKey(...(at(i) as [number, number, number]));
    const list = grid.get(k);
    if (list) list.push(i);
    else grid.set(k, [i]);
  }
  const out: Term2[] = [];
  for (let i = 0; i < total; i++) {
    const [x, y, z] = at(i);
    for (let dx = -1; dx <= 1; dx++) for (let dy = -1; dy <= 1; dy++) for (let dz = -1; dz <= 1; dz++) {
      for (const j of grid.get(cellKey(x + dx, y + dy, z + dz)) ?? []) {
        if (j <= i) continue;
        const topo = near.get(key(i, j));
        if (topo !== undefined && topo < 3) continue;
        const d = Math.hypot(pos[3 * i] - pos[3 * j], pos[3 * i + 1] - pos[3 * j + 1], pos[3 * i + 2] - pos[3 * j + 2]);
        if (d < cell) out.push({ i, j, d: contact(i, j), k: 10 });
      }
    }
  }
  return out;
}

interface Terms { stretch: Term2[]; angles: Term2[]; planes: Term4[]; torsions: Term4[]; pairs: Term2[] }

/** Total energy; adds its gradient into `g`. */
export function energy(p: Float64Array, g: Float64Array, t: Terms): number {
  let e = 0;
  for (const s of t.stretch) e += distanceTerm(p, g, s.i, s.j, s.d, s.k, 0);
  for (const a of t.angles) e += a.k >= 0 ? distanceTerm(p, g, a.i, a.j, a.d, a.k, 0) : distanceTerm(p, g, a.i, a.j, a.d, -a.k, -1);
  for (const r of t.pairs) e += distanceTerm(p, g, r.i, r.j, r.d, r.k, -1);
  for (const q of t.planes) e += plane(p, g, q);
  for (const q of t.torsions) e += torsion(p, g, q);
  return e;
}

/** k (d − d0)²; with `onlyBelow` −1 only when d < d0 (a repulsion or a lower bound). */
function distanceTerm(p: Float64Array, g: Float64Array, i: number, j: number, d0: number, k: number, onlyBelow: 0 | -1): number {
  const dx = p[3 * i] - p[3 * j];
  const dy = p[3 * i + 1] - p[3 * j + 1];
  const dz = p[3 * i + 2] - p[3 * j + 2];
  const sq = dx * dx + dy * dy + dz * dz;
  if (onlyBelow && sq >= d0 * d0) return 0;
  const d = Math.sqrt(sq) || 1e-9;
  const diff = d - d0;
  const s = (2 * k * diff) / d;
  g[3 * i] += s * dx;
  g[3 * i + 1] += s * dy;
  g[3 * i + 2] += s * dz;
  g[3 * j] -= s * dx;
  g[3 * j + 1] -= s * dy;
  g[3 * j + 2] -= s * dz;
  return k * diff * diff;
}

const sub = (p: Float64Array, i: number, j: number) => [p[3 * i] - p[3 * j], p[3 * i + 1] - p[3 * j + 1], p[3 * i + 2] - p[3 * j + 2]];
const cross = (u: number[], v: number[]) => [u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]];
const dot = (u: number[], v: number[]) => u[0] * v[0] + u[1] * v[1] + u[2] * v[2];

/** k (V − v0)², V = (b−a)·((c−a)×(d−a)): v0 = 0 holds the four atoms in one plane. */
function plane(p: Float64Array, g: Float64Array, { a, b, c, d, k, v0 = 0 }: Term4): number {
  const u = sub(p, b, a);
  const v = sub(p, c, a);
  const w = sub(p, d, a);
  const vol = dot(u, cross(v, w)) - v0;
  const s = 2 * k * vol;
  const gb = cross(v, w);
  const gc = cross(w, u);
  const gd = cross(u, v);
  for (let x = 0; x < 3; x++) {
    g[3 * b + x] += s * gb[x];
    g[3 * c + x] += s * gc[x];
    g[3 * d + x] += s * gd[x];
    g[3 * a + x] -= s * (gb[x] + gc[x] + gd[x]);
  }
  return k * vol * vol;
}

/** k (1 + cos 3φ) for the dihedral a–b–c–d (gradient of Blondel and Karplus, J. Comput. Chem. 1996, 17, 1132). */
function torsion(p: Float64Array, g: Float64Array, { a, b, c, d, k }: Term4): number {
  const F = sub(p, a, b);
  const G = sub(p, b, c);
  const H = sub(p, d, c);
  const A = cross(F, G);
  const B = cross(H, G);
  const asq = dot(A, A);
  const bsq = dot(B, B);
  const glen = Math.sqrt(dot(G, G));
  if (asq < 1e-8 || bsq < 1e-8 || glen < 1e-6) return 0;
  const phi = Math.atan2(dot(cross(B, A), G) / glen, dot(A, B));
  const dEdphi = -3 * k * Math.sin(3 * phi);
  const fg = dot(F, G);
  const hg = dot(H, G);
  for (let x = 0; x < 3; x++) {
    const ga = (-glen / asq) * A[x];
    const gd = (glen / bsq) * B[x];
    const gb = (glen / asq) * A[x] + (fg / (asq * glen)) * A[x] - (hg / (bsq * glen)) * B[x];
    const gc = (-glen / bsq) * B[x] - (fg / (asq * glen)) * A[x] + (hg / (bsq * glen)) * B[x];
    g[3 * a + x] += dEdphi * ga;
    g[3 * b + x] += dEdphi * gb;
    g[3 * c + x] += dEdphi * gc;
    g[3 * d + x] += dEdphi * gd;
  }
  return k * (1 + Math.cos(3 * phi));
}
