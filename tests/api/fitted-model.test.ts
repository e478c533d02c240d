/** @vitest-environment node */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { binary } from '../helpers/binary';
import { beadCentre } from '../../server/chem/centres';
import { prepare } from '../../server/chem/prepared';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, snapshot, userId } from '../helpers/fixtures';
import { connectClient, listen, sessionCookie, synced, until, type CollabClient } from '../helpers/collab-client';
import { generateConformer } from '../../server/chem/index';
import { createMapping } from '../../server/mappings/mappings.service';
import { makeSystem } from '../../seeds/invented-reference';
import { assignAtoms, beadsOf, createBead, deleteBead, readBonded } from '../../src/shared/mapping-doc';
import type { BondedTerm } from '../../src/shared/bonded-terms';
import type { BondedFillView } from '../../src/shared/bonded-fill';
import type { Molecule } from '../../src/shared/chem';
import type { AnalysisView, Term } from '../../src/shared/references';
import { analysedSurfactant, finishedAnalysis, SURFACTANT, uploadReference, type AnalysedSurfactant } from './analysis-fixtures';

// A CG model from a reference analysis: PUT /api/mappings/:id/bonded-terms { fromAnalysis } fills the
// draft's terms from the analysis's fitted values in one edit a live editor sees (terms matched by bead
// names, what does not match reported), and GET …/export?format=gromacs|lammps&analysis=ID places the
// beads at the analysis's mean structure; bad analyses are refused in the shared shape, nothing changed.

let t: TestApp;
let modeller: ApiClient;
let student: ApiClient;
let s: AnalysedSurfactant;
let fitted: AnalysisView;
let server: Awaited<ReturnType<typeof listen>>;
let live: CollabClient;

/** kT in kJ/mol at 300 K, R = 8.314462618 J mol⁻¹ K⁻¹ (CODATA 2018). */
const KT = 8.314462618e-3 * 300;
const url = () => `/api/mappings/${s.mappingId}/bonded-terms`;
const row = (terms: BondedTerm[], kind: string, beads: string[]) => terms.find((x) => x.kind === kind && (x.beads.join() === beads.join() || x.beads.join() === [...beads].reverse().join()));

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
  s = await analysedSurfactant(t, modeller, 'Fill surfactant');
  fitted = (await modeller.get(`/api/analyses/${s.analysisId}`).expect(200)).body;
  server = await listen(t);
  live = connectClient(server.url, s.mappingId, await sessionCookie(server.url, 'modeller@example.org'));
  await synced(live);
}, 180_000);
afterAll(async () => {
  live?.destroy();
  await server?.close();
  await t.stop();
});

describe('filling bonded terms from an analysis', () => {
  it('fills every bond, angle and dihedral from the stored fit, in one edit a live editor sees; keeps a constraint', async () => {
    await modeller.put(url(), { terms: [{ kind: 'bond', beads: ['T1', 'T2'], function: 'harmonic', value: 0.3, k: null, constraint: true }], exclusions: 1 }).expect(200);
    const res = await modeller.put(url(), { fromAnalysis: s.analysisId }).expect(200);
    const body = res.body as BondedFillView;
    const r = fitted.result!;
    expect(body.fill).toMatchObject({ analysisId: s.analysisId, skipped: [], missing: [] });
    expect(body.fill.filled).toHaveLength(r.bonds.length + r.angles.length + r.dihedrals.length);
    expect(body.exclusions).toBe(1);
    for (const term of r.bonds) {
      const got = row(body.terms, 'bond', term.beads)!;
      expect(got).toMatchObject({ function: 'harmonic', value: term.mean, k: term.k });
      // k_b = kT/σ_r² (Tschöp et al. 1998; Reith, Pütz & Müller-Plathe 2003), σ from the stored sd.
      expect(got.k! / (KT / term.sd ** 2)).toBeCloseTo(1, 4);
    }
    expect(row(body.terms, 'bond', ['T1', 'T2'])!.constraint).toBe(true);
    for (const term of r.angles) {
      const got = row(body.terms, 'angle', term.beads)!;
      expect(got).toMatchObject({ function: 'harmonic', value: term.mean, k: term.k });
      // k_θ = kT/σ_θ² with σ_θ in radians (same sources).
      expect(got.k! / (KT / ((term.sd * Math.PI) / 180) ** 2)).toBeCloseTo(1, 4);
    }
    for (const term of r.dihedrals as Term[]) {
      const top = term.fourier!.reduce((a, b) => (b.k > a.k ? b : a));
      expect(row(body.terms, 'dihedral', term.beads)).toMatchObject({ function: 'periodic', value: Math.round(top.phase), k: top.k, multiplicity: top.n });
    }
    // The open editor's document holds the same entries, relayed like a person's edit.
    await until('the live editor sees the fill', () => Object.values(readBonded(live.doc)).filter((p) => p.k !== null).length === r.bonds.length + r.angles.length + r.dihedrals.length);
    expect(readBonded(live.doc)['bond:t1,t2']).toEqual({ function: 'harmonic', value: r.bonds.find((b) => b.beadIds.join() === 't1,t2')!.mean, k: r.bonds.find((b) => b.beadIds.join() === 't1,t2')!.k, constraint: true });
  });

  it('fills what matches by bead names and reports what was skipped and what is missing', async () => {
    live.doc.transact(() => beadsOf(live.doc).get('e2')!.set('name', 'X2'));
    await until('the rename evaluated', async () => (await modeller.get(url())).body.terms.some((x: BondedTerm) => x.beads.includes('X2')));
    // Forget the old values so "missing" rows are visibly left as they are.
    await modeller.put(url(), { terms: [], exclusions: 1 }).expect(200);
    const body = (await modeller.put(url(), { fromAnalysis: s.analysisId }).expect(200)).body as BondedFillView;
    expect(body.fill.skipped.map((x) => x.kind).sort()).toEqual(['angle', 'bond', 'dihedral']);
    expect(body.fill.skipped.every((x) => x.beads.includes('E2'))).toBe(true);
    expect(body.fill.skipped[0].reason).toMatch(/has no (bond|angle|dihedral)/);
    expect(body.fill.missing.map((x) => x.kind).sort()).toEqual(['angle', 'bond', 'dihedral']);
    for (const m of body.fill.missing) expect(row(body.terms, m.kind, m.beads)).toMatchObject({ value: null, k: null });
    expect(body.fill.filled).toHaveLength(3);
    live.doc.transact(() => beadsOf(live.doc).get('e2')!.set('name', 'E2'));
    await until('the rename back evaluated', async () => (await modeller.get(url())).body.terms.some((x: BondedTerm) => x.beads.includes('E2')));
  });

  it('refuses another mapping\'s analysis (422), an unfinished one (409), an unknown or invisible one (404) and a student (403), changing nothing', async () => {
    const { cancelled, elsewhere } = await badAnalyses();
    const before = await modeller.get(url()).expect(200);
    const tables = await snapshot(t.ctx.db, ['analyses', 'mapping_updates']);
    const cases: [ApiClient, unknown, number, string][] = [
      [modeller, { fromAnalysis: s.otherAnalysisId }, 422, 'analysis_of_other_mapping'],
      [modeller, { fromAnalysis: cancelled }, 409, 'analysis_not_finished'],
      [modeller, { fromAnalysis: 987654 }, 404, 'not_found'],
      [modeller, { fromAnalysis: elsewhere }, 404, 'not_found'],
      [modeller, { fromAnalysis: -3 }, 400, 'validation_failed'],
      [modeller, { fromAnalysis: s.analysisId, terms: [] }, 400, 'validation_failed'],
      [student, { fromAnalysis: s.analysisId }, 403, 'forbidden'],
    ];
    for (const [who, body, status, code] of cases) {
      const res = await who.put(url(), body);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    }
    expect((await modeller.get(url()).expect(200)).body).toEqual(before.body);
    expect(await snapshot(t.ctx.db, ['analyses', 'mapping_updates'])).toBe(tables);
  });
});

describe('an engine export at an analysis\'s mean structure', () => {
  /** Mean bead centres of copy 1 (nm) from the generator's unwrapped coordinates, by the chemistry core: an independent estimate (the copies do not tumble). */
  function knownMean(): number[][] {
    const p = prepare(s.mol);
    const sum = SURFACTANT.beads.map(() => [0, 0, 0]);
    for (const frame of s.sys.whole) {
      const w = frame[0];
      const xyz = Array.from({ length: w.length / 3 }, (_, i) => [w[3 * i], w[3 * i + 1], w[3 * i + 2]]);
      SURFACTANT.beads.forEach((b, i) => beadCentre(p, xyz, b.atoms, b.centre)!.forEach((v, d) => (sum[i][d] += v / 10 / s.sys.whole.length)));
    }
    return sum;
  }
  const dist = (a: number[], b: number[]) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);

  it('writes conf.gro and the LAMMPS data file at the mean structure, says so, and grompp accepts it', async () => {
    await modeller.put(url(), { fromAnalysis: s.analysisId }).expect(200);
    const zip = await JSZip.loadAsync((await binary(modeller.get(`/api/mappings/${s.mappingId}/export?format=gromacs&version=draft&analysis=${s.analysisId}`)).expect(200)).body);
    const files = Object.fromEntries(await Promise.all(Object.values(zip.files).map(async (f) => [f.name.split('/').pop()!, await f.async('string')] as const)));
    const gro = files['conf.gro'].split('\n');
    expect(gro[0]).toContain(`mean structure of analysis ${s.analysisId} (version 1; copy 1 over 40 frames, superposed)`);
    const at = gro.slice(2, 6).map((l) => [20, 28, 36].map((c) => Number(l.slice(c, c + 8))));
    const want = knownMean();
    for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) expect(Math.abs(dist(at[i], at[j]) - dist(want[i], want[j]))).toBeLessThan(0.003);
    expect(files['topol.top']).toContain(`Coordinates: bead centres: mean structure of analysis ${s.analysisId}`);
    // The index file in the reference's numbering rides along: each bead's group holds its atoms in every copy.
    const groups = (text: string) => Object.fromEntries(text.split('[ ').slice(1).map((g) => [g.split(' ]')[0], g.split(']')[1].trim().split(/\s+/).map(Number)]));
    const own = groups(Object.entries(files).find(([n]) => n.endsWith('-atoms.ndx'))![1]);
    const ref = groups(Object.entries(files).find(([n]) => n.endsWith(`-reference-${s.referenceId}.ndx`))![1]);
    expect(Object.keys(ref)).toEqual(['T1', 'T2', 'E1', 'E2']);
    for (const name of Object.keys(ref)) expect(ref[name]).toHaveLength(8 * own[name].length);
    const dir = mkdtempSync(join(tmpdir(), 'beadloom-fitted-'));
    try {
      for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
      const run = spawnSync(process.env.GMX_PATH ?? '/usr/bin/gmx', ['-quiet', 'grompp', '-f', 'md.mdp', '-c', 'conf.gro', '-p', 'topol.top', '-o', 'run.tpr', '-maxwarn', '20'], { cwd: dir, encoding: 'utf8' });
      expect(run.status, run.stderr).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    const lammps = await JSZip.loadAsync((await binary(modeller.get(`/api/mappings/${s.mappingId}/export?format=lammps&version=draft&analysis=${s.analysisId}`)).expect(200)).body);
    const data = await Object.values(lammps.files).find((f) => f.name.endsWith('.data'))!.async('string');
    const atoms = data.split('Atoms')[1].split('\n').filter((l) => /^\d+ /.test(l)).map((l) => l.split(/\s+/).slice(4, 7).map((v) => Number(v) / 10));
    for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) expect(Math.abs(dist(atoms[i], atoms[j]) - dist(want[i], want[j]))).toBeLessThan(0.003);
  });

  it('refuses a state with a bead the analysis did not have (422 naming it)', async () => {
    live.doc.transact(() => createBead(live.doc, [12], { id: 'e3', name: 'E3', type: 'HEAD' }));
    await until('the split evaluated', async () => (await modeller.get(url())).body.terms.some((x: BondedTerm) => x.beads.includes('E3')));
    const res = await modeller.get(`/api/mappings/${s.mappingId}/export?format=gromacs&analysis=${s.analysisId}`).expect(422);
    expect(res.body.error.code).toBe('model_incomplete');
    expect(res.body.error.details.problems).toContainEqual({ check: 'analysis_bead_missing', message: expect.stringContaining('Bead E3 is not in the analysis') });
    live.doc.transact(() => {
      deleteBead(live.doc, 'e3');
      assignAtoms(live.doc, 'e2', [12]);
    });
    await until('the merge evaluated', async () => !(await modeller.get(url())).body.terms.some((x: BondedTerm) => x.beads.includes('E3')));
  });

  it('refuses another mapping\'s analysis (422), an unfinished one (409), an unknown or invisible one (404), a chain of units (422)', async () => {
    const { cancelled, elsewhere } = await badAnalyses();
    const cases: [string, number, string][] = [
      [`analysis=${s.otherAnalysisId}`, 422, 'analysis_of_other_mapping'],
      [`analysis=${cancelled}`, 409, 'analysis_not_finished'],
      ['analysis=987654', 404, 'not_found'],
      [`analysis=${elsewhere}`, 404, 'not_found'],
      [`analysis=${s.analysisId}&units=3`, 422, 'analysis_one_unit'],
      ['analysis=abc', 400, 'validation_failed'],
    ];
    for (const [q, status, code] of cases) {
      const res = await modeller.get(`/api/mappings/${s.mappingId}/export?format=gromacs&${q}`);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    }
  });
});

let bad: Promise<{ cancelled: number; elsewhere: number }> | undefined;
/** A cancelled analysis of this mapping and a finished one in another project (made once). */
function badAnalyses() {
  bad ??= (async () => {
    const cancelled = (await modeller.post(`/api/mappings/${s.mappingId}/analyses`, { referenceId: s.referenceId, version: 1 }).expect(202)).body.id as number;
    await modeller.delete(`/api/analyses/${cancelled}`).expect(202);
    await t.tasks.idle();
    expect((await modeller.get(`/api/analyses/${cancelled}`).expect(200)).body.status).toBe('cancelled');
    return { cancelled, elsewhere: await analysisInAnotherProject() };
  })();
  return bad;
}

/** A finished analysis of a mapping in a project the modeller is not a member of (made by the site admin). */
async function analysisInAnotherProject(): Promise<number> {
  const db = t.ctx.db;
  const admin = await signedIn(t.app, 'admin@example.org');
  const [projectId] = await db('projects').insert({ name: 'Elsewhere (fill)', description: '', created_by: await userId(db, 'admin@example.org') });
  const moleculeId = await createMolecule(db, projectId, 'Propanol elsewhere', 'CCCO');
  const mol = JSON.parse((await db('molecules').where({ id: moleculeId }).first('model')).model) as Molecule;
  const bead = (id: string, atoms: number[]) => ({ id, name: id.toUpperCase(), centre: 'mass' as const, atoms: atoms.map((index) => ({ index, weight: 1 })) });
  const mappingId = await createMapping(db, moleculeId, { name: 'Propanol 2:1', resolution: '2:1' }, null as unknown as number, { beads: [bead('a', [0, 1]), bead('b', [2, 3])] });
  await admin.post(`/api/mappings/${mappingId}/versions`, { message: 'v1' }).expect(201);
  const referenceId = await uploadReference(t, admin, moleculeId, makeSystem(mol, await generateConformer(mol, { seed: 1 }), { copies: 2, frames: 2, boxA: 20, noiseA: 0.05, seed: 1 }));
  return (await finishedAnalysis(t, admin, mappingId, referenceId)).id;
}
