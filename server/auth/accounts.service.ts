import type { Db } from '../db/knex';
import type { AppContext } from '../context';

// Knex access to the accounts a session stands for: finding them, ending their sessions, and the
// changes a person makes to their own account. Site administration of accounts (listing, creating,
// disabling) is server/users/, which builds on this. Rows use snake_case; the API uses camelCase.

export interface UserRow {
  id: number;
  email: string;
  display_name: string;
  password_hash: string | null;
  is_admin: number | boolean;
  disabled_at: Date | null;
  session_version: number;
  created_at: Date;
}

export function toSessionUser(row: UserRow): Express.User {
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    isAdmin: !!row.is_admin,
    sessionVersion: row.session_version,
  };
}

export const findUserById = (db: Db, id: number) => db<UserRow>('users').where({ id }).first();
export const findUserByEmail = (db: Db, email: string) => db<UserRow>('users').where({ email: email.toLowerCase() }).first();

/** Ends every session of the account: their stored session version no longer matches (open sockets close too). */
export async function endSessions(ctx: AppContext, userId: number): Promise<void> {
  await ctx.db('users').where({ id: userId }).increment('session_version', 1);
  ctx.accessChanges.publish({ kind: 'account', userId });
}

/** A person renames themselves; open sockets take the new name (access-changes.ts). */
export async function renameAccount(ctx: AppContext, userId: number, displayName: string): Promise<void> {
  await ctx.db('users').where({ id: userId }).update({ display_name: displayName, updated_at: ctx.db.fn.now() });
  ctx.accessChanges.publish({ kind: 'account', userId });
}

/** Stores a new password hash (the caller ends the account's other sessions). */
export async function setPasswordHash(db: Db, userId: number, hash: string): Promise<void> {
  await db('users').where({ id: userId }).update({ password_hash: hash, updated_at: db.fn.now() });
}
