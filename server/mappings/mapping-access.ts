import type { Request } from 'express';
import type { Db } from '../db/knex';
import { can, canSee, type ProjectAction } from '../../src/shared/permissions';
import { authorizeProject, requireUser, roleInProject, type Actor } from '../auth/access';
import { notFound } from '../http/errors';
import { mappingsWithMolecule } from './mappings.service';
import type { ProjectRole } from '../../src/shared/roles';

const projectOfMapping = async (db: Db, mappingId: number): Promise<number | null> =>
  (await mappingsWithMolecule(db).where('p.id', mappingId).first('m.project_id'))?.project_id ?? null;

/** A mapping's project, authorised for `action`: 401 anonymous, 404 unknown or invisible, 403 not allowed. */
export async function authorizeMapping(db: Db, req: Request, mappingId: number, action: ProjectAction): Promise<{ projectId: number; role: ProjectRole | null }> {
  requireUser(req);
  const load = () => projectOfMapping(db, mappingId);
  const projectId = req.accessCache ? await req.accessCache.projectOf('mapping', mappingId, load) : await load();
  if (projectId === null) throw notFound('That mapping');
  const role = await authorizeProject(db, req, projectId, action).catch((err) => {
    throw err.status === 404 ? notFound('That mapping') : err;
  });
  return { projectId, role };
}

export interface MappingAccess {
  projectId: number;
  role: ProjectRole | null;
  /** 'mapping:edit' (the production lock is the mapping's state, not a permission: checked apart). */
  canEdit: boolean;
}

/**
 * What `actor` may do with a mapping, asked of the permission module, for callers without a request
 * (the collaboration socket, at its upgrade and whenever access changes): null when the mapping does
 * not exist or is not visible to the actor (answered as 404).
 */
export async function mappingAccess(db: Db, actor: Actor, mappingId: number): Promise<MappingAccess | null> {
  const projectId = await projectOfMapping(db, mappingId);
  if (projectId === null) return null;
  const { exists, role } = await roleInProject(db, projectId, actor.id);
  const standing = { isAdmin: actor.isAdmin, role };
  if (!exists || !canSee(standing) || !can(standing, 'mapping:read')) return null;
  return { projectId, role, canEdit: can(standing, 'mapping:edit') };
}
