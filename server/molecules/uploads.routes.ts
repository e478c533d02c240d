import { z } from 'zod';
import multer from 'multer';
import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeProject, requireUser } from '../auth/access';
import { AppError, badRequest, notFound } from '../http/errors';
import { idParam } from '../../src/shared/fields';
import { UPLOAD_FIELD, UPLOAD_MAX_BYTES, uploadFields, type UploadResponse } from '../../src/shared/molecules';
import { toDetail } from './molecule-view';
import { findMolecule, isMoleculeOf } from './molecules.service';
import { attachCoordinates, importRecords, readStructureFile } from './uploads.service';
import type { Conformers } from './conformer-queue';

const params = z.object({ id: idParam });

const receive = multer({ storage: multer.memoryStorage(), limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 10 } }).single(UPLOAD_FIELD);

/** multer, with its errors in the API's shape. Runs only after the caller is authorised. */
const receiveFile: RequestHandler = (req, res, next) =>
  receive(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'payload_too_large', `A structure file is at most ${UPLOAD_MAX_BYTES / 1024 / 1024} MB.`, { limit: UPLOAD_MAX_BYTES }));
      return next(badRequest('validation_failed', `Send one file in the form field "${UPLOAD_FIELD}" (${err.message}).`, { code: err.code }));
    }
    next(err);
  });

export function uploadRoutes(r: RouteTable, ctx: AppContext, conformers: Conformers): void {
  // Checked before the file is read, so a refused caller never uploads it.
  const authorize = typed({ params }, async ({ params }, req, _res, next) => {
    await authorizeProject(ctx.db, req, params.id, 'molecule:create');
    next();
  });

  r.post('/api/projects/:id/molecules/upload', authorize, receiveFile, typed({ params, body: uploadFields }, async ({ params, body: fields }, req, res) => {
    const projectId = params.id;
    if (!req.file) throw badRequest('validation_failed', `Attach a molfile or SD file in the form field "${UPLOAD_FIELD}".`);
    const text = readStructureFile(req.file);
    if (fields.moleculeId !== undefined) {
      if (!(await isMoleculeOf(ctx.db, fields.moleculeId, projectId))) throw notFound('That molecule');
      await authorizeProject(ctx.db, req, projectId, 'molecule:update');
      await attachCoordinates(ctx.db, fields.moleculeId, text);
      return void res.json(toDetail(await findMolecule(ctx.db, fields.moleculeId, true), null));
    }
    const records = await importRecords(ctx.db, projectId, requireUser(req).id, req.file, text, fields.name, fields.allowDuplicate);
    for (const rec of records) if (rec.ok && rec.molecule.coordinates.source === null) conformers.enqueue(rec.molecule.id);
    const created = records.filter((rec) => rec.ok).length;
    const body: UploadResponse = { records, created, failed: records.length - created };
    if (created === 0) throw new AppError(422, 'no_molecule_imported', 'No record of the file could be read as a molecule.', body);
    res.status(201).json(body);
  }));
}
