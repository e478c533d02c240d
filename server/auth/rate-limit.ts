import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { Config } from '../config';
import { AppError } from '../http/errors';
import { RedisStore, type RedisReply } from 'rate-limit-redis';
import type { Redis } from 'ioredis';

/**
 * Sign-in limits that count failed attempts only (a wrong password, or an unknown e-mail), under
 * three keys, each with a growing back-off:
 * - account + address: the tight one (`perAccountAddress` free failures). A stranger guessing from
 *   their address locks only themself out; the owner signing in from elsewhere is not affected.
 * - account: a looser ceiling (`perAccount`) against guessing one password from many addresses.
 *   A stranger who passes it does slow the owner down too: that is the price of the ceiling.
 * - address: `perIp` failures over all accounts (one address trying many accounts).
 * Past its free failures a key is blocked for `baseBackoffMs` (1 s), then 2, 4, 8 … times that, up to `maxBackoffMs` after each
 * further failure. A blocked attempt is answered 429 before the password is checked (so it neither
 * counts nor costs a bcrypt); `Retry-After` and the error's details give the seconds actually left.
 * A successful sign-in forgets its account + address failures. A key is forgotten `windowMs` after
 * its last block ends. The address is `req.ip`: X-Forwarded-For counts only with TRUST_PROXY.
 * One app server keeps the counters in memory; several (REDIS_URL) share them in Redis
 * (createRedisLoginLimiter below), so an attacker gains nothing by spreading guesses over the servers.
 */

interface Entry {
  failures: number;
  /** Blocked until this time (ms since the epoch); 0 when not blocked. */
  until: number;
  last: number;
}

type Limits = Config['loginLimits'];
/** Entries kept at most; the oldest go first (an attacker rotating e-mails cannot fill memory). */
const MAX_ENTRIES = 100_000;

export interface LoginLimiter {
  /** Refuses a request while any of its keys is blocked. */
  check: RequestHandler;
  /** Counted once the promise resolves (the answer waits for it, so the next attempt sees it). */
  failed(req: Request): Promise<void>;
  succeeded(req: Request): Promise<void>;
}

function keysFor(req: Request, limits: Limits): { key: string; free: number }[] {
  const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
  const ip = ipKeyGenerator(req.ip ?? 'unknown');
  return [
    { key: `account+ip:${email}|${ip}`, free: limits.perAccountAddress ?? limits.perAccount },
    { key: `account:${email}`, free: limits.perAccount },
    { key: `ip:${ip}`, free: limits.perIp },
  ];
}

/** How long a key is blocked after its `failures`-th failure (0 while within its free ones). */
function backoffMs(limits: Limits, failures: number, free: number): number {
  if (failures < free) return 0;
  return Math.min(limits.maxBackoffMs ?? 15 * 60_000, (limits.baseBackoffMs ?? 1000) * 2 ** Math.min(30, failures - free));
}

function refuse(until: number, t: number): never {
  const seconds = Math.ceil((until - t) / 1000);
  throw new AppError(429, 'rate_limited', `Too many failed sign-in attempts. Try again in ${seconds} s.`, { retryAfterSeconds: seconds }, { 'Retry-After': String(seconds) });
}

export function createLoginLimiter(config: Config, now: () => number = Date.now): LoginLimiter {
  const limits: Limits = config.loginLimits;
  const entries = new Map<string, Entry>();

  const keysOf = (req: Request) => keysFor(req, limits);

  const live = (key: string): Entry | undefined => {
    const e = entries.get(key);
    if (e && now() > Math.max(e.until, e.last) + limits.windowMs) {
      entries.delete(key);
      return undefined;
    }
    return e;
  };

  const check: RequestHandler = (req, _res, next) => {
    const t = now();
    const until = Math.max(0, ...keysOf(req).map(({ key }) => live(key)?.until ?? 0));
    if (until <= t) return next();
    refuse(until, t);
  };

  const failed = async (req: Request): Promise<void> => {
    const t = now();
    for (const { key, free } of keysOf(req)) {
      const e = live(key) ?? { failures: 0, until: 0, last: t };
      entries.delete(key); // re-inserted last: the Map's order is the age order MAX_ENTRIES drops by
      e.failures++;
      e.last = t;
      if (e.failures >= free) e.until = t + backoffMs(limits, e.failures, free);
      entries.set(key, e);
    }
    while (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value as string);
  };

  const succeeded = async (req: Request): Promise<void> => {
    entries.delete(keysOf(req)[0].key);
  };

  return { check, failed, succeeded };
}

/**
 * The same limits shared by every app server through Redis. The failures of a key are counted by
 * rate-limit-redis's store (express-rate-limit's Store interface: an atomic INCR whose count expires
 * `windowMs` after the first failure); the back-off block after a failure is one key whose value is
 * the time it ends, expiring then. A Redis that does not answer within a second fails open for the
 * check (sign-in still needs the password) and the failure is logged.
 */
export function createRedisLoginLimiter(config: Config, redis: Redis, onError: (err: unknown) => void): LoginLimiter {
  const limits: Limits = config.loginLimits;
  const store = new RedisStore({ prefix: 'beadloom:login-failures:', sendCommand: (command: string, ...args: string[]) => redis.call(command, ...args) as Promise<RedisReply> });
  store.init({ windowMs: limits.windowMs } as never);
  const blockKey = (key: string) => `beadloom:login-block:${key}`;
  const withinASecond = <T>(work: Promise<T>, fallback: T): Promise<T> =>
    Promise.race([work, new Promise<T>((resolve) => setTimeout(() => resolve(fallback), 1000).unref())]).catch((err: unknown) => {
      onError(err);
      return fallback;
    });

  const check: RequestHandler = async (req, _res, next) => {
    const blocks = await withinASecond(redis.mget(...keysFor(req, limits).map(({ key }) => blockKey(key))), [] as (string | null)[]);
    const t = Date.now();
    const until = Math.max(0, ...blocks.map((b) => Number(b ?? 0)));
    if (until <= t) return next();
    refuse(until, t);
  };

  const failed = async (req: Request): Promise<void> => {
    const t = Date.now();
    await withinASecond(
      Promise.all(
        keysFor(req, limits).map(async ({ key, free }) => {
          const { totalHits } = await store.increment(key);
          const wait = backoffMs(limits, totalHits, free);
          if (wait > 0) await redis.set(blockKey(key), String(t + wait), 'PX', wait);
        }),
      ),
      undefined,
    );
  };

  const succeeded = async (req: Request): Promise<void> => {
    const { key } = keysFor(req, limits)[0];
    await withinASecond(Promise.all([store.resetKey(key), redis.del(blockKey(key))]), undefined);
  };

  return { check, failed, succeeded };
}
