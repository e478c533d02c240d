import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { snapshot } from '../helpers/fixtures';
import { assignAtoms, renameBead } from '../../src/shared/mapping-doc';
import type { Comparison, VersionDetail, VersionSummary } from '../../src/shared/versions';
import { editDraft, propanolMapping } from './versions-fixtures';

let t: TestApp;
let modeller: ApiClient;
let student: ApiClient;
const TABLES = ['mappings', 'mapping_versions', 'mapping_locks', 'mapping_audit', 'mapping_updates', 'mapping_snapshots'];

beforeAll(async () => {
  t = await createTestApp();
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
});
afterAll(() => t.stop());

describe('versions', () => {
  it('saves the server’s own draft with its evaluation, numbered per mapping', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Save test');
    const saved = await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'First cut' }).expect(201);
    expect(saved.body).toMatchObject({ number: 1, message: 'First cut', beadCount: 2, production: false, author: { displayName: expect.any(String) } });
    const v: VersionDetail = (await student.get(`/api/mappings/${mappingId}/versions/1`).expect(200)).body;
    expect(v.draft.beads.map((b) => [b.id, b.atoms.map((a) => a.index)])).toEqual([['a', [0, 1]], ['b', [2, 3]]]);
    expect(v.evaluation?.beads).toHaveLength(2);
    expect(v.canonicalSmiles).toBe((await t.ctx.db('molecules').join('mappings', 'mappings.molecule_id', 'molecules.id').where('mappings.id', mappingId).first('canonical_smiles')).canonical_smiles);
    // The stated hash is SHA-256 (Node's crypto) over the content text docs/exports.md documents, written
    // out by hand for this draft: keys in order, 1-based atom numbers with weights, type null when unset.
    const documented =
      `{"canonicalSmiles":${JSON.stringify(v.canonicalSmiles)},"beads":[` +
      '{"id":"a","name":"A","type":"C1","centre":"mass","atoms":[[1,1],[2,1]]},' +
      '{"id":"b","name":"B","type":null,"centre":"mass","atoms":[[3,1],[4,1]]}]}';
    expect(v.sha256).toBe(createHash('sha256').update(documented, 'utf8').digest('hex'));
  });

  it('ignores any draft a client sends: the body may carry a message only', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Client draft');
    const before = await snapshot(t.ctx.db, TABLES);
    const res = await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'x', draft: { beads: [] } }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('gives parallel saves distinct numbers 1…n', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Parallel');
    const results = await Promise.all(Array.from({ length: 8 }, (_, i) => modeller.post(`/api/mappings/${mappingId}/versions`, { message: `save ${i}` })));
    expect(results.map((r) => r.status)).toEqual(Array(8).fill(201));
    expect(results.map((r) => r.body.number).sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    const list: VersionSummary[] = (await student.get(`/api/mappings/${mappingId}/versions`).expect(200)).body;
    expect(list.map((v) => v.number)).toEqual([8, 7, 6, 5, 4, 3, 2, 1]);
  });

  it('answers 404 for a version that does not exist and changes nothing', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Missing');
    const before = await snapshot(t.ctx.db, TABLES);
    for (const res of [await student.get(`/api/mappings/${mappingId}/versions/7`), await modeller.post(`/api/mappings/${mappingId}/versions/7/restore`)]) {
      expect(res.status).toBe(404);
      expect(res.body.error).toMatchObject({ code: 'not_found', message: expect.stringContaining('Version 7') });
    }
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });

  it('compares two versions and a version with the draft', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Compare');
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'one' }).expect(201);
    await editDraft(t.ctx.db, mappingId, (doc) => {
      assignAtoms(doc, 'a', [2]);
      renameBead(doc, 'b', 'OH');
    });
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'two' }).expect(201);
    const c: Comparison = (await student.get(`/api/mappings/${mappingId}/compare?from=1&to=2`).expect(200)).body;
    expect(c.moved).toEqual([{ atom: 2, from: { b: 1 }, to: { a: 1 } }]);
    expect(c.renamed).toEqual([{ id: 'b', from: 'B', to: 'OH' }]);
    expect(c.added).toEqual([]);
    expect(c.removed).toEqual([]);
    const a = c.deltas.find((d) => d.id === 'a')!;
    expect(a.heavyAtoms).toBe(1);
    expect(a.mass).toBeGreaterThan(12); // gained one CH2 (≈ 14.03 g/mol)
    expect(a.mass).toBeLessThan(15);
    const toDraft: Comparison = (await student.get(`/api/mappings/${mappingId}/compare?from=1&to=draft`).expect(200)).body;
    expect(toDraft.to).toBe('draft');
    expect(toDraft.moved).toEqual(c.moved);
    const bad = await student.get(`/api/mappings/${mappingId}/compare?from=1&to=production`).expect(400);
    expect(bad.body.error.code).toBe('validation_failed');
    expect((await student.get(`/api/mappings/${mappingId}/compare?from=9&to=draft`)).status).toBe(404);
  });

  it('restores a version into the draft and records it', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Restore');
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'one' }).expect(201);
    await editDraft(t.ctx.db, mappingId, (doc) => assignAtoms(doc, 'a', [2, 3]));
    expect((await student.get(`/api/mappings/${mappingId}`).expect(200)).body.draft.beads[1].atoms).toEqual([]);
    const res = await modeller.post(`/api/mappings/${mappingId}/versions/1/restore`).expect(200);
    expect(res.body.draft.beads.map((b: { id: string }) => b.id)).toEqual(['a', 'b']);
    // The draft differed from version 1, so it was kept first as version 2 (issue 13, point 1).
    expect(res.body).toMatchObject({ restored: 1, snapshot: 2 });
    const kept: VersionDetail = (await student.get(`/api/mappings/${mappingId}/versions/2`).expect(200)).body;
    expect(kept.message).toBe('before restore of v1');
    expect(kept.draft.beads.map((b) => b.atoms.map((a) => a.index))).toEqual([[0, 1, 2, 3], []]);
    // Stored: a fresh read from MariaDB (the room closed again) has the restored draft.
    const again = (await student.get(`/api/mappings/${mappingId}`).expect(200)).body;
    expect(again.draft.beads.map((b: { atoms: { index: number }[] }) => b.atoms.map((a) => a.index))).toEqual([[0, 1], [2, 3]]);
    expect(await t.collab.rooms.live(mappingId)).toBeNull();
    const audit = (await student.get(`/api/mappings/${mappingId}/audit`).expect(200)).body;
    expect(audit.map((e: { action: string; version: number }) => [e.action, e.version])).toEqual([['restore', 1], ['save', 2], ['save', 1]]);
  });

  it('keeps no snapshot when the draft equals the newest version, and none when the restore is refused', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Restore unchanged');
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'one' }).expect(201);
    await editDraft(t.ctx.db, mappingId, (doc) => assignAtoms(doc, 'a', [2]));
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'two' }).expect(201);
    const res = await modeller.post(`/api/mappings/${mappingId}/versions/1/restore`, {}).expect(200);
    expect(res.body).toMatchObject({ restored: 1, snapshot: null });
    expect((await student.get(`/api/mappings/${mappingId}/versions`).expect(200)).body).toHaveLength(2);

    // A bad body and a locked mapping change nothing: no snapshot, no restore.
    await editDraft(t.ctx.db, mappingId, (doc) => assignAtoms(doc, 'a', [3]));
    const before = await snapshot(t.ctx.db, TABLES);
    const bad = await modeller.post(`/api/mappings/${mappingId}/versions/2/restore`, { clientId: 'me' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('validation_failed');
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
    await t.ctx.db('mappings').where({ id: mappingId }).update({ locked: true });
    const whileLocked = await snapshot(t.ctx.db, TABLES);
    const locked = await modeller.post(`/api/mappings/${mappingId}/versions/2/restore`, {});
    expect([locked.status, locked.body.error.code]).toEqual([409, 'mapping_locked']);
    expect(await snapshot(t.ctx.db, TABLES)).toBe(whileLocked);
  });

  it('refuses students saving or restoring', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Student');
    await modeller.post(`/api/mappings/${mappingId}/versions`, {}).expect(201);
    const before = await snapshot(t.ctx.db, TABLES);
    expect((await student.post(`/api/mappings/${mappingId}/versions`, {})).status).toBe(403);
    expect((await student.post(`/api/mappings/${mappingId}/versions/1/restore`)).status).toBe(403);
    expect(await snapshot(t.ctx.db, TABLES)).toBe(before);
  });
});
