import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateMapping, generateConformer, parseMolecule } from '../../../server/chem/index';
import { planAnalysis, type AnalysisPlan } from '../../../server/analyses/analysis-plan';
import { ANALYSIS_THREADS, ANALYSIS_WORKER, runAnalysis, type AnalysisRun } from '../../../server/analyses/analysis-run';
import type { FrameIndex } from '../../../server/references/frame-index';
import { matchReference } from '../../../server/references/match-reference';
import { readySpareThreads } from '../../../server/workers/task-thread';
import { groText, makeSystem } from '../../../seeds/invented-reference';
import type { Mapping } from '../../../src/shared/chem';

// runAnalysis as the job runs it, on an invented multi-frame GRO: two threads taking chunks from a
// shared counter, values streamed to a file and read back in blocks, and spare threads kept for
// the next analysis. Correctness against GROMACS is in tests/api/references-gromacs.test.ts; here,
// that the machinery gives one answer however the work is split and whichever threads run it.

let dir: string;
let run: AnalysisRun;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'beadloom-analysis-run-'));
  const mol = await parseMolecule({ smiles: 'CCCCCCCCOCCOCCO' });
  const sys = makeSystem(mol, await generateConformer(mol, { seed: 1 }), { copies: 8, frames: 40, boxA: 40, noiseA: 0.08, seed: 5, solvent: 12 });
  writeFileSync(join(dir, 'sys.gro'), groText(sys));
  const found = await matchReference({ structure: { path: join(dir, 'sys.gro'), format: 'gro' }, trajectory: null, selection: null, molecule: mol, outDir: dir }, () => {});
  const draft: Mapping = { beads: [[0, 1, 2], [3, 4, 5], [6, 7, 8, 9], [10, 11, 12, 13, 14]].map((atoms, i) => ({ id: `b${i}`, name: `B${i + 1}`, centre: 'mass' as const, atoms: atoms.map((index) => ({ index, weight: 1 })) })) };
  const plan: AnalysisPlan = planAnalysis(mol, draft, evaluateMapping(mol, draft, { fragments: false }));
  const index = JSON.parse(readFileSync(join(dir, 'frames.json'), 'utf8')) as FrameIndex;
  run = { plan, source: found.source, index, copiesFile: join(dir, 'copies.bin'), copies: found.copies, atomsPerCopy: found.atomsPerCopy, outDir: dir, temperature: 300, bins: 40 };
}, 60_000);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('running an analysis', () => {
  it('gives the same result with one thread or two, cold or on spare threads; keeps the centres, removes the values file', async () => {
    mkdirSync(join(dir, 'one'));
    const one = await runAnalysis({ ...run, outDir: join(dir, 'one'), threads: 1 });
    const two = await runAnalysis({ ...run, keepWarm: true });
    expect(two).toEqual(one);
    expect(two.bonds).toHaveLength(3);
    expect(two.dihedrals).toHaveLength(1);
    expect(two.bonds[0].histogram.counts.reduce((s, c) => s + c, 0)).toBe(40 * 8);
    // centres.f32: frames × copies × beads × 3 float32; values.f32 gone.
    expect(statSync(join(dir, 'centres.f32')).size).toBe(40 * 8 * 4 * 3 * 4);
    expect(readFileSync(join(dir, 'centres.f32'))).toEqual(readFileSync(join(dir, 'one', 'centres.f32')));
    expect(existsSync(join(dir, 'values.f32'))).toBe(false);
    // The job asked for spares: they come up, and the next analysis runs on them.
    await expect.poll(() => readySpareThreads(ANALYSIS_WORKER), { timeout: 30_000 }).toBe(ANALYSIS_THREADS);
    const warm = await runAnalysis(run);
    expect(readySpareThreads(ANALYSIS_WORKER)).toBe(0);
    expect(warm).toEqual(one);
  }, 120_000);
});
