import { expect } from 'vitest';
import type { APIRequestContext } from 'playwright-core';
import type { browserSession } from './browser-session';
import { DEMO_PASSWORD } from '../../seeds/demo-data';

/** POST with the CSRF token of the request context's session; fails the test on an error answer. */
export async function csrfApi(request: APIRequestContext) {
  const { token } = await (await request.get('/api/auth/csrf')).json();
  return {
    async post(path: string, data: unknown) {
      const res = await request.post(path, { data, headers: { 'x-csrf-token': token } });
      expect(res.ok(), `${path}: ${await res.text()}`).toBe(true);
      return res.json();
    },
  };
}

/** The demo supervisor adds a modeller to the first project; the invitation's token sets their password. */
export async function addModeller(session: ReturnType<typeof browserSession>, who: { email: string; name: string; password: string }): Promise<void> {
  const request = (await session.context()).request;
  const anon = await csrfApi(request);
  const login = await anon.post('/api/auth/login', { email: 'supervisor@example.org', password: DEMO_PASSWORD });
  const projects = await (await request.get('/api/projects')).json();
  const res = await request.post(`/api/projects/${projects[0].id}/members`, {
    data: { email: who.email, role: 'modeller', displayName: who.name },
    headers: { 'x-csrf-token': login.csrfToken },
  });
  expect(res.ok(), await res.text()).toBe(true);
  const invitation = (await session.mail()).find((m) => m.to.includes(who.email))!;
  const token = /token=([^\s&]+)/.exec(invitation.text)![1];
  const reset = await request.post('/api/auth/reset', { data: { token, password: who.password }, headers: { 'x-csrf-token': login.csrfToken } });
  expect(reset.ok(), await reset.text()).toBe(true);
}
