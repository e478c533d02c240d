import type { Db } from '../db/knex';
import type { AppContext } from '../context';
import type { UserSummary } from '../../src/shared/users';

// Knex access to accounts. Rows use snake_case; the API uses camelCase.

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

export function toUserSummary(row: UserRow): UserSummary {
  return {
    id: row.id,
    email: row.email,
    displayName: row.display_name,
    isAdmin: !!row.is_admin,
    disabled: row.disabled_at !== null,
    activated: row.password_hash !== null,
    createdAt: new Date(row.created_at).toISOString(),
  };
}

export const findUserById = (db: Db, id: number) => db<UserRow>('users').where({ id }).first();
export const findUserByEmail = (db: Db, email: string) => db<UserRow>('users').where({ email: email.toLowerCase() }).first();
export const listUsers = (db: Db) => db<UserRow>('users').orderBy('email');

/** Ends every session of the account: their stored session version no longer matches (open sockets close too). */
export async function endSessions(ctx: AppContext, userId: number): Promise<void> {
  await ctx.db('users').where({ id: userId }).increment('session_version', 1);
  ctx.accessChanges.publish({ kind: 'account', userId });
}

export interface AccountChanges {
  displayName?: string;
  isAdmin?: boolean;
  disabled?: boolean;
}

/** An admin's change to an account; disabling it ends its sessions. Open sockets follow (access-changes.ts). */
export async function updateAccount(ctx: AppContext, id: number, changes: AccountChanges): Promise<void> {
  const { displayName, isAdmin, disabled } = changes;
  await ctx.db('users')
    .where({ id })
    .update({
      ...(displayName !== undefined ? { display_name: displayName } : {}),
      ...(isAdmin !== undefined ? { is_admin: isAdmin } : {}),
      ...(disabled !== undefined ? { disabled_at: disabled ? ctx.db.fn.now() : null } : {}),
      updated_at: ctx.db.fn.now(),
    });
  if (disabled === true) await endSessions(ctx, id);
  else ctx.accessChanges.publish({ kind: 'account', userId: id });
}
