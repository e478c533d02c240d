import type { AppContext } from '../context';
import type { Member } from '../../src/shared/projects';
import type { ProjectRole } from '../../src/shared/roles';
import { conflict, notFound } from '../http/errors';
import { findUserByEmail } from '../auth/accounts.service';
import { createInvitedAccount } from '../users/invitations.service';
import { addedToProjectMail } from '../mail/messages';

const memberColumns = ['u.id as userId', 'u.email', 'u.display_name as displayName', 'm.role', 'u.password_hash'] as const;

function toMember(row: Record<string, unknown>): Member {
  return {
    userId: row.userId as number,
    email: row.email as string,
    displayName: row.displayName as string,
    role: row.role as ProjectRole,
    activated: row.password_hash !== null,
  };
}

export async function listMembers(ctx: AppContext, projectId: number): Promise<Member[]> {
  const rows = await ctx.db('project_members as m').join('users as u', 'u.id', 'm.user_id').where('m.project_id', projectId).orderBy('u.display_name').select(...memberColumns);
  return rows.map(toMember);
}

async function getMember(ctx: AppContext, projectId: number, userId: number): Promise<Member> {
  const row = await ctx.db('project_members as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.project_id': projectId, 'm.user_id': userId }).first(...memberColumns);
  if (!row) throw notFound('That member');
  return toMember(row);
}

interface AddMember {
  email: string;
  role: ProjectRole;
  displayName?: string;
}

/** Adds an existing account, or creates one and sends its invitation. */
export async function addMember(ctx: AppContext, projectId: number, input: AddMember, actor: Express.User): Promise<Member> {
  const project = await ctx.db('projects').where({ id: projectId }).first('name');
  const existing = await findUserByEmail(ctx.db, input.email);
  if (existing) {
    const already = await ctx.db('project_members').where({ project_id: projectId, user_id: existing.id }).first();
    if (already) throw conflict('already_member', `${existing.email} is already a member of this project.`);
    await ctx.db('project_members').insert({ project_id: projectId, user_id: existing.id, role: input.role });
    // Committed: what this instance (or another) remembered of them in this project is dropped.
    ctx.accessChanges.publish({ kind: 'membership', projectId, userId: existing.id });
    await ctx.mailer.send(addedToProjectMail({ email: existing.email, displayName: existing.display_name }, project.name, ctx.config.appUrl));
    return getMember(ctx, projectId, existing.id);
  }
  const displayName = input.displayName ?? input.email.split('@')[0];
  const row = await createInvitedAccount(ctx, { email: input.email, displayName }, actor.displayName, { id: projectId, name: project.name, role: input.role });
  return getMember(ctx, projectId, row.id);
}

/**
 * Changes a role or removes a member, refusing to leave the project without a
 * supervisor (409 last_supervisor). Runs in a transaction with the supervisor
 * rows locked, so two concurrent demotions cannot both pass the check.
 */
export async function changeMembership(ctx: AppContext, projectId: number, userId: number, role: ProjectRole | null): Promise<Member | null> {
  await ctx.db.transaction(async (trx) => {
    const current = await trx('project_members').where({ project_id: projectId, user_id: userId }).forUpdate().first('role');
    if (!current) throw notFound('That member');
    if (current.role === 'supervisor' && role !== 'supervisor') {
      const supervisors = await trx('project_members').where({ project_id: projectId, role: 'supervisor' }).forUpdate().select('user_id');
      if (supervisors.length <= 1) {
        throw conflict('last_supervisor', 'A project needs at least one supervisor. Make someone else supervisor first.');
      }
    }
    const q = trx('project_members').where({ project_id: projectId, user_id: userId });
    await (role === null ? q.delete() : q.update({ role }));
  });
  // Committed: open sockets of this member re-decide (a student's socket turns read-only, a removed member's closes).
  ctx.accessChanges.publish({ kind: 'membership', projectId, userId });
  return role === null ? null : getMember(ctx, projectId, userId);
}
