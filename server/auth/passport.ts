import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Config } from '../config';
import type { Db } from '../db/knex';
import { AppError } from '../http/errors';
import { verifyPassword } from './passwords';
import { findUserByEmail, findUserById, toSessionUser } from './accounts.service';
import type { AccessCache, CachedAccount } from './access-cache';

// The session stores { id, v }: the account id and its session version. A
// disabled account, or one whose version moved on (disable, password change),
// is signed out on its next request.

export interface SessionRef {
  id: number;
  v: number;
}

/**
 * The account a session stands for, or null once the account is disabled or gone or its sessions were
 * ended. Asked on every request, and by open collaboration sockets when access changes.
 */
export async function sessionUser(db: Db, ref: SessionRef, cache?: AccessCache): Promise<Express.User | null> {
  const load = async (): Promise<CachedAccount | null> => {
    const row = await findUserById(db, ref.id);
    return row ? { user: toSessionUser(row), disabled: !!row.disabled_at } : null;
  };
  const account = cache ? await cache.account(ref.id, load) : await load();
  if (!account || account.disabled || account.user.sessionVersion !== ref.v) return null;
  // A copy: a request may change its req.user (a rename answers with the new name).
  return { ...account.user };
}

/** `cache`: the accounts behind sessions, kept between requests (access-cache.ts); without it every request reads MariaDB. */
export function configurePassport(db: Db, config: Config, cache?: AccessCache): passport.PassportStatic {
  const pp = new passport.Passport();
  pp.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, async (email, password, done) => {
      try {
        const row = await findUserByEmail(db, email);
        const ok = await verifyPassword(password, row?.password_hash ?? null, config.bcryptCost);
        if (!row || !ok) return done(new AppError(401, 'invalid_credentials', 'That e-mail and password do not match an account.'));
        if (row.disabled_at) return done(new AppError(403, 'account_disabled', 'This account has been disabled. Ask an administrator.'));
        return done(null, toSessionUser(row));
      } catch (err) {
        return done(err);
      }
    }),
  );
  pp.serializeUser((user, done) => done(null, { id: user.id, v: user.sessionVersion } satisfies SessionRef));
  pp.deserializeUser(async (ref: SessionRef, done) => {
    try {
      return done(null, (await sessionUser(db, ref, cache)) ?? false);
    } catch (err) {
      return done(err);
    }
  });
  return pp as unknown as passport.PassportStatic;
}
