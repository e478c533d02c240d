import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { AppError } from './errors';

// Runs the shared zod schemas on a request before the handler sees it. The
// handler then reads only parsed values: req.body, req.params and req.query are
// replaced by the schemas' output. Bad params are unknown ids (404), not 400s.

interface Schemas {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
}

export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) {
      const parsed = schemas.params.safeParse(req.params);
      if (!parsed.success) throw new AppError(404, 'not_found', 'No such resource.');
      req.params = parsed.data as typeof req.params;
    }
    if (schemas.query) {
      const parsed = schemas.query.safeParse(req.query);
      if (!parsed.success) throw validationError(parsed.error, 'query');
      // Express 5 defines req.query as a getter; shadow it with the parsed value.
      Object.defineProperty(req, 'query', { value: parsed.data, writable: true, configurable: true });
    }
    if (schemas.body) {
      const parsed = schemas.body.safeParse(req.body ?? {});
      if (!parsed.success) throw validationError(parsed.error, 'body');
      req.body = parsed.data;
    }
    next();
  };
}

function validationError(error: z.ZodError, where: 'body' | 'query'): AppError {
  const issues = error.issues.map((issue) => ({
    path: issue.path.join('.'),
    code: issue.code,
    message: issue.message,
  }));
  const first = issues[0];
  const message = first ? `${first.path ? `${first.path}: ` : ''}${first.message}` : 'The request is not valid.';
  return new AppError(400, 'validation_failed', message, { in: where, issues });
}
