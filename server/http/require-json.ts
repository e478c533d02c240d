import type { RequestHandler } from 'express';
import { AppError } from './errors';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * A state-changing request that carries a body must say it is JSON; anything
 * else is refused with 415 instead of being silently read as an empty body.
 * Routes that take uploads mount their own parser and are listed in `except`.
 */
export function requireJson(except: (path: string) => boolean): RequestHandler {
  return (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method) || except(req.path)) return next();
    const hasBody = Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
    if (hasBody && !req.is('application/json')) {
      throw new AppError(415, 'unsupported_media_type', 'Send the request body as application/json.');
    }
    next();
  };
}
