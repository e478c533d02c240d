import { createRequire } from 'node:module';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { inflateSync } from 'node:zlib';

// The app's own Open Sans (the @fontsource/open-sans files the client bundles) for the PNG export,
// so a picture never depends on the fonts of the machine it is made on. resvg reads TrueType/OpenType
// files only, and the package ships WOFF: each WOFF file is unpacked once into a plain TrueType file
// (W3C WOFF 1.0 §3–5: a 44-byte header, a 20-byte directory entry per table, tables zlib-compressed
// when their compressed length is below the original) under the system's temp directory.

const WEIGHTS = ['400', '600', '700'] as const;
let cached: string[] | null = null;

export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 file');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_v, i) => {
    const at = 44 + i * 20;
    const [offset, compLength, origLength, checksum] = [woff.readUInt32BE(at + 4), woff.readUInt32BE(at + 8), woff.readUInt32BE(at + 12), woff.readUInt32BE(at + 16)];
    const raw = woff.subarray(offset, offset + compLength);
    return { tag: woff.subarray(at, at + 4), checksum, data: compLength < origLength ? inflateSync(raw) : raw };
  });
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const head = Buffer.alloc(12 + 16 * numTables);
  head.writeUInt32BE(flavor, 0);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(searchRange, 6);
  head.writeUInt16BE(entrySelector, 8);
  head.writeUInt16BE(numTables * 16 - searchRange, 10);
  const bodies: Buffer[] = [];
  let offset = head.length;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    t.tag.copy(head, at);
    head.writeUInt32BE(t.checksum, at + 4);
    head.writeUInt32BE(offset, at + 8);
    head.writeUInt32BE(t.data.length, at + 12);
    const padded = Buffer.alloc((t.data.length + 3) & ~3);
    t.data.copy(padded);
    bodies.push(padded);
    offset += padded.length;
  });
  return Buffer.concat([head, ...bodies]);
}

/** Paths of TrueType files of the app's Open Sans (regular, semibold, bold; Latin). */
export function bundledFontFiles(): string[] {
  if (cached) return cached;
  const require = createRequire(import.meta.url);
  const pkg = require.resolve('@fontsource/open-sans/package.json');
  const dir = join(dirname(pkg), 'files');
  // One folder per package version, so an upgrade never reuses older unpacked files.
  const out = join(tmpdir(), `beadloom-fonts-${(JSON.parse(readFileSync(pkg, 'utf8')) as { version: string }).version}`);
  mkdirSync(out, { recursive: true });
  cached = WEIGHTS.map((w) => {
    const source = join(dir, `open-sans-latin-${w}-normal.woff`);
    const target = join(out, `open-sans-latin-${w}-normal.ttf`);
    if (!existsSync(target)) {
      // Written aside and renamed, so a process reading it never sees half a file.
      const partial = `${target}.${process.pid}.part`;
      writeFileSync(partial, woffToSfnt(readFileSync(source)));
      renameSync(partial, target);
    }
    return target;
  });
  return cached;
}
