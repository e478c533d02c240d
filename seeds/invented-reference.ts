import type { Molecule } from '../src/shared/chem';

// Invented reference systems (the trajectory tests, the demo seed and bench:trajectory): copies of a
// molecule (coordinates in the atom-index contract's order, Å) placed with random orientations in a periodic box, every frame with
// Gaussian thermal noise on every atom, each atom then wrapped into the box on its own, so molecules
// near the faces are cut by it. The unwrapped coordinates are kept, for checks computed from them.
// Files list each copy's atoms heavy atom by heavy atom, each followed by its hydrogens (the order
// force-field files use), which differs from the contract's order: the matcher has to find it.

export interface RefSystem {
  atomsPerCopy: number;
  copies: number;
  /** Extra lone atoms after the copies (solvent-like, skipped by the matcher). */
  solvent: number;
  elements: string[];
  names: string[];
  residues: string[];
  residueNumbers: number[];
  boxA: number;
  /** Per frame: all atoms in file order, wrapped into the box (Å). */
  frames: Float64Array[];
  /** Per frame and copy: the copy's atoms in contract order, unwrapped (Å). */
  whole: Float64Array[][];
  /** fileIndex[p]: where contract point p of a copy sits in the file, counted within the copy. */
  fileIndex: number[];
}

function rng(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

function gauss(r: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
}

function rotation(r: () => number): number[] {
  const q = [gauss(r), gauss(r), gauss(r), gauss(r)];
  const n = Math.hypot(...q);
  const [w, x, y, z] = q.map((v) => v / n);
  return [1 - 2 * (y * y + z * z), 2 * (x * y - z * w), 2 * (x * z + y * w), 2 * (x * y + z * w), 1 - 2 * (x * x + z * z), 2 * (y * z - x * w), 2 * (x * z - y * w), 2 * (y * z + x * w), 1 - 2 * (x * x + y * y)];
}

/** The file order of one copy: heavy atom, its hydrogens, next heavy atom … */
export function fileOrder(m: Molecule): number[] {
  const order: number[] = [];
  let h = m.atoms.length;
  m.atoms.forEach((a, i) => {
    order.push(i);
    for (let k = 0; k < a.hydrogens; k++) order.push(h + k);
    h += a.hydrogens;
  });
  return order;
}

export function makeSystem(m: Molecule, xyz: number[][], opts: { copies: number; frames: number; boxA: number; noiseA: number; seed: number; residue?: string; solvent?: number; /** false: every copy in the middle of its own cell, none cut by the box. */ cut?: boolean }): RefSystem {
  const r = rng(opts.seed);
  const order = fileOrder(m);
  const fileIndex: number[] = [];
  order.forEach((p, i) => (fileIndex[p] = i));
  const n = xyz.length;
  const centre = [0, 1, 2].map((k) => xyz.reduce((s, p) => s + p[k], 0) / n);
  const elements: string[] = [];
  const names: string[] = [];
  const residues: string[] = [];
  const residueNumbers: number[] = [];
  const pointElement = (p: number): string => {
    if (p < m.atoms.length) return m.atoms[p].element;
    return 'H';
  };
  for (let c = 0; c < opts.copies; c++) {
    order.forEach((p, i) => {
      const el = pointElement(p);
      elements.push(el);
      names.push(`${el.toUpperCase()}${i + 1}`.slice(0, 5));
      residues.push(opts.residue ?? 'MOL');
      residueNumbers.push(c + 1);
    });
  }
  const solvent = opts.solvent ?? 0;
  for (let s = 0; s < solvent; s++) {
    elements.push('Ar');
    names.push('Ar');
    residues.push('SOL');
    residueNumbers.push(opts.copies + s + 1);
  }
  // Copies sit on a grid (no two overlap) shifted by a random offset, so those near the faces are cut.
  const k = Math.ceil(Math.cbrt(opts.copies));
  const cell = opts.boxA / k;
  const shift = opts.cut === false ? [cell / 2, cell / 2, cell / 2] : [r() * cell, r() * cell, r() * cell];
  const poses = Array.from({ length: opts.copies }, (_, c) => ({
    rot: rotation(r),
    at: [c % k, Math.floor(c / k) % k, Math.floor(c / (k * k))].map((g, d) => g * cell + shift[d]),
  }));
  const solventAt = Array.from({ length: solvent }, () => [r() * opts.boxA, r() * opts.boxA, r() * opts.boxA]);
  const frames: Float64Array[] = [];
  const whole: Float64Array[][] = [];
  const total = opts.copies * n + solvent;
  for (let f = 0; f < opts.frames; f++) {
    const frame = new Float64Array(3 * total);
    const copies: Float64Array[] = [];
    poses.forEach((pose, c) => {
      const w = new Float64Array(3 * n);
      for (let p = 0; p < n; p++) {
        const d = [0, 1, 2].map((k) => xyz[p][k] - centre[k]);
        for (let k = 0; k < 3; k++) {
          const v = pose.rot[3 * k] * d[0] + pose.rot[3 * k + 1] * d[1] + pose.rot[3 * k + 2] * d[2];
          w[3 * p + k] = pose.at[k] + v + opts.noiseA * gauss(r);
        }
        const at = c * n + fileIndex[p];
        for (let k = 0; k < 3; k++) frame[3 * at + k] = w[3 * p + k] - Math.floor(w[3 * p + k] / opts.boxA) * opts.boxA;
      }
      copies.push(w);
    });
    solventAt.forEach((p, s) => {
      for (let k = 0; k < 3; k++) frame[3 * (opts.copies * n + s) + k] = p[k];
    });
    frames.push(frame);
    whole.push(copies);
  }
  return { atomsPerCopy: n, copies: opts.copies, solvent, elements, names, residues, residueNumbers, boxA: opts.boxA, frames, whole, fileIndex };
}

const f3 = (v: number) => (v / 10).toFixed(3).padStart(8);

export function groText(s: RefSystem, frames = s.frames): string {
  const out: string[] = [];
  frames.forEach((frame, f) => {
    out.push(`Invented reference t= ${f}.00000`, String(s.elements.length));
    for (let i = 0; i < s.elements.length; i++) {
      out.push(`${String(s.residueNumbers[i] % 100000).padStart(5)}${s.residues[i].padEnd(5)}${s.names[i].padStart(5)}${String((i + 1) % 100000).padStart(5)}${f3(frame[3 * i])}${f3(frame[3 * i + 1])}${f3(frame[3 * i + 2])}`);
    }
    out.push(`${f3(s.boxA)}${f3(s.boxA)}${f3(s.boxA)}`);
  });
  return out.join('\n') + '\n';
}

export function pdbText(s: RefSystem, frames = s.frames): string {
  const out: string[] = [`CRYST1${s.boxA.toFixed(3).padStart(9)}${s.boxA.toFixed(3).padStart(9)}${s.boxA.toFixed(3).padStart(9)}  90.00  90.00  90.00 P 1           1`];
  frames.forEach((frame, f) => {
    out.push(`MODEL     ${String(f + 1).padStart(4)}`);
    for (let i = 0; i < s.elements.length; i++) {
      const name = s.names[i].length < 4 ? ` ${s.names[i]}`.padEnd(4) : s.names[i].slice(0, 4);
      out.push(
        `HETATM${String((i + 1) % 100000).padStart(5)} ${name} ${s.residues[i].padEnd(3).slice(0, 3)} A${String(s.residueNumbers[i] % 10000).padStart(4)}    ${frame[3 * i].toFixed(3).padStart(8)}${frame[3 * i + 1].toFixed(3).padStart(8)}${frame[3 * i + 2].toFixed(3).padStart(8)}  1.00  0.00          ${s.elements[i].toUpperCase().padStart(2)}`,
      );
    }
    out.push('ENDMDL');
  });
  out.push('END');
  return out.join('\n') + '\n';
}

/** A CHARMM-style little-endian DCD with a unit cell per frame (Å, float32 coordinates). */
export function dcdBytes(s: RefSystem, frames = s.frames): Buffer {
  const n = s.elements.length;
  const parts: Buffer[] = [];
  const record = (payload: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeInt32LE(payload.length);
    parts.push(len, payload, len);
  };
  const head = Buffer.alloc(84);
  head.write('CORD', 0, 'latin1');
  head.writeInt32LE(frames.length, 4); // NSET
  head.writeInt32LE(0, 8); // ISTART
  head.writeInt32LE(1, 12); // NSAVC
  head.writeFloatLE(0.002, 40); // DELTA
  head.writeInt32LE(1, 44); // unit cell present
  head.writeInt32LE(24, 80); // CHARMM version
  record(head);
  const title = Buffer.alloc(4 + 80, ' ');
  title.writeInt32LE(1, 0);
  title.write('Invented reference', 4, 'latin1');
  record(title);
  const natom = Buffer.alloc(4);
  natom.writeInt32LE(n);
  record(natom);
  for (const frame of frames) {
    const cell = Buffer.alloc(48);
    [s.boxA, 90, s.boxA, 90, 90, s.boxA].forEach((v, i) => cell.writeDoubleLE(v, 8 * i));
    record(cell);
    for (let k = 0; k < 3; k++) {
      const c = Buffer.alloc(4 * n);
      for (let i = 0; i < n; i++) c.writeFloatLE(frame[3 * i + k], 4 * i);
      record(c);
    }
  }
  return Buffer.concat(parts);
}
