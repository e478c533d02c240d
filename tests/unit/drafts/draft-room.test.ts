import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { beadsOf, createBead, docToMapping, renameBead } from '../../../src/shared/mapping-doc';
import type { EvaluationInputs } from '../../../server/drafts/evaluate-draft';
import type { DraftRoom } from '../../../server/drafts/draft-room';
import { createInProcessRelay } from '../../../server/drafts/in-process-relay';
import { Awareness, applyAwarenessUpdate, encodeAwarenessUpdate } from 'y-protocols/awareness';
import { MemoryDraftStorage } from '../../../server/drafts/memory-draft-storage';
import { drained, openRoom, propanolInputs, testPeer, updateOn } from './room-test-kit';

// The room's order for an update (server/drafts/draft-room.ts): check → store → relay → evaluate.
// A refused update is neither stored nor relayed; a failed store relays nothing and tells the sender
// to send again; a slow store holds back everything behind it, so storage, relay and the document
// keep the order the updates arrived in. In-memory storage and the in-process relay, no database.

let inputs: EvaluationInputs;
const open: DraftRoom[] = [];

beforeAll(async () => {
  inputs = await propanolInputs(); // openchemlib and RDKit start here, not inside a test
}, 60_000);

afterEach(() => {
  for (const room of open.splice(0)) room.close();
});

async function kit(...args: Parameters<typeof openRoom> extends [unknown, ...infer R] ? R : never) {
  const k = await openRoom(inputs, ...args);
  open.push(k.room);
  return k;
}

/** The bead ids of a document. */
const beadIds = (doc: Y.Doc) => [...beadsOf(doc).keys()].sort();

describe('an accepted update', () => {
  it('is checked, stored, relayed to the others (not the sender), applied, then evaluated', async () => {
    const { room, storage, events, published } = await kit();
    const alice = testPeer(1);
    const bob = testPeer(2);
    room.join(alice);
    room.join(bob);
    const opened = alice.nextEvaluation();
    await opened; // the room's first evaluation, of the empty draft
    expect(events).toEqual(['evaluate']);
    events.length = 0;

    const evaluated = bob.nextEvaluation();
    const update = updateOn(room.doc, (d) => createBead(d, [0, 1], { id: 'a', name: 'A' }));
    room.receiveUpdate(alice, update);
    await evaluated;

    expect(events).toEqual(['store', 'relay', 'evaluate']);
    expect(storage.updates.map((u) => [u.mappingId, u.userId])).toEqual([[inputs.mappingId, 1]]);
    expect(published).toMatchObject([{ kind: 'update', seq: storage.updates[0].seq, prevSeq: 0, sender: alice.id, instance: 'this-server' }]);
    expect(bob.updates).toHaveLength(1);
    expect(alice.updates).toHaveLength(0);
    expect(beadIds(room.doc)).toEqual(['a']);
    // Bob's copy, built from what he was sent, is the room's draft.
    const bobsDoc = new Y.Doc();
    for (const u of bob.updates) Y.applyUpdate(bobsDoc, u);
    expect(docToMapping(bobsDoc)).toEqual(room.draft());
    // The evaluation is of the new draft: one bead of atoms 0 and 1.
    const { result } = room.snapshot();
    expect((await result).evaluation?.beads.map((b) => [b.id, b.heavyAtoms])).toEqual([['a', 2]]);
  });
});

describe('a refused update', () => {
  it('is neither stored, relayed, applied nor evaluated, and the sender is told why', async () => {
    const { room, storage, events, published, evaluations } = await kit();
    const alice = testPeer(1);
    const bob = testPeer(2);
    room.join(alice);
    room.join(bob);
    await alice.nextEvaluation();
    const before = evaluations();
    events.length = 0;

    // Atom 9 does not exist: propanol has atoms 0 to 3.
    room.receiveUpdate(alice, updateOn(room.doc, (d) => createBead(d, [9], { id: 'bad' })));
    await drained(room);

    expect(alice.errors).toMatchObject([{ code: 'update_refused', details: { code: 'atom_out_of_range', path: 'atoms.9' } }]);
    expect(storage.updates).toEqual([]);
    expect(published.filter((m) => m.kind === 'update')).toEqual([]);
    expect(bob.updates).toEqual([]);
    expect(beadIds(room.doc)).toEqual([]);
    // No new revision: asking for the current evaluation reuses the first one.
    await room.snapshot().result;
    expect(evaluations()).toBe(before);
    expect(events).toEqual([]);
  });

  it('leaves the updates accepted with it in the same batch intact', async () => {
    const { room, storage } = await kit();
    const alice = testPeer(1);
    const bob = testPeer(2);
    room.join(alice);
    room.join(bob);
    const good = updateOn(room.doc, (d) => createBead(d, [0], { id: 'good', name: 'G' }));
    const bad = updateOn(room.doc, (d) => createBead(d, [7], { id: 'bad' }));
    const next = updateOn(room.doc, (d) => {
      Y.applyUpdate(d, good);
      renameBead(d, 'good', 'Renamed');
    });
    // Three updates queued before the room's queue runs: one batch.
    room.receiveUpdate(alice, good);
    room.receiveUpdate(alice, bad);
    room.receiveUpdate(bob, next);
    await drained(room);
    expect(alice.errors).toHaveLength(1);
    expect(storage.updates.map((u) => u.userId)).toEqual([1, 2]);
    expect(room.draft().beads.map((b) => [b.id, b.name])).toEqual([['good', 'Renamed']]);
    expect(bob.updates).toHaveLength(1); // alice's good one; his own is not sent back
    expect(alice.updates).toHaveLength(1); // bob's
  });
});

describe('a failed store', () => {
  it('relays and applies nothing, asks the sender to send again, and the resend goes through', async () => {
    const storage = new MemoryDraftStorage();
    let failNext = true;
    storage.beforeAppend = () => {
      if (failNext) {
        failNext = false;
        throw new Error('MariaDB went away');
      }
    };
    const { room, published } = await kit({}, storage);
    const alice = testPeer(1);
    const bob = testPeer(2);
    room.join(alice);
    room.join(bob);
    const update = updateOn(room.doc, (d) => createBead(d, [2, 3], { id: 'oh', name: 'OH' }));
    room.receiveUpdate(alice, update);
    await drained(room);

    expect(alice.retries).toHaveLength(1);
    expect(storage.updates).toEqual([]);
    expect(published.filter((m) => m.kind === 'update')).toEqual([]);
    expect(bob.updates).toEqual([]);
    expect(beadIds(room.doc)).toEqual([]);

    // Reconnecting sends the same update again; the shadow was rolled back, so it is accepted.
    room.receiveUpdate(alice, update);
    await drained(room);
    expect(storage.updates).toHaveLength(1);
    expect(bob.updates).toHaveLength(1);
    expect(beadIds(room.doc)).toEqual(['oh']);
  });
});

describe('a slow store', () => {
  it('keeps arrival order in storage, relay and document across concurrent updates, and relays nothing before it is stored', async () => {
    const storage = new MemoryDraftStorage();
    const gates: (() => void)[] = [];
    storage.beforeAppend = () => new Promise<void>((resolve) => gates.push(resolve));
    const { room, published } = await kit({}, storage);
    const alice = testPeer(1);
    const bob = testPeer(2);
    const watcher = testPeer(3);
    for (const p of [alice, bob, watcher]) room.join(p);

    // Alice creates bead a; while it is being stored, Bob renames it twice and Alice adds bead b.
    const create = updateOn(room.doc, (d) => createBead(d, [0], { id: 'a', name: 'First' }));
    const afterCreate = new Y.Doc();
    Y.applyUpdate(afterCreate, create);
    const rename1 = updateOn(afterCreate, (d) => renameBead(d, 'a', 'Second'));
    Y.applyUpdate(afterCreate, rename1);
    const rename2 = updateOn(afterCreate, (d) => renameBead(d, 'a', 'Third'));
    const other = updateOn(room.doc, (d) => createBead(d, [3], { id: 'b', name: 'B' }));

    room.receiveUpdate(alice, create);
    await until(() => gates.length === 1);
    room.receiveUpdate(bob, rename1);
    room.receiveUpdate(bob, rename2);
    room.receiveUpdate(alice, other);
    // Held at the first store: nothing is relayed or applied yet, nothing else is stored.
    await Promise.resolve();
    expect(published.filter((m) => m.kind === 'update')).toEqual([]);
    expect(watcher.updates).toEqual([]);
    expect(beadIds(room.doc)).toEqual([]);

    gates.shift()!();
    await until(() => gates.length === 1); // the three that arrived meanwhile: one batch, one append
    expect(watcher.updates).toHaveLength(1);
    gates.shift()!();
    await drained(room);

    // Stored in arrival order: replaying the stored updates one by one shows each step.
    const replay = new Y.Doc();
    const steps = storage.updates.map((u) => {
      Y.applyUpdate(replay, u.data);
      return docToMapping(replay).beads.map((b) => b.name).join(',');
    });
    expect(steps).toEqual(['First', 'Second', 'Third', 'Third,B']);
    const seqs = storage.updates.map((u) => u.seq);
    expect(published.filter((m) => m.kind === 'update').map((m) => m.kind === 'update' && [m.seq, m.prevSeq])).toEqual(seqs.map((s, i) => [s, i === 0 ? 0 : seqs[i - 1]]));
    expect(watcher.updates).toEqual(storage.updates.map((u) => u.data));
    expect(room.draft().beads.map((b) => [b.id, b.name])).toEqual([
      ['a', 'Third'],
      ['b', 'B'],
    ]);
    // What was stored loads as the same draft.
    expect(docToMapping((await storage.load(inputs.mappingId, 4)).doc)).toEqual(room.draft());
  });
});

describe('the relay between servers', () => {
  it('applies another server’s update, sends it to the peers, and notices a missing one', async () => {
    const relay = createInProcessRelay();
    const { room } = await kit({ relay });
    const bob = testPeer(2);
    room.join(bob);
    const first = updateOn(room.doc, (d) => createBead(d, [1], { id: 'x', name: 'X' }));
    relay.publish({ kind: 'update', mappingId: inputs.mappingId, seq: 10, prevSeq: 0, update: first, instance: 'other-server', sender: 'someone' });
    expect(beadIds(room.doc)).toEqual(['x']);
    expect(bob.updates).toEqual([first]);
    expect(room.gaps).toBe(0);
    const later = updateOn(room.doc, (d) => renameBead(d, 'x', 'Y'));
    relay.publish({ kind: 'update', mappingId: inputs.mappingId, seq: 14, prevSeq: 12, update: later, instance: 'other-server', sender: 'someone' });
    expect(room.gaps).toBe(1);
  });

  it('on a gap reads the stored draft and takes what it lacks: applied, sent to its peers, compaction allowed again', async () => {
    const relay = createInProcessRelay();
    const storage = new MemoryDraftStorage();
    const { room } = await kit({ relay }, storage);
    const bob = testPeer(2);
    room.join(bob);
    // Another server stored two updates whose messages never arrived here.
    const other = new Y.Doc();
    const missed1 = updateOn(other, (d) => createBead(d, [0], { id: 'm1', name: 'M1' }));
    Y.applyUpdate(other, missed1);
    const missed2 = updateOn(other, (d) => createBead(d, [1], { id: 'm2', name: 'M2' }));
    Y.applyUpdate(other, missed2);
    const seq = await storage.append(inputs.mappingId, [{ userId: 9, data: missed1 }, { userId: 9, data: missed2 }]);
    // Its next update names the last of them as its predecessor: this room never had it.
    const next = updateOn(other, (d) => renameBead(d, 'm2', 'Later'));
    await storage.append(inputs.mappingId, [{ userId: 9, data: next }]);
    relay.publish({ kind: 'update', mappingId: inputs.mappingId, seq: seq + 1, prevSeq: seq, update: next, instance: 'other-server', sender: 'someone' });
    expect(room.gaps).toBe(1);
    await drained(room);
    expect(room.caughtUp).toBe(1);
    expect(room.draft().beads.map((b) => [b.id, b.name]).sort()).toEqual([
      ['m1', 'M1'],
      ['m2', 'Later'],
    ]);
    // Bob got the relayed update and then what was missing; together they give him the same draft.
    const bobs = new Y.Doc();
    for (const u of bob.updates) Y.applyUpdate(bobs, u);
    expect(docToMapping(bobs)).toEqual(room.draft());
    // Nothing was missing any more: a second gap message finds nothing to take.
    relay.publish({ kind: 'gap', mappingId: inputs.mappingId });
    await drained(room);
    expect(room.caughtUp).toBe(1);
  });
});

describe('two servers on one relay', () => {
  it('each stores its own peers’ updates; the other applies them and sends them on, presence too', async () => {
    const relay = createInProcessRelay();
    const a = await kit({ relay, instance: 'server-a' });
    const b = await kit({ relay, instance: 'server-b' }, a.storage); // one database behind both
    const alice = testPeer(1);
    const bob = testPeer(2);
    a.room.join(alice);
    b.room.join(bob);

    a.room.receiveUpdate(alice, updateOn(a.room.doc, (d) => createBead(d, [0, 1, 2], { id: 'c3', name: 'C3' })));
    await drained(a.room);
    expect(a.storage.updates).toHaveLength(1); // stored once, by the server that took it
    expect(beadIds(b.room.doc)).toEqual(['c3']);
    expect(bob.updates).toHaveLength(1);
    expect(b.room.gaps).toBe(0);

    const tab = new Awareness(new Y.Doc());
    tab.setLocalState({ cursor: 2 });
    applyAwarenessUpdate(a.room.awareness, encodeAwarenessUpdate(tab, [tab.clientID]), alice);
    expect(alice.controlled.has(tab.clientID)).toBe(true);
    expect(bob.presence).toHaveLength(1);
    expect(alice.presence).toHaveLength(1); // the sender sees its own presence, as from one server
    expect(b.room.awareness.getStates().get(tab.clientID)).toEqual({ cursor: 2 });
  });
});

/** Waits for a condition that the room's queue makes true (event-driven: re-checked after each turn). */
async function until(done: () => boolean): Promise<void> {
  for (let i = 0; i < 1000 && !done(); i++) await new Promise((resolve) => setImmediate(resolve));
  if (!done()) throw new Error('condition not reached');
}

describe('what is stored and relayed', () => {
  it('is what the update added, so a struct the draft already has, sent again with other content, goes nowhere', async () => {
    const { room, storage } = await kit();
    const alice = testPeer(1);
    const bob = testPeer(2);
    room.join(alice);
    room.join(bob);
    // A client creates bead a; then a forged copy of the same struct ids (same client, same clocks)
    // carries another name. The room already has those structs, so the copy adds nothing.
    const client = new Y.Doc();
    client.clientID = 4242;
    const real = updateOn(client, (d) => {
      d.clientID = 4242;
      createBead(d, [0], { id: 'a', name: 'Real' });
    });
    const forgedDoc = new Y.Doc();
    forgedDoc.clientID = 4242;
    createBead(forgedDoc, [0], { id: 'a', name: 'Fake' });
    const forged = Y.encodeStateAsUpdate(forgedDoc);
    room.receiveUpdate(alice, real);
    await drained(room);
    room.receiveUpdate(alice, forged);
    await drained(room);
    expect(storage.updates).toHaveLength(1);
    expect(bob.updates).toHaveLength(1);
    const bobsDoc = new Y.Doc();
    for (const u of bob.updates) Y.applyUpdate(bobsDoc, u);
    expect(docToMapping(bobsDoc).beads.map((b) => b.name)).toEqual(['Real']);
    expect(room.draft().beads.map((b) => b.name)).toEqual(['Real']);
  });
});
