import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { connectClient, listen, sessionCookie, synced, until, type CollabClient } from '../helpers/collab-client';
import * as Y from 'yjs';
import * as decoding from 'lib0/decoding';
import { ATOMS, BEADS, assignAtoms, docToMapping } from '../../src/shared/mapping-doc';
import { MESSAGE_RESTORE } from '../../src/shared/collab-protocol';
import { propanolMapping } from './versions-fixtures';

// Versions against live rooms, with Node y-websocket clients: a save takes the room's document, a
// restore reaches everyone as one update, and a lock turns connected editors read-only at once.

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let modeller: ApiClient;
let supervisor: ApiClient;
let cookie: string;
const open: CollabClient[] = [];

beforeAll(async () => {
  t = await createTestApp({ loginLimits: { perAccount: 1000, perIp: 10_000, windowMs: 60_000 } }, { pingIntervalMs: 250 });
  http = await listen(t);
  modeller = await signedIn(t.app, 'modeller@example.org');
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  cookie = await sessionCookie(http.url, 'modeller@example.org');
});
afterAll(async () => {
  for (const c of open) c.destroy();
  await http.close();
  await t.stop();
});

const atomsOfBeads = (c: CollabClient) => docToMapping(c.doc).beads.map((b) => [b.id, b.atoms.map((a) => a.index)]);

describe('versions on a live draft', () => {
  it('saves the live document, restores as one update to everyone, and locks connected editors out', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Live');
    const [a, b] = [connectClient(http.url, mappingId, cookie), connectClient(http.url, mappingId, cookie)];
    open.push(a, b);
    await Promise.all([synced(a), synced(b)]);
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'start' }).expect(201);

    assignAtoms(a.doc, 'a', [2, 3]);
    await until('b sees the edit', () => JSON.stringify(atomsOfBeads(b)) === JSON.stringify([['a', [0, 1, 2, 3]], ['b', []]]));
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'all in a' }).expect(201);
    const v2 = (await modeller.get(`/api/mappings/${mappingId}/versions/2`).expect(200)).body;
    expect(v2.draft.beads.map((x: { atoms: unknown[] }) => x.atoms.length)).toEqual([4, 0]);

    let updates = 0;
    b.doc.on('update', () => updates++);
    await modeller.post(`/api/mappings/${mappingId}/versions/1/restore`).expect(200);
    for (const c of [a, b]) await until('restored', () => JSON.stringify(atomsOfBeads(c)) === JSON.stringify([['a', [0, 1]], ['b', [2, 3]]]));
    expect(updates).toBe(1);

    await supervisor.post(`/api/mappings/${mappingId}/lock`, { version: 1 }).expect(200);
    for (const c of [a, b]) await until('read-only session', () => c.session?.readOnly === true && c.session.readOnlyReason === 'locked');
    const stored = await t.ctx.db('mapping_updates').where({ mapping_id: mappingId }).count({ n: '*' }).first();
    assignAtoms(a.doc, 'b', [0]);
    await until('the refusal', () => a.errors.some((e) => e.code === 'read_only'));
    expect(await t.ctx.db('mapping_updates').where({ mapping_id: mappingId }).count({ n: '*' }).first()).toEqual(stored);
    expect(atomsOfBeads(b)).toEqual([['a', [0, 1]], ['b', [2, 3]]]);

    await supervisor.post(`/api/mappings/${mappingId}/unlock`, { reason: 'More work needed' }).expect(200);
    await until('editable again', () => a.session?.readOnly === false);
  });

  it('sends the restorer’s own connection the restore as a restore frame it can undo as one step', async () => {
    const { mappingId } = await propanolMapping(t.ctx.db, 'Undo restore');
    const [a, b] = [connectClient(http.url, mappingId, cookie), connectClient(http.url, mappingId, cookie)];
    open.push(a, b);
    await Promise.all([synced(a), synced(b)]);
    // Presence, as the editor announces it once its session starts: the server learns a's client id.
    // (With the account's own id: the server drops a state that claims another account.)
    a.provider.awareness.setLocalStateField('user', { id: a.session!.userId, name: 'a' });
    await modeller.post(`/api/mappings/${mappingId}/versions`, { message: 'start' }).expect(201);
    assignAtoms(b.doc, 'a', [2, 3]);
    await until('a sees the edit', () => JSON.stringify(atomsOfBeads(a)) === JSON.stringify([['a', [0, 1, 2, 3]], ['b', []]]));
    await until('the server knows a’s awareness', async () => (await t.collab.rooms.live(mappingId))?.peers.size === 2 && [...(await t.collab.rooms.live(mappingId))!.peers].some((p) => p.controlled.has(a.doc.clientID)));

    // What the editor does with a restore frame (src/features/editor/collab/mapping-session.ts).
    const undo = new Y.UndoManager([a.doc.getMap(BEADS), a.doc.getMap(ATOMS)], { trackedOrigins: new Set(), captureTimeout: 0 });
    let frames = 0;
    a.provider.messageHandlers[MESSAGE_RESTORE] = (_e, d) => {
      frames++;
      undo.trackedOrigins.add(a.provider);
      Y.applyUpdate(a.doc, decoding.readVarUint8Array(d), a.provider);
      undo.trackedOrigins.delete(a.provider);
    };
    const res = await modeller.post(`/api/mappings/${mappingId}/versions/1/restore`, { clientId: a.doc.clientID }).expect(200);
    expect(res.body.snapshot).toBe(2);
    for (const c of [a, b]) await until('restored', () => JSON.stringify(atomsOfBeads(c)) === JSON.stringify([['a', [0, 1]], ['b', [2, 3]]]));
    expect(frames).toBe(1);
    expect(undo.undoStack).toHaveLength(1);

    undo.undo();
    for (const c of [a, b]) await until('undone everywhere', () => JSON.stringify(atomsOfBeads(c)) === JSON.stringify([['a', [0, 1, 2, 3]], ['b', []]]));
    undo.destroy();
  });
});
