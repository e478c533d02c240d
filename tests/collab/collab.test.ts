import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import WebSocket from 'ws';
import * as encoding from 'lib0/encoding';
import { Awareness, encodeAwarenessUpdate } from 'y-protocols/awareness';
import * as Y from 'yjs';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { connectClient, cookieSocket, listen, sessionCookie, synced, until, type CollabClient } from '../helpers/collab-client';
import { createAccount, demoMappingId, demoProjectId } from '../helpers/fixtures';
import { assignAtoms, atomsOf, beadsOf, createBead, docToMapping } from '../../src/shared/mapping-doc';
import { CLOSE_MALFORMED, MESSAGE_AWARENESS } from '../../src/shared/collab-protocol';
import { acceptGhosts, dismissGhosts, openProposal, proposalOf, readOpenProposal } from '../../src/shared/proposal-doc';

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let mappingId: number;
const cookies: Record<string, string> = {};
const open: CollabClient[] = [];

const client = async (who: string, doc?: Y.Doc) => {
  const c = connectClient(http.url, mappingId, cookies[who], doc);
  open.push(c);
  await synced(c);
  return c;
};
const storedUpdates = async () => Number((await t.ctx.db('mapping_updates').where({ mapping_id: mappingId }).count({ n: '*' }).first())?.n ?? 0);
const restDraft = async () => {
  const res = await fetch(`${http.url}/api/mappings/${mappingId}`, { headers: { cookie: cookies.modeller } });
  return (await res.json()).draft as ReturnType<typeof docToMapping>;
};
const beadIds = (c: CollabClient) => [...beadsOf(c.doc).keys()].sort();

beforeAll(async () => {
  t = await createTestApp({ loginLimits: { perAccount: 1000, perIp: 10_000, windowMs: 60_000 } }, { pingIntervalMs: 250 });
  http = await listen(t);
  mappingId = await demoMappingId(t.ctx.db);
  const projectId = await demoProjectId(t.ctx.db);
  await createAccount(t.ctx.db, 'second.modeller@example.org', { projectId, role: 'modeller' });
  await createAccount(t.ctx.db, 'outsider@example.org');
  for (const [who, email] of Object.entries({
    modeller: 'modeller@example.org',
    supervisor: 'supervisor@example.org',
    second: 'second.modeller@example.org',
    student: 'student@example.org',
    outsider: 'outsider@example.org',
  })) cookies[who] = await sessionCookie(http.url, email);
});
afterAll(async () => {
  for (const c of open) c.destroy();
  await http.close();
  await t.stop();
});

describe('live collaboration', () => {
  let a: CollabClient, b: CollabClient, c: CollabClient;

  beforeAll(async () => {
    [a, b, c] = await Promise.all([client('modeller'), client('supervisor'), client('second')]);
  });

  it('loads the stored draft before answering, and sends the session and an evaluation', async () => {
    expect(docToMapping(a.doc).beads.map((x) => x.name)).toEqual(['T1', 'T2', 'T3', 'E1', 'E2']);
    expect(a.session).toMatchObject({ mappingId, readOnly: false, role: 'modeller' });
    await until('first evaluation', () => a.evaluations.length > 0);
    expect(a.evaluations[0].evaluation?.beads).toHaveLength(5);
  });

  it('converges on concurrent edits by three users, stores them and re-evaluates', async () => {
    const before = await storedUpdates();
    const ids = [createBead(a.doc, [18, 19], { id: 'from-a' }), createBead(b.doc, [20], { id: 'from-b' }), createBead(c.doc, [21, 22], { id: 'from-c' })];
    for (const x of [a, b, c]) await until('all beads everywhere', () => ids.every((id) => beadsOf(x.doc).has(id)));
    expect(Y.encodeStateAsUpdate(a.doc)).toEqual(Y.encodeStateAsUpdate(b.doc));
    expect(docToMapping(b.doc)).toEqual(docToMapping(c.doc));
    expect(await storedUpdates()).toBeGreaterThanOrEqual(before + 3);
    expect((await restDraft()).beads.map((x) => x.id)).toEqual(expect.arrayContaining(ids));
    await until('evaluation with the new beads', () => ids.every((id) => c.evaluations.at(-1)?.evaluation?.beads.some((x) => x.id === id) ?? false));
  });

  it('keeps the numbers coming during a long burst of edits, with far fewer evaluations than edits', async () => {
    // Debounced 40 ms, bounded at 100 ms (server/drafts/debounce-window.ts). Renames about 10 ms apart
    // never leave a 40 ms quiet gap, so a debounce alone would evaluate only after the burst; the
    // 100 ms bound must bring evaluations of intermediate names while it goes on. The burst ends on an
    // event — the second intermediate name seen evaluated (or 400 renames, a cap that fails the test) —
    // so a slow machine lengthens the burst instead of changing what is counted.
    const id = createBead(a.doc, [], { id: 'burst' });
    await until('the burst bead on the third client', () => beadsOf(c.doc).has(id));
    const bead = beadsOf(a.doc).get(id)!;
    const before = c.evaluations.length;
    const nameOf = (e: (typeof c.evaluations)[number] | undefined) => e?.evaluation?.beads.find((x) => x.id === id)?.name;
    const intermediates = () => new Set(c.evaluations.slice(before).map(nameOf).filter((n) => n?.startsWith('N'))).size;
    let edits = 0;
    while (edits < 400 && intermediates() < 2) {
      bead.set('name', `N${edits++}`);
      await new Promise((r) => setTimeout(r, 10));
    }
    bead.set('name', 'last');
    edits++;
    await until('the last name evaluated', () => nameOf(c.evaluations.at(-1)) === 'last');
    expect(intermediates()).toBeGreaterThanOrEqual(2);
    // Far fewer evaluations than edits: one per 100 ms at most against one edit per 10 ms.
    expect(c.evaluations.length - before).toBeLessThanOrEqual(Math.ceil(edits / 4));
  });

  it('resolves the same atom assigned at once by two users to one bead on all three', async () => {
    assignAtoms(a.doc, 'from-a', [23]);
    assignAtoms(b.doc, 'from-b', [23]);
    const holder = (x: CollabClient) => Object.keys(atomsOf(x.doc).get('23') ?? {});
    await until('one holder everywhere', () => {
      const h = [a, b, c].map((x) => holder(x).join());
      return h[0] !== '' && h.every((v) => v === h[0]) && atomsOf(a.doc).get('23') !== undefined;
    });
    // Let the two concurrent writes both arrive, then check again: still one bead, the same on all.
    await until('both writes applied', () => [a, b, c].every((x) => Y.encodeStateVector(x.doc).toString() === Y.encodeStateVector(a.doc).toString()));
    expect(holder(a)).toHaveLength(1);
    expect(holder(b)).toEqual(holder(a));
    expect(holder(c)).toEqual(holder(a));
  });

  it('drops a student’s updates (never relayed, never stored) while their awareness flows', async () => {
    const s = await client('student');
    expect(s.session).toMatchObject({ readOnly: true, readOnlyReason: 'role', role: 'student' });
    const before = await storedUpdates();
    createBead(s.doc, [24], { id: 'from-student' });
    s.provider.awareness.setLocalStateField('user', { name: 'Lea' });
    await until('read-only notice', () => s.errors.some((e) => e.code === 'read_only'));
    // Relayed with the name of the student's account (the server stamps presence), not the one claimed.
    await until('student awareness reaches a modeller', () => [...a.provider.awareness.getStates().values()].some((st) => st.user?.name === 'Lea Okafor'));
    // A later modeller edit arrives at the student: anything the server relayed before it has arrived too.
    createBead(a.doc, [24], { id: 'after-student' });
    await until('modeller edit reaches the student', () => beadsOf(s.doc).has('after-student'));
    await until('and the others', () => beadsOf(b.doc).has('after-student') && beadsOf(c.doc).has('after-student'));
    expect(beadsOf(b.doc).has('from-student')).toBe(false);
    expect(beadsOf(c.doc).has('from-student')).toBe(false);
    expect((await restDraft()).beads.map((x) => x.id)).not.toContain('from-student');
    const studentId = (await t.ctx.db('users').where({ email: 'student@example.org' }).first('id')).id;
    expect(await t.ctx.db('mapping_updates').where({ user_id: studentId })).toHaveLength(0);
    expect(await storedUpdates()).toBe(before + 1);
  });

  it('keeps the open proposal in the draft: stored, shown to all, decided by editors only', async () => {
    const ATOMS = 25;
    const ghostNames = (c: CollabClient) => readOpenProposal(c.doc, ATOMS)?.beads.map((g) => g.name) ?? [];
    const beads = [
      { name: 'P1', atoms: [18, 19, 20], type: null, reason: 'test' },
      { name: 'P2', atoms: [21, 22], type: null, reason: 'test' },
      { name: 'P3', atoms: [23, 24], type: null, reason: 'test' },
    ];
    openProposal(a.doc, { cost: 1, beads }, 'unassigned', { id: 1, name: 'Tomas Brenn', colour: '#1f4e5a' });
    await until('the proposal reaches the supervisor', () => ghostNames(b).length === 3);
    // A student sees it but cannot decide: the dismissal stays local and is dropped by the server.
    const s = await client('student');
    expect(ghostNames(s)).toEqual(['P1', 'P2', 'P3']);
    dismissGhosts(s.doc, ['g1']);
    await until('read-only notice', () => s.errors.some((e) => e.code === 'read_only'));
    // The supervisor (not the proposer) accepts P2; everyone gets the bead and loses the ghost.
    acceptGhosts(b.doc, [readOpenProposal(b.doc, ATOMS)!.beads[1]], null);
    await until('the accept reaches the proposer', () => ghostNames(a).join() === 'P1,P3' && docToMapping(a.doc).beads.some((x) => x.name === 'P2'));
    expect(ghostNames(c)).toContain('P1');
    // A fresh connection (a reload) loads the open proposal from storage.
    const again = await client('modeller');
    expect(ghostNames(again)).toEqual(['P1', 'P3']);
    dismissGhosts(again.doc, ['g1', 'g3']);
    await until('dismissed for everyone', () => [a, b, c].every((x) => ghostNames(x).length === 0));
  });

  it('carries ghosts that share an atom, and their accept, to everyone and to storage; refuses malformed weights', async () => {
    const ATOMS = 25;
    // Atom 24 shared half and half by two ghosts (hand-worked: 0.5 + 0.5 = 1).
    const beads = [
      { name: 'S1', atoms: [23, 24], weights: [1, 0.5], type: null, reason: 'test' },
      { name: 'S2', atoms: [24], weights: [0.5], type: null, reason: 'test' },
    ];
    openProposal(a.doc, { cost: 1, beads }, 'all', { id: 1, name: 'Tomas Brenn', colour: '#1f4e5a' });
    await until('the sharing ghosts reach the supervisor', () => readOpenProposal(b.doc, ATOMS)?.beads.length === 2);
    expect(readOpenProposal(b.doc, ATOMS)!.beads.map((g) => g.weights)).toEqual([[1, 0.5], [0.5]]);
    acceptGhosts(b.doc, readOpenProposal(b.doc, ATOMS)!.beads, null);
    const shares = (x: CollabClient) => docToMapping(x.doc).beads.filter((bead) => bead.name.startsWith('S')).map((bead) => [bead.name, bead.atoms.map((at) => [at.index, at.weight])]);
    const expected = [['S1', [[23, 1], [24, 0.5]]], ['S2', [[24, 0.5]]]];
    await until('the accept reaches the others', () => [a, c].every((x) => JSON.stringify(shares(x)) === JSON.stringify(expected)));
    await until('and storage', async () => {
      const stored = (await restDraft()).beads.filter((bead) => bead.name.startsWith('S')).map((bead) => [bead.name, bead.atoms.map((at) => [at.index, at.weight])]);
      return JSON.stringify(stored) === JSON.stringify(expected);
    });

    const bad = await client('supervisor');
    proposalOf(bad.doc).set('g:bad', { p: 'p1', name: 'X1', atoms: [0, 1], weights: [0.5], type: null, reason: '' });
    await until('refusal', () => bad.errors.some((e) => e.code === 'update_refused'));
    expect(bad.errors.at(-1)).toMatchObject({ code: 'update_refused', message: expect.stringMatching(/weights are a list as long as its atoms/), details: { code: 'wrong_type' } });
    createBead(a.doc, [0], { id: 'marker-after-bad-weights' });
    await until('marker reaches b', () => beadsOf(b.doc).has('marker-after-bad-weights'));
    expect(proposalOf(b.doc).has('g:bad')).toBe(false);
    bad.destroy();
  });

  it('refuses an invalid update with a clear error and changes nothing', async () => {
    const bad = await client('supervisor');
    const before = await storedUpdates();
    const draftBefore = await restDraft();
    atomsOf(bad.doc).set('999', { 'from-a': 1 });
    await until('refusal', () => bad.errors.some((e) => e.code === 'update_refused'));
    expect(bad.errors.at(-1)).toMatchObject({ code: 'update_refused', message: expect.stringMatching(/Atom 1000 \(index 999\) does not exist/), details: { code: 'atom_out_of_range', path: 'atoms.999' } });
    createBead(a.doc, [0], { id: 'marker-after-bad' });
    await until('marker reaches b', () => beadsOf(b.doc).has('marker-after-bad'));
    expect(atomsOf(b.doc).has('999')).toBe(false);
    expect(await storedUpdates()).toBe(before + 1);
    expect((await restDraft()).beads.filter((x) => x.id !== 'marker-after-bad').length).toBe(draftBefore.beads.filter((x) => x.id !== 'marker-after-bad').length);
    bad.destroy();
  });

  it('closes only the connection that sends a malformed frame', async () => {
    const ws = new (cookieSocket(cookies.modeller) as typeof WebSocket)(`${http.url.replace('http', 'ws')}/collab/${mappingId}`);
    const closed = new Promise<number>((resolve) => ws.on('close', (code) => resolve(code)));
    await new Promise((resolve) => ws.on('open', resolve));
    ws.send(Buffer.from([0, 7, 200, 200, 200]));
    expect(await closed).toBe(CLOSE_MALFORMED);
    createBead(a.doc, [1], { id: 'after-malformed' });
    await until('others still live', () => beadsOf(b.doc).has('after-malformed') && beadsOf(c.doc).has('after-malformed'));
    expect(a.provider.wsconnected && b.provider.wsconnected).toBe(true);
  });

  it('merges offline edits on reconnect', async () => {
    a.provider.disconnect();
    createBead(a.doc, [2], { id: 'offline-a' });
    createBead(b.doc, [3], { id: 'online-b' });
    await until('b’s edit reaches c', () => beadsOf(c.doc).has('online-b'));
    a.provider.connect();
    for (const x of [a, b, c]) await until('merged', () => beadsOf(x.doc).has('offline-a') && beadsOf(x.doc).has('online-b'));
    expect(beadIds(a)).toEqual(beadIds(b));
    expect((await restDraft()).beads.map((x) => x.id)).toEqual(expect.arrayContaining(['offline-a', 'online-b']));
  });

  it('removes the awareness of a connection that stops answering pings', async () => {
    const ws = new WebSocket(`${http.url.replace('http', 'ws')}/collab/${mappingId}`, { headers: { cookie: cookies.second }, autoPong: false });
    await new Promise((resolve) => ws.on('open', resolve));
    const ghost = new Awareness(new Y.Doc());
    ghost.setLocalState({ user: { name: 'Ghost' } });
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, MESSAGE_AWARENESS);
    encoding.writeVarUint8Array(e, encodeAwarenessUpdate(ghost, [ghost.clientID]));
    ws.send(encoding.toUint8Array(e));
    const seen = () => a.provider.awareness.getStates().has(ghost.clientID);
    await until('ghost appears', seen);
    await until('ghost removed', () => !seen());
    ghost.destroy();
    ws.terminate();
  });
});

describe('the upgrade', () => {
  const attempt = (cookie?: string, id = mappingId) =>
    new Promise<number>((resolve) => {
      const ws = new WebSocket(`${http.url.replace('http', 'ws')}/collab/${id}`, cookie ? { headers: { cookie } } : {});
      ws.on('unexpected-response', (_req, res) => resolve(res.statusCode ?? 0));
      ws.on('open', () => (ws.close(), resolve(101)));
      ws.on('error', () => undefined);
    });

  it('refuses anonymous callers (401), non-members and unknown mappings (404)', async () => {
    expect(await attempt()).toBe(401);
    expect(await attempt(cookies.outsider)).toBe(404);
    expect(await attempt(cookies.modeller, 999999)).toBe(404);
    expect(await attempt(cookies.modeller)).toBe(101);
  });
});
