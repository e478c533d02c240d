import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import WebSocket from 'ws';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { connectClient, listen, signInOverHttp, synced, until, type CollabClient } from '../helpers/collab-client';
import { createAccount, demoMappingId, demoProjectId } from '../helpers/fixtures';
import { beadsOf, createBead } from '../../src/shared/mapping-doc';
import { CLOSE_NOT_FOUND, CLOSE_UNAUTHENTICATED } from '../../src/shared/collab-protocol';

// Issue 11, item 2: access is decided at the upgrade and again whenever it changes
// (server/auth/access-changes.ts → server/drafts/collab-access.ts). For each kind of change, an open
// socket of the affected account loses write access within 1 s: it turns read-only, or it is closed
// with a documented code. A write it sends right after the change is neither relayed nor stored.

let t: TestApp;
let http: Awaited<ReturnType<typeof listen>>;
let mappingId: number;
let projectId: number;
let supervisor: ApiClient;
let admin: ApiClient;
/** The supervisor's socket sees what is relayed; the demo modeller's sends markers. */
let watcher: CollabClient;
let marker: CollabClient;
const open: CollabClient[] = [];
let n = 0;

const connect = async (cookie: string) => {
  const c = connectClient(http.url, mappingId, cookie);
  open.push(c);
  await synced(c);
  return c;
};
const newModeller = async (name: string) => {
  const email = `${name}@example.org`;
  const id = await createAccount(t.ctx.db, email, { projectId, role: 'modeller' });
  return { id, email, ...(await signInOverHttp(http.url, email)) };
};
const storedBy = async (userId: number) => Number((await t.ctx.db('mapping_updates').where({ mapping_id: mappingId, user_id: userId }).count({ n: '*' }).first())?.n ?? 0);
const restDraftIds = async () => {
  const res = await fetch(`${http.url}/api/mappings/${mappingId}`, { headers: { cookie: watcherCookie } });
  return ((await res.json()).draft.beads as { id: string }[]).map((b) => b.id);
};
let watcherCookie = '';

/** A write that goes through: relayed to the watcher and stored with its author. */
async function expectKept(c: CollabClient, userId: number): Promise<void> {
  const before = await storedBy(userId);
  const id = `kept-${++n}`;
  createBead(c.doc, [n % 20], { id });
  await until('relayed to the watcher', () => beadsOf(watcher.doc).has(id));
  expect(await storedBy(userId)).toBeGreaterThan(before);
}

/** `id` was written by `userId` after losing access: not relayed, not stored, not in the draft. */
async function expectDropped(id: string, userId: number, storedBefore: number): Promise<void> {
  // A later edit by someone else reaches the watcher: anything relayed before it has arrived too.
  const later = `marker-${++n}`;
  createBead(marker.doc, [n % 20], { id: later });
  await until('the marker reaches the watcher', () => beadsOf(watcher.doc).has(later));
  expect(beadsOf(watcher.doc).has(id)).toBe(false);
  expect(await storedBy(userId)).toBe(storedBefore);
  expect(await restDraftIds()).not.toContain(id);
}

/** Milliseconds from now until `check` holds. */
async function msUntil(what: string, check: () => boolean): Promise<number> {
  const start = performance.now();
  await until(what, check);
  return performance.now() - start;
}

beforeAll(async () => {
  t = await createTestApp({ loginLimits: { perAccount: 1000, perIp: 10_000, windowMs: 60_000 } }, { compactIntervalMs: 10 * 60_000 });
  http = await listen(t);
  mappingId = await demoMappingId(t.ctx.db);
  projectId = await demoProjectId(t.ctx.db);
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  admin = await signedIn(t.app, 'admin@example.org');
  watcherCookie = (await signInOverHttp(http.url, 'supervisor@example.org')).cookie;
  watcher = await connect(watcherCookie);
  marker = await connect((await signInOverHttp(http.url, 'modeller@example.org')).cookie);
});
afterAll(async () => {
  for (const c of open) c.destroy();
  await http.close();
  await t.stop();
});

describe('open sockets follow access changes', () => {
  it('a modeller demoted to student turns read-only at once, and editable again when promoted', async () => {
    const m = await newModeller('demoted');
    const c = await connect(m.cookie);
    expect(c.session).toMatchObject({ readOnly: false, role: 'modeller' });
    await expectKept(c, m.id);

    const before = await storedBy(m.id);
    await supervisor.patch(`/api/projects/${projectId}/members/${m.id}`, { role: 'student' }).expect(200);
    createBead(c.doc, [3], { id: 'after-demotion' }); // sent at once, before the client heard anything
    const ms = await msUntil('read-only session', () => c.session?.readOnly === true && c.session.readOnlyReason === 'role' && c.session.role === 'student');
    expect(ms).toBeLessThan(1000);
    await until('the read-only notice', () => c.errors.some((e) => e.code === 'read_only'));
    await expectDropped('after-demotion', m.id, before);

    await supervisor.patch(`/api/projects/${projectId}/members/${m.id}`, { role: 'modeller' }).expect(200);
    await until('editable again', () => c.session?.readOnly === false && c.session.role === 'modeller');
    // This client's document holds the dropped edit, which its next updates depend on: it reloads
    // (a new connection), as the editor does after a refusal.
    await expectKept(await connect(m.cookie), m.id);
  });

  it('a member removed from the project is closed with 4404', async () => {
    const m = await newModeller('removed');
    const c = await connect(m.cookie);
    await expectKept(c, m.id);

    const before = await storedBy(m.id);
    await supervisor.delete(`/api/projects/${projectId}/members/${m.id}`).expect(204);
    createBead(c.doc, [4], { id: 'after-removal' });
    expect(await msUntil('closed with 4404', () => c.closes.includes(CLOSE_NOT_FOUND))).toBeLessThan(1000);
    await expectDropped('after-removal', m.id, before);
    expect(await upgradeStatus(m.cookie)).toBe(404);
  });

  it('a disabled account is closed with 4401', async () => {
    const m = await newModeller('disabled');
    const c = await connect(m.cookie);
    await expectKept(c, m.id);

    const before = await storedBy(m.id);
    await admin.patch(`/api/users/${m.id}`, { disabled: true }).expect(200);
    createBead(c.doc, [5], { id: 'after-disable' });
    expect(await msUntil('closed with 4401', () => c.closes.includes(CLOSE_UNAUTHENTICATED))).toBeLessThan(1000);
    await expectDropped('after-disable', m.id, before);
    expect(await upgradeStatus(m.cookie)).toBe(401);
  });

  it('signing out closes the sockets of that session with 4401, and only those', async () => {
    const m = await newModeller('leaver');
    const other = await signInOverHttp(http.url, m.email); // a second session of the same account
    const [c, d] = [await connect(m.cookie), await connect(other.cookie)];
    await expectKept(c, m.id);

    const before = await storedBy(m.id);
    const out = await fetch(`${http.url}/api/auth/logout`, { method: 'POST', headers: { cookie: m.cookie, 'x-csrf-token': m.csrfToken } });
    expect(out.status).toBe(204);
    createBead(c.doc, [6], { id: 'after-sign-out' });
    expect(await msUntil('closed with 4401', () => c.closes.includes(CLOSE_UNAUTHENTICATED))).toBeLessThan(1000);
    await expectDropped('after-sign-out', m.id, before);
    expect(d.closes).toEqual([]);
    await expectKept(d, m.id);
  });

  it('a production lock turns connected editors read-only, and the unlock editable again', async () => {
    const m = await newModeller('locked-out');
    const c = await connect(m.cookie);
    await expectKept(c, m.id);
    const version = (await supervisor.post(`/api/mappings/${mappingId}/versions`, { message: 'for the lock' }).expect(201)).body.number as number;

    const before = await storedBy(m.id);
    await supervisor.post(`/api/mappings/${mappingId}/lock`, { version }).expect(200);
    createBead(c.doc, [7], { id: 'after-lock' });
    expect(await msUntil('read-only session', () => c.session?.readOnly === true && c.session.readOnlyReason === 'locked')).toBeLessThan(1000);
    await until('the read-only notice', () => c.errors.some((e) => e.code === 'read_only'));

    // (The marker of expectDropped is an edit too, so it runs after the unlock.)
    await supervisor.post(`/api/mappings/${mappingId}/unlock`, { reason: 'More work' }).expect(200);
    expect(await msUntil('editable again', () => c.session?.readOnly === false)).toBeLessThan(1000);
    await expectDropped('after-lock', m.id, before);
    await expectKept(await connect(m.cookie), m.id);
  });
});

function upgradeStatus(cookie: string): Promise<number> {
  return new Promise((resolve) => {
    const ws = new WebSocket(`${http.url.replace('http', 'ws')}/collab/${mappingId}`, { headers: { cookie } });
    ws.on('unexpected-response', (_req, res) => resolve(res.statusCode ?? 0));
    ws.on('open', () => (ws.close(), resolve(101)));
    ws.on('error', () => undefined);
  });
}
