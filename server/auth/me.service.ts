import type { Db } from '../db/knex';
import type { Me } from '../../src/shared/auth';
import type { ProjectRole } from '../../src/shared/roles';
import { canSite } from '../../src/shared/permissions';

export async function buildMe(db: Db, user: Express.User): Promise<Me> {
  const rows = await db('project_members as m')
    .join('projects as p', 'p.id', 'm.project_id')
    .where('m.user_id', user.id)
    .orderBy('p.name')
    .select('p.id as projectId', 'p.name as projectName', 'm.role as role');
  const projects = rows.map((r) => ({ projectId: r.projectId as number, projectName: r.projectName as string, role: r.role as ProjectRole }));
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    isAdmin: user.isAdmin,
    canCreateProjects: canSite({ isAdmin: user.isAdmin, roles: projects.map((p) => p.role) }, 'project:create'),
    projects,
  };
}
