import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn, type ApiClient } from '../helpers/client';
import { demoProjectId, snapshot } from '../helpers/fixtures';

// Each bad request gets a clear error in the shared shape and changes nothing.

let t: TestApp;
let supervisor: ApiClient;
let projectId: number;
beforeAll(async () => {
  t = await createTestApp();
  supervisor = await signedIn(t.app, 'supervisor@example.org');
  projectId = await demoProjectId(t.ctx.db);
});
afterAll(() => t.stop());

async function expectRefused(send: () => PromiseLike<{ status: number; body: any }>, status: number, code?: string) {
  const before = await snapshot(t.ctx.db);
  const res = await send();
  expect(res.status).toBe(status);
  expect(res.body.error).toEqual(expect.objectContaining({ code: code ?? expect.any(String), message: expect.any(String) }));
  expect(await snapshot(t.ctx.db)).toEqual(before);
  return res;
}

describe('bad input', () => {
  it('malformed JSON → 400 malformed_json', async () => {
    await expectRefused(() => supervisor.agent.post('/api/projects').set('x-csrf-token', supervisor.csrf).set('content-type', 'application/json').send('{"name": "x",'), 400, 'malformed_json');
  });

  it('unknown fields → 400 validation_failed naming the field', async () => {
    const res = await expectRefused(() => supervisor.post('/api/projects', { name: 'Fine', colour: 'red' }), 400, 'validation_failed');
    expect(JSON.stringify(res.body.error.details)).toContain('colour');
  });

  it('a name over 200 characters → 400', async () => {
    const res = await expectRefused(() => supervisor.post('/api/projects', { name: 'x'.repeat(201) }), 400, 'validation_failed');
    expect(res.body.error.message).toMatch(/200/);
  });

  it('wrong types → 400', async () => {
    await expectRefused(() => supervisor.post(`/api/projects/${projectId}/members`, { email: 42, role: 'student' }), 400, 'validation_failed');
    await expectRefused(() => supervisor.post(`/api/projects/${projectId}/members`, { email: 'x@example.org', role: 'emperor' }), 400, 'validation_failed');
  });

  it('a body over 1 MB → 413', async () => {
    await expectRefused(() => supervisor.post('/api/projects', { name: 'big', description: 'x'.repeat(1_100_000) }), 413, 'payload_too_large');
  });

  it('a body that is not JSON → 415', async () => {
    await expectRefused(() => supervisor.agent.post('/api/projects').set('x-csrf-token', supervisor.csrf).set('content-type', 'text/plain').send('name=x'), 415, 'unsupported_media_type');
  });

  it('an unknown or malformed project id → 404', async () => {
    await expectRefused(() => supervisor.get('/api/projects/999999'), 404, 'not_found');
    await expectRefused(() => supervisor.get('/api/projects/abc'), 404, 'not_found');
    await expectRefused(() => supervisor.patch('/api/projects/999999', { name: 'x' }), 404, 'not_found');
  });

  it('a non-member reading a project → 404, not 403', async () => {
    const { password_hash } = await t.ctx.db('users').first('password_hash');
    await t.ctx.db('users').insert({ email: 'stranger@example.org', display_name: 'Stranger', password_hash });
    const stranger = await signedIn(t.app, 'stranger@example.org');
    await expectRefused(() => stranger.get(`/api/projects/${projectId}`), 404, 'not_found');
    await expectRefused(() => stranger.get(`/api/projects/${projectId}/members`), 404, 'not_found');
  });

  it('a student changing members → 403', async () => {
    const student = await signedIn(t.app, 'student@example.org');
    await expectRefused(() => student.post(`/api/projects/${projectId}/members`, { email: 'x@example.org', role: 'student' }), 403, 'forbidden');
  });

  it('the last supervisor demoting themself or leaving → 409 last_supervisor', async () => {
    const me = (await supervisor.get('/api/me')).body.id;
    await expectRefused(() => supervisor.patch(`/api/projects/${projectId}/members/${me}`, { role: 'modeller' }), 409, 'last_supervisor');
    await expectRefused(() => supervisor.delete(`/api/projects/${projectId}/members/${me}`), 409, 'last_supervisor');
  });

  it('adding someone who is already a member → 409', async () => {
    await expectRefused(() => supervisor.post(`/api/projects/${projectId}/members`, { email: 'student@example.org', role: 'student' }), 409, 'already_member');
  });

  it('an admin creating an account with a taken e-mail → 409', async () => {
    const admin = await signedIn(t.app, 'admin@example.org');
    await expectRefused(() => admin.post('/api/users', { email: 'modeller@example.org', displayName: 'Again' }), 409, 'email_taken');
  });

  it('an unknown route → 404 in the error shape', async () => {
    await expectRefused(() => supervisor.get('/api/nothing/here'), 404, 'not_found');
  });
});
