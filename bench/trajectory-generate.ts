/**
 * The invented system of bench:trajectory (bench/trajectory.ts), written to a folder: conf.gro, and
 * traj.xtc made by `gmx trjconv` from TRR frames streamed to disk (one frame in memory). Copies of a
 * 40-atom surfactant (CCCCCCCCOCCOCCO, 15 heavy atoms + 25 H) on a grid with thermal noise, plus
 * lone argon atoms (10 % of the atoms) for the matcher to skip. The same poses every frame (same
 * seed) with a fresh jitter per frame. With `repeat` > 1 the XTC is then concatenated with itself
 * that many times (XTC frames stand alone, so the result is a valid trajectory of repeat × frames
 * frames), to reach file sizes (gigabytes) that would take too long to generate frame by frame.
 */
import { spawnSync } from 'node:child_process';
import { createReadStream, createWriteStream, existsSync } from 'node:fs';
import { readFile, rm, stat, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { generateConformer, parseMolecule } from '../server/chem/index';
import { groText, makeSystem } from '../seeds/invented-reference';
import type { Mapping, Molecule } from '../src/shared/chem';

export const BENCH_SMILES = 'CCCCCCCCOCCOCCO';

/** Four beads of the bench molecule (mass centres), as a draft mapping. */
export const benchMapping = (): Mapping => ({
  beads: [[0, 1, 2], [3, 4, 5], [6, 7, 8, 9], [10, 11, 12, 13, 14]].map((atoms, i) => ({ id: `b${i}`, name: `B${i + 1}`, centre: 'mass' as const, atoms: atoms.map((index) => ({ index, weight: 1 })) })),
});

export interface Generated {
  dir: string;
  atoms: number;
  copies: number;
  frames: number;
  xtc: string;
  xtcBytes: number;
}

/** Writes (or reuses, when `dir` already holds the same settings) the bench's files. */
export async function generate(dir: string, opts: { copies: number; frames: number; repeat: number; gmx: string }, mol?: Molecule): Promise<Generated> {
  const meta = join(dir, 'bench.json');
  const key = JSON.stringify(opts);
  const xtc = join(dir, opts.repeat > 1 ? `traj-x${opts.repeat}.xtc` : 'traj.xtc');
  if (existsSync(meta) && existsSync(xtc)) {
    const m = JSON.parse(await readFile(meta, 'utf8')) as { key: string; atoms: number };
    if (m.key === key) return { dir, atoms: m.atoms, copies: opts.copies, frames: opts.frames * opts.repeat, xtc, xtcBytes: (await stat(xtc)).size };
  }
  const { copies, frames } = opts;
  const molecule = mol ?? (await parseMolecule({ smiles: BENCH_SMILES }));
  const xyz = await generateConformer(molecule, { seed: 1 });
  const k = Math.ceil(Math.cbrt(copies));
  const boxA = k * 24;
  const system = () => makeSystem(molecule, xyz, { copies, frames: 1, boxA, noiseA: 0.06, seed: 1, solvent: Math.round(copies * 4) });
  const first = system();
  const atoms = first.elements.length;
  await writeFile(join(dir, 'conf.gro'), groText(first));
  const out = createWriteStream(join(dir, 'traj.trr'));
  for (let f = 0; f < frames; f++) {
    const frame = system().frames[0];
    // GROMACS trrio layout, single precision, with the box.
    const head = Buffer.alloc(24 + 52 + 8);
    let p = 0;
    const int = (v: number) => ((head.writeInt32BE(v, p), (p += 4)));
    int(1993); int(13); int(12); head.write('GMX_trn_file', p, 'latin1'); p += 12;
    [0, 0, 36, 0, 0, 0, 0, 12 * atoms, 0, 0, atoms, f, 0].forEach(int);
    head.writeFloatBE(f, p); head.writeFloatBE(0, p + 4);
    const box = Buffer.alloc(36);
    box.writeFloatBE(boxA / 10, 0); box.writeFloatBE(boxA / 10, 16); box.writeFloatBE(boxA / 10, 32);
    const body = Buffer.alloc(12 * atoms);
    for (let i = 0; i < 3 * atoms; i++) body.writeFloatBE(frame[i] / 10 + (((i * 2654435761 + f * 40503) % 1000) / 1000 - 0.5) * 0.004, 4 * i);
    if (!out.write(Buffer.concat([head, box, body]))) await new Promise<void>((r) => out.once('drain', () => r()));
  }
  await new Promise<void>((r) => out.end(() => r()));
  const conv = spawnSync(opts.gmx, ['-quiet', 'trjconv', '-f', 'traj.trr', '-s', 'conf.gro', '-o', 'traj.xtc'], { cwd: dir, input: '0\n', encoding: 'utf8' });
  if (conv.status !== 0) throw new Error(conv.stderr);
  await rm(join(dir, 'traj.trr'));
  if (opts.repeat > 1) {
    const big = createWriteStream(xtc);
    for (let r = 0; r < opts.repeat; r++) await pipeline(createReadStream(join(dir, 'traj.xtc')), big, { end: r === opts.repeat - 1 });
  }
  await writeFile(meta, JSON.stringify({ key, atoms }));
  return { dir, atoms, copies, frames: frames * opts.repeat, xtc, xtcBytes: (await stat(xtc)).size };
}
