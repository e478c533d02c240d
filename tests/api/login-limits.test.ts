import { afterEach, describe, expect, it } from 'vitest';
import { createServer, type Server } from 'node:http';
import { setTimeout as sleep } from 'node:timers/promises';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { AddressClient } from '../helpers/address-client';
import { snapshot } from '../helpers/fixtures';
import type { Config } from '../../server/config';

// Issue 11, item 6: the sign-in limiter counts failures only, keys them by account + address (plus a
// looser per-account ceiling and a per-address limit), backs off more after each failure, gives the
// real remaining seconds, and believes X-Forwarded-For only with TRUST_PROXY. Every caller here
// connects from its own loopback address (127.0.0.x), a real different address.

const PASSWORD = 'beadloom-demo';
const OWNER = 'modeller@example.org';
let running: { t: TestApp; server: Server; url: string } | null = null;

async function start(overrides: Partial<Config>): Promise<string> {
  const t = await createTestApp(overrides);
  const server = createServer(t.app);
  await new Promise<void>((resolve) => server.listen(0, '0.0.0.0', resolve));
  const port = (server.address() as { port: number }).port;
  running = { t, server, url: `http://127.0.0.1:${port}` };
  return running.url;
}
afterEach(async () => {
  if (!running) return;
  running.server.closeAllConnections();
  await new Promise((resolve) => running!.server.close(resolve));
  await running.t.stop();
  running = null;
});

/** A long first block (30 s) unless a test says otherwise, so a slow machine cannot outlast it mid-test. */
const limits = (l: Partial<Config['loginLimits']>): Partial<Config> => ({
  loginLimits: { perAccountAddress: 3, perAccount: 50, perIp: 100, windowMs: 60_000, baseBackoffMs: 30_000, ...l },
});
const from = (url: string, last: number) => new AddressClient(url, `127.0.0.${last}`);

describe('sign-in limiter', () => {
  it('does not count successful sign-ins: a shared account is not locked by its own users', async () => {
    const url = await start(limits({ perAccountAddress: 2, perAccount: 2, perIp: 2 }));
    for (let i = 0; i < 6; i++) expect((await from(url, 2).signIn(OWNER, PASSWORD)).status).toBe(200);
  });

  it("a stranger's failures from one address do not lock out the owner at another", async () => {
    const url = await start(limits({ perAccountAddress: 3 }));
    const stranger = from(url, 3);
    const before = await snapshot(running!.t.ctx.db);
    const statuses = [];
    for (let i = 0; i < 5; i++) statuses.push((await stranger.signIn(OWNER, 'a wrong guess')).status);
    expect(statuses).toEqual([401, 401, 401, 429, 429]);
    // The right password from the stranger's address is refused too while it is blocked.
    expect((await stranger.signIn(OWNER, PASSWORD)).status).toBe(429);
    expect((await from(url, 2).signIn(OWNER, PASSWORD)).status).toBe(200);
    expect(await snapshot(running!.t.ctx.db)).toEqual(before);
  });

  it('has a looser per-account ceiling over all addresses', async () => {
    const url = await start(limits({ perAccountAddress: 3, perAccount: 4 }));
    for (const last of [3, 4]) for (let i = 0; i < 2; i++) expect((await from(url, last).signIn(OWNER, 'guess')).status).toBe(401);
    const res = await from(url, 2).signIn(OWNER, PASSWORD);
    expect(res.status).toBe(429);
    expect(res.body.error.code).toBe('rate_limited');
  });

  it('limits failures per address over all accounts', async () => {
    const url = await start(limits({ perIp: 3 }));
    const c = from(url, 5);
    for (const who of ['a', 'b', 'c']) expect((await c.signIn(`${who}@example.org`, 'x')).status).toBe(401);
    expect((await c.signIn('d@example.org', 'x')).status).toBe(429);
    expect((await from(url, 6).signIn('d@example.org', 'x')).status).toBe(401);
  });

  it('backs off more after each further failure, and Retry-After gives the seconds actually left', async () => {
    const url = await start(limits({ perAccountAddress: 1, baseBackoffMs: 1000 }));
    const c = from(url, 7);
    const retryAfter = async () => {
      const res = await c.signIn(OWNER, 'guess');
      return res.status === 429 ? { s: Number(res.headers['retry-after']), body: res.body.error } : { status: res.status };
    };
    expect(await retryAfter()).toEqual({ status: 401 }); // 1st failure: blocked 1 s
    expect((await retryAfter()).s).toBe(1);
    await sleep(1100); // the block's own length: what is under test
    expect(await retryAfter()).toEqual({ status: 401 }); // 2nd failure: blocked 2 s
    expect((await retryAfter()).s).toBe(2);
    await sleep(2100);
    expect(await retryAfter()).toEqual({ status: 401 }); // 3rd failure: blocked 4 s
    const first = await retryAfter();
    expect(first.s).toBe(4);
    expect(first.body).toEqual({ code: 'rate_limited', message: 'Too many failed sign-in attempts. Try again in 4 s.', details: { retryAfterSeconds: 4 } });
    await sleep(1500);
    expect((await retryAfter()).s).toBe(3); // not the whole window again: what is left of it
  });

  it('ignores X-Forwarded-For by default: rotating it does not escape the per-address limit', async () => {
    const url = await start(limits({ perIp: 2 }));
    const c = from(url, 8);
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await c.signIn(`x${i}@example.org`, 'x', { 'x-forwarded-for': `10.0.0.${i}` })).status);
    expect(statuses).toEqual([401, 401, 429, 429]);
  });

  it('with TRUST_PROXY believes X-Forwarded-For from the proxy', async () => {
    const url = await start({ ...limits({ perIp: 2 }), trustProxy: 1 });
    const c = from(url, 9);
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await c.signIn(`x${i}@example.org`, 'x', { 'x-forwarded-for': `10.0.0.${i}` })).status);
    expect(statuses).toEqual([401, 401, 401, 401]);
  });
});

describe('session cookie Secure flag', () => {
  const cookieOf = (headers: Record<string, unknown>) => ((headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('beadloom.sid='));

  it('is Secure behind a trusted proxy when the request came over HTTPS, and only then', async () => {
    const url = await start({ trustProxy: 1 });
    const https = await from(url, 10).signIn(OWNER, PASSWORD, { 'x-forwarded-proto': 'https' });
    expect(https.status).toBe(200);
    expect(cookieOf(https.headers)).toMatch(/; Secure/i);
    const plain = await from(url, 11).signIn(OWNER, PASSWORD);
    expect(cookieOf(plain.headers)).toBeDefined();
    expect(cookieOf(plain.headers)).not.toMatch(/; Secure/i);
  });

  it('ignores X-Forwarded-Proto without TRUST_PROXY', async () => {
    const url = await start({});
    const res = await from(url, 12).signIn(OWNER, PASSWORD, { 'x-forwarded-proto': 'https' });
    expect(res.status).toBe(200);
    expect(cookieOf(res.headers)).not.toMatch(/; Secure/i);
  });
});
