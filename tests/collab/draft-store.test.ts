import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { connectClient, listen, sessionCookie, synced } from '../helpers/collab-client';
import { demoMappingId } from '../helpers/fixtures';
import { atomsOf, beadsOf, createBead, docToMapping } from '../../src/shared/mapping-doc';
import { loadDraft } from '../../server/collab/draft-store';

// The room stores an update while it checks it and deletes it again when the check refuses it
// (server/collab/room.ts). A server that dies between the two leaves the refused update in
// mapping_updates: loading must skip it, with the same checks in the same order, and keep the rest.

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let mappingId: number;
let cookie: string;

beforeAll(async () => {
  t = await createTestApp();
  http = await listen(t);
  mappingId = await demoMappingId(t.ctx.db);
  cookie = await sessionCookie(http.url, 'modeller@example.org');
});
afterAll(async () => {
  await http.close();
  await t.stop();
});

/** An update made on a copy of the stored draft, as a client would send it. */
async function updateOnStored(edit: (doc: Y.Doc) => void): Promise<Uint8Array> {
  const { doc } = await loadDraft(t.ctx.db, mappingId);
  const before = Y.encodeStateVector(doc);
  edit(doc);
  return Y.encodeStateAsUpdate(doc, before);
}

describe('loading a draft with a refused update left behind', () => {
  it('skips the refused and the undecodable update and keeps the ones after them', async () => {
    const userId = (await t.ctx.db('users').where({ email: 'modeller@example.org' }).first('id')).id;
    const before = docToMapping((await loadDraft(t.ctx.db, mappingId)).doc);
    const outOfRange = await updateOnStored((doc) => atomsOf(doc).set('999', { ghost: 1 }));
    const renameAll = await updateOnStored((doc) => beadsOf(doc).forEach((b) => b.set('name', '')));
    const after = await updateOnStored((doc) => void createBead(doc, [0], { id: 'after-crash' }));
    for (const data of [outOfRange, Buffer.from([1, 2, 3, 250]), renameAll, after]) {
      await t.ctx.db('mapping_updates').insert({ mapping_id: mappingId, user_id: userId, data: Buffer.from(data) });
    }

    const loaded = await loadDraft(t.ctx.db, mappingId);
    expect(loaded.pending).toBe(4);
    expect(atomsOf(loaded.doc).has('999')).toBe(false);
    const draft = docToMapping(loaded.doc);
    expect(draft.beads.map((b) => b.id).sort()).toEqual([...before.beads.map((b) => b.id), 'after-crash'].sort());
    expect(draft.beads.every((b) => b.name.length > 0)).toBe(true);

    // The REST read (no room open) and a live room see the same.
    const res = await fetch(`${http.url}/api/mappings/${mappingId}`, { headers: { cookie } });
    expect((await res.json()).draft).toEqual(draft);
    const c = connectClient(http.url, mappingId, cookie);
    await synced(c);
    expect(docToMapping(c.doc)).toEqual(draft);
    expect(atomsOf(c.doc).has('999')).toBe(false);
    c.destroy();
  });
});
