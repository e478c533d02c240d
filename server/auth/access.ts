import type { Request } from 'express';
import type { Db } from '../db/knex';
import type { ProjectRole } from '../../src/shared/roles';
import { can, canSee, canSite, type ProjectAction, type SiteAction } from '../../src/shared/permissions';
import { forbidden, notFound, unauthenticated } from '../http/errors';

// The bridge between requests and the shared rule table (src/shared/permissions.ts): look up the
// caller's standing, ask the table, and throw the right error (401, 404 or 403).

/** Who is asking, as the rule table needs it (a signed-in account). */
export interface Actor {
  id: number;
  isAdmin: boolean;
}

export function requireUser(req: Request): Express.User {
  if (!req.user) throw unauthenticated();
  return req.user;
}

export async function roleInProject(db: Db, projectId: number, userId: number): Promise<{ exists: boolean; role: ProjectRole | null }> {
  const row = await db('projects as p')
    .leftJoin('project_members as m', function joinMember() {
      this.on('m.project_id', '=', 'p.id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('p.id', projectId)
    .first('p.id', 'm.role');
  return { exists: !!row, role: (row?.role as ProjectRole | undefined) ?? null };
}

/** Resolves the caller's role in a project or throws: 401 anonymous, 404 invisible, 403 not allowed. */
export async function authorizeProject(db: Db, req: Request, projectId: number, action: ProjectAction): Promise<ProjectRole | null> {
  const user = requireUser(req);
  const load = () => roleInProject(db, projectId, user.id);
  // The app's access cache (app.ts puts it on the request), dropped by membership changes.
  const { exists, role } = req.accessCache ? await req.accessCache.role(projectId, user.id, load) : await load();
  const standing = { isAdmin: user.isAdmin, role };
  if (!exists || !canSee(standing)) throw notFound('That project');
  if (!can(standing, action)) throw forbidden();
  return role;
}

export async function rolesAnywhere(db: Db, userId: number): Promise<ProjectRole[]> {
  const rows = await db('project_members').where({ user_id: userId }).distinct('role');
  return rows.map((r) => r.role as ProjectRole);
}

export async function authorizeSite(db: Db, req: Request, action: SiteAction): Promise<Express.User> {
  const user = requireUser(req);
  const roles = user.isAdmin ? [] : await rolesAnywhere(db, user.id);
  if (!canSite({ isAdmin: user.isAdmin, roles }, action)) throw forbidden('Your account does not allow that.');
  return user;
}
