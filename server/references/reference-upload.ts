import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { unlink } from 'node:fs/promises';
import multer from 'multer';
import type { Request, RequestHandler } from 'express';
import { AppError, badRequest, tooLarge } from '../http/errors';
import { REFERENCE_FIELDS } from '../../src/shared/references';
import { uploadDir } from './reference-files';

// Reference uploads stream to disk (multer's disk storage) under the data folder, never into memory;
// a file over the limit stops the upload with 413 and multer removes what it wrote.

export type UploadedFiles = { structure?: Express.Multer.File[]; trajectory?: Express.Multer.File[] };

export function referenceUpload(dataDir: string, maxBytes: number): RequestHandler {
  const dir = uploadDir(dataDir);
  const receive = multer({
    storage: multer.diskStorage({
      destination: (_req, _file, cb) => {
        mkdirSync(dir, { recursive: true });
        cb(null, dir);
      },
      filename: (_req, _file, cb) => cb(null, `${randomUUID()}.part`),
    }),
    limits: { fileSize: maxBytes, files: 2, fields: 10, fieldSize: 64 * 1024 },
  }).fields([
    { name: REFERENCE_FIELDS.structure, maxCount: 1 },
    { name: REFERENCE_FIELDS.trajectory, maxCount: 1 },
  ]);
  return (req, res, next) =>
    receive(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(tooLarge(`A reference file is at most ${formatBytes(maxBytes)}.`, { limit: maxBytes }));
        return next(badRequest('validation_failed', `Send the structure in the form field "${REFERENCE_FIELDS.structure}" and an optional trajectory in "${REFERENCE_FIELDS.trajectory}" (${err.message}).`, { code: err.code }));
      }
      next(err);
    });
}

export function uploadedFiles(req: Request): { structure?: Express.Multer.File; trajectory?: Express.Multer.File } {
  const files = (req.files ?? {}) as UploadedFiles;
  return { structure: files.structure?.[0], trajectory: files.trajectory?.[0] };
}

export async function discardUploads(req: Request): Promise<void> {
  const { structure, trajectory } = uploadedFiles(req);
  await Promise.all([structure, trajectory].filter((f) => !!f).map((f) => unlink(f!.path).catch(() => undefined)));
}

export function formatBytes(n: number): string {
  if (n >= 1024 ** 3) return `${+(n / 1024 ** 3).toFixed(2)} GiB`;
  if (n >= 1024 ** 2) return `${+(n / 1024 ** 2).toFixed(1)} MiB`;
  return `${n} bytes`;
}

export const quotaExceeded = (quota: number, used: number) =>
  new AppError(413, 'quota_exceeded', `This project's references may take ${formatBytes(quota)} together; ${formatBytes(used)} are in use. Delete a reference first.`, { quota, used });
