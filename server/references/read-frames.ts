/**
 * Coordinates of a range of frames, read with molstar's readers (XTC, TRR, DCD, GRO, XYZ; PDB lines
 * through its tokenizer, columns per the wwPDB format). Only the range's bytes are read from disk, so
 * memory follows the range, not the file. Coordinates come back in Å; boxes as nine
 * numbers in Å (box.ts), or null when the frame has none.
 *
 * molstar's TRR and DCD readers view `data.buffer` from byte 0, so each range is read into a fresh
 * buffer of its own.
 *
 * The analysis reads columns (readFrameColumns: molstar's own x, y, z arrays, no copy) and may ask
 * for the first `atoms` atoms only. XTC compresses atom after atom, each from the ones before, so the
 * atoms before a given one decode the same whether or not the rest are decoded: the range's frame
 * headers are given that smaller atom count (the coordinate block's length stays, so the reader
 * still steps to the next frame) and molstar stops there. Solvent written after the solute, as
 * GROMACS systems usually are, is then never decoded. Its DCD reader reads the unit cell's second value from a wrong offset; the box
 * lengths A, B, C (cell values 0, 2, 5) are right and are all that is used here.
 */
import { readSync } from 'node:fs';
import { open } from 'node:fs/promises';
import { parseXtc } from 'molstar/lib/mol-io/reader/xtc/parser.js';
import { parseTrr } from 'molstar/lib/mol-io/reader/trr/parser.js';
import { parseDcd } from 'molstar/lib/mol-io/reader/dcd/parser.js';
import { parseGRO } from 'molstar/lib/mol-io/reader/gro/parser.js';
import { parseXyz } from 'molstar/lib/mol-io/reader/xyz/parser.js';
import { parsePDB } from 'molstar/lib/mol-io/reader/pdb/parser.js';
import { FrameError, type FrameIndex } from './frame-index';

export interface Frame {
  xyz: Float32Array;
  box: Float64Array | null;
}

/** One frame as columns (Å); only the first `count` atoms are meant to be read. */
export interface FrameColumns {
  count: number;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  z: ArrayLike<number>;
  box: Float64Array | null;
}

/**
 * `file`: a path (opened and closed for the read), or a descriptor the caller keeps open and reads
 * synchronously: an analysis thread reads chunk after chunk and does nothing else meanwhile, so a
 * blocking read there saves the open, the close and the trips through libuv's thread pool.
 */
async function readBytes(file: string | number, at: number, length: number, prefix?: Uint8Array): Promise<Uint8Array> {
  const out = new Uint8Array((prefix?.length ?? 0) + length);
  if (prefix) out.set(prefix, 0);
  if (typeof file === 'number') {
    readSync(file, out, prefix?.length ?? 0, length, at);
    return out;
  }
  const fh = await open(file, 'r');
  try {
    await fh.read(out, prefix?.length ?? 0, length, at);
  } finally {
    await fh.close();
  }
  return out;
}

function interleave(count: number, x: ArrayLike<number>, y: ArrayLike<number>, z: ArrayLike<number>): Float32Array {
  const out = new Float32Array(3 * count);
  for (let i = 0; i < count; i++) {
    out[3 * i] = x[i];
    out[3 * i + 1] = y[i];
    out[3 * i + 2] = z[i];
  }
  return out;
}

const rectangular = (a: number, b: number, c: number): Float64Array | null => (a > 0 && b > 0 && c > 0 ? Float64Array.from([a, 0, 0, 0, b, 0, 0, 0, c]) : null);

/** Frames from (0-based) up to but not including `to`, interleaved. */
export async function readFrames(path: string | number, index: FrameIndex, from: number, to: number): Promise<Frame[]> {
  if (index.format === 'pdb') {
    const text = Buffer.from(await readBytes(path, index.offsets[from], index.offsets[to] - index.offsets[from])).toString('latin1');
    // A CRYST1 written once before the models holds for every model without its own.
    const box = index.box ? Float64Array.from(index.box) : null;
    return (await pdbFrames(text)).map((f) => ({ xyz: f.xyz, box: f.box ?? box }));
  }
  return (await readFrameColumns(path, index, from, to)).map((f) => ({ xyz: interleave(f.count, f.x, f.y, f.z), box: f.box }));
}

/**
 * Frames from (0-based) up to but not including `to`, as columns. `atoms`: how many atoms from the
 * start are needed (all when absent); XTC then decodes no further (see above), other formats read all.
 * `path` may be an open descriptor (readBytes).
 */
export async function readFrameColumns(path: string | number, index: FrameIndex, from: number, to: number, atoms = index.atoms): Promise<FrameColumns[]> {
  const start = index.offsets[from];
  const length = index.offsets[to] - start;
  const fail = (message: string): never => {
    throw new FrameError(`${message} (in frames ${from + 1}–${to}).`, from + 1);
  };
  switch (index.format) {
    case 'xtc': {
      const bytes = await readBytes(path, start, length);
      // Fewer than 10 atoms would switch the reader to XTC's uncompressed layout: keep the count then.
      if (atoms < index.atoms && atoms > 9 && index.atoms > 9) limitXtcAtoms(bytes, index.offsets, from, to, atoms);
      const r = await parseXtc(bytes).run();
      if (r.isError) return fail(`The XTC file could not be read: ${r.message}`);
      return r.result.frames.map((f, i) => ({ count: Math.min(f.count, atoms), x: f.x, y: f.y, z: f.z, box: Float64Array.from(r.result.boxes[i]) }));
    }
    case 'trr': {
      const r = await parseTrr(await readBytes(path, start, length)).run();
      if (r.isError) return fail(`The TRR file could not be read: ${r.message}`);
      return r.result.frames.map((f, i) => ({ count: f.count, x: f.x, y: f.y, z: f.z, box: r.result.boxes[i] ? Float64Array.from(r.result.boxes[i]) : null }));
    }
    case 'dcd': {
      const header = await readBytes(path, 0, index.headerBytes);
      // The header's frame count (NSET) must say how many frames this range holds.
      new DataView(header.buffer).setInt32(8, to - from, true);
      const r = await parseDcd(await readBytes(path, start, length, header)).run();
      if (r.isError) return fail(`The DCD file could not be read: ${String(r.message)}`);
      return r.result.frames.map((f) => ({ count: f.elementCount, x: f.x, y: f.y, z: f.z, box: f.cell ? rectangular(f.cell[0], f.cell[2], f.cell[5]) : null }));
    }
    case 'gro': {
      const text = Buffer.from(await readBytes(path, start, length)).toString('latin1');
      const r = await parseGRO(text).run();
      if (r.isError) return fail(`The GRO file could not be read: ${r.message}`);
      return r.result.structures.map((s: GroStructure) => ({
        count: s.atoms.count,
        x: col(s.atoms.x, s.atoms.count, 10),
        y: col(s.atoms.y, s.atoms.count, 10),
        z: col(s.atoms.z, s.atoms.count, 10),
        box: rectangular(10 * s.header.box[0], 10 * s.header.box[1], 10 * s.header.box[2]),
      }));
    }
    case 'xyz': {
      const text = Buffer.from(await readBytes(path, start, length)).toString('latin1');
      const r = await parseXyz(text).run();
      if (r.isError) return fail(`The XYZ file could not be read: ${r.message}`);
      return r.result.molecules.map((m) => ({ count: m.count, x: col(m.x, m.count, 1), y: col(m.y, m.count, 1), z: col(m.z, m.count, 1), box: null }));
    }
    case 'pdb': {
      const frames = await readFrames(path, index, from, to);
      return frames.map((f) => {
        const n = f.xyz.length / 3;
        const [x, y, z] = [0, 1, 2].map((k) => Float32Array.from({ length: n }, (_, i) => f.xyz[3 * i + k]));
        return { count: n, x, y, z, box: f.box };
      });
    }
  }
}

/**
 * Sets the atom count of each XTC frame header in `bytes` (the frames from … to of the index) to
 * `atoms`: both places the header holds it (after the magic number, and before the precision).
 */
function limitXtcAtoms(bytes: Uint8Array, offsets: number[], from: number, to: number, atoms: number): void {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let f = from; f < to; f++) {
    const at = offsets[f] - offsets[from];
    view.setInt32(at + 4, atoms);
    view.setInt32(at + 52, atoms);
  }
}

interface NumberColumn {
  value(row: number): number;
}
interface GroStructure {
  header: { box: number[] };
  atoms: { count: number; x: NumberColumn; y: NumberColumn; z: NumberColumn };
}

// float32, as the binary formats give them (and as the analysis always saw them).
function col(c: NumberColumn, n: number, scale: number): Float32Array {
  const out = new Float32Array(n);
  for (let i = 0; i < n; i++) out[i] = c.value(i) * scale;
  return out;
}

/** Models of PDB text: ATOM/HETATM coordinates (columns 31–54) and CRYST1 (a, b, c; rectangular). */
export async function pdbFrames(text: string): Promise<Frame[]> {
  const r = await parsePDB(text).run();
  if (r.isError) throw new FrameError(`The PDB file could not be read: ${r.message}`, 1);
  const { lines } = r.result;
  const frames: Frame[] = [];
  let xyz: number[] = [];
  let box: Float64Array | null = null;
  const flush = () => {
    if (xyz.length) frames.push({ xyz: Float32Array.from(xyz), box });
    xyz = [];
  };
  for (let i = 0; i < lines.count; i++) {
    const line = text.slice(lines.indices[2 * i], lines.indices[2 * i + 1]);
    const rec = line.slice(0, 6);
    if (rec === 'ATOM  ' || rec === 'HETATM') xyz.push(Number(line.slice(30, 38)), Number(line.slice(38, 46)), Number(line.slice(46, 54)));
    else if (rec === 'CRYST1') box = rectangular(Number(line.slice(6, 15)), Number(line.slice(15, 24)), Number(line.slice(24, 33)));
    else if (rec === 'ENDMDL' || rec.trim() === 'END') flush();
  }
  flush();
  return frames;
}
