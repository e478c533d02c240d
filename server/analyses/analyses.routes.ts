import { z } from 'zod';
import { join } from 'node:path';
import type { Request } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { DraftAccess } from '../mappings/draft-access';
import type { BackgroundTasks } from '../jobs/background-task';
import { typed } from '../http/validate';
import { authorizeProject, requireUser } from '../auth/access';
import { conflict, forbidden, notFound, unprocessable } from '../http/errors';
import { can, type ProjectAction } from '../../src/shared/permissions';
import { idParam } from '../../src/shared/fields';
import { analysisBody, cgTrajectoryQuery, DEFAULT_BINS, DEFAULT_TEMPERATURE } from '../../src/shared/references';
import { authorizeMapping } from '../mappings/mapping-access';
import { findMapping } from '../mappings/mappings.service';
import { exportSource } from '../exports/export-source';
import { slug } from '../exports/render';
import { findReference } from '../references/references.service';
import { analysisDir, removeDir } from '../references/reference-files';
import { planAnalysis } from './analysis-plan';
import { analysisJobHooks, analysisJobRunner } from './analysis-job';
import { analysesOf, deleteAnalysis, findAnalysis, insertAnalysis, projectOfAnalysis, requestCancel, toAnalysisView } from './analyses.service';
import { termsCsv } from './terms-csv';
import { writeCgGro, writeCgPdb, writeCgTrr } from './cg-trajectory';

const params = z.object({ id: idParam });

async function authorizeAnalysis(ctx: AppContext, req: Request, id: number, action: ProjectAction) {
  const user = requireUser(req);
  const projectId = await projectOfAnalysis(ctx.db, id);
  const row = projectId === null ? undefined : await findAnalysis(ctx.db, id);
  if (!row || projectId === null) throw notFound('That analysis');
  const role = await authorizeProject(ctx.db, req, projectId, action).catch((err) => {
    throw err.status === 404 ? notFound('That analysis') : err;
  });
  return { row, user, role };
}

export function analysisRoutes(r: RouteTable, ctx: AppContext, drafts: DraftAccess, tasks: BackgroundTasks): void {
  const run = analysisJobRunner(ctx.db, ctx.config.dataDir);
  const start = (id: number) =>
    tasks.start('analysis', run, { analysisId: id }, analysisJobHooks(ctx.db, id));

  r.post('/api/mappings/:id/analyses', typed({ params, body: analysisBody }, async ({ params, body }, req, res) => {
    const user = requireUser(req);
    await authorizeMapping(ctx.db, req, params.id, 'analysis:start');
    const mapping = await findMapping(ctx.db, params.id);
    const ref = await findReference(ctx.db, body.referenceId);
    if (!ref || ref.project_id !== mapping.projectId) throw notFound('That reference');
    if (ref.molecule_id !== mapping.moleculeId) throw unprocessable('reference_of_other_molecule', 'That reference is a simulation of another molecule; pick a reference of this mapping’s molecule.', { referenceId: ref.id });
    if (ref.status !== 'ready') throw conflict('reference_not_ready', `That reference is ${ref.status}; an analysis needs a reference whose copies have been found.`, { status: ref.status });
    const source = await exportSource(ctx.db, drafts, params.id, body.version);
    const plan = planAnalysis(source.model, source.draft, source.evaluation);
    const id = await insertAnalysis(ctx.db, {
      mappingId: params.id,
      referenceId: ref.id,
      version: body.version,
      versionNumber: source.version,
      contentSha256: source.sha256,
      temperature: body.temperature ?? DEFAULT_TEMPERATURE,
      bins: body.bins ?? DEFAULT_BINS,
      plan,
      createdBy: user.id,
    });
    start(id);
    res.status(202).json({ id, status: 'queued' });
  }));

  r.get('/api/mappings/:id/analyses', typed({ params }, async ({ params }, req, res) => {
    await authorizeMapping(ctx.db, req, params.id, 'reference:read');
    res.json((await analysesOf(ctx.db, params.id)).map((a) => toAnalysisView(a, false)));
  }));

  r.get('/api/analyses/:id', typed({ params }, async ({ params }, req, res) => {
    const { row } = await authorizeAnalysis(ctx, req, params.id, 'reference:read');
    res.json(toAnalysisView(row, true));
  }));

  // A running analysis is cancelled (its job stops at its next look at the flag); a finished one is removed.
  r.delete('/api/analyses/:id', typed({ params }, async ({ params }, req, res) => {
    const { row, user, role } = await authorizeAnalysis(ctx, req, params.id, 'analysis:start');
    if (row.created_by !== user.id && !can({ isAdmin: user.isAdmin, role }, 'analysis:manage')) throw forbidden('Only the person who started this analysis, or a supervisor, may cancel or remove it.');
    if (row.status === 'queued' || row.status === 'running') {
      await requestCancel(ctx.db, params.id);
      return void res.status(202).json({ id: params.id, status: 'cancelling' });
    }
    await deleteAnalysis(ctx.db, params.id);
    await removeDir(analysisDir(ctx.config.dataDir, params.id));
    res.status(204).end();
  }));

  const finished = async (req: Request, id: number) => {
    const { row } = await authorizeAnalysis(ctx, req, id, 'mapping:export');
    if (row.status !== 'done' || !row.result) throw conflict('analysis_not_finished', `This analysis is ${row.status}; its files exist once it is done.`, { status: row.status });
    const mapping = await findMapping(ctx.db, row.mapping_id);
    const ref = await findReference(ctx.db, row.reference_id);
    const view = toAnalysisView(row, true);
    const base = `${slug(mapping.name)}-${row.version_number === null ? 'draft' : `v${row.version_number}`}-analysis-${row.id}`;
    return { row, view, base, mappingName: mapping.name, referenceName: ref?.name ?? '' };
  };

  r.get('/api/analyses/:id/terms.csv', typed({ params }, async ({ params }, req, res) => {
    const { view, base, mappingName, referenceName } = await finished(req, params.id);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${base}-terms.csv"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(termsCsv({ ...view, mappingName, referenceName }));
  }));

  r.get('/api/analyses/:id/cg-trajectory', typed({ params, query: cgTrajectoryQuery }, async ({ params, query }, req, res) => {
    const { view, base, mappingName } = await finished(req, params.id);
    const result = view.result!;
    const layout = { frames: result.frames, copies: result.copies, beadNames: result.beads.map((b) => b.name), residue: 'CG', title: `Beadloom analysis ${view.id} of ${mappingName}` };
    const path = join(analysisDir(ctx.config.dataDir, params.id), 'centres.f32');
    const mime = query.format === 'trr' ? 'application/octet-stream' : query.format === 'pdb' ? 'chemical/x-pdb' : 'text/plain; charset=utf-8';
    res.setHeader('Content-Type', mime);
    res.setHeader('Content-Disposition', `attachment; filename="${base}.${query.format}"`);
    res.setHeader('Cache-Control', 'no-store');
    const writer = query.format === 'gro' ? writeCgGro : query.format === 'pdb' ? writeCgPdb : writeCgTrr;
    await writer(path, layout, res);
    res.end();
  }));
}
