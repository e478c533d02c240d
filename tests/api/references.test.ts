import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createMolecule, demoProjectId, snapshot } from '../helpers/fixtures';
import { generateConformer } from '../../server/chem/index';
import { groText, makeSystem, type RefSystem } from '../../seeds/invented-reference';
import type { Molecule } from '../../src/shared/chem';

// References over the API: streamed upload, matching in the background, and bad input refused with
// a clear error and nothing kept.

let t: TestApp;
let modeller: ApiClient;
let student: ApiClient;
let moleculeId: number;
let sys: RefSystem;
const TABLES = ['simulation_references'];

beforeAll(async () => {
  t = await createTestApp({ referenceMaxBytes: 2_000_000, projectQuotaBytes: 3_000_000 });
  const projectId = await demoProjectId(t.ctx.db);
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
  // An invented surfactant: an ether-alcohol head on a short tail.
  moleculeId = await createMolecule(t.ctx.db, projectId, 'Invented surfactant', 'CCCCCCOCCOCCO');
  const row = await t.ctx.db('molecules').where({ id: moleculeId }).first('model');
  const mol = JSON.parse(row.model) as Molecule;
  sys = makeSystem(mol, await generateConformer(mol, { seed: 3 }), { copies: 8, frames: 4, boxA: 40, noiseA: 0.05, seed: 5, residue: 'SUR', solvent: 10 });
}, 60_000);
afterAll(() => t.stop());

const upload = (files: Record<string, [string, string | Buffer]>, fields: Record<string, string> = {}, who = modeller) => {
  let req = who.agent.post(`/api/molecules/${moleculeId}/references`).set('x-csrf-token', who.csrf);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  for (const [k, [name, content]] of Object.entries(files)) req = req.attach(k, Buffer.isBuffer(content) ? content : Buffer.from(content), name);
  return req;
};

const uploadsLeft = () => {
  try {
    return readdirSync(join(t.ctx.config.dataDir, 'uploads')).length;
  } catch {
    return 0;
  }
};

describe('references', () => {
  it('accepts a structure and a multi-frame GRO trajectory and finds every copy', async () => {
    const res = await upload({ structure: ['sys.gro', groText(sys, sys.frames.slice(0, 1))], trajectory: ['traj.gro', groText(sys)] }, { name: 'Surfactant box' }).expect(202);
    expect(res.body).toEqual({ id: expect.any(Number), status: 'queued' });
    await t.tasks.idle();
    const got = await modeller.get(`/api/references/${res.body.id}`).expect(200);
    expect(got.body).toMatchObject({ id: res.body.id, moleculeId, name: 'Surfactant box', status: 'ready', copies: 8, frames: 4, atomsPerCopy: sys.atomsPerCopy, progress: { done: 1000, total: 1000 } });
    const list = await student.get(`/api/molecules/${moleculeId}/references`).expect(200);
    expect(list.body.map((r: { id: number }) => r.id)).toContain(res.body.id);
    expect(uploadsLeft()).toBe(0);
  });

  it('a trajectory whose atom count differs from the structure fails the reference with a clear error and keeps no file', async () => {
    const fewer = { ...sys, elements: sys.elements.slice(0, -1), frames: sys.frames.map((f) => f.slice(0, -3)) };
    const res = await upload({ structure: ['sys.gro', groText(sys, sys.frames.slice(0, 1))], trajectory: ['traj.gro', groText(fewer as RefSystem)] }).expect(202);
    await t.tasks.idle();
    const got = await modeller.get(`/api/references/${res.body.id}`).expect(200);
    expect(got.body.status).toBe('failed');
    expect(got.body.error).toMatchObject({ code: 'atom_count_mismatch', message: expect.stringMatching(/has \d+ atoms per frame; the structure has \d+/) });
    expect(readdirSync(join(t.ctx.config.dataDir, 'references')).includes(String(res.body.id))).toBe(false);
  });

  it('a structure without the molecule names the first misfit, keeps the files, and matches again with a narrowed search', async () => {
    const res = await upload({ structure: ['sys.gro', groText(sys, sys.frames.slice(0, 1))] }, { selection: JSON.stringify({ start: 2, atomsPerCopy: sys.atomsPerCopy, copies: 2 }) }).expect(202);
    await t.tasks.idle();
    const got = await modeller.get(`/api/references/${res.body.id}`).expect(200);
    expect(got.body).toMatchObject({ status: 'failed', error: { code: 'molecule_not_found', message: expect.stringMatching(/^Atom \d+ \(/), retryable: true } });
    // The files stay (and count in the quota) so the search can be narrowed without uploading again.
    expect(readdirSync(join(t.ctx.config.dataDir, 'references', String(res.body.id)))).toContain('structure.gro');
    expect(got.body.bytes).toBeGreaterThan(0);
    const url = `/api/references/${res.body.id}/match`;
    const before = await snapshot(t.ctx.db, TABLES);
    // A bad selection, or a student, changes nothing.
    const bad = await modeller.post(url, { selection: { start: 0, atomsPerCopy: 3, copies: 1 } }).expect(400);
    expect(bad.body.error.code).toBe('validation_failed');
    await modeller.post(url, { selection: null, extra: 1 }).expect(400);
    await student.post(url, { selection: null }).expect(403);
    expect(await snapshot(t.ctx.db, TABLES)).toEqual(before);
    const again = await modeller.post(url, { selection: { start: 1, atomsPerCopy: sys.atomsPerCopy, copies: 8 } }).expect(202);
    expect(again.body).toEqual({ id: res.body.id, status: 'queued' });
    await t.tasks.idle();
    const ready = await modeller.get(`/api/references/${res.body.id}`).expect(200);
    expect(ready.body).toMatchObject({ status: 'ready', copies: 8, frames: 1, atomsPerCopy: sys.atomsPerCopy });
    expect(ready.body.error).toBeUndefined();
    // Only a failed reference is matched again.
    const ok = await modeller.post(url, { selection: null }).expect(409);
    expect(ok.body.error).toMatchObject({ code: 'reference_not_failed', details: { status: 'ready' } });
  });

  it('a reference whose files could not be read is not matched again: its files are gone', async () => {
    const fewer = { ...sys, elements: sys.elements.slice(0, -1), frames: sys.frames.map((f) => f.slice(0, -3)) };
    const res = await upload({ structure: ['sys.gro', groText(sys, sys.frames.slice(0, 1))], trajectory: ['traj.gro', groText(fewer as RefSystem)] }).expect(202);
    await t.tasks.idle();
    const got = await modeller.get(`/api/references/${res.body.id}`).expect(200);
    expect(got.body).toMatchObject({ status: 'failed', bytes: 0, error: { code: 'atom_count_mismatch' } });
    expect(got.body.error.retryable).toBeUndefined();
    const r = await modeller.post(`/api/references/${res.body.id}/match`, { selection: null }).expect(409);
    expect(r.body.error).toMatchObject({ code: 'reference_files_gone', message: expect.stringMatching(/upload them again/) });
  });

  it('bad input is refused in the shared shape and nothing is stored', async () => {
    const before = await snapshot(t.ctx.db, TABLES);
    const gro = groText(sys, sys.frames.slice(0, 1));
    const cases: [ReturnType<typeof upload>, number, string][] = [
      [upload({}), 400, 'validation_failed'],
      [upload({ structure: ['sys.txt', gro] }), 400, 'validation_failed'],
      [upload({ structure: ['sys.gro', gro], trajectory: ['t.nc', 'x'] }), 400, 'validation_failed'],
      [upload({ structure: ['sys.gro', gro] }, { selection: '{"residue":' }), 400, 'validation_failed'],
      [upload({ structure: ['sys.gro', gro] }, { selection: '{"start":0,"atomsPerCopy":3,"copies":1}' }), 400, 'validation_failed'],
      [upload({ structure: ['sys.gro', Buffer.alloc(2_100_000, 32)] }), 413, 'payload_too_large'],
      [upload({ structure: ['sys.gro', gro] }, {}, student), 403, 'forbidden'],
    ];
    for (const [req, status, code] of cases) {
      const res = await req;
      expect(res.status, JSON.stringify(res.body)).toBe(status);
      expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    }
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
    expect(uploadsLeft()).toBe(0);
  });

  it('a project over its quota answers 413 and keeps nothing', async () => {
    const big = Buffer.alloc(1_500_000, 32);
    const first = await upload({ structure: ['a.gro', groText(sys, sys.frames.slice(0, 1))], trajectory: ['big.xyz', big] }).expect(202);
    await t.tasks.idle();
    await modeller.delete(`/api/references/${first.body.id}`).expect(204);
    // Fill the quota with accepted files (a failed reference frees its bytes), then go over it.
    const ok = await upload({ structure: ['a.gro', groText(sys, sys.frames.slice(0, 1))], trajectory: ['t.gro', groText(sys)] }).expect(202);
    await t.tasks.idle();
    await t.ctx.db('simulation_references').where({ id: ok.body.id }).update({ bytes: 2_900_000 });
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await upload({ structure: ['a.gro', groText(sys, sys.frames.slice(0, 1))], trajectory: ['t.gro', groText(sys)] });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('quota_exceeded');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
    expect(uploadsLeft()).toBe(0);
  });

  it('deleting a reference removes its row and files', async () => {
    const res = await upload({ structure: ['sys.gro', groText(sys, sys.frames.slice(0, 1))] }).expect(202);
    await t.tasks.idle();
    await student.delete(`/api/references/${res.body.id}`).expect(403);
    await modeller.delete(`/api/references/${res.body.id}`).expect(204);
    await modeller.get(`/api/references/${res.body.id}`).expect(404);
    expect(readdirSync(join(t.ctx.config.dataDir, 'references')).includes(String(res.body.id))).toBe(false);
  });
});
