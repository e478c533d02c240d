import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { AppError } from './errors';

// Runs the shared zod schemas on a request before the handler sees it. `typed()` hands the parsed
// params, query and body to the handler with their zod types (no `Number(req.params.id)`, no casts);
// `validate()` is the same check as a plain middleware, for the few chains that must check some parts
// before others (an upload checks the path before it reads the file). Both also replace req.params,
// req.query and req.body by the parsed values. Bad params are unknown ids (404), not 400s.

export interface Schemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

type Out<T> = T extends z.ZodType ? z.output<T> : undefined;

/** What a typed handler receives: each part as its schema parsed it (undefined without a schema). */
export interface Parsed<S extends Schemas> {
  params: Out<S['params']>;
  query: Out<S['query']>;
  body: Out<S['body']>;
}

export type TypedHandler<S extends Schemas> = (input: Parsed<S>, req: Request, res: Response, next: NextFunction) => unknown;

/** Parses the request with the schemas (throwing 404 for bad params, 400 for a bad query or body) and stores the parsed values on it. */
function parseRequest<S extends Schemas>(schemas: S, req: Request): Parsed<S> {
  const out = { params: undefined, query: undefined, body: undefined } as Record<keyof Schemas, unknown>;
  if (schemas.params) {
    const parsed = schemas.params.safeParse(req.params);
    if (!parsed.success) throw new AppError(404, 'not_found', 'No such resource.');
    req.params = parsed.data as typeof req.params;
    out.params = parsed.data;
  }
  if (schemas.query) {
    const parsed = schemas.query.safeParse(req.query);
    if (!parsed.success) throw validationError(parsed.error, 'query');
    // Express 5 defines req.query as a getter; shadow it with the parsed value.
    Object.defineProperty(req, 'query', { value: parsed.data, writable: true, configurable: true });
    out.query = parsed.data;
  }
  if (schemas.body) {
    const parsed = schemas.body.safeParse(req.body ?? {});
    if (!parsed.success) throw validationError(parsed.error, 'body');
    req.body = parsed.data;
    out.body = parsed.data;
  }
  return out as Parsed<S>;
}

/** A route handler that receives the parsed, typed params, query and body (Express 5 forwards its rejections). */
export function typed<S extends Schemas>(schemas: S, handler: TypedHandler<S>): RequestHandler {
  return (req, res, next) => handler(parseRequest(schemas, req), req, res, next);
}

/** The same checks as a middleware, for a chain that checks part of the request before reading the rest. */
export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    parseRequest(schemas, req);
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
