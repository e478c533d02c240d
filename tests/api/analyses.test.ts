import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId, snapshot } from '../helpers/fixtures';
import { generateConformer } from '../../server/chem/index';
import { beadCentre } from '../../server/chem/centres';
import { prepare } from '../../server/chem/prepared';
import { createMapping } from '../../server/mappings/mappings.service';
import { makeSystem, type RefSystem } from '../../seeds/invented-reference';
import type { Mapping, Molecule } from '../../src/shared/chem';
import type { AnalysisView } from '../../src/shared/references';
import { uploadReference as uploadReferenceFor } from './analysis-fixtures';

// Analyses over the API: a mapping version applied to a reference in the background, its result,
// cancelling, downloads, and bad input refused with nothing stored.

let t: TestApp;
let modeller: ApiClient;
let student: ApiClient;
let supervisor: ApiClient;
let mol: Molecule;
let sys: RefSystem;
let mappingId: number;
let referenceId: number;
let otherReferenceId: number;
let halfMappingId: number;

// An invented surfactant: C0–C5 tail, O6 C7 C8 O9 C10 C11 O12 head.
const DRAFT: Mapping = {
  beads: [
    { id: 't1', name: 'T1', centre: 'mass', atoms: [0, 1, 2].map((index) => ({ index, weight: 1 })) },
    { id: 't2', name: 'T2', centre: 'mass', atoms: [3, 4, 5].map((index) => ({ index, weight: 1 })) },
    { id: 'e1', name: 'E1', centre: 'geometry', atoms: [6, 7, 8].map((index) => ({ index, weight: 1 })) },
    { id: 'e2', name: 'E2', centre: 'mass', atoms: [9, 10, 11, 12].map((index) => ({ index, weight: 1 })) },
  ],
};

const uploadReference = (moleculeId: number, s: RefSystem) => uploadReferenceFor(t, modeller, moleculeId, s);

const untilFinished = async (id: number): Promise<AnalysisView> => {
  await t.tasks.idle();
  return (await modeller.get(`/api/analyses/${id}`).expect(200)).body;
};

beforeAll(async () => {
  t = await createTestApp();
  const projectId = await demoProjectId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  const moleculeId = await createMolecule(t.ctx.db, projectId, 'Invented surfactant', 'CCCCCCOCCOCCO');
  mol = JSON.parse((await t.ctx.db('molecules').where({ id: moleculeId }).first('model')).model) as Molecule;
  sys = makeSystem(mol, await generateConformer(mol, { seed: 3 }), { copies: 8, frames: 40, boxA: 40, noiseA: 0.06, seed: 5, residue: 'SUR', solvent: 10 });
  mappingId = await createMapping(t.ctx.db, moleculeId, { name: 'Surfactant 3:1', resolution: '3:1' }, null as unknown as number, DRAFT);
  halfMappingId = await createMapping(t.ctx.db, moleculeId, { name: 'Half', resolution: '3:1' }, null as unknown as number, { beads: DRAFT.beads.slice(0, 2) });
  await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'For the reference' }).expect(201);
  referenceId = await uploadReference(moleculeId, sys);
  const otherId = await createMolecule(t.ctx.db, projectId, 'Other', 'CCCO');
  const other = JSON.parse((await t.ctx.db('molecules').where({ id: otherId }).first('model')).model) as Molecule;
  otherReferenceId = await uploadReference(otherId, makeSystem(other, await generateConformer(other, { seed: 1 }), { copies: 2, frames: 1, boxA: 20, noiseA: 0, seed: 1 }));
}, 120_000);
afterAll(() => t.stop());

/** Bead centres of copy c in frame f from the known unwrapped coordinates, by the chemistry core. */
function knownCentres(f: number, c: number): number[][] {
  const p = prepare(mol);
  const w = sys.whole[f][c];
  const xyz = Array.from({ length: w.length / 3 }, (_, i) => [w[3 * i], w[3 * i + 1], w[3 * i + 2]]);
  return DRAFT.beads.map((b) => beadCentre(p, xyz, b.atoms, b.centre)!.map((v) => v / 10));
}

describe('analyses', () => {
  let done: AnalysisView;

  it('applies version 1 to the reference: every CG bond, angle and dihedral with mean, sd and k', async () => {
    const res = await modeller.post(`/api/mappings/${mappingId}/analyses`, { referenceId, version: 1, temperature: 300, bins: 50 }).expect(202);
    done = await untilFinished(res.body.id);
    expect(done).toMatchObject({ status: 'done', mappingId, version: 1, versionNumber: 1, referenceId, temperature: 300, bins: 50, progress: { done: 40, total: 40 } });
    const r = done.result!;
    expect([r.frames, r.copies, r.bonds.length, r.angles.length, r.dihedrals.length]).toEqual([40, 8, 3, 2, 1]);
    // Independent values: centres by server/chem/centres.ts from the generator's unwrapped coordinates.
    for (const term of r.bonds) {
      const [i, j] = term.beadIds.map((id) => DRAFT.beads.findIndex((b) => b.id === id));
      const d: number[] = [];
      for (let f = 0; f < 40; f++) for (let c = 0; c < 8; c++) {
        const x = knownCentres(f, c);
        d.push(Math.hypot(x[i][0] - x[j][0], x[i][1] - x[j][1], x[i][2] - x[j][2]));
      }
      const mean = d.reduce((s, v) => s + v, 0) / d.length;
      const sd = Math.sqrt(d.reduce((s, v) => s + (v - mean) ** 2, 0) / (d.length - 1));
      // GRO stores 0.001 nm: centres carry at most ~0.0005 nm of rounding.
      expect(term.mean).toBeCloseTo(mean, 3);
      expect(Math.abs(term.sd - sd)).toBeLessThan(0.0005);
      expect(term.k).toBeCloseTo((0.008314462618 * 300) / term.sd ** 2, -1);
      expect(term.histogram.counts.reduce((s, v) => s + v, 0)).toBe(320);
      expect(term.potential.x).toHaveLength(50);
    }
    expect(r.dihedrals[0].fourier!.length).toBeGreaterThan(0);
    // Which cosine terms were fitted is said, with the filled bins (and why, when fewer than four).
    const fit = r.dihedrals[0].fourierFit!;
    expect(fit.fitted).toEqual(r.dihedrals[0].fourier!.map((f) => f.n));
    expect(fit.filledBins).toBeGreaterThan(0);
    expect(fit.note === null).toBe(fit.fitted.length === 4);
  });

  it('lists the analyses of a mapping for every member, and offers terms.csv and the CG trajectory', async () => {
    const list = await student.get(`/api/mappings/${mappingId}/analyses`).expect(200);
    expect(list.body[0]).toMatchObject({ id: done.id, status: 'done' });
    expect(list.body[0].result).toBeUndefined();
    const csv = await student.get(`/api/analyses/${done.id}/terms.csv`).expect(200);
    expect(csv.text).toMatch(/^# Beadloom analysis/);
    expect(csv.text).toContain('bond,T1-T2,');
    const gro = await student.get(`/api/analyses/${done.id}/cg-trajectory?format=gro`).expect(200);
    expect(gro.text.split('\n').filter((l) => /^ *\d+CG/.test(l))).toHaveLength(40 * 8 * 4);
    const pdb = await student.get(`/api/analyses/${done.id}/cg-trajectory?format=pdb`).expect(200);
    expect(pdb.text.match(/^MODEL/gm)).toHaveLength(40);
    const trr = await student.get(`/api/analyses/${done.id}/cg-trajectory?format=trr`).buffer(true).expect(200);
    expect((trr.body as Buffer).length).toBe(40 * (24 + 52 + 8 + 12 * 32));
    await student.get(`/api/analyses/${done.id}/cg-trajectory?format=xyz`).expect(400);
  });

  it('the starter can cancel a running analysis; a student cannot', async () => {
    const res = await modeller.post(`/api/mappings/${mappingId}/analyses`, { referenceId, version: 'draft' }).expect(202);
    await student.delete(`/api/analyses/${res.body.id}`).expect(403);
    await modeller.delete(`/api/analyses/${res.body.id}`).expect(202);
    const got = await untilFinished(res.body.id);
    expect(got.status).toBe('cancelled');
    await supervisor.delete(`/api/analyses/${res.body.id}`).expect(204);
    await modeller.get(`/api/analyses/${res.body.id}`).expect(404);
  });

  it('bad input gets a clear error and nothing is stored', async () => {
    const before = await snapshot(t.ctx.db, ['analyses']);
    const cases: [ApiClient, number, unknown, number, string][] = [
      [student, mappingId, { referenceId, version: 1 }, 403, 'forbidden'],
      [modeller, mappingId, { referenceId: otherReferenceId, version: 1 }, 422, 'reference_of_other_molecule'],
      [modeller, halfMappingId, { referenceId, version: 'draft' }, 422, 'mapping_not_ready'],
      [modeller, mappingId, { referenceId: 999999, version: 1 }, 404, 'not_found'],
      [modeller, mappingId, { referenceId, version: 7 }, 404, 'not_found'],
      [modeller, mappingId, { referenceId, version: 'production' }, 409, 'no_production_version'],
      [modeller, mappingId, { referenceId, version: 'latest' }, 400, 'validation_failed'],
      [modeller, mappingId, { referenceId, version: 1, bins: 3 }, 400, 'validation_failed'],
      [modeller, mappingId, { referenceId, version: 1, temperature: -5 }, 400, 'validation_failed'],
    ];
    for (const [who, id, body, status, code] of cases) {
      const res = await who.post(`/api/mappings/${id}/analyses`, body);
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    }
    const half = await modeller.post(`/api/mappings/${halfMappingId}/analyses`, { referenceId, version: 'draft' });
    expect(half.body.error.message).toMatch(/heavy atom/);
    expect(await snapshot(t.ctx.db, ['analyses'])).toBe(before);
  });
});
