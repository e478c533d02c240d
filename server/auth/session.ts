import session from 'express-session';
import createMySQLStore from 'express-mysql-session';
import type { Config } from '../config';
import { CachedSessionStore } from './session-cache';

// Sessions live in MariaDB (table `sessions`, created by a migration) so app
// servers stay stateless. Cookies are httpOnly and SameSite=Lax. Each instance keeps the rows it
// read or wrote in memory (session-cache.ts): a request reads no session row and writes the rolling
// expiry at most once a minute.

export const SESSION_COOKIE = 'beadloom.sid';

export function createSessionMiddleware(config: Config) {
  const MySQLStore = createMySQLStore(session);
  const url = new URL(config.databaseUrl);
  const store = new MySQLStore({
    host: url.hostname,
    port: Number(url.port || 3306),
    user: decodeURIComponent(url.username),
    password: decodeURIComponent(url.password),
    database: url.pathname.slice(1),
    createDatabaseTable: false,
    clearExpired: true,
    checkExpirationInterval: 15 * 60_000,
    expiration: 7 * 24 * 60 * 60_000,
  });
  const cached = new CachedSessionStore(store, { ttlMs: 60_000, touchEveryMs: 60_000, max: 10_000 });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store: cached,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      // Behind a trusted proxy (TRUST_PROXY): Secure whenever the request came over HTTPS
      // (X-Forwarded-Proto); otherwise Secure when the public address is https.
      secure: config.trustProxy !== false ? 'auto' : config.appUrl.startsWith('https://'),
      maxAge: 7 * 24 * 60 * 60_000,
    },
  });
  return { middleware, store, cached };
}
