import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { createAccount, demoProjectId, snapshot } from '../helpers/fixtures';
import type { AuditEntry } from '../../src/shared/audit';
import { propanolMapping } from './versions-fixtures';

let t: TestApp;
let modeller: ApiClient;
let student: ApiClient;
let supervisor: ApiClient;
let supervisor2: ApiClient;
const TABLES = ['mappings', 'mapping_versions', 'mapping_locks', 'mapping_audit', 'mapping_updates', 'mapping_snapshots'];

beforeAll(async () => {
  t = await createTestApp();
  await createAccount(t.ctx.db, 'second.supervisor@example.org', { projectId: await demoProjectId(t.ctx.db), role: 'supervisor' });
  [modeller, student, supervisor, supervisor2] = await Promise.all(
    ['modeller@example.org', 'student@example.org', 'supervisor@example.org', 'second.supervisor@example.org'].map((e) => signedIn(t.app, e)),
  );
});
afterAll(() => t.stop());

async function withVersions(name: string, n = 2): Promise<number> {
  const { mappingId } = await propanolMapping(t.ctx.db, name);
  for (let i = 0; i < n; i++) await modeller.post(`/api/mappings/${mappingId}/versions`, { message: `v${i + 1}` }).expect(201);
  return mappingId;
}

describe('production lock', () => {
  it('locks a version, badges it, makes the draft read-only over REST, and unlocks with a reason', async () => {
    const id = await withVersions('Lock flow');
    const locked = await supervisor.post(`/api/mappings/${id}/lock`, { version: 2, note: 'Reviewed for the production runs.' }).expect(200);
    expect(locked.body).toMatchObject({ locked: true, version: 2, note: 'Reviewed for the production runs.' });
    expect((await student.get(`/api/mappings/${id}`).expect(200)).body.locked).toBe(true);
    const list = (await student.get(`/api/mappings/${id}/versions`).expect(200)).body;
    expect(list.map((v: { number: number; production: boolean }) => [v.number, v.production])).toEqual([[2, true], [1, false]]);

    const before = await snapshot(t.ctx.db, TABLES);
    const edit = await modeller.patch(`/api/mappings/${id}`, { name: 'Renamed while locked' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.code).toBe('mapping_locked');
    const restore = await modeller.post(`/api/mappings/${id}/versions/1/restore`);
    expect(restore.status).toBe(409);
    expect(restore.body.error.code).toBe('mapping_locked');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);

    await supervisor.post(`/api/mappings/${id}/unlock`, { reason: 'Charges need another look.' }).expect(200);
    expect((await student.get(`/api/mappings/${id}/lock`).expect(200)).body.locked).toBe(false);
    await modeller.patch(`/api/mappings/${id}`, { name: 'Renamed after unlock' }).expect(200);
    const audit: AuditEntry[] = (await student.get(`/api/mappings/${id}/audit`).expect(200)).body;
    expect(audit.map((e) => [e.action, e.version, e.reason])).toEqual([
      ['unlock', 2, 'Charges need another look.'],
      ['lock', 2, 'Reviewed for the production runs.'],
      ['save', 2, 'v2'],
      ['save', 1, 'v1'],
    ]);
    expect(audit[0].actor?.displayName).toEqual(expect.any(String));
  });

  it.each([1, 2, 3, 4, 5])('lets exactly one of two supervisors locking at once win (round %i)', async (round) => {
    const id = await withVersions(`Race ${round}`);
    const [a, b] = await Promise.all([supervisor.post(`/api/mappings/${id}/lock`, { version: 1 }), supervisor2.post(`/api/mappings/${id}/lock`, { version: 2 })]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error.code).toBe('already_locked');
    expect(await t.ctx.db('mapping_locks').where({ mapping_id: id }).count({ n: '*' }).first()).toMatchObject({ n: 1 });
    expect((await t.ctx.db('mapping_audit').where({ mapping_id: id, action: 'lock' })).length).toBe(1);
  });

  it.each([
    ['a modeller locking', () => modeller, 'lock', { version: 1 }, 403, 'forbidden'],
    ['a student locking', () => student, 'lock', { version: 1 }, 403, 'forbidden'],
    ['an unknown version', () => supervisor, 'lock', { version: 99 }, 422, 'unknown_version'],
    ['no version', () => supervisor, 'lock', {}, 400, 'validation_failed'],
    ['an unlock without a reason', () => supervisor, 'unlock', {}, 400, 'validation_failed'],
    ['an unlock with a blank reason', () => supervisor, 'unlock', { reason: '   ' }, 400, 'validation_failed'],
    ['an unlock of an unlocked mapping', () => supervisor, 'unlock', { reason: 'Why not' }, 409, 'not_locked'],
  ])('refuses %s and changes nothing', async (_what, who, action, body, status, code) => {
    const id = await withVersions(`Refuse ${_what}`, 1);
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await who().post(`/api/mappings/${id}/${action}`, body);
    expect(res.status).toBe(status);
    expect(res.body.error).toMatchObject({ code, message: expect.any(String) });
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('keeps the audit trail append-only in the database itself', async () => {
    const id = await withVersions('Append only', 1);
    const before = await snapshot(t.ctx.db, ['mapping_audit']);
    await expect(t.ctx.db('mapping_audit').where({ mapping_id: id }).update({ reason: 'rewritten' })).rejects.toThrow(/append-only/);
    await expect(t.ctx.db('mapping_audit').where({ mapping_id: id }).delete()).rejects.toThrow(/append-only/);
    expect(await snapshot(t.ctx.db, ['mapping_audit'])).toBe(before);
  });
});
