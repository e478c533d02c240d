import type { Request } from 'express';
import type { Db } from '../db/knex';
import type { ProjectAction } from '../../src/shared/permissions';
import { authorizeProject, requireUser } from '../auth/access';
import { notFound } from '../http/errors';
import { mappingsWithMolecule } from '../mappings/mappings.service';
import type { ProjectRole } from '../../src/shared/roles';

// A thread or comment, authorised through its mapping's project: 401 anonymous, 404 unknown or in a
// project the caller cannot see (another project's thread is 404, never 403), 403 not allowed.

export interface ThreadPlace {
  threadId: number;
  mappingId: number;
  projectId: number;
  beadId: string;
  role: ProjectRole | null;
}

const threadBase = (db: Db) => mappingsWithMolecule(db).join('threads as t', 't.mapping_id', 'p.id');

async function authorize(db: Db, req: Request, row: { threadId: number; mappingId: number; projectId: number; beadId: string } | undefined, what: string, action: ProjectAction) {
  if (!row) throw notFound(what);
  const role = await authorizeProject(db, req, row.projectId, action).catch((err) => {
    throw err.status === 404 ? notFound(what) : err;
  });
  return { ...row, role };
}

export async function authorizeThread(db: Db, req: Request, threadId: number, action: ProjectAction): Promise<ThreadPlace> {
  requireUser(req);
  const row = await threadBase(db).where('t.id', threadId).first('t.id as threadId', 't.mapping_id as mappingId', 'm.project_id as projectId', 't.bead_id as beadId');
  return authorize(db, req, row, 'That thread', action);
}

export async function authorizeComment(db: Db, req: Request, commentId: number, action: ProjectAction): Promise<ThreadPlace & { authorId: number | null; deleted: boolean }> {
  requireUser(req);
  const row = await threadBase(db)
    .join('thread_comments as c', 'c.thread_id', 't.id')
    .where('c.id', commentId)
    .first('t.id as threadId', 't.mapping_id as mappingId', 'm.project_id as projectId', 't.bead_id as beadId', 'c.author_id as authorId', 'c.deleted_at as deletedAt');
  const place = await authorize(db, req, row, 'That comment', action);
  return { ...place, authorId: row.authorId, deleted: row.deletedAt !== null };
}
