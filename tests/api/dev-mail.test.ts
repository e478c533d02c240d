import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { anonymous, signedIn } from '../helpers/client';
import { snapshot } from '../helpers/fixtures';
import { until } from '../helpers/collab-client';
import { createApp } from '../../server/app';
import { DEMO_PASSWORD } from '../../seeds/demo-data';

// The local mail sink's pages (server/mail/dev-mail.routes.ts) show every account's reset links, so
// they are a site admin's only, and not served at all in production unless BEADLOOM_DEV_MAIL=1.
// The attack of issue 11: ask a reset for someone else, read the link from /dev/mail.json, set a
// new password. Here the reading fails for everyone but the admin, and MariaDB is left as it was.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.stop());

const VICTIM = 'supervisor@example.org';
const TABLES = ['users', 'password_tokens', 'project_members', 'dev_mail'];
const resetMailFor = async (email: string) => (await t.mail()).filter((m) => m.to.includes(email) && /reset/i.test(m.subject));

/** The unknown-route answer, in the shared error shape, with nothing of the mail in it. */
function expectUnknownRoute(res: request.Response, path: string): void {
  expect(res.status, path).toBe(404);
  expect(res.body).toEqual({ error: { code: 'not_found', message: expect.stringMatching(/^No route GET \S*mail(\.json)?\.$/) } });
  expect(res.text).not.toMatch(/token=/);
}

describe('/dev/mail', () => {
  it('refuses the account-takeover path: a victim’s reset link is not readable anonymously or by a non-admin', async () => {
    const attacker = await anonymous(t.app);
    const before = (await resetMailFor(VICTIM)).length;
    await attacker.post('/api/auth/forgot', { email: VICTIM }).expect(202);
    await until('the reset mail is in the sink', async () => (await resetMailFor(VICTIM)).length > before);
    const token = /token=([^\s&]+)/.exec((await resetMailFor(VICTIM))[0].text)![1];
    const stored = await snapshot(t.ctx.db, TABLES);

    for (const path of ['/dev/mail.json', '/dev/mail']) expectUnknownRoute(await attacker.get(path), path);
    for (const email of ['student@example.org', 'modeller@example.org', 'supervisor@example.org']) {
      const member = await signedIn(t.app, email);
      for (const path of ['/dev/mail.json', '/dev/mail']) expectUnknownRoute(await member.get(path), path);
    }

    // Nothing changed: the token is unspent, the password is the old one.
    expect(await snapshot(t.ctx.db, TABLES)).toBe(stored);
    await signedIn(t.app, VICTIM, DEMO_PASSWORD);

    // The mail was there all along: the admin reads it, link included (so the refusals above are real).
    const admin = await signedIn(t.app, 'admin@example.org');
    const json = await admin.get('/dev/mail.json').expect(200);
    expect(json.body.some((m: { to: string[]; text: string }) => m.to.includes(VICTIM) && m.text.includes(token))).toBe(true);
    expect(json.body[0]).toEqual(expect.objectContaining({ to: expect.any(Array), subject: expect.any(String), text: expect.any(String), createdAt: expect.any(String) }));
    const html = await admin.get('/dev/mail').expect(200);
    expect(html.text).toContain('Caught mail');
    expect(html.text).toContain(`token=${token}`);
  });
});

describe('where /dev/mail is not mounted', () => {
  const adminReads = async (app: ReturnType<typeof createApp>) => {
    const admin = await signedIn(app.app, 'admin@example.org');
    return [await admin.get('/dev/mail.json'), await admin.get('/dev/mail')];
  };

  it('has no /dev/mail once a real SMTP server is configured', async () => {
    const built = createApp({ ...t.ctx, mailSinkInUse: false });
    try {
      const [json, html] = await adminReads(built);
      expectUnknownRoute(json, '/dev/mail.json');
      expectUnknownRoute(html, '/dev/mail');
      // Where it is mounted, a refused caller cannot tell it apart from this.
      const refused = await (await anonymous(t.app)).get('/dev/mail.json');
      expect(refused.body).toEqual(json.body);
    } finally {
      await built.close();
    }
  });

  it('has no /dev/mail with NODE_ENV=production, not even for the admin, unless BEADLOOM_DEV_MAIL=1', async () => {
    const production = createApp({ ...t.ctx, config: { ...t.ctx.config, production: true, devMail: false } });
    try {
      const [json, html] = await adminReads(production);
      expectUnknownRoute(json, '/dev/mail.json');
      expectUnknownRoute(html, '/dev/mail');
    } finally {
      await production.close();
    }
    const optedIn = createApp({ ...t.ctx, config: { ...t.ctx.config, production: true, devMail: true } });
    try {
      const [json] = await adminReads(optedIn);
      expect(json.status).toBe(200);
      expectUnknownRoute(await (await anonymous(optedIn.app)).get('/dev/mail.json'), '/dev/mail.json');
    } finally {
      await optedIn.close();
    }
  });

  it('reads BEADLOOM_DEV_MAIL from the environment', async () => {
    const { configFromEnv } = await import('../../server/config');
    const env = { DATABASE_URL: 'mysql://x@localhost/x', SESSION_SECRET: 'x'.repeat(32), NODE_ENV: 'production' };
    expect(configFromEnv(env).devMail).toBe(false);
    expect(configFromEnv({ ...env, BEADLOOM_DEV_MAIL: '1' }).devMail).toBe(true);
  });
});
