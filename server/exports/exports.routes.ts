import express from 'express';
import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { DraftAccess } from '../mappings/draft-access';
import { typed } from '../http/validate';
import { authorizeProject, requireUser } from '../auth/access';
import { idParam } from '../../src/shared/fields';
import { exportQuery, importBody, isEngineFormat, IMPORT_MAX_BYTES, type ExportFormat, type ImportOutcome } from '../../src/shared/exports';
import { conflict, notFound, unprocessable } from '../http/errors';
import { engineZip } from './engine-export';
import { assertUnits } from './repeat-units';
import { authorizeMapping } from '../mappings/mapping-access';
import { authorizeMolecule } from '../molecules/molecule-access';
import { findMapping } from '../mappings/mappings.service';
import { exportSource } from './export-source';
import { renderExport } from './render';
import { writeProjectZip } from './project-zip';
import { importMapping, planImport, previewOf } from './import.service';
import { finishedAnalysisOf, libraryNonbonded, projectName } from './exports.service';
import { analysisStructure, type AnalysisStructure } from './analysis-structure';
import { ndxComments, slug } from './render';
import { writeNdx } from './ndx';
import { referenceIndexGroups } from './reference-ndx';
import { stateLabel } from './export-source';
import { findReference } from '../references/references.service';
import { readCopyAtoms } from '../references/copy-atoms';

const params = z.object({ id: idParam });

/** Paths whose JSON bodies may be larger than the app's 1 MB default; app.ts leaves them to the route. */
export const LARGE_JSON_PATHS = /^\/api\/molecules\/[^/]+\/mappings\/import\/?$/;

export function exportRoutes(r: RouteTable, ctx: AppContext, drafts: DraftAccess): void {
  r.get('/api/mappings/:id/export', typed({ params, query: exportQuery }, async ({ params, query }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:export');
    const q = query;
    const source = await exportSource(ctx.db, drafts, id, q.version);
    if (isEngineFormat(q.format)) {
      let structure: AnalysisStructure | undefined;
      if (q.analysis !== undefined) {
        const analysis = await finishedAnalysisOf(ctx.db, id, q.analysis);
        if ((q.units ?? 1) > 1) throw unprocessable('analysis_one_unit', 'An analysis\'s mean structure is one molecule; export a chain of units from the 3D coordinates (without analysis).', { analysisId: q.analysis });
        structure = await analysisStructure(ctx.config.dataDir, analysis);
        // The reference's own numbering too, so gmx traj -n on the reference gives the same bead centres.
        const ref = q.format === 'gromacs' ? await findReference(ctx.db, analysis.referenceId) : undefined;
        if (ref?.status === 'ready' && ref.atoms_per_copy) {
          const groups = referenceIndexGroups(source, await readCopyAtoms(ctx.config.dataDir, ref.id), ref.atoms_per_copy);
          structure.referenceNdx = { name: `${slug(source.mappingName)}-reference-${ref.id}.ndx`, text: writeNdx(groups, ndxComments(source, `atoms numbered as in reference "${ref.name}" (${ref.copies} copies)`)) };
        }
      }
      assertUnits(source, q.units);
      const zip = await engineZip(source, q.format, await libraryNonbonded(ctx.db, id), q.units ?? 1, structure);
      res.setHeader('Content-Type', 'application/zip');
      res.setHeader('Content-Disposition', `attachment; filename="${zip.name}"`);
      res.setHeader('X-Content-SHA256', source.sha256);
      res.setHeader('Cache-Control', 'no-store');
      return void res.send(zip.body);
    }
    if (q.analysis !== undefined || q.units !== undefined) throw unprocessable('engine_only', 'analysis and units apply to the gromacs and lammps formats only.');
    if (q.reference !== undefined) {
      if (q.format !== 'ndx') throw unprocessable('ndx_only', 'reference applies to the ndx format only.');
      const ref = await findReference(ctx.db, q.reference);
      const mapping = await findMapping(ctx.db, id);
      if (!ref || ref.project_id !== mapping.projectId) throw notFound('That reference');
      if (ref.molecule_id !== mapping.moleculeId) throw unprocessable('reference_of_other_molecule', 'That reference is a simulation of another molecule.', { referenceId: ref.id });
      if (ref.status !== 'ready' || !ref.atoms_per_copy) throw conflict('reference_not_ready', `That reference is ${ref.status}; its atoms are numbered once its copies have been found.`, { status: ref.status });
      const groups = referenceIndexGroups(source, await readCopyAtoms(ctx.config.dataDir, ref.id), ref.atoms_per_copy);
      const text = writeNdx(groups, ndxComments(source, `atoms numbered as in reference "${ref.name}" (${ref.copies} copies)`));
      res.setHeader('Content-Type', 'text/plain; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="${slug(source.mappingName)}-${stateLabel(source)}-reference-${ref.id}.ndx"`);
      res.setHeader('X-Content-SHA256', source.sha256);
      res.setHeader('Cache-Control', 'no-store');
      return void res.send(text);
    }
    if (q.residue !== undefined && q.format !== 'pdb') throw unprocessable('pdb_only', 'residue applies to the pdb format only.');
    const highlight = q.highlight?.split(',').map((n) => Number(n) - 1);
    const file = renderExport(source, q.format as ExportFormat, { highlight }, { residue: q.residue?.toUpperCase() });
    res.setHeader('Content-Type', file.mime);
    res.setHeader('Content-Disposition', `attachment; filename="${file.name}"`);
    res.setHeader('X-Content-SHA256', source.sha256);
    res.setHeader('Cache-Control', 'no-store');
    res.send(file.body);
  }));

  r.get('/api/projects/:id/export.zip', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'mapping:export');
    res.setHeader('Content-Type', 'application/zip');
    res.setHeader('Content-Disposition', `attachment; filename="${slug(await projectName(ctx.db, id))}-production.zip"`);
    await writeProjectZip(ctx.db, drafts, id, res);
  }));

  r.post(
    '/api/molecules/:id/mappings/import',
    express.json({ limit: IMPORT_MAX_BYTES }),
    typed({ params, body: importBody }, async ({ params, body }, req, res) => {
      const moleculeId = params.id;
      await authorizeMolecule(ctx.db, req, moleculeId, 'mapping:create');
      if (body.preview) return void res.json(previewOf(await planImport(ctx.db, moleculeId, body)));
      const { id, plan } = await importMapping(ctx.db, moleculeId, body, requireUser(req).id);
      const outcome: ImportOutcome = { correspondence: plan.correspondence, modified: plan.modified };
      res.status(201).json({ ...(await findMapping(ctx.db, id)), import: outcome });
    }),
  );
}
