import type { AppContext } from '../context';
import type { ProjectRole } from '../../src/shared/roles';
import { issueToken } from '../auth/tokens.service';
import { passwordLink } from '../auth/auth.service';
import { invitationMail } from '../mail/messages';
import { findUserByEmail, type UserRow } from '../auth/accounts.service';
import { conflict } from '../http/errors';

interface NewAccount {
  email: string;
  displayName: string;
  isAdmin?: boolean;
}

interface Joining {
  id: number;
  name: string;
  role: ProjectRole;
}

/**
 * Creates an account without a password (and, when given, its membership) in one
 * transaction, then e-mails a single-use set-your-password link. Should the mail
 * fail, the person can still ask for a reset link from the sign-in page.
 */
export async function createInvitedAccount(ctx: AppContext, account: NewAccount, invitedBy: string | null, project: Joining | null): Promise<UserRow> {
  if (await findUserByEmail(ctx.db, account.email)) throw conflict('email_taken', 'An account with that e-mail address already exists.');
  const { id, token } = await ctx.db.transaction(async (trx) => {
    const [newId] = await trx('users').insert({ email: account.email, display_name: account.displayName, is_admin: !!account.isAdmin });
    if (project) await trx('project_members').insert({ project_id: project.id, user_id: newId, role: project.role });
    return { id: newId as number, token: await issueToken(trx, newId, 'invite') };
  });
  await ctx.mailer.send(invitationMail({ email: account.email, displayName: account.displayName }, passwordLink(ctx, token), invitedBy, project?.name ?? null));
  return (await ctx.db<UserRow>('users').where({ id }).first()) as UserRow;
}
