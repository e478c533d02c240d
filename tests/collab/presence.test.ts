import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { Awareness, encodeAwarenessUpdate } from 'y-protocols/awareness';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { connectClient, listen, rawCollabSocket, sessionCookie, synced, until, type CollabClient, type RawCollabSocket } from '../helpers/collab-client';
import { demoMappingId, userId } from '../helpers/fixtures';
import { presenceColour } from '../../src/shared/presence-colour';
import { MAX_CLIENT_IDS } from '../../server/drafts/awareness-stamp';

// Issue 11, item 5: presence comes from the signed-in account (server/drafts/awareness-stamp.ts).
// A read-only student claims to be the site admin; the supervisor's client sees the student's real
// identity or nothing, never the admin's. Every state the supervisor's client ever received is
// recorded, so a forged state that was relayed and replaced at once is still caught.

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let mappingId: number;
let supervisor: CollabClient;
let student: CollabClient;
const open: CollabClient[] = [];
const sockets: RawCollabSocket[] = [];
/** Every remote user field the supervisor's client has seen, by awareness client id. */
const seen: { clientId: number; user: unknown }[] = [];
let ids: Record<'admin' | 'student' | 'supervisor', number>;
const ADMIN_NAME = 'Ada Quill (site admin)';

beforeAll(async () => {
  t = await createTestApp();
  http = await listen(t);
  mappingId = await demoMappingId(t.ctx.db);
  ids = { admin: await userId(t.ctx.db, 'admin@example.org'), student: await userId(t.ctx.db, 'student@example.org'), supervisor: await userId(t.ctx.db, 'supervisor@example.org') };
  supervisor = connectClient(http.url, mappingId, await sessionCookie(http.url, 'supervisor@example.org'));
  student = connectClient(http.url, mappingId, await sessionCookie(http.url, 'student@example.org'));
  open.push(supervisor, student);
  await Promise.all([synced(supervisor), synced(student)]);
  supervisor.provider.awareness.on('change', ({ added, updated }: { added: number[]; updated: number[] }) => {
    for (const clientId of [...added, ...updated]) seen.push({ clientId, user: supervisor.provider.awareness.getStates().get(clientId)?.user });
  });
});
afterAll(async () => {
  for (const s of sockets) s.ws.terminate();
  for (const c of open) c.destroy();
  await http.close();
  await t.stop();
});

const stateOf = (_c: CollabClient, clientId: number) => supervisor.provider.awareness.getStates().get(clientId) as Record<string, unknown> | undefined;
const studentUser = () => ({ id: ids.student, name: 'Lea Okafor', colour: presenceColour(ids.student) });
const claimsAdmin = (user: unknown) => {
  const u = user as { id?: unknown; name?: unknown } | undefined;
  return u?.id === ids.admin || u?.name === ADMIN_NAME;
};

describe('awareness', () => {
  it('a student claiming to be the admin is shown as the student, or not at all', async () => {
    const aw = student.provider.awareness;
    expect(student.session).toMatchObject({ readOnly: true, role: 'student' });
    // The full forgery: the admin's id, name and colour.
    aw.setLocalState({ user: { id: ids.admin, name: ADMIN_NAME, colour: presenceColour(ids.admin) }, pointer: { x: 1, y: 2 }, selection: [0] });
    // Then the name only, with no id: rewritten to who the student is.
    aw.setLocalState({ user: { name: ADMIN_NAME, colour: '#000000' }, pointer: { x: 3, y: 4 }, selection: [1] });
    await until('the student’s second state arrives', () => (stateOf(supervisor, aw.clientID)?.pointer as { x?: number } | undefined)?.x === 3);
    expect(stateOf(supervisor, aw.clientID)?.user).toEqual(studentUser());
    expect(seen.filter((s) => claimsAdmin(s.user))).toEqual([]);
  });

  it('stamps an honest state with the account’s id, name and colour', async () => {
    student.provider.awareness.setLocalState({ user: { id: ids.student, name: 'Someone else', colour: '#123456' }, pointer: { x: 5, y: 6 } });
    await until('arrives', () => (stateOf(supervisor, student.provider.awareness.clientID)?.pointer as { x?: number } | undefined)?.x === 5);
    expect(stateOf(supervisor, student.provider.awareness.clientID)?.user).toEqual(studentUser());
  });

  it('drops states for another connection’s awareness id (no speaking or leaving for someone else)', async () => {
    const victim = supervisor.provider.awareness.clientID;
    supervisor.provider.awareness.setLocalStateField('pointer', { x: 7, y: 8 });
    await until('the supervisor’s own state is known to the student', () => student.provider.awareness.getStates().has(victim));
    const s = await rawCollabSocket(http.url, mappingId, await sessionCookie(http.url, 'student@example.org'));
    sockets.push(s);
    const doc = new Y.Doc();
    doc.clientID = victim;
    const forged = new Awareness(doc);
    forged.setLocalState({ user: { id: ids.student }, pointer: { x: 666, y: 666 } });
    for (let i = 0; i < 5; i++) forged.setLocalState({ user: { id: ids.student }, pointer: { x: 666, y: 666 + i } }); // clock beyond the real one
    s.sendAwareness(encodeAwarenessUpdate(forged, [victim]));
    forged.setLocalState(null); // and a removal of the supervisor's presence
    s.sendAwareness(encodeAwarenessUpdate(forged, [victim]));
    // An honest state on the same socket afterwards: once it arrives, the forged ones were handled.
    const own = new Awareness(new Y.Doc());
    own.setLocalState({ pointer: { x: 9, y: 9 } });
    s.sendAwareness(encodeAwarenessUpdate(own, [own.clientID]));
    await until('the honest state arrives', () => student.provider.awareness.getStates().has(own.clientID));
    expect(student.provider.awareness.getStates().get(own.clientID)?.user).toEqual(studentUser());
    const victimState = student.provider.awareness.getStates().get(victim);
    expect(victimState?.pointer).toEqual({ x: 7, y: 8 });
    expect(victimState?.user).toEqual({ id: ids.supervisor, name: 'Dr Ines Marlow', colour: presenceColour(ids.supervisor) });
  });

  it(`lets one connection announce at most ${MAX_CLIENT_IDS} awareness ids`, async () => {
    const s = await rawCollabSocket(http.url, mappingId, await sessionCookie(http.url, 'student@example.org'));
    sockets.push(s);
    const many = Array.from({ length: MAX_CLIENT_IDS + 3 }, () => new Awareness(new Y.Doc()));
    for (const a of many) {
      a.setLocalState({ pointer: { x: 0, y: 0 } });
      s.sendAwareness(encodeAwarenessUpdate(a, [a.clientID]));
    }
    // Then the first one leaves: once that arrives, everything sent before it was handled.
    const first = many[0];
    first.setLocalState(null);
    s.sendAwareness(encodeAwarenessUpdate(first, [first.clientID]));
    const announced = (a: Awareness) => seen.some((x) => x.clientId === a.clientID);
    await until('the first arrived and left', () => announced(first) && !supervisor.provider.awareness.getStates().has(first.clientID));
    expect(many.map(announced)).toEqual(many.map((_, i) => i < MAX_CLIENT_IDS));
  });
});
