import type { Request } from 'express';
import type { Db } from '../db/knex';
import type { ProjectAction } from '../../src/shared/permissions';
import { authorizeProject, requireUser } from '../auth/access';
import { notFound } from '../http/errors';

/** A molecule's project, authorised for `action`: 401 anonymous, 404 unknown or invisible, 403 not allowed. */
export async function authorizeMolecule(db: Db, req: Request, moleculeId: number, action: ProjectAction): Promise<number> {
  requireUser(req);
  const load = async (): Promise<number | null> => (await db('molecules').where({ id: moleculeId }).first('project_id'))?.project_id ?? null;
  const projectId = req.accessCache ? await req.accessCache.projectOf('molecule', moleculeId, load) : await load();
  if (projectId === null) throw notFound('That molecule');
  await authorizeProject(db, req, projectId, action).catch((err) => {
    throw err.status === 404 ? notFound('That molecule') : err;
  });
  return projectId;
}
