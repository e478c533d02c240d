import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoMappingId, snapshot, userId } from '../helpers/fixtures';
import { beadsOf } from '../../src/shared/mapping-doc';
import { COMMENT_MAX, type Thread } from '../../src/shared/threads';
import { createThreadFixture, editDraft, firstBeadId, otherProjectMapping } from './threads-fixtures';

const TABLES = ['threads', 'thread_comments', 'thread_beads', 'notifications', 'notification_preferences'];

let t: TestApp;
let mappingId: number;
let beadId: string;
let modeller: ApiClient;
let student: ApiClient;
let supervisor: ApiClient;
beforeAll(async () => {
  t = await createTestApp();
  mappingId = await demoMappingId(t.ctx.db);
  beadId = await firstBeadId(t.ctx.db, mappingId);
  modeller = await signedIn(t.app, 'modeller@example.org');
  student = await signedIn(t.app, 'student@example.org');
  supervisor = await signedIn(t.app, 'supervisor@example.org');
});
afterAll(() => t.stop());

const unchanged = async (run: () => Promise<unknown>) => {
  const before = await snapshot(t.ctx.db, TABLES);
  await run();
  expect(await snapshot(t.ctx.db, TABLES)).toEqual(before);
};

describe('threads on beads', () => {
  it('a student opens a thread on a bead, others reply, and it is listed with the bead name', async () => {
    const created = await student.post(`/api/mappings/${mappingId}/threads`, { beadId, body: 'Should the *ring* carbon go here?' }).expect(201);
    const thread = created.body as Thread;
    expect(thread).toMatchObject({ mappingId, beadId, resolved: false, beadRemoved: false, createdBy: { displayName: 'Lea Okafor' } });
    expect(thread.comments).toHaveLength(1);
    const reply = await modeller.post(`/api/threads/${thread.id}/comments`, { body: 'I think so.' }).expect(201);
    expect(reply.body).toMatchObject({ threadId: thread.id, body: 'I think so.', author: { displayName: 'Tomas Brenn' }, editedAt: null });
    const list = await supervisor.get(`/api/mappings/${mappingId}/threads`).expect(200);
    const listed = (list.body as Thread[]).find((x) => x.id === thread.id)!;
    expect(listed.comments.map((c) => c.body)).toEqual(['Should the *ring* carbon go here?', 'I think so.']);
    expect(listed.beadName).not.toBe('');
  });

  it('resolves and reopens, and filters open / resolved', async () => {
    const { threadId } = await createThreadFixture(t.ctx.db);
    const resolved = await supervisor.patch(`/api/threads/${threadId}`, { resolved: true }).expect(200);
    expect(resolved.body).toMatchObject({ resolved: true, resolvedBy: { displayName: 'Dr Ines Marlow' } });
    const ids = async (status: string) => ((await student.get(`/api/mappings/${mappingId}/threads?status=${status}`).expect(200)).body as Thread[]).map((x) => x.id);
    expect(await ids('resolved')).toContain(threadId);
    expect(await ids('open')).not.toContain(threadId);
    await student.patch(`/api/threads/${threadId}`, { resolved: false }).expect(200);
    expect(await ids('open')).toContain(threadId);
    await student.get(`/api/mappings/${mappingId}/threads?status=maybe`).expect(400);
  });

  it('edits show as edited; deletes as deleted; supervisors delete anyone’s', async () => {
    const { threadId, commentId } = await createThreadFixture(t.ctx.db, 'modeller@example.org', 'First take.');
    const edited = await modeller.patch(`/api/comments/${commentId}`, { body: 'Second take.' }).expect(200);
    expect(edited.body).toMatchObject({ body: 'Second take.', editedAt: expect.any(String) });
    const mine = await student.post(`/api/threads/${threadId}/comments`, { body: 'Mine.' }).expect(201);
    await student.delete(`/api/comments/${mine.body.id}`).expect(204);
    await supervisor.delete(`/api/comments/${commentId}`).expect(204);
    const thread = ((await modeller.get(`/api/mappings/${mappingId}/threads`)).body as Thread[]).find((x) => x.id === threadId)!;
    expect(thread.comments.map((c) => [c.body, c.deletedAt !== null])).toEqual([
      ['', true],
      ['', true],
    ]);
    const again = await modeller.patch(`/api/comments/${commentId}`, { body: 'Back?' }).expect(409);
    expect(again.body.error.code).toBe('comment_deleted');
  });

  it('survives renaming the bead, and stays readable on a removed bead with its last name', async () => {
    const db = t.ctx.db;
    let id = '';
    await editDraft(db, mappingId, (doc) => {
      id = [...beadsOf(doc).keys()].at(-1)!;
      beadsOf(doc).get(id)!.set('name', 'Renamed');
    });
    const created = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: id, body: 'On the renamed bead.' }).expect(201);
    expect(created.body).toMatchObject({ beadName: 'Renamed', beadRemoved: false });
    await editDraft(db, mappingId, (doc) => beadsOf(doc).get(id)!.set('name', 'Renamed again'));
    const find = async () => ((await modeller.get(`/api/mappings/${mappingId}/threads`)).body as Thread[]).find((x) => x.id === created.body.id)!;
    expect(await find()).toMatchObject({ beadName: 'Renamed again', beadRemoved: false });
    await editDraft(db, mappingId, (doc) => beadsOf(doc).delete(id));
    expect(await find()).toMatchObject({ beadName: 'Renamed again', beadRemoved: true, comments: [expect.objectContaining({ body: 'On the renamed bead.' })] });
    // A bead the mapping once had still takes new threads.
    await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: id, body: 'Still about it.' }).expect(201);
  });
});

describe('bad input and abuse: a clear error, nothing changed', () => {
  it('a bead id the mapping never had is 422', async () => {
    await unchanged(async () => {
      const res = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: 'bnever000000000000', body: 'Hello' }).expect(422);
      expect(res.body.error).toMatchObject({ code: 'unknown_bead', message: expect.any(String), details: { beadId: 'bnever000000000000' } });
    });
  });

  it('a bead id of another mapping is 422 here', async () => {
    const other = await otherProjectMapping(t.ctx.db);
    await unchanged(() => modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: 'bx1', body: 'Hi' }).expect(422));
    // …and the other project's mapping itself is invisible to the modeller.
    await unchanged(() => modeller.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bx1', body: 'Hi' }).expect(404));
  });

  it('a comment on another project’s thread is 404, as are its edit, delete and resolve', async () => {
    const other = await otherProjectMapping(t.ctx.db);
    const sup = await userId(t.ctx.db, 'supervisor@example.org');
    const [threadId] = await t.ctx.db('threads').insert({ mapping_id: other.mappingId, bead_id: 'bx1', created_by: sup });
    const [commentId] = await t.ctx.db('thread_comments').insert({ thread_id: threadId, author_id: sup, body: 'Private.' });
    await unchanged(async () => {
      const res = await modeller.post(`/api/threads/${threadId}/comments`, { body: 'Let me in' }).expect(404);
      expect(res.body.error.code).toBe('not_found');
      await modeller.patch(`/api/threads/${threadId}`, { resolved: true }).expect(404);
      await modeller.patch(`/api/comments/${commentId}`, { body: 'Mine now' }).expect(404);
      await modeller.delete(`/api/comments/${commentId}`).expect(404);
      await modeller.get(`/api/mappings/${other.mappingId}/threads`).expect(404);
    });
  });

  it('editing someone else’s comment is 403, for supervisors too; a student may not delete others’', async () => {
    const { commentId } = await createThreadFixture(t.ctx.db, 'modeller@example.org', 'Original.');
    await unchanged(async () => {
      for (const who of [student, supervisor]) {
        const res = await who.patch(`/api/comments/${commentId}`, { body: 'Changed.' }).expect(403);
        expect(res.body.error.code).toBe('forbidden');
      }
      await student.delete(`/api/comments/${commentId}`).expect(403);
    });
  });

  it('a body over the limit is 413; empty and malformed bodies are 400', async () => {
    const { threadId, commentId } = await createThreadFixture(t.ctx.db);
    const long = 'x'.repeat(COMMENT_MAX + 1);
    await unchanged(async () => {
      const res = await modeller.post(`/api/threads/${threadId}/comments`, { body: long }).expect(413);
      expect(res.body.error).toMatchObject({ code: 'payload_too_large', details: { max: COMMENT_MAX, length: COMMENT_MAX + 1 } });
      await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body: long }).expect(413);
      await modeller.patch(`/api/comments/${commentId}`, { body: long }).expect(413);
      await modeller.post(`/api/threads/${threadId}/comments`, { body: '   ' }).expect(400);
      await modeller.post(`/api/threads/${threadId}/comments`, { body: 5 }).expect(400);
      await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: '<script>', body: 'x' }).expect(400);
      await modeller.patch(`/api/threads/${threadId}`, { resolved: 'yes' }).expect(400);
    });
    await modeller.post(`/api/threads/${threadId}/comments`, { body: 'y'.repeat(COMMENT_MAX) }).expect(201);
  });

  it('stores hostile bodies as text; the API never returns HTML', async () => {
    const body = '<img src=x onerror=alert(1)> [x](javascript:alert(2)) <script>alert(3)</script>';
    const res = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId, body }).expect(201);
    expect(res.body.comments[0].body).toBe(body);
    expect(res.headers['content-type']).toMatch(/application\/json/);
  });
});

describe('Beadloom’s own record of bead ids', () => {
  it('a bead a thread was started on stays valid after the draft history is rewritten', async () => {
    const { writeSnapshot } = await import('../../server/drafts/drafts.service');
    const other = await otherProjectMapping(t.ctx.db);
    const sup = await signedIn(t.app, 'supervisor@example.org');
    const created = await sup.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bx1', body: 'About E.' }).expect(201);
    // A draft written anew (as a restore or copy does) carries no tombstone of bx1.
    await writeSnapshot(t.ctx.db, other.mappingId, Y.encodeStateAsUpdate(new Y.Doc()), 0);
    const list = (await sup.get(`/api/mappings/${other.mappingId}/threads`).expect(200)).body as Thread[];
    expect(list.find((x) => x.id === created.body.id)).toMatchObject({ beadName: 'E', beadRemoved: true });
    await sup.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bx1', body: 'Still about E.' }).expect(201);
    await sup.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bx2', body: 'Never was.' }).expect(422);
  });
});

describe('threads and saved versions', () => {
  it('a bead only a saved version still has takes threads', async () => {
    const { writeSnapshot } = await import('../../server/drafts/drafts.service');
    const other = await otherProjectMapping(t.ctx.db);
    const sup = await signedIn(t.app, 'supervisor@example.org');
    await sup.post(`/api/mappings/${other.mappingId}/versions`, { message: 'First cut.' }).expect(201);
    await writeSnapshot(t.ctx.db, other.mappingId, Y.encodeStateAsUpdate(new Y.Doc()), 0);
    await sup.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bx1', body: 'On the saved bead.' }).expect(201);
  });

  it('viewing a version lists the threads of the beads it contains', async () => {
    const other = await otherProjectMapping(t.ctx.db);
    const sup = await signedIn(t.app, 'supervisor@example.org');
    const saved = await sup.post(`/api/mappings/${other.mappingId}/versions`, {}).expect(201);
    const onSaved = await sup.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bx1', body: 'Saved bead.' }).expect(201);
    await editDraft(t.ctx.db, other.mappingId, (doc) => {
      const m = new Y.Map<unknown>();
      m.set('name', 'New');
      m.set('type', null);
      m.set('centre', 'mass');
      beadsOf(doc).set('bnew', m);
    });
    const onNew = await sup.post(`/api/mappings/${other.mappingId}/threads`, { beadId: 'bnew', body: 'Later bead.' }).expect(201);
    const ids = async (q: string) => ((await sup.get(`/api/mappings/${other.mappingId}/threads${q}`).expect(200)).body as Thread[]).map((x) => x.id);
    expect(await ids(`?version=${saved.body.number}`)).toEqual([onSaved.body.id]);
    expect(await ids('')).toEqual([onSaved.body.id, onNew.body.id]);
    const missing = await sup.get(`/api/mappings/${other.mappingId}/threads?version=999`).expect(404);
    expect(missing.body.error.code).toBe('not_found');
    await sup.get(`/api/mappings/${other.mappingId}/threads?version=zero`).expect(400);
  });
});
