import type { Db } from '../db/knex';
import type { AppContext } from '../context';
import type { UserSummary } from '../../src/shared/users';
import { endSessions, findUserById, type UserRow } from '../auth/accounts.service';
import { conflict, notFound } from '../http/errors';

// Site administration of accounts (an admin's list and changes). Finding an account and ending its
// sessions are the sign-in's, in auth/accounts.service.ts. Rows use snake_case; the API uses camelCase.

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

export const listUsers = (db: Db) => db<UserRow>('users').orderBy('email');

export interface AccountChanges {
  displayName?: string;
  isAdmin?: boolean;
  disabled?: boolean;
}

/**
 * An admin's change to an account; disabling it ends its sessions. Open sockets follow
 * (access-changes.ts). Nobody disables their own account or drops their own admin flag.
 */
export async function updateAccount(ctx: AppContext, adminId: number, id: number, changes: AccountChanges): Promise<UserSummary> {
  const { displayName, isAdmin, disabled } = changes;
  if (!(await findUserById(ctx.db, id))) throw notFound('That account');
  if (id === adminId && (disabled === true || isAdmin === false)) {
    throw conflict('conflict', 'You cannot disable your own account or remove your own admin flag.');
  }
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
  return toUserSummary((await findUserById(ctx.db, id))!);
}
