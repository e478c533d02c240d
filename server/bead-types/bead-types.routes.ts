import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeProject, requireUser } from '../auth/access';
import { badRequest } from '../http/errors';
import { idParam } from '../../src/shared/fields';
import {
  beadTypesFromCsv,
  beadTypesQuery,
  beadTypesToCsv,
  importBeadTypesCsvBody,
  putBeadTypesBody,
  type BeadTypeLibrary,
  type BeadTypeRow,
} from '../../src/shared/bead-types';
import { lastChange, libraryFor, replaceLibrary } from './bead-types.service';

const params = z.object({ id: idParam });

/** `{ types }` as JSON, or `{ csv }` parsed with the shared CSV reader, then checked by the same schema. */
function typesFromBody(body: unknown): { types: BeadTypeRow[]; note?: string } {
  const csv = importBeadTypesCsvBody.safeParse(body);
  let candidate = body;
  if (csv.success) {
    const parsed = beadTypesFromCsv(csv.data.csv);
    if (!parsed.ok) throw badRequest('validation_failed', `CSV line ${parsed.line}: ${parsed.message}`, { in: 'body', line: parsed.line });
    candidate = { types: parsed.types, ...(csv.data.note !== undefined ? { note: csv.data.note } : {}) };
  }
  const checked = putBeadTypesBody.safeParse(candidate);
  if (!checked.success) {
    const issues = checked.error.issues.map((i) => ({ path: i.path.join('.'), code: i.code, message: i.message }));
    throw badRequest('validation_failed', `${issues[0].path ? `${issues[0].path}: ` : ''}${issues[0].message}`, { in: 'body', issues });
  }
  return checked.data;
}

export function beadTypeRoutes(r: RouteTable, ctx: AppContext, onChange: (projectId: number) => void): void {
  const library = async (projectId: number): Promise<BeadTypeLibrary> => ({ projectId, types: await libraryFor(ctx.db, projectId), ...(await lastChange(ctx.db, projectId)) });

  r.get('/api/projects/:id/bead-types', typed({ params, query: beadTypesQuery }, async ({ params, query }, req, res) => {
    const projectId = params.id;
    await authorizeProject(ctx.db, req, projectId, 'library:read');
    const lib = await library(projectId);
    if (query.format === 'csv') {
      res.setHeader('Content-Disposition', `attachment; filename="bead-types-project-${projectId}.csv"`);
      return void res.type('text/csv').send(beadTypesToCsv(lib.types));
    }
    res.json(lib);
  }));

  r.put('/api/projects/:id/bead-types', typed({ params }, async ({ params }, req, res) => {
    const projectId = params.id;
    await authorizeProject(ctx.db, req, projectId, 'library:edit');
    const { types, note } = typesFromBody(req.body);
    await replaceLibrary(ctx.db, projectId, types, requireUser(req).id, note);
    onChange(projectId);
    res.json(await library(projectId));
  }));
}
