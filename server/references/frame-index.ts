/**
 * Where each frame of a trajectory file starts, found by reading frame headers only, so a file of any
 * size is indexed with a few kilobytes of memory. A frame that does not start with its format's
 * marker, or that runs past the end of the file, stops the index with an error naming it (1-based),
 * so a truncated or corrupt file is refused before any analysis.
 *
 * XTC (GROMACS xtcio/libxdrf): magic 1995, natoms, step, time, box (9 floats), natoms again; then
 * for more than 9 atoms precision, minint[3], maxint[3], smallidx and the byte count of the
 * compressed coordinates, padded to 4 bytes; all big-endian XDR.
 * TRR (GROMACS trrio): magic 1993, a version string, 13 block sizes and counts, time and lambda, then
 * the box, virial, pressure, x, v and f blocks of the sizes the header gave.
 * DCD (CHARMM/NAMD, Fortran unformatted records): an 84-byte header record, a title record, the atom
 * count record, then per frame an optional unit-cell record (48 bytes) and three coordinate records.
 * Text formats (gro, pdb, xyz) are indexed by counting lines.
 */
import { open, type FileHandle } from 'node:fs/promises';
import type { TrajectoryFormat } from './formats';

export interface FrameIndex {
  format: TrajectoryFormat;
  atoms: number;
  /** offsets[f] … offsets[f + 1]: the bytes of frame f; offsets.length = frames + 1. */
  offsets: number[];
  /** DCD: the bytes before the first frame (its header), which every frame range needs. */
  headerBytes: number;
  /** DCD: whether frames carry a unit cell record; little-endian. */
  dcdCell?: boolean;
  /** PDB: the box of a CRYST1 record written once before the models (Å, box.ts layout). */
  box?: number[];
}

export class FrameError extends Error {
  constructor(
    message: string,
    readonly frame: number,
  ) {
    super(message);
  }
}

export async function indexFrames(path: string, format: TrajectoryFormat, onProgress?: (bytes: number, total: number) => void): Promise<FrameIndex> {
  const fh = await open(path, 'r');
  try {
    const { size } = await fh.stat();
    if (format === 'xtc') return await indexXtc(fh, size, onProgress);
    if (format === 'trr') return await indexTrr(fh, size, onProgress);
    if (format === 'dcd') return await indexDcd(fh, size);
    return await indexText(fh, size, format, onProgress);
  } finally {
    await fh.close();
  }
}

async function readAt(fh: FileHandle, at: number, length: number): Promise<Buffer> {
  const buf = Buffer.alloc(length);
  const { bytesRead } = await fh.read(buf, 0, length, at);
  return buf.subarray(0, bytesRead);
}

async function indexXtc(fh: FileHandle, size: number, onProgress?: (b: number, t: number) => void): Promise<FrameIndex> {
  const offsets: number[] = [];
  let atoms = -1;
  let at = 0;
  while (at < size) {
    const f = offsets.length + 1;
    const h = await readAt(fh, at, 92);
    if (h.length < 56) throw new FrameError(`The XTC file is truncated in frame ${f}.`, f);
    if (h.readInt32BE(0) !== 1995) throw new FrameError(`The XTC file is corrupt at frame ${f}: no frame header where one should start.`, f);
    const n = h.readInt32BE(4);
    if (atoms < 0) atoms = n;
    if (n !== atoms || h.readInt32BE(52) !== n) throw new FrameError(`The XTC file is corrupt at frame ${f}: its atom count changes.`, f);
    let length: number;
    if (n <= 9) length = 56 + 12 * n;
    else {
      if (h.length < 92) throw new FrameError(`The XTC file is truncated in frame ${f}.`, f);
      const bytes = h.readInt32BE(88);
      if (bytes < 0) throw new FrameError(`The XTC file is corrupt at frame ${f}.`, f);
      length = 92 + Math.ceil(bytes / 4) * 4;
    }
    if (at + length > size) throw new FrameError(`The XTC file is truncated in frame ${f}.`, f);
    offsets.push(at);
    at += length;
    if (offsets.length % 256 === 0) onProgress?.(at, size);
  }
  offsets.push(at);
  return { format: 'xtc', atoms: Math.max(atoms, 0), offsets, headerBytes: 0 };
}

async function indexTrr(fh: FileHandle, size: number, onProgress?: (b: number, t: number) => void): Promise<FrameIndex> {
  const offsets: number[] = [];
  let atoms = -1;
  let at = 0;
  while (at < size) {
    const f = offsets.length + 1;
    const h = await readAt(fh, at, 128);
    if (h.length < 12 || h.readInt32BE(0) !== 1993) {
      throw new FrameError(h.length < 12 ? `The TRR file is truncated in frame ${f}.` : `The TRR file is corrupt at frame ${f}: no frame header where one should start.`, f);
    }
    const versionBytes = h.readInt32BE(8);
    const p = 12 + versionBytes;
    if (versionBytes < 0 || versionBytes > 64 || h.length < p + 52) throw new FrameError(`The TRR file is corrupt or truncated at frame ${f}.`, f);
    const ints = Array.from({ length: 13 }, (_, i) => h.readInt32BE(p + 4 * i));
    const [irSize, eSize, boxSize, virSize, presSize, topSize, symSize, xSize, vSize, fSize, n] = ints;
    const real = boxSize ? boxSize / 9 : xSize ? xSize / (3 * n) : 4;
    if (real !== 4 && real !== 8) throw new FrameError(`The TRR file is corrupt at frame ${f}.`, f);
    if (atoms < 0) atoms = n;
    if (n !== atoms) throw new FrameError(`The TRR file is corrupt at frame ${f}: its atom count changes.`, f);
    if (!xSize) throw new FrameError(`Frame ${f} of the TRR file has no coordinates.`, f);
    const length = p + 52 + 2 * real + irSize + eSize + boxSize + virSize + presSize + topSize + symSize + xSize + vSize + fSize;
    if (at + length > size) throw new FrameError(`The TRR file is truncated in frame ${f}.`, f);
    offsets.push(at);
    at += length;
    if (offsets.length % 256 === 0) onProgress?.(at, size);
  }
  offsets.push(at);
  return { format: 'trr', atoms: Math.max(atoms, 0), offsets, headerBytes: 0 };
}

async function indexDcd(fh: FileHandle, size: number): Promise<FrameIndex> {
  const h = await readAt(fh, 0, 100);
  if (h.length < 92 || h.readInt32LE(0) !== 84 || h.toString('latin1', 4, 8) !== 'CORD') {
    throw new FrameError('The DCD file has no CHARMM/NAMD header (only little-endian DCD files are read).', 0);
  }
  const charmm = h.readInt32LE(4 + 80) !== 0;
  const cell = charmm && h.readInt32LE(4 + 44) !== 0;
  const fourDims = charmm && h.readInt32LE(4 + 48) === 1;
  if (h.readInt32LE(4 + 36) > 0) throw new FrameError('DCD files with fixed atoms are not read.', 0);
  let at = 92;
  const titleLen = (await readAt(fh, at, 4)).readInt32LE(0);
  at += titleLen + 8;
  const natomRec = await readAt(fh, at, 12);
  if (natomRec.length < 12 || natomRec.readInt32LE(0) !== 4) throw new FrameError('The DCD file header is corrupt.', 0);
  const atoms = natomRec.readInt32LE(4);
  at += 12;
  const headerBytes = at;
  const frameBytes = (cell ? 56 : 0) + 3 * (8 + 4 * atoms);
  if (fourDims) throw new FrameError('Four-dimensional DCD files are not read.', 0);
  const offsets: number[] = [];
  while (at < size) {
    const f = offsets.length + 1;
    if (at + frameBytes > size) throw new FrameError(`The DCD file is truncated in frame ${f}.`, f);
    const mark = (await readAt(fh, at + (cell ? 56 : 0), 4)).readInt32LE(0);
    if ((cell && (await readAt(fh, at, 4)).readInt32LE(0) !== 48) || mark !== 4 * atoms) throw new FrameError(`The DCD file is corrupt at frame ${f}.`, f);
    offsets.push(at);
    at += frameBytes;
  }
  offsets.push(at);
  return { format: 'dcd', atoms, offsets, headerBytes, dcdCell: cell };
}

/** Lines of gro (title, count, atoms, box), pdb (MODEL … ENDMDL, or the whole file) and xyz (count, comment, atoms). */
async function indexText(fh: FileHandle, size: number, format: TrajectoryFormat, onProgress?: (b: number, t: number) => void): Promise<FrameIndex> {
  const offsets: number[] = [];
  let atoms = -1;
  let lineStart = 0;
  let pending = '';
  // gro/xyz: lines left in the current frame; -1 while waiting for the count line.
  let left = 0;
  let lineInFrame = 0;
  let pdbAtoms = 0;
  let pdbFrameStart = -1;
  const chunk = Buffer.alloc(1 << 22);
  let pos = 0;
  let box: number[] | undefined;
  const line = (text: string, start: number, end: number): void => {
    if (format === 'pdb') {
      const rec = text.slice(0, 6).trim();
      if (rec === 'CRYST1' && offsets.length === 0 && pdbFrameStart < 0) {
        const [a, b, c] = [text.slice(6, 15), text.slice(15, 24), text.slice(24, 33)].map(Number);
        if (a > 0 && b > 0 && c > 0) box = [a, 0, 0, 0, b, 0, 0, 0, c];
      }
      if (rec === 'MODEL' || (pdbFrameStart < 0 && (rec === 'ATOM' || rec === 'HETATM'))) {
        if (pdbFrameStart < 0) pdbFrameStart = start;
        if (rec === 'ATOM' || rec === 'HETATM') pdbAtoms++;
      } else if (rec === 'ATOM' || rec === 'HETATM') pdbAtoms++;
      else if ((rec === 'ENDMDL' || rec === 'END') && pdbFrameStart >= 0) {
        const f = offsets.length + 1;
        if (atoms < 0) atoms = pdbAtoms;
        if (pdbAtoms !== atoms) throw new FrameError(`Model ${f} of the PDB file has ${pdbAtoms} atoms; the first has ${atoms}.`, f);
        offsets.push(pdbFrameStart);
        pdbFrameStart = -1;
        pdbAtoms = 0;
        offsetsEnd = end;
      }
      return;
    }
    if (left === 0) {
      if (text.trim() === '') return;
      offsets.push(start);
      lineInFrame = 0;
      left = -1;
    }
    lineInFrame++;
    const countLine = format === 'gro' ? 2 : 1;
    if (lineInFrame === countLine) {
      const n = Number(text.trim());
      const f = offsets.length;
      if (!Number.isInteger(n) || n <= 0) throw new FrameError(`Frame ${f} of the ${format.toUpperCase()} file has no atom count where one should be.`, f);
      if (atoms < 0) atoms = n;
      if (n !== atoms) throw new FrameError(`Frame ${f} of the ${format.toUpperCase()} file has ${n} atoms; the first has ${atoms}.`, f);
      left = format === 'gro' ? n + 1 : n + 1;
      return;
    }
    if (left > 0) {
      left--;
      if (left === 0) offsetsEnd = end;
    }
  };
  let offsetsEnd = 0;
  while (pos < size) {
    const { bytesRead } = await fh.read(chunk, 0, chunk.length, pos);
    if (bytesRead === 0) break;
    const text = pending + chunk.toString('latin1', 0, bytesRead);
    const base = pos - pending.length;
    let from = 0;
    for (let nl = text.indexOf('\n'); nl >= 0; nl = text.indexOf('\n', from)) {
      lineStart = base + from;
      line(text.slice(from, nl), lineStart, base + nl + 1);
      from = nl + 1;
    }
    pending = text.slice(from);
    pos += bytesRead;
    onProgress?.(pos, size);
  }
  if (pending.trim() !== '') line(pending, size - pending.length, size);
  if (format === 'pdb' && pdbFrameStart >= 0 && pdbAtoms > 0) {
    // A last model without ENDMDL/END, or a file of one model without MODEL records.
    const f = offsets.length + 1;
    if (atoms >= 0 && pdbAtoms !== atoms) throw new FrameError(`Model ${f} of the PDB file has ${pdbAtoms} atoms; the first has ${atoms}.`, f);
    if (atoms < 0) atoms = pdbAtoms;
    offsets.push(pdbFrameStart);
    offsetsEnd = size;
  }
  if (format !== 'pdb' && left !== 0) {
    const f = offsets.length;
    throw new FrameError(`The ${format.toUpperCase()} file is truncated in frame ${f}.`, f);
  }
  if (offsets.length === 0) throw new FrameError(`The ${format.toUpperCase()} file holds no frame.`, 1);
  offsets.push(offsetsEnd);
  return { format, atoms, offsets, headerBytes: 0, ...(box ? { box } : {}) };
}
