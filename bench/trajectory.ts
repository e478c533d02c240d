/**
 * `npm run bench:trajectory [-- --copies 1000 --frames 500 --repeat 1 --dir DIR --no-write]`: Beadloom's
 * matching and analysis against `gmx traj -com -n` on the same XTC, in the same run.
 *
 * The system is invented (bench/trajectory-generate.ts: copies of a 41-atom surfactant with thermal
 * noise plus 10 % lone argon atoms to skip; `--repeat N` concatenates the XTC N times to reach
 * gigabytes). The generation runs here; Beadloom's side runs in a child process of its own
 * (bench/trajectory-analyse.ts: matching, then the analysis exactly as the job runs it), so its peak
 * RSS is the analysis's alone; the start of its two threads is timed apart (the job keeps spare
 * threads after a process's first analysis, so later ones find them ready). GROMACS's side: `gmx traj -com -n` with Beadloom's .ndx (one group
 * per bead over all copies; the bead centres Beadloom computes), on the same file. The load average
 * is taken before and after each timed part: the machine is shared. `--dir` keeps the generated
 * files there (and reuses them). The row goes into the table of docs/benchmarks.md (replacing a row
 * of the same size) unless `--no-write`.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluateMapping, parseMolecule } from '../server/chem/index';
import { planAnalysis } from '../server/analyses/analysis-plan';
import { beadIndexGroups, writeNdx } from '../server/exports/ndx';
import { BENCH_SMILES, benchMapping, generate } from './trajectory-generate';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const dirArg = process.argv.indexOf('--dir');
const COPIES = arg('copies', 1000);
const FRAMES = arg('frames', 500);
const REPEAT = arg('repeat', 1);
const GMX = process.env.GMX_PATH ?? 'gmx';

const keep = dirArg > 0;
const dir = keep ? process.argv[dirArg + 1] : await mkdtemp(join(tmpdir(), 'beadloom-bench-traj-'));
await mkdir(dir, { recursive: true });
const mol = await parseMolecule({ smiles: BENCH_SMILES });
const draft = benchMapping();
const g = await generate(dir, { copies: COPIES, frames: FRAMES, repeat: REPEAT, gmx: GMX }, mol);
await writeFile(join(dir, 'molecule.json'), JSON.stringify({ atoms: mol.atoms, bonds: mol.bonds }));
await writeFile(join(dir, 'plan.json'), JSON.stringify(planAnalysis(mol, draft, evaluateMapping(mol, draft, { fragments: false }))));

const load = () => loadavg()[0].toFixed(1);
// Beadloom, in its own process (tsx runs the script in a child node process; the peak RSS is taken there).
const loadBefore = load();
const child = spawnSync(process.execPath, [join('node_modules', '.bin', 'tsx'), 'bench/trajectory-analyse.ts', dir, g.xtc], { encoding: 'utf8' });
const loadAfterBeadloom = load();
if (child.status !== 0) throw new Error(child.stderr);
const b = JSON.parse(child.stdout.trim().split('\n').pop()!) as { tMatch: number; tThreads: number; tAnalysis: number; rssStartKB: number; rssMatchKB: number; rssKB: number; frames: number; copies: number; atomsPerCopy: number };

// GROMACS: gmx traj -com -n with the reference-numbered index (one group per bead over all copies).
const copyAtoms = new Int32Array((await readFile(join(dir, 'copies.bin'))).buffer.slice(0));
const groups = beadIndexGroups(mol, draft.beads).map((grp) => ({ name: grp.name, atoms: Array.from({ length: b.copies }, (_, c) => grp.atoms.map((n) => copyAtoms[c * b.atomsPerCopy + n - 1] + 1)).flat().sort((x, y) => x - y) }));
await writeFile(join(dir, 'beads.ndx'), writeNdx(groups));
const t2 = performance.now();
const traj = spawnSync(GMX, ['-quiet', 'traj', '-f', g.xtc, '-s', 'conf.gro', '-n', 'beads.ndx', '-com', '-ng', String(groups.length), '-ox', 'com.xvg'], { cwd: dir, input: groups.map((_, i) => `${i}\n`).join(''), encoding: 'utf8' });
const tGmx = performance.now() - t2;
const loadAfterGmx = load();
if (traj.status !== 0) throw new Error(traj.stderr);
await rm(join(dir, 'com.xvg'), { force: true });
await rm(join(dir, 'analysis'), { recursive: true, force: true });
if (!keep) await rm(dir, { recursive: true, force: true });

const s = (ms: number) => (ms / 1000).toFixed(1);
const size = g.xtcBytes >= 1024 ** 3 ? `${(g.xtcBytes / 1024 ** 3).toFixed(2)} GiB` : `${(g.xtcBytes / 1024 ** 2).toFixed(0)} MiB`;
const header = [
  '| atom-frames | XTC size | Beadloom match | Beadloom analysis (threads ready) | + start of the two threads | gmx traj -com -n | ratio (analysis / gmx) | ratio with the threads’ start | peak RSS of the analysis process | load average (1 min): before / after Beadloom / after gmx | cores |',
  '|---:|---:|---:|---:|---:|---:|---:|---:|---:|---|---:|',
];
const row = `| ${((g.atoms * b.frames) / 1e6).toFixed(1)} M (${b.copies} copies × ${b.atomsPerCopy} atoms + ${g.atoms - b.copies * b.atomsPerCopy} solvent, ${b.frames} frames) | ${size} | ${s(b.tMatch)} s | ${s(b.tAnalysis)} s | ${s(b.tThreads)} s | ${s(tGmx)} s | ${(b.tAnalysis / tGmx).toFixed(2)} | ${((b.tAnalysis + b.tThreads) / tGmx).toFixed(2)} | ${(b.rssKB / 1024).toFixed(0)} MB (after matching ${(b.rssMatchKB / 1024).toFixed(0)} MB) | ${loadBefore} / ${loadAfterBeadloom} / ${loadAfterGmx} | ${cpus().length} |`;
console.log([...header, row].join('\n'));

if (!process.argv.includes('--no-write')) {
  // The table sits between these two markers in docs/benchmarks.md; rows of other sizes stay.
  const doc = 'docs/benchmarks.md';
  const [open, close] = ['<!-- bench:trajectory table -->', '<!-- /bench:trajectory table -->'];
  const text = existsSync(doc) ? readFileSync(doc, 'utf8') : '';
  const a = text.indexOf(open);
  const z = text.indexOf(close);
  if (a < 0 || z < a) throw new Error(`${doc} has no ${open} … ${close} markers`);
  const key = (r: string) => r.split('|')[1].trim() + r.split('|')[2].trim();
  const rows = text.slice(a + open.length, z).split('\n').filter((r) => r.startsWith('| ') && !r.startsWith('| atom-frames') && key(r) !== key(row));
  const byWork = (r: string) => parseFloat(r.split('|')[1]);
  const body = [...header, ...[...rows, row].sort((x, y) => byWork(x) - byWork(y))].join('\n');
  writeFileSync(doc, `${text.slice(0, a + open.length)}\n${body}\n${text.slice(z)}`);
  console.log(`Wrote the row into ${doc}.`);
}
