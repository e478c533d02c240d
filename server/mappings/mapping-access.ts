import type { Request } from 'express';
import type { Db } from '../db/knex';
import type { ProjectAction } from '../auth/permissions';
import { authorizeProject, requireUser } from '../auth/access';
import { notFound } from '../http/errors';
import type { ProjectRole } from '../../src/shared/roles';

/** A mapping's project, authorised for `action`: 401 anonymous, 404 unknown or invisible, 403 not allowed. */
export async function authorizeMapping(db: Db, req: Request, mappingId: number, action: ProjectAction): Promise<{ projectId: number; role: ProjectRole | null }> {
  requireUser(req);
  const row = await db('mappings as p').join('molecules as m', 'm.id', 'p.molecule_id').where('p.id', mappingId).first('m.project_id');
  if (!row) throw notFound('That mapping');
  const role = await authorizeProject(db, req, row.project_id, action).catch((err) => {
    throw err.status === 404 ? notFound('That mapping') : err;
  });
  return { projectId: row.project_id, role };
}
