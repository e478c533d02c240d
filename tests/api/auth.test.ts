import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { anonymous, signedIn, ApiClient } from '../helpers/client';
import { snapshot, userId } from '../helpers/fixtures';
import { SESSION_COOKIE } from '../../server/auth/session';
import { requestPasswordReset } from '../../server/auth/auth.service';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ loginLimits: { perAccount: 1000, perIp: 10_000, windowMs: 60_000 } });
});
afterAll(() => t.stop());

const cookies = (h: string | string[] | undefined): string[] => (Array.isArray(h) ? h : h ? [h] : []);
const tokenFrom = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)?.[1] ?? '';

describe('sign-in', () => {
  it('signs in with the demo supervisor and /api/me returns the project roles', async () => {
    const c = await anonymous(t.app);
    const res = await c.signIn('supervisor@example.org');
    expect(res.status).toBe(200);
    expect(res.body.csrfToken).toEqual(expect.any(String));
    const me = await c.get('/api/me').expect(200);
    expect(me.body).toMatchObject({ email: 'supervisor@example.org', isAdmin: false, projects: [{ projectName: 'Micelle formers', role: 'supervisor' }] });
  });

  it('sets an httpOnly SameSite=Lax session cookie and changes the session id at sign-in', async () => {
    const c = new ApiClient(t.app);
    const before = await c.agent.get('/api/auth/csrf');
    const sidBefore = cookies(before.headers['set-cookie']).find((h: string) => h.startsWith(SESSION_COOKIE)) ?? '';
    c.csrf = before.body.token;
    const login = await c.post('/api/auth/login', { email: 'modeller@example.org', password: 'beadloom-demo' }).expect(200);
    const sidAfter = cookies(login.headers['set-cookie']).find((h: string) => h.startsWith(SESSION_COOKIE)) ?? '';
    expect(sidAfter).toMatch(/HttpOnly/i);
    expect(sidAfter).toMatch(/SameSite=Lax/i);
    expect(sidAfter.split(';')[0]).not.toEqual(sidBefore.split(';')[0]);
  });

  it('answers a wrong password and an unknown account with the same generic 401', async () => {
    const c = await anonymous(t.app);
    const wrong = await c.post('/api/auth/login', { email: 'student@example.org', password: 'not it at all' });
    const unknown = await c.post('/api/auth/login', { email: 'nobody@example.org', password: 'not it at all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('refuses a state-changing request without the CSRF token', async () => {
    const c = await signedIn(t.app, 'modeller@example.org');
    const res = await c.agent.patch('/api/me').send({ displayName: 'No token' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
  });

  it('signs out', async () => {
    const c = await signedIn(t.app, 'student@example.org');
    await c.post('/api/auth/logout').expect(204);
    await c.get('/api/me').expect(401);
  });
});

describe('rate limits', () => {
  it('limits sign-in attempts per account with 429 and Retry-After', async () => {
    const limited = await createTestApp({ loginLimits: { perAccount: 3, perIp: 100, windowMs: 60_000 } });
    try {
      const c = await anonymous(limited.app);
      for (let i = 0; i < 3; i++) await c.post('/api/auth/login', { email: 'student@example.org', password: 'wrong wrong' }).expect(401);
      const res = await c.post('/api/auth/login', { email: 'student@example.org', password: 'beadloom-demo' });
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      // Another account from the same address is not affected by this account's limit.
      await c.post('/api/auth/login', { email: 'modeller@example.org', password: 'wrong wrong' }).expect(401);
    } finally {
      await limited.stop();
    }
  });

  it('limits sign-in attempts per IP address', async () => {
    const limited = await createTestApp({ loginLimits: { perAccount: 100, perIp: 2, windowMs: 60_000 } });
    try {
      const c = await anonymous(limited.app);
      await c.post('/api/auth/login', { email: 'a@example.org', password: 'x' }).expect(401);
      await c.post('/api/auth/login', { email: 'b@example.org', password: 'x' }).expect(401);
      const res = await c.post('/api/auth/login', { email: 'c@example.org', password: 'x' });
      expect(res.status).toBe(429);
      expect(res.headers['retry-after']).toBeDefined();
    } finally {
      await limited.stop();
    }
  });
});

describe('passwords', () => {
  it('changes the password, keeps this session and ends the others', async () => {
    await t.ctx.db('users').insert({ email: 'changer@example.org', display_name: 'Changer', password_hash: (await t.ctx.db('users').first('password_hash')).password_hash });
    const a = await signedIn(t.app, 'changer@example.org');
    const b = await signedIn(t.app, 'changer@example.org');
    const res = await a.post('/api/me/password', { currentPassword: 'beadloom-demo', newPassword: 'a brand new secret' }).expect(200);
    a.csrf = res.body.csrfToken;
    await a.get('/api/me').expect(200);
    await b.get('/api/me').expect(401);
    expect((await new ApiClient(t.app).signIn('changer@example.org', 'a brand new secret')).status).toBe(200);
  });

  it('resets a password through the e-mailed single-use link, which cannot be reused', async () => {
    const c = await anonymous(t.app);
    await c.post('/api/auth/forgot', { email: 'student@example.org' }).expect(202);
    let mail;
    for (let i = 0; i < 50 && !mail; i++) {
      mail = (await t.mail()).find((m) => m.to.includes('student@example.org') && /reset/i.test(m.subject));
      if (!mail) await new Promise((r) => setTimeout(r, 100));
    }
    expect(mail).toBeDefined();
    const token = tokenFrom(mail!.text);
    expect(mail!.text).toContain(`${t.ctx.config.appUrl}/reset-password?token=`);
    const stored = await t.ctx.db('password_tokens').where({ user_id: await userId(t.ctx.db, 'student@example.org') }).first();
    expect(stored.token_hash).not.toContain(token);
    // Choosing the password signs the person in (issue 13, point 9).
    const done = await c.post('/api/auth/reset', { token, password: 'student secret 42' }).expect(200);
    expect(done.body.user.email).toBe('student@example.org');
    expect(done.body.csrfToken).toEqual(expect.any(String));
    expect((await c.get('/api/me').expect(200)).body.email).toBe('student@example.org');
    const again = await (await anonymous(t.app)).post('/api/auth/reset', { token, password: 'another secret 42' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
    expect((await new ApiClient(t.app).signIn('student@example.org', 'student secret 42')).status).toBe(200);
  });

  it('refuses an expired token and changes nothing', async () => {
    const admin = await signedIn(t.app, 'admin@example.org');
    await admin.post('/api/users', { email: 'late@example.org', displayName: 'Late Comer' }).expect(201);
    const token = tokenFrom((await t.mail()).find((m) => m.to.includes('late@example.org'))!.text);
    await t.ctx.db('password_tokens').update({ expires_at: new Date(Date.now() - 1000) });
    const before = await snapshot(t.ctx.db);
    const res = await (await anonymous(t.app)).post('/api/auth/reset', { token, password: 'too late now 123' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_token');
    expect(await snapshot(t.ctx.db)).toEqual(before);
  });

  it('answers forgot-password for an unknown address the same way and sends nothing', async () => {
    // The same answer as for a known address (the reset test above): 202 { ok: true }.
    const unknown = await (await anonymous(t.app)).post('/api/auth/forgot', { email: 'unknown-person@example.org' });
    expect([unknown.status, unknown.body]).toEqual([202, { ok: true }]);
    // The route sends in the background, so wait for the work itself, not for time: the service the
    // route calls, awaited, for the unknown address sends nothing and for a known one sends one mail.
    const before = (await t.mail()).length;
    await requestPasswordReset(t.ctx, 'unknown-person@example.org');
    expect((await t.mail()).length).toBe(before);
    await requestPasswordReset(t.ctx, 'student@example.org');
    const after = await t.mail();
    expect(after.length).toBe(before + 1);
    expect(after[0].to).toContain('student@example.org');
  });
});

describe('accounts made by an admin', () => {
  it('invites a new account, which sets its password from the link and signs in', async () => {
    const admin = await signedIn(t.app, 'admin@example.org');
    const res = await admin.post('/api/users', { email: 'New.Person@Example.org', displayName: 'New Person' }).expect(201);
    expect(res.body).toMatchObject({ email: 'new.person@example.org', activated: false, disabled: false });
    const mail = (await t.mail()).find((m) => m.to.includes('new.person@example.org'))!;
    expect(mail.subject).toMatch(/set your password/i);
    const c = await anonymous(t.app);
    expect((await c.signIn('new.person@example.org', 'whatever it is')).status).toBe(401);
    await c.post('/api/auth/reset', { token: tokenFrom(mail.text), password: 'my own password' }).expect(200);
    expect((await c.get('/api/me').expect(200)).body.email).toBe('new.person@example.org');
    expect((await new ApiClient(t.app).signIn('new.person@example.org', 'my own password')).status).toBe(200);
  });

  it('disabling an account ends its sessions and refuses sign-in', async () => {
    const admin = await signedIn(t.app, 'admin@example.org');
    const victim = await signedIn(t.app, 'modeller@example.org');
    const id = await userId(t.ctx.db, 'modeller@example.org');
    await admin.patch(`/api/users/${id}`, { disabled: true }).expect(200);
    await victim.get('/api/me').expect(401);
    const again = await new ApiClient(t.app).signIn('modeller@example.org');
    expect(again.status).toBe(403);
    expect(again.body.error.code).toBe('account_disabled');
    await admin.patch(`/api/users/${id}`, { disabled: false }).expect(200);
    expect((await new ApiClient(t.app).signIn('modeller@example.org')).status).toBe(200);
  });

  it('does not let an admin disable their own account', async () => {
    const admin = await signedIn(t.app, 'admin@example.org');
    const res = await admin.patch(`/api/users/${await userId(t.ctx.db, 'admin@example.org')}`, { disabled: true });
    expect(res.status).toBe(409);
  });
});
