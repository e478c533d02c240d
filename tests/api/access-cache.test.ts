import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp, type BuiltApp } from '../../server/app';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { ApiClient, signedIn } from '../helpers/client';
import { createAccount, demoMappingId, demoProjectId } from '../helpers/fixtures';
import { SESSION_COOKIE } from '../../server/auth/session';
import { propanolMapping } from './versions-fixtures';

// Issue 18 (capacity): the account, the membership and the session row a request needs are kept in
// memory between requests (server/auth/access-cache.ts, session-cache.ts). Each change of access must
// reach the very next request: a demoted member is read-only at once, a removed one gets 404, a
// disabled account 401, a changed password or a sign-out ends the other sessions. The first test shows
// the copies are really used (a change made behind the services' back, which publishes nothing, is not
// seen), so the others would fail without the invalidation.

let t: TestApp;
let projectId: number;
let mappingId: number;
let supervisor: ApiClient;
let admin: ApiClient;
let n = 0;

const member = async (role: string) => {
  const email = `cached${++n}@example.org`;
  const id = await createAccount(t.ctx.db, email, { projectId, role });
  return { id, email, client: await signedIn(t.app, email) };
};

beforeAll(async () => {
  t = await createTestApp();
  projectId = await demoProjectId(t.ctx.db);
  mappingId = await demoMappingId(t.ctx.db);
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  admin = await signedIn(t.app, 'admin@example.org');
});
afterAll(() => t.stop());

describe('access kept between requests', () => {
  it('is really kept: a change written straight to MariaDB (no access change published) is not seen', async () => {
    const m = await member('modeller');
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(true);
    await t.ctx.db('project_members').where({ project_id: projectId, user_id: m.id }).update({ role: 'student' });
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(true);
    // Published, as the services do after committing: the next request reads MariaDB again.
    t.ctx.accessChanges.publish({ kind: 'membership', projectId, userId: m.id });
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(false);
  });

  it("a 'resync' (this instance may have missed changes) drops every kept account, membership and session", async () => {
    const m = await member('modeller');
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(true);
    await t.ctx.db('project_members').where({ project_id: projectId, user_id: m.id }).update({ role: 'student' });
    await t.ctx.db('users').where({ id: m.id }).update({ display_name: 'Renamed behind the back' });
    t.ctx.accessChanges.publish({ kind: 'resync' });
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(false);
    expect((await m.client.get('/api/me').expect(200)).body.displayName).toBe('Renamed behind the back');
    // A session row deleted behind the back (as another instance's sign-out does) is gone after a resync too.
    const sid = decodeURIComponent(m.client.agent.jar.getCookie(SESSION_COOKIE, { domain: '127.0.0.1', path: '/', secure: false, script: false })!.value).slice(2).split('.')[0];
    expect(await t.ctx.db('sessions').where({ session_id: sid }).delete()).toBe(1);
    await m.client.get('/api/me').expect(200);
    t.ctx.accessChanges.publish({ kind: 'resync' });
    await m.client.get('/api/me').expect(401);
  });

  it('a demoted modeller is read-only on the next request, and may edit again once promoted', async () => {
    const m = await member('modeller');
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(true);
    await m.client.patch(`/api/mappings/${mappingId}`, { description: 'By a modeller.' }).expect(200);
    await supervisor.patch(`/api/projects/${projectId}/members/${m.id}`, { role: 'student' }).expect(200);
    expect((await m.client.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(false);
    await m.client.patch(`/api/mappings/${mappingId}`, { description: 'By a student.' }).expect(403);
    await supervisor.patch(`/api/projects/${projectId}/members/${m.id}`, { role: 'modeller' }).expect(200);
    await m.client.patch(`/api/mappings/${mappingId}`, { description: 'By a modeller again.' }).expect(200);
  });

  it('a removed member gets 404 on the next request', async () => {
    const m = await member('student');
    await m.client.get(`/api/projects/${projectId}`).expect(200);
    await m.client.get(`/api/mappings/${mappingId}/threads`).expect(200);
    await supervisor.delete(`/api/projects/${projectId}/members/${m.id}`).expect(204);
    await m.client.get(`/api/projects/${projectId}`).expect(404);
    await m.client.get(`/api/mappings/${mappingId}/threads`).expect(404);
  });

  it('someone added to a project sees it on the next request', async () => {
    const email = `outsider${++n}@example.org`;
    await createAccount(t.ctx.db, email);
    const outsider = await signedIn(t.app, email);
    await outsider.get(`/api/projects/${projectId}`).expect(404);
    await supervisor.post(`/api/projects/${projectId}/members`, { email, role: 'student' }).expect(201);
    await outsider.get(`/api/projects/${projectId}`).expect(200);
  });

  it("a deleted molecule's mappings are 404 on the next request (the project each belonged to is not kept)", async () => {
    const { moleculeId, mappingId: gone } = await propanolMapping(t.ctx.db, 'To delete');
    await supervisor.get(`/api/molecules/${moleculeId}/mappings`).expect(200);
    await supervisor.get(`/api/mappings/${gone}/threads`).expect(200);
    await supervisor.delete(`/api/molecules/${moleculeId}`).expect(204);
    await supervisor.get(`/api/molecules/${moleculeId}/mappings`).expect(404);
    await supervisor.get(`/api/mappings/${gone}/threads`).expect(404);
  });

  it('a disabled account gets 401 on the next request', async () => {
    const m = await member('modeller');
    await m.client.get('/api/me').expect(200);
    await admin.patch(`/api/users/${m.id}`, { disabled: true }).expect(200);
    await m.client.get('/api/me').expect(401);
    await m.client.get(`/api/projects/${projectId}`).expect(401);
  });

  it('an admin flag taken away is gone on the next request', async () => {
    const m = await member('student');
    await admin.patch(`/api/users/${m.id}`, { isAdmin: true }).expect(200);
    expect((await m.client.get('/api/me').expect(200)).body.isAdmin).toBe(true);
    await m.client.get('/api/users').expect(200);
    await admin.patch(`/api/users/${m.id}`, { isAdmin: false }).expect(200);
    expect((await m.client.get('/api/me').expect(200)).body.isAdmin).toBe(false);
    await m.client.get('/api/users').expect(403);
  });

  it("a password change ends the account's other sessions at once; the one that changed it goes on", async () => {
    const m = await member('modeller');
    const other = await signedIn(t.app, m.email);
    await other.get('/api/me').expect(200);
    const res = await m.client.post('/api/me/password', { currentPassword: 'beadloom-demo', newPassword: 'a new long password 42' }).expect(200);
    m.client.csrf = res.body.csrfToken;
    await other.get('/api/me').expect(401);
    await m.client.get('/api/me').expect(200);
  });

  it('a signed-out session is refused on its next request, even with the old cookie replayed', async () => {
    const m = await member('student');
    await m.client.get('/api/me').expect(200);
    const cookie = m.client.agent.jar.getCookie(SESSION_COOKIE, { domain: '127.0.0.1', path: '/', secure: false, script: false });
    expect(cookie).toBeTruthy();
    await m.client.post('/api/auth/logout').expect(204);
    await request(t.app).get('/api/me').set('cookie', `${SESSION_COOKIE}=${cookie!.value}`).expect(401);
  });
});

describe('two app instances on one database and one access-change hub', () => {
  // The shape of a deployment with several app servers: each instance has its own caches, and the
  // access changes reach all of them (in-process here; the hub is the seam a Redis relay implements).
  let second: BuiltApp;
  beforeAll(() => {
    second = createApp(t.ctx);
  });
  afterAll(() => second.close());

  it('a role change, a removal and a sign-out made through one instance reach the next request on the other', async () => {
    const m = await member('modeller');
    const onSecond = new ApiClient(second.app);
    await onSecond.signIn(m.email);
    expect((await onSecond.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(true);
    await supervisor.patch(`/api/projects/${projectId}/members/${m.id}`, { role: 'student' }).expect(200);
    expect((await onSecond.get(`/api/mappings/${mappingId}`).expect(200)).body.canEdit).toBe(false);
    await supervisor.delete(`/api/projects/${projectId}/members/${m.id}`).expect(204);
    await onSecond.get(`/api/mappings/${mappingId}`).expect(404);

    // The session signed in on the second instance, signed out through the first.
    await onSecond.get('/api/me').expect(200);
    const cookie = onSecond.agent.jar.getCookie(SESSION_COOKIE, { domain: '127.0.0.1', path: '/', secure: false, script: false })!;
    const first = new ApiClient(t.app);
    first.agent.jar.setCookie(`${SESSION_COOKIE}=${cookie.value}; Path=/`, '127.0.0.1', '/');
    await first.fetchCsrf();
    await first.post('/api/auth/logout').expect(204);
    await onSecond.get('/api/me').expect(401);
  });
});
