import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from './errors';
import { isChemError } from '../chem/errors';
import { bodyError, dbUnavailable, isDbUnavailable } from './client-errors';

export const unknownRoute: RequestHandler = (req) => {
  throw new AppError(404, 'not_found', `No route ${req.method} ${req.path}.`);
};

interface BodyParserError {
  type?: string;
  status?: number;
  limit?: number;
}

/** The one place that writes error responses. Unknown errors never show internals. */
export const errorMiddleware: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toAppError(err) ?? bodyError(err, req) ?? (isDbUnavailable(err) ? dbUnavailable() : null);
  if (known?.code === 'db_unavailable') req.log?.warn({ err }, 'database unavailable');
  if (!known) req.log?.error({ err }, 'unhandled error');
  const e = known ?? new AppError(500, 'internal_error', 'Something went wrong on the server. It has been logged.');
  if (res.headersSent) {
    res.end();
    return;
  }
  for (const [name, value] of Object.entries(e.headers)) res.setHeader(name, value);
  res.status(e.status).json({ error: { code: e.code, message: e.message, ...(e.details !== undefined ? { details: e.details } : {}) } });
};

function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (isChemError(err)) return new AppError(err.status, err.code, err.message, err.details);
  const bp = err as BodyParserError;
  if (bp && typeof bp === 'object') {
    if (bp.type === 'entity.parse.failed') return new AppError(400, 'malformed_json', 'The request body is not valid JSON.');
    if (bp.type === 'entity.too.large') {
      return new AppError(413, 'payload_too_large', `The request body is larger than the limit of ${bp.limit} bytes.`, { limit: bp.limit });
    }
    if (bp.type === 'charset.unsupported' || bp.type === 'encoding.unsupported') {
      return new AppError(415, 'unsupported_media_type', 'The body encoding is not supported; send UTF-8 JSON.');
    }
  }
  return null;
}
