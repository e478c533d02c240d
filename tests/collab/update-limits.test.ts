import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { connectClient, listen, rawCollabSocket, sessionCookie, synced, until, type CollabClient, type RawCollabSocket } from '../helpers/collab-client';
import { demoMappingId } from '../helpers/fixtures';
import { propanolMapping } from '../api/versions-fixtures';
import { beadsOf, createBead, docToMapping } from '../../src/shared/mapping-doc';
import { loadDraft } from '../../server/drafts/drafts.service';
import { UpdateLog } from '../../server/drafts/update-log';
import { connectionOptions } from '../../server/db/knex';
import { configFromEnv } from '../../server/config';
import { CLOSE_TOO_LARGE } from '../../src/shared/collab-protocol';

// Issue 11, item 4, with the issue's own examples sent over a bare socket (as an attacker's client
// would): an update whose dependencies the server never received, a forbidden key, content that is
// not visible in the map, frames over the per-frame limit (1 MiB by default). Each is refused, and
// nothing of it is relayed or stored. A stored oversized row (from before these checks) leaves its
// mapping loadable and compactable.

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let mappingId: number;
let cookie: string;
let watcher: CollabClient;
let marker: CollabClient;
const open: CollabClient[] = [];
const sockets: RawCollabSocket[] = [];
let n = 0;

const stored = async (id = mappingId) => Number((await t.ctx.db('mapping_updates').where({ mapping_id: id }).count({ n: '*' }).first())?.n ?? 0);
const attacker = async () => {
  const s = await rawCollabSocket(http.url, mappingId, cookie);
  sockets.push(s);
  return s;
};

/** Two updates of one client: `first` creates a bead, `second` changes it with `edit` (so it depends on `first`). */
function dependentUpdates(edit: (bead: Y.Map<unknown>) => void, gc = true): { beadId: string; first: Uint8Array; second: Uint8Array } {
  const doc = new Y.Doc({ gc });
  const updates: Uint8Array[] = [];
  doc.on('update', (u: Uint8Array) => updates.push(u));
  const beadId = createBead(doc, [0], { id: `dep-${++n}` });
  doc.transact(() => edit(beadsOf(doc).get(beadId)!));
  expect(updates).toHaveLength(2);
  return { beadId, first: updates[0], second: updates[1] };
}

/** Nothing of the attack reached the others or MariaDB: a later edit arrives, the attack did not. */
async function expectNothingKept(storedBefore: number, beadId: string): Promise<void> {
  const later = `marker-${++n}`;
  createBead(marker.doc, [1], { id: later });
  await until('the marker reaches the watcher', () => beadsOf(watcher.doc).has(later));
  expect(beadsOf(watcher.doc).has(beadId)).toBe(false);
  expect(watcher.doc.store.pendingStructs).toBeNull();
  expect(watcher.doc.store.pendingDs).toBeNull();
  expect(await stored()).toBe(storedBefore + 1); // the marker only
  const draft = docToMapping((await loadDraft(t.ctx.db, mappingId)).doc);
  expect(draft.beads.map((b) => b.id)).not.toContain(beadId);
  expect(draft.beads.every((b) => b.name.length <= 40)).toBe(true);
}

beforeAll(async () => {
  // Slow pings: the big frames keep this one process busy, and a missed pong would reconnect a client
  // (its sync reply is then stored again, which the counts below would mistake for a leak).
  t = await createTestApp({}, { pingIntervalMs: 30_000, compactIntervalMs: 10 * 60_000 });
  http = await listen(t);
  mappingId = await demoMappingId(t.ctx.db);
  cookie = await sessionCookie(http.url, 'modeller@example.org');
  watcher = connectClient(http.url, mappingId, await sessionCookie(http.url, 'supervisor@example.org'));
  marker = connectClient(http.url, mappingId, cookie);
  open.push(watcher, marker);
  await Promise.all([synced(watcher), synced(marker)]);
  // One edit each way: every frame the two sent while connecting (their sync replies) is handled, so
  // the stored-update counts below move only with the tests' own edits.
  createBead(marker.doc, [2], { id: 'settle-1' });
  createBead(watcher.doc, [3], { id: 'settle-2' });
  await until('settled', () => beadsOf(watcher.doc).has('settle-1') && beadsOf(marker.doc).has('settle-2'));
});
afterAll(async () => {
  for (const s of sockets) s.ws.terminate();
  for (const c of open) c.destroy();
  await http.close();
  await t.stop();
});

describe('incoming Yjs updates', () => {
  it('refuses the issue’s 3,000,000-character bead name sent with missing dependencies (over the frame limit: closed 1009)', async () => {
    const { beadId, second } = dependentUpdates((bead) => bead.set('name', 'N'.repeat(3_000_000)));
    expect(second.length).toBeGreaterThan(1024 * 1024);
    const before = await stored();
    const s = await attacker();
    s.sendUpdate(second);
    expect(await s.closed).toBe(CLOSE_TOO_LARGE);
    await expectNothingKept(before, beadId);
  });

  it('refuses a 15.5 MB frame (closed 1009), and a frame just over 1 MiB; the socket of others lives on', async () => {
    for (const size of [15_500_000, 1024 * 1024 + 1]) {
      const before = await stored();
      const s = await attacker();
      s.sendUpdate(new Uint8Array(size));
      expect(await s.closed).toBe(CLOSE_TOO_LARGE);
      await expectNothingKept(before, 'none');
    }
    expect(watcher.provider.wsconnected && marker.provider.wsconnected).toBe(true);
  });

  it('refuses an update that leaves pending structs (its dependencies never arrived)', async () => {
    const { beadId, second } = dependentUpdates((bead) => bead.set('name', 'Fine'));
    const before = await stored();
    const s = await attacker();
    s.sendUpdate(second);
    await until('the refusal', () => s.errors.length > 0);
    expect(s.errors[0]).toMatchObject({ code: 'update_refused', details: { code: 'missing_dependencies' } });
    await expectNothingKept(before, beadId);
  });

  it('refuses a pending delete set (deletions of content the server never received)', async () => {
    const doc = new Y.Doc();
    const beadId = createBead(doc, [0], { id: `del-${++n}` });
    let deletion: Uint8Array | null = null;
    doc.on('update', (u: Uint8Array) => (deletion = u));
    beadsOf(doc).delete(beadId);
    const before = await stored();
    const s = await attacker();
    s.sendUpdate(deletion!);
    await until('the refusal', () => s.errors.length > 0);
    expect(s.errors[0]).toMatchObject({ code: 'update_refused', details: { code: 'missing_dependencies' } });
    await expectNothingKept(before, beadId);
  });

  it('refuses a forbidden key, also where it cannot be seen (in a pending update)', async () => {
    const { beadId, second } = dependentUpdates((bead) => bead.set('evil', 'x'));
    const before = await stored();
    const s = await attacker();
    s.sendUpdate(second);
    await until('the refusal', () => s.errors.length > 0);
    expect(s.errors[0]).toMatchObject({ code: 'update_refused', details: { code: 'unknown_key', path: expect.stringContaining('evil') } });
    await expectNothingKept(before, beadId);
  });

  it('refuses an over-long name within the frame limit that is overwritten in the same update (never visible)', async () => {
    // Accepted first: a bead of this client; then, in one transaction, a 900,000-character name and a
    // fine one over it. The map would show "Fine", but the update carries (and would store) the long one.
    const doc = new Y.Doc({ gc: false });
    const updates: Uint8Array[] = [];
    doc.on('update', (u: Uint8Array) => updates.push(u));
    const beadId = createBead(doc, [0], { id: `hidden-${++n}` });
    doc.transact(() => {
      beadsOf(doc).get(beadId)!.set('name', 'H'.repeat(900_000));
      beadsOf(doc).get(beadId)!.set('name', 'Fine');
    });
    expect(updates[1].length).toBeGreaterThan(900_000);
    expect(updates[1].length).toBeLessThan(1024 * 1024);
    const s = await attacker();
    s.sendUpdate(updates[0]);
    await until('the bead arrives', () => beadsOf(watcher.doc).has(beadId));
    const before = await stored();
    s.sendUpdate(updates[1]);
    await until('the refusal', () => s.errors.length > 0);
    expect(s.errors[0]).toMatchObject({ code: 'update_refused', details: { code: 'wrong_type' } });
    const later = `marker-${++n}`;
    createBead(marker.doc, [1], { id: later });
    await until('the marker reaches the watcher', () => beadsOf(watcher.doc).has(later));
    expect(beadsOf(watcher.doc).get(beadId)?.get('name')).not.toBe('Fine');
    expect(await stored()).toBe(before + 1);
  });

  it('takes the frame limit from COLLAB_MAX_FRAME_BYTES (1 MiB unless set)', () => {
    const env = { DATABASE_URL: 'mysql://x@localhost/x', SESSION_SECRET: 'x'.repeat(32) };
    expect(configFromEnv(env).collabMaxFrameBytes).toBe(1024 * 1024);
    expect(configFromEnv({ ...env, COLLAB_MAX_FRAME_BYTES: '4194304' }).collabMaxFrameBytes).toBe(4 * 1024 * 1024);
  });
});

describe('a mapping with an oversized stored row', () => {
  it('stays loadable, editable and compactable; compaction drops the row', async () => {
    const { mappingId: id } = await propanolMapping(t.ctx.db, 'Oversized row');
    // As the issue found it: a 15.5 MB update with missing dependencies, appended by the real write path.
    const { second } = dependentUpdates((bead) => bead.set('name', 'X'.repeat(15_500_000)));
    expect(second.length).toBeGreaterThan(15_500_000);
    const log = new UpdateLog(connectionOptions(t.ctx.config.databaseUrl));
    try {
      await log.append(id, [{ userId: null, data: second }]);
    } finally {
      await log.close();
    }
    expect(await stored(id)).toBe(1);

    const loaded = await loadDraft(t.ctx.db, id);
    expect(docToMapping(loaded.doc).beads.map((b) => b.name)).toEqual(['A', 'B']);
    expect(loaded.doc.store.pendingStructs).toBeNull();

    const c = connectClient(http.url, id, cookie);
    await synced(c);
    createBead(c.doc, [3], { id: 'after-big-row', name: 'Ok' });
    await until('the edit is stored', async () => docToMapping((await loadDraft(t.ctx.db, id)).doc).beads.some((b) => b.id === 'after-big-row'));
    c.destroy(); // the last client leaves: the room compacts
    await until('compacted: no stored updates left', async () => (await stored(id)) === 0);
    const snap = await t.ctx.db('mapping_snapshots').where({ mapping_id: id }).first(t.ctx.db.raw('LENGTH(state) as bytes'));
    expect(Number(snap.bytes)).toBeLessThan(10_000);
    expect(docToMapping((await loadDraft(t.ctx.db, id)).doc).beads.map((b) => b.id).sort()).toEqual(['a', 'after-big-row', 'b']);
  });
});
