import type { Db } from '../db/knex';
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

/** Ends every session of the account: their stored session version no longer matches. */
export async function endSessions(db: Db, userId: number): Promise<void> {
  await db('users').where({ id: userId }).increment('session_version', 1);
}
