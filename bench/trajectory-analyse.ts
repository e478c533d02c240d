/**
 * The Beadloom side of bench:trajectory, in a process of its own so that its peak RSS is the
 * matching's and the analysis's alone (not the generation's, nor the chemistry core's: the parent
 * writes the molecule and the analysis plan to the folder, as the server stores them with the rows).
 * Matching as the match job runs it, then runAnalysis as the analysis job runs it (two threads,
 * centres and values to files, distributions from the values file).
 * Prints one line of JSON: times (ms; the threads' start apart from the analysis) and peak RSS (kB, worker threads included); with RESULT_OUT
 * set, writes the analysis result there (to compare two versions of the code).
 * Usage: tsx bench/trajectory-analyse.ts <dir> <trajectory.xtc>
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Molecule } from '../src/shared/chem';
import type { AnalysisPlan } from '../server/analyses/analysis-plan';
import { ANALYSIS_THREADS, ANALYSIS_WORKER, runAnalysis } from '../server/analyses/analysis-run';
import { keepSpareThreads } from '../server/workers/task-thread';
import type { FrameIndex } from '../server/references/frame-index';
import { matchReference } from '../server/references/match-reference';

const [dir, xtc] = process.argv.slice(2);
const molecule = JSON.parse(await readFile(join(dir, 'molecule.json'), 'utf8')) as Pick<Molecule, 'atoms' | 'bonds'>;
const plan = JSON.parse(await readFile(join(dir, 'plan.json'), 'utf8')) as AnalysisPlan;
const rssStart = process.resourceUsage().maxRSS;
const t0 = performance.now();
const found = await matchReference({ structure: { path: join(dir, 'conf.gro'), format: 'gro' }, trajectory: { path: xtc, format: 'xtc' }, selection: null, molecule, outDir: dir }, () => {});
const tMatch = performance.now() - t0;
const rssMatch = process.resourceUsage().maxRSS;
const index = JSON.parse(await readFile(join(dir, 'frames.json'), 'utf8')) as FrameIndex;
const outDir = join(dir, 'analysis');
await mkdir(outDir, { recursive: true });
// The analysis threads' start (tsx and molstar loading in each), timed on its own: the job keeps
// spare threads after its first analysis, so only a process's first analysis pays it.
const tw = performance.now();
await keepSpareThreads(ANALYSIS_WORKER, ANALYSIS_THREADS);
const tThreads = performance.now() - tw;
const t1 = performance.now();
const result = await runAnalysis({ plan, source: found.source, index, copiesFile: join(dir, 'copies.bin'), copies: found.copies, atomsPerCopy: found.atomsPerCopy, outDir, temperature: 298.15, bins: 100 });
const tAnalysis = performance.now() - t1;
if (process.env.RESULT_OUT) await writeFile(process.env.RESULT_OUT, JSON.stringify(result));
console.log(JSON.stringify({ tMatch, tThreads, tAnalysis, rssStartKB: rssStart, rssMatchKB: rssMatch, rssKB: process.resourceUsage().maxRSS, frames: found.frames, copies: found.copies, atomsPerCopy: found.atomsPerCopy }));
