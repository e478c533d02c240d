import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { signedIn } from '../helpers/client';
import { demoMappingId, userId } from '../helpers/fixtures';
import { DEMO_PASSWORD } from '../../seeds/demo-data';
import { firstBeadId, otherProjectMapping } from './threads-fixtures';

// The server-sent event streams over a real listening socket, read the way a browser's EventSource
// reads them (fetch with Accept: text/event-stream and the session cookie).

let t: TestApp;
let server: Server;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await t.stop();
});

/** Signs in over real HTTP and returns the cookie header. */
async function cookieFor(email: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const [k, v] = pair!.split('=');
      jar.set(k!, v!);
    }
  };
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { token } = (await csrf.json()) as { token: string };
  const login = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: header() }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
  expect(login.status).toBe(200);
  keep(login);
  return header();
}

/** Live changes must arrive within 2 s: a time-out on the wait, not a measurement. */
const LIVE = 2_000;
const within = <T>(ms: number, p: Promise<T>) =>
  new Promise<T>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`no event within ${ms} ms`)), ms);
    p.then((v) => (clearTimeout(timer), resolve(v)), reject);
  });

/** Opens a stream and collects its events; `next(type)` waits for the next one of that type. */
async function openStream(path: string, cookie: string) {
  const controller = new AbortController();
  const res = await fetch(`${base}${path}`, { headers: { accept: 'text/event-stream', cookie }, signal: controller.signal });
  const events: { type: string; data: unknown }[] = [];
  const waiters: (() => void)[] = [];
  void (async () => {
    const decoder = new TextDecoder();
    let buffer = '';
    try {
      for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
        buffer += decoder.decode(chunk, { stream: true });
        let end;
        while ((end = buffer.indexOf('\n\n')) >= 0) {
          const block = buffer.slice(0, end);
          buffer = buffer.slice(end + 2);
          const type = /^event: (.*)$/m.exec(block)?.[1];
          const data = /^data: (.*)$/m.exec(block)?.[1];
          if (type && data) events.push({ type, data: JSON.parse(data) });
          waiters.splice(0).forEach((w) => w());
        }
      }
    } catch {
      /* aborted */
    }
  })();
  let seen = 0;
  const next = (type: string) => within(LIVE, nextOf(type));
  const nextOf = async (type: string) => {
    for (;;) {
      const i = events.findIndex((e, k) => k >= seen && e.type === type);
      if (i >= 0) {
        seen = i + 1;
        return events[i]!.data as never;
      }
      await new Promise<void>((resolve) => waiters.push(resolve));
    }
  };
  return { res, next, close: () => controller.abort() };
}

describe('live thread events (server-sent events)', () => {
  it('a new comment and a resolution reach another viewer of the mapping', { timeout: 15_000 }, async () => {
    const mappingId = await demoMappingId(t.ctx.db);
    const stream = await openStream(`/api/mappings/${mappingId}/events`, await cookieFor('student@example.org'));
    expect(stream.res.status).toBe(200);
    expect(stream.res.headers.get('content-type')).toMatch(/^text\/event-stream/);
    const modeller = await signedIn(t.app, 'modeller@example.org');
    const created = await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: await firstBeadId(t.ctx.db, mappingId), body: 'Live one.' }).expect(201);
    const first = await stream.next('thread');
    expect(first).toMatchObject({ type: 'thread', thread: { id: created.body.id, resolved: false, comments: [expect.objectContaining({ body: 'Live one.' })] } });
    await modeller.patch(`/api/threads/${created.body.id}`, { resolved: true }).expect(200);
    expect(await stream.next('thread')).toMatchObject({ thread: { id: created.body.id, resolved: true } });
    stream.close();
  });

  it('the mentioned person’s own stream tells their new unread count', { timeout: 15_000 }, async () => {
    const mappingId = await demoMappingId(t.ctx.db);
    const stream = await openStream('/api/notifications/events', await cookieFor('supervisor@example.org'));
    const modeller = await signedIn(t.app, 'modeller@example.org');
    const sup = await userId(t.ctx.db, 'supervisor@example.org');
    await modeller.post(`/api/mappings/${mappingId}/threads`, { beadId: await firstBeadId(t.ctx.db, mappingId), body: `@[x](user:${sup}) look` }).expect(201);
    const event = await stream.next('notifications');
    const count = (await t.ctx.db('notifications').where({ user_id: sup }).whereNull('read_at').count({ n: '*' }).first())!.n;
    expect(event).toEqual({ type: 'notifications', unread: Number(count) });
    stream.close();
  });

  it('refuses streams of mappings one cannot see, and anonymous callers', async () => {
    const other = await otherProjectMapping(t.ctx.db);
    const res = await fetch(`${base}/api/mappings/${other.mappingId}/events`, { headers: { accept: 'text/event-stream', cookie: await cookieFor('modeller@example.org') } });
    expect(res.status).toBe(404);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe('not_found');
    const anon = await fetch(`${base}/api/notifications/events`, { headers: { accept: 'text/event-stream' } });
    expect(anon.status).toBe(401);
  });
});
