import session, { type SessionData, type Store } from 'express-session';
import { TtlCache } from '../cache/ttl-cache';

/**
 * The session store MariaDB holds, with the two reads every request made taken off it: the session
 * row is kept here once read or written (as its JSON, so express-session gets a fresh object to
 * mutate each time), and the rolling expiry is written back at most every `touchEveryMs` per session
 * instead of on every answer (express-session's `rolling` touches on each one; the browser's cookie
 * still rolls every time, only the row's expiry may lag by that much of its 7 days).
 *
 * Sessions only change by being written (sign-in, a CSRF token issued) or destroyed (sign-out) —
 * both pass through here — so on one instance the copy is never stale. Another instance's sign-out
 * arrives as `forget()` (auth/access-cache.ts follows the access changes); `ttlMs` bounds how long a
 * copy can outlive a change that reached no listener.
 */
export class CachedSessionStore extends session.Store {
  private readonly rows: TtlCache<string, { json: string; expires: number; touchedAt: number }>;

  constructor(
    private readonly inner: Store,
    private readonly options: { ttlMs: number; touchEveryMs: number; max: number },
    private readonly now: () => number = Date.now,
  ) {
    super();
    this.rows = new TtlCache(options.ttlMs, options.max, now);
  }

  override get(sid: string, callback: (err: unknown, session?: SessionData | null) => void): void {
    const hit = this.rows.get(sid);
    if (hit && hit.expires > this.now()) return callback(null, JSON.parse(hit.json) as SessionData);
    if (hit) this.rows.delete(sid);
    const mark = this.rows.mark();
    this.inner.get(sid, (err, data) => {
      if (!err && data) this.keep(sid, data, this.now(), mark);
      callback(err, data);
    });
  }

  override set(sid: string, data: SessionData, callback?: (err?: unknown) => void): void {
    // Dropped first, so a concurrent get cannot serve the old row while the new one is written.
    this.rows.delete(sid);
    const mark = this.rows.mark();
    this.inner.set(sid, data, (err) => {
      if (!err) this.keep(sid, data, this.now(), mark);
      callback?.(err);
    });
  }

  override touch(sid: string, data: SessionData, callback?: (err?: unknown) => void): void {
    const hit = this.rows.get(sid);
    if (hit && this.now() - hit.touchedAt < this.options.touchEveryMs) {
      hit.expires = expiresOf(data, this.now());
      return callback?.();
    }
    // express-session types touch's callback without an error; the MariaDB store passes one.
    const touch = this.inner.touch!.bind(this.inner) as (sid: string, data: SessionData, cb: (err?: unknown) => void) => void;
    touch(sid, data, (err) => {
      if (!err && hit) {
        hit.touchedAt = this.now();
        hit.expires = expiresOf(data, this.now());
      }
      callback?.(err);
    });
  }

  override destroy(sid: string, callback?: (err?: unknown) => void): void {
    this.rows.delete(sid);
    this.inner.destroy(sid, (err) => callback?.(err));
  }

  /** Another instance ended this session: the next request reads MariaDB (where it is gone). */
  forget(sid: string): void {
    this.rows.delete(sid);
  }

  /** This instance may have missed sign-outs elsewhere: every session is read from MariaDB again. */
  forgetAll(): void {
    this.rows.clear();
  }

  private keep(sid: string, data: SessionData, touchedAt: number, mark: number): void {
    this.rows.setIfUnchanged(sid, { json: JSON.stringify(data), expires: expiresOf(data, this.now()), touchedAt }, mark);
  }
}

/** When the stored row expires (as the MariaDB store computes it); a session cookie without an expiry: a day. */
function expiresOf(data: SessionData, now: number): number {
  const cookie = data.cookie as { expires?: Date | string | null; _expires?: Date | string | null } | undefined;
  const at = cookie?.expires ?? cookie?._expires;
  return at ? new Date(at).getTime() : now + 24 * 60 * 60_000;
}
