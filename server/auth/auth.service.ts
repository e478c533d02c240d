import type { AppContext } from '../context';
import { hashPassword, verifyPassword } from './passwords';
import { consumeToken, issueToken } from './tokens.service';
import { endSessions, findUserByEmail, findUserById, setPasswordHash, toSessionUser } from './accounts.service';
import { resetMail } from '../mail/messages';
import { AppError, badRequest } from '../http/errors';

export function passwordLink(ctx: AppContext, token: string): string {
  return `${ctx.config.appUrl}/reset-password?token=${encodeURIComponent(token)}`;
}

/** Sends a reset link when the address belongs to an active account; says nothing either way. */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  const user = await findUserByEmail(ctx.db, email);
  if (!user || user.disabled_at) return;
  const token = await issueToken(ctx.db, user.id, 'reset');
  await ctx.mailer.send(resetMail({ email: user.email, displayName: user.display_name }, passwordLink(ctx, token)));
}

/** Sets the password of the token's account; returns that account to sign in (null when it is disabled). */
export async function resetPassword(ctx: AppContext, token: string, password: string): Promise<Express.User | null> {
  // Hash first so a valid token is not spent when hashing fails.
  const hash = await hashPassword(password, ctx.config.bcryptCost);
  const userId = await consumeToken(ctx.db, token);
  if (userId === null) throw badRequest('invalid_token', 'This link has already been used or has expired. Ask for a new one.');
  await setPasswordHash(ctx.db, userId, hash);
  await endSessions(ctx, userId);
  const row = await findUserById(ctx.db, userId);
  return row && !row.disabled_at ? toSessionUser(row) : null;
}

export async function changePassword(ctx: AppContext, userId: number, current: string, next: string): Promise<number> {
  const row = await findUserById(ctx.db, userId);
  if (!row || !(await verifyPassword(current, row.password_hash, ctx.config.bcryptCost))) {
    throw new AppError(400, 'invalid_credentials', 'The current password is not right.', { issues: [{ path: 'currentPassword', message: 'The current password is not right.' }] });
  }
  const hash = await hashPassword(next, ctx.config.bcryptCost);
  await setPasswordHash(ctx.db, userId, hash);
  await endSessions(ctx, userId);
  return row.session_version + 1;
}
