import { z } from 'zod';
import type { Request } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { BackgroundTasks } from '../jobs/background-task';
import { typed } from '../http/validate';
import { requireUser, authorizeProject } from '../auth/access';
import { badRequest, conflict, notFound } from '../http/errors';
import { idParam } from '../../src/shared/fields';
import { referenceNameField, REFERENCE_FIELDS } from '../../src/shared/references';
import { referenceSelection } from '../../src/shared/references-selection';
import type { ProjectAction } from '../../src/shared/permissions';
import { authorizeMolecule } from '../molecules/molecule-access';
import { structureFormatOf, trajectoryFormatOf } from './formats';
import { adoptUpload, analysisDir, referenceDir, removeDir } from './reference-files';
import { discardUploads, quotaExceeded, referenceUpload, uploadedFiles } from './reference-upload';
import { deleteReference, findReference, insertReference, projectBytes, referencesOf, requeueReference, toReferenceView } from './references.service';
import { matchJobHooks, matchJobRunner } from './match-job';

const params = z.object({ id: idParam });
const matchAgainBody = z.object({ selection: referenceSelection.nullable() }).strict();

/** A reference's project, authorised for `action`: 404 for unknown and invisible alike. */
export async function authorizeReference(ctx: AppContext, req: Request, id: number, action: ProjectAction) {
  requireUser(req);
  const row = await findReference(ctx.db, id);
  if (!row) throw notFound('That reference');
  await authorizeProject(ctx.db, req, row.project_id, action).catch((err) => {
    throw err.status === 404 ? notFound('That reference') : err;
  });
  return row;
}

export function referenceRoutes(r: RouteTable, ctx: AppContext, tasks: BackgroundTasks): void {
  const { dataDir, referenceMaxBytes, projectQuotaBytes } = ctx.config;
  const runMatch = matchJobRunner(ctx.db, dataDir);

  // Authorised and checked against the quota before the body is read, so a refused caller never uploads.
  const before = typed({ params }, async ({ params }, req, _res, next) => {
    const projectId = await authorizeMolecule(ctx.db, req, params.id, 'reference:create');
    const used = await projectBytes(ctx.db, projectId);
    const announced = Number(req.headers['content-length'] ?? 0);
    if (used + announced > projectQuotaBytes) throw quotaExceeded(projectQuotaBytes, used);
    next();
  });

  r.post('/api/molecules/:id/references', before, referenceUpload(dataDir, referenceMaxBytes), typed({ params }, async ({ params }, req, res) => {
    try {
      const projectId = await authorizeMolecule(ctx.db, req, params.id, 'reference:create');
      const { structure, trajectory } = uploadedFiles(req);
      const fields = (req.body ?? {}) as Record<string, unknown>;
      if (!structure) throw badRequest('validation_failed', `Attach a structure (.gro, .pdb or a molfile) in the form field "${REFERENCE_FIELDS.structure}".`);
      const structureFormat = structureFormatOf(structure.originalname);
      if (!structureFormat) throw badRequest('validation_failed', `The structure must be a .gro, .pdb or molfile (.mol, .sdf); "${structure.originalname}" is none of these.`, { field: 'structure' });
      const trajectoryFormat = trajectory ? trajectoryFormatOf(trajectory.originalname) : null;
      if (trajectory && !trajectoryFormat) throw badRequest('validation_failed', `The trajectory must be .xtc, .trr, .dcd, a multi-model .pdb, or a multi-frame .gro or .xyz; "${trajectory.originalname}" is none of these.`, { field: 'trajectory' });
      const name = referenceNameField.safeParse(typeof fields.name === 'string' && fields.name.trim() ? fields.name : structure.originalname);
      if (!name.success) throw badRequest('validation_failed', name.error.issues[0].message, { field: 'name' });
      let selection = null;
      if (typeof fields.selection === 'string' && fields.selection.trim() !== '') {
        let raw: unknown;
        try {
          raw = JSON.parse(fields.selection);
        } catch {
          throw badRequest('validation_failed', 'The selection is not JSON: send { "residue": "SDS" } or { "start": 1, "atomsPerCopy": 42, "copies": 100 }.', { field: 'selection' });
        }
        const parsed = referenceSelection.safeParse(raw);
        if (!parsed.success) throw badRequest('validation_failed', 'The selection is { "residue": "SDS" } or { "start": 1, "atomsPerCopy": 42, "copies": 100 } (1-based atom numbers).', { field: 'selection' });
        selection = parsed.data;
      }
      const bytes = structure.size + (trajectory?.size ?? 0);
      const used = await projectBytes(ctx.db, projectId);
      if (used + bytes > projectQuotaBytes) throw quotaExceeded(projectQuotaBytes, used);
      const id = await insertReference(ctx.db, {
        moleculeId: params.id,
        projectId,
        name: name.data,
        structureName: structure.originalname,
        structureFormat,
        trajectoryName: trajectory?.originalname ?? null,
        trajectoryFormat,
        selection,
        bytes,
        createdBy: requireUser(req).id,
      });
      const dir = referenceDir(dataDir, id);
      await adoptUpload(structure.path, dir, `structure.${structureFormat}`);
      if (trajectory) await adoptUpload(trajectory.path, dir, `trajectory.${trajectoryFormat}`);
      tasks.start('reference-match', runMatch, { referenceId: id }, matchJobHooks(ctx.db, id));
      res.status(202).json({ id, status: 'queued' });
    } finally {
      await discardUploads(req);
    }
  }));

  r.get('/api/molecules/:id/references', typed({ params }, async ({ params }, req, res) => {
    await authorizeMolecule(ctx.db, req, params.id, 'reference:read');
    res.json((await referencesOf(ctx.db, params.id)).map(toReferenceView));
  }));

  r.get('/api/references/:id', typed({ params }, async ({ params }, req, res) => {
    res.json(toReferenceView(await authorizeReference(ctx, req, params.id, 'reference:read')));
  }));

  // Matching again with another selection, on the files a failed search kept (no new upload).
  r.post('/api/references/:id/match', typed({ params, body: matchAgainBody }, async ({ params, body }, req, res) => {
    const row = await authorizeReference(ctx, req, params.id, 'reference:create');
    if (row.status !== 'failed') throw conflict('reference_not_failed', `That reference is ${row.status}; only a reference whose search failed is matched again.`, { status: row.status });
    if (!(await requeueReference(ctx.db, params.id, body.selection))) {
      const now = await findReference(ctx.db, params.id);
      if (now?.status === 'failed') throw conflict('reference_files_gone', 'That reference’s files were removed when it failed (they could not be read or did not agree), so it cannot be matched again: upload them again.', { code: now.error_code });
      throw conflict('reference_not_failed', `That reference is ${now?.status ?? 'gone'}; only a reference whose search failed is matched again.`, { status: now?.status });
    }
    tasks.start('reference-match', runMatch, { referenceId: params.id }, matchJobHooks(ctx.db, params.id));
    res.status(202).json({ id: params.id, status: 'queued' });
  }));

  r.delete('/api/references/:id', typed({ params }, async ({ params }, req, res) => {
    await authorizeReference(ctx, req, params.id, 'reference:delete');
    const analyses = await deleteReference(ctx.db, params.id);
    await removeDir(referenceDir(dataDir, params.id));
    for (const a of analyses) await removeDir(analysisDir(dataDir, a));
    res.status(204).end();
  }));
}
