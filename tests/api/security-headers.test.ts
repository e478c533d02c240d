import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/client';

// Issue 11, item 9: a Permissions-Policy on every answer, `Cache-Control: no-store` on every API
// answer (errors included), and a CSP that still allows no eval.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.stop());

describe('security headers', () => {
  it('sends Permissions-Policy denying camera, microphone, geolocation and the rest', async () => {
    const res = await request(t.app).get('/api/health');
    for (const feature of ['camera', 'microphone', 'geolocation', 'payment', 'usb']) expect(res.headers['permissions-policy']).toContain(`${feature}=()`);
  });

  it('marks API answers no-store: data, errors and the CSRF token', async () => {
    const modeller = await signedIn(t.app, 'modeller@example.org');
    const answers = {
      me: await modeller.get('/api/me'),
      projects: await modeller.get('/api/projects'),
      unknownRoute: await modeller.get('/api/nothing/here'),
      anonymousMe: await request(t.app).get('/api/me'),
      csrf: await request(t.app).get('/api/auth/csrf'),
    };
    for (const [what, res] of Object.entries(answers)) expect(res.headers['cache-control'], what).toBe('no-store');
  });

  it("keeps the CSP free of 'unsafe-eval' (only WebAssembly compilation is allowed)", async () => {
    const csp = (await request(t.app).get('/api/health')).headers['content-security-policy'];
    expect(csp).toContain("script-src 'self' 'wasm-unsafe-eval'");
    expect(csp).not.toContain("'unsafe-eval'");
  });
});
