/**
 * The CG trajectory of an analysis (bead centres of every copy, frame by frame) as multi-frame GRO,
 * multi-model PDB (wwPDB fixed columns) or TRR (GROMACS's portable binary trajectory: XDR big-endian,
 * single precision; the header as GROMACS's trrio writes it, no box). Written frame by frame from
 * centres.f32, so memory follows one frame. Bead names are the atom names, each copy one residue.
 */
import { open } from 'node:fs/promises';
import type { Writable } from 'node:stream';

export interface CgLayout {
  frames: number;
  copies: number;
  beadNames: string[];
  residue: string;
  title: string;
}

async function eachFrame(path: string, l: CgLayout, fn: (f: number, xyz: Float32Array) => Promise<void>): Promise<void> {
  const per = l.copies * l.beadNames.length * 3;
  const fh = await open(path, 'r');
  try {
    for (let f = 0; f < l.frames; f++) {
      const xyz = new Float32Array(per);
      await fh.read(new Uint8Array(xyz.buffer), 0, per * 4, f * per * 4);
      await fn(f, xyz);
    }
  } finally {
    await fh.close();
  }
}

function write(out: Writable, chunk: string | Uint8Array): Promise<void> {
  return new Promise((resolve) => (out.write(chunk) ? resolve() : out.once('drain', resolve)));
}

export async function writeCgGro(path: string, l: CgLayout, out: Writable): Promise<void> {
  const nb = l.beadNames.length;
  await eachFrame(path, l, async (f, xyz) => {
    const lines = [`${l.title} t= ${f}`, String(l.copies * nb)];
    for (let c = 0; c < l.copies; c++) {
      for (let b = 0; b < nb; b++) {
        const i = c * nb + b;
        const n = (v: number) => v.toFixed(3).padStart(8);
        lines.push(`${String((c + 1) % 100000).padStart(5)}${l.residue.padEnd(5).slice(0, 5)}${l.beadNames[b].slice(0, 5).padStart(5)}${String((i + 1) % 100000).padStart(5)}${n(xyz[3 * i])}${n(xyz[3 * i + 1])}${n(xyz[3 * i + 2])}`);
      }
    }
    lines.push('   0.00000   0.00000   0.00000');
    await write(out, lines.join('\n') + '\n');
  });
}

export async function writeCgPdb(path: string, l: CgLayout, out: Writable): Promise<void> {
  const nb = l.beadNames.length;
  await write(out, `REMARK   1 ${l.title.slice(0, 68)}\n`);
  await eachFrame(path, l, async (f, xyz) => {
    const lines = [`MODEL     ${String(f + 1).padStart(4)}`];
    for (let c = 0; c < l.copies; c++) {
      for (let b = 0; b < nb; b++) {
        const i = c * nb + b;
        const a = (v: number) => (v * 10).toFixed(3).padStart(8);
        const name = l.beadNames[b].slice(0, 4);
        lines.push(`HETATM${String((i + 1) % 100000).padStart(5)} ${(name.length < 4 ? ` ${name}` : name).padEnd(4)} ${l.residue.slice(0, 3).padEnd(3)} A${String((c + 1) % 10000).padStart(4)}    ${a(xyz[3 * i])}${a(xyz[3 * i + 1])}${a(xyz[3 * i + 2])}  1.00  0.00           C`);
      }
    }
    lines.push('ENDMDL');
    await write(out, lines.join('\n') + '\n');
  });
  await write(out, 'END\n');
}

export async function writeCgTrr(path: string, l: CgLayout, out: Writable): Promise<void> {
  const n = l.copies * l.beadNames.length;
  await eachFrame(path, l, async (f, xyz) => {
    const version = 'GMX_trn_file';
    const head = Buffer.alloc(4 + 4 + 4 + 12 + 13 * 4 + 8);
    let p = 0;
    const int = (v: number) => {
      head.writeInt32BE(v, p);
      p += 4;
    };
    int(1993);
    int(version.length + 1); // the string's length with its terminator, as xdr_string writes it
    int(version.length);
    head.write(version, p, 'latin1');
    p += 12;
    // ir, e, box, vir, pres, top, sym, x, v, f sizes; natoms, step, nre
    [0, 0, 0, 0, 0, 0, 0, 12 * n, 0, 0, n, f, 0].forEach(int);
    head.writeFloatBE(f, p); // time (ps): the frame number
    head.writeFloatBE(0, p + 4); // lambda
    const body = Buffer.alloc(12 * n);
    for (let i = 0; i < 3 * n; i++) body.writeFloatBE(xyz[i], 4 * i);
    await write(out, head);
    await write(out, body);
  });
}
