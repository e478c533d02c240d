import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { connectClient, listen, sessionCookie, synced, until, type CollabClient } from '../helpers/collab-client';
import { demoMappingId } from '../helpers/fixtures';
import { beadsOf, createBead, docToMapping } from '../../src/shared/mapping-doc';
import { loadDraft } from '../../server/drafts/drafts.service';

// Compaction runs beside the room's update queue (server/drafts/draft-room.ts): with a snapshot every 5
// updates, a fast stream of edits is compacted many times while later edits are still being stored.
// Nothing may be lost or doubled, and the stored draft must equal the live one.

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let mappingId: number;
let cookie: string;

beforeAll(async () => {
  t = await createTestApp({}, { compactEvery: 5 });
  http = await listen(t);
  mappingId = await demoMappingId(t.ctx.db);
  cookie = await sessionCookie(http.url, 'modeller@example.org');
});
afterAll(async () => {
  await http.close();
  await t.stop();
});

const snapshotRow = () => t.ctx.db('mapping_snapshots').where({ mapping_id: mappingId }).first('last_update_id');
const pendingIds = async () => (await t.ctx.db('mapping_updates').where({ mapping_id: mappingId }).orderBy('id').select('id')).map((r) => Number(r.id));

describe('compaction beside live edits', () => {
  let a: CollabClient;
  let b: CollabClient;

  beforeAll(async () => {
    a = connectClient(http.url, mappingId, cookie);
    b = connectClient(http.url, mappingId, cookie);
    await Promise.all([synced(a), synced(b)]);
  });

  it('keeps every edit of a fast stream while compacting every 5 updates', async () => {
    const before = Number((await snapshotRow())?.last_update_id ?? 0);
    const id = createBead(a.doc, [18], { id: 'stream', name: 'S-0' });
    for (let i = 1; i <= 60; i++) {
      beadsOf(a.doc).get(id)!.set('name', `S-${i}`);
      // A few at a time so some updates are stored while a compaction is running.
      if (i % 3 === 0) await new Promise((r) => setTimeout(r, 2));
    }
    await until('the last name reaches the other client', () => beadsOf(b.doc).get(id)?.get('name') === 'S-60');

    // Compacted at least once during the stream; the updates left over are all newer than the snapshot.
    await until('a compaction after the stream', async () => Number((await snapshotRow())?.last_update_id ?? 0) > before);
    const snap = Number((await snapshotRow())!.last_update_id);
    expect((await pendingIds()).every((x) => x > snap)).toBe(true);

    // The stored draft (snapshot + later updates) is the live draft.
    const stored = await loadDraft(t.ctx.db, mappingId);
    expect(docToMapping(stored.doc)).toEqual(docToMapping(b.doc));
    expect(Y.encodeStateVector(stored.doc)).toEqual(Y.encodeStateVector(a.doc));
  });

  it('folds everything into the snapshot when the last client leaves', async () => {
    const live = docToMapping(a.doc);
    a.destroy();
    b.destroy();
    await until('no stored updates left', async () => (await pendingIds()).length === 0);
    expect(docToMapping((await loadDraft(t.ctx.db, mappingId)).doc)).toEqual(live);
  });
});
