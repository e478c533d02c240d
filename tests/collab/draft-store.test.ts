import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { connectClient, listen, sessionCookie, synced, until } from '../helpers/collab-client';
import { demoMappingId } from '../helpers/fixtures';
import { atomsOf, beadsOf, createBead, docToMapping } from '../../src/shared/mapping-doc';
import { loadDraft } from '../../server/drafts/drafts.service';
import { CLOSE_TRY_AGAIN } from '../../src/shared/collab-protocol';

// The room stores only updates that pass its checks (server/drafts/draft-room.ts), but a stored row may still
// be bad (written by other means, or damaged): loading must skip it, with the same checks in the same
// order, and keep the rest, rather than leave the mapping unloadable. When an update cannot be stored
// at all, nothing is relayed and the sender reconnects and resends.

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

describe('loading a draft with bad rows among its updates', () => {
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

describe('an update that cannot be stored', () => {
  it('is not relayed; its sender reconnects and sends it again once MariaDB takes it', async () => {
    const a = connectClient(http.url, mappingId, cookie);
    const b = connectClient(http.url, mappingId, cookie);
    await Promise.all([synced(a), synced(b)]);
    const closes: (number | undefined)[] = [];
    a.provider.on('connection-close', (event) => void closes.push(event?.code));

    // A real failure of the INSERT: the table is briefly not there.
    await t.ctx.db.raw('RENAME TABLE mapping_updates TO mapping_updates_away');
    try {
      createBead(a.doc, [1], { id: 'while-away' });
      await until('the sender is told to reconnect', () => closes.includes(CLOSE_TRY_AGAIN));
      expect(beadsOf(b.doc).has('while-away')).toBe(false);
    } finally {
      await t.ctx.db.raw('RENAME TABLE mapping_updates_away TO mapping_updates');
    }

    await until('the bead reaches the other client after the resend', () => beadsOf(b.doc).has('while-away'));
    // Stored: the draft as MariaDB has it holds the bead. (Not a row count: a compaction may fold the
    // update rows into the snapshot meanwhile, which left fewer rows than before in a loaded run.)
    expect(docToMapping((await loadDraft(t.ctx.db, mappingId)).doc).beads.map((x) => x.id)).toContain('while-away');
    a.destroy();
    b.destroy();
  });
});
