/**
 * `npm run bench:trajectory [-- --copies 1000 --frames 500]`: Beadloom's apply-mapping-and-
 * distributions against `gmx traj -com -n` on the same XTC, in the same run.
 *
 * The system is invented (seeds/invented-reference.ts): copies of a 40-atom surfactant (C12E4 minus
 * three carbons' worth: CCCCCCCCOCCOCCO, 15 heavy atoms + 25 H = 40 atoms) on a grid with thermal noise,
 * plus 10 % solvent-like argon atoms to skip. Frames are written as TRR (streamed, one frame in
 * memory) and turned into XTC by `gmx trjconv`. Beadloom's side: matching on the first frame, then the
 * analysis exactly as the job runs it (two worker threads over halves of the frames, distributions
 * at the end). GROMACS's side: `gmx traj -com -n` with Beadloom's .ndx (one group per bead over all
 * copies). Peak RSS is this process's (worker threads included). The load average is printed beside
 * the numbers: the machine is shared.
 */
import { spawnSync } from 'node:child_process';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm, writeFile, stat } from 'node:fs/promises';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseMolecule, generateConformer, evaluateMapping } from '../server/chem/index';
import { matchReference } from '../server/references/match-reference';
import { runTaskThread } from '../server/workers/task-thread';
import { planAnalysis } from '../server/analyses/analysis-plan';
import { buildResult } from '../server/analyses/analysis-result';
import type { AnalysisPart, AnalysisTask } from '../server/analyses/analysis-task';
import type { FrameIndex } from '../server/references/frame-index';
import { readFile } from 'node:fs/promises';
import { beadIndexGroups, writeNdx } from '../server/exports/ndx';
import { groText, makeSystem } from '../seeds/invented-reference';
import type { Mapping } from '../src/shared/chem';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const COPIES = arg('copies', 1000);
const FRAMES = arg('frames', 500);
const GMX = process.env.GMX_PATH ?? 'gmx';

const dir = await mkdtemp(join(tmpdir(), 'beadloom-bench-traj-'));
const mol = await parseMolecule({ smiles: 'CCCCCCCCOCCOCCO' });
const draft: Mapping = { beads: [[0, 1, 2], [3, 4, 5], [6, 7, 8, 9], [10, 11, 12, 13, 14]].map((atoms, i) => ({ id: `b${i}`, name: `B${i + 1}`, centre: 'mass' as const, atoms: atoms.map((index) => ({ index, weight: 1 })) })) };
const xyz = await generateConformer(mol, { seed: 1 });
const k = Math.ceil(Math.cbrt(COPIES));
const boxA = k * 24;
// One frame of the system, to learn the layout; frames are then made one at a time.
const first = makeSystem(mol, xyz, { copies: COPIES, frames: 1, boxA, noiseA: 0.06, seed: 1, solvent: Math.round(COPIES * 4) });
const atoms = first.elements.length;
await writeFile(join(dir, 'conf.gro'), groText(first));

// TRR frames (GROMACS trrio layout, single precision, with the box), streamed to disk.
const out = createWriteStream(join(dir, 'traj.trr'));
for (let f = 0; f < FRAMES; f++) {
  const frame = makeSystem(mol, xyz, { copies: COPIES, frames: 1, boxA, noiseA: 0.06, seed: 1, solvent: Math.round(COPIES * 4) }).frames[0];
  // Same poses (same seed) with fresh noise per frame: jitter by frame number.
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
const conv = spawnSync(GMX, ['-quiet', 'trjconv', '-f', 'traj.trr', '-s', 'conf.gro', '-o', 'traj.xtc'], { cwd: dir, input: '0\n', encoding: 'utf8' });
if (conv.status !== 0) throw new Error(conv.stderr);
const xtcBytes = (await stat(join(dir, 'traj.xtc'))).size;

// Beadloom: match, then analyse as the job does.
const t0 = performance.now();
const found = await matchReference({ structure: { path: join(dir, 'conf.gro'), format: 'gro' }, trajectory: { path: join(dir, 'traj.xtc'), format: 'xtc' }, selection: null, molecule: mol, outDir: dir }, () => {});
const tMatch = performance.now() - t0;
const plan = planAnalysis(mol, draft, evaluateMapping(mol, draft, { fragments: false }));
const index = JSON.parse(await readFile(join(dir, 'frames.json'), 'utf8')) as FrameIndex;
const values = plan.terms.map(() => new Float32Array(found.frames * found.copies));
const base: Omit<AnalysisTask, 'from' | 'to'> = { source: found.source, index, copiesFile: join(dir, 'copies.bin'), copies: found.copies, atomsPerCopy: found.atomsPerCopy, order: plan.order, via: plan.via, beads: plan.beads, terms: plan.terms, chunk: 16 };
const onPart = (part: AnalysisPart) => {
  const nf = part.to - part.from;
  plan.terms.forEach((_, ti) => values[ti].set(part.values.subarray(ti * nf * found.copies, (ti + 1) * nf * found.copies), part.from * found.copies));
};
const t1 = performance.now();
await Promise.all([0, 1].map((h) => runTaskThread<AnalysisTask, null, AnalysisPart>(new URL('../server/analyses/analysis-worker.ts', import.meta.url), { ...base, from: Math.floor((h * found.frames) / 2), to: Math.floor(((h + 1) * found.frames) / 2) }, { onPart })));
buildResult(plan, values, found.frames, found.copies, 298.15, 100);
const tAnalysis = performance.now() - t1;
const rssMB = process.resourceUsage().maxRSS / 1024;

// GROMACS: gmx traj -com -n with the reference-numbered index (one group per bead over all copies).
const copyAtoms = new Int32Array((await readFile(join(dir, 'copies.bin'))).buffer.slice(0));
const own = beadIndexGroups(mol, draft.beads);
const groups = own.map((g) => ({ name: g.name, atoms: Array.from({ length: found.copies }, (_, c) => g.atoms.map((n) => copyAtoms[c * found.atomsPerCopy + n - 1] + 1)).flat().sort((a, b) => a - b) }));
await writeFile(join(dir, 'beads.ndx'), writeNdx(groups));
const t2 = performance.now();
const traj = spawnSync(GMX, ['-quiet', 'traj', '-f', 'traj.xtc', '-s', 'conf.gro', '-n', 'beads.ndx', '-com', '-ng', String(groups.length), '-ox', 'com.xvg'], { cwd: dir, input: groups.map((_, i) => `${i}\n`).join(''), encoding: 'utf8' });
const tGmx = performance.now() - t2;
if (traj.status !== 0) throw new Error(traj.stderr);

const s = (ms: number) => (ms / 1000).toFixed(1);
console.log(`| atom-frames | XTC size | Beadloom match | Beadloom analysis | gmx traj -com -n | ratio (analysis / gmx) | peak RSS | load average (1/5/15 min) |`);
console.log(`|---:|---:|---:|---:|---:|---:|---:|---|`);
console.log(`| ${(atoms * FRAMES / 1e6).toFixed(1)} M (${COPIES} copies × 40 atoms + ${atoms - COPIES * 40} solvent, ${FRAMES} frames) | ${(xtcBytes / 1024 ** 2).toFixed(0)} MiB | ${s(tMatch)} s | ${s(tAnalysis)} s | ${s(tGmx)} s | ${(tAnalysis / tGmx).toFixed(2)} | ${rssMB.toFixed(0)} MB | ${loadavg().map((l) => l.toFixed(2)).join(' / ')} |`);
await rm(dir, { recursive: true, force: true });
