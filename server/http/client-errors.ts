import type { Request } from 'express';
import { AppError } from './errors';

/**
 * Errors thrown by the libraries that read request bodies (body-parser, raw-body, zlib, multer and
 * busboy) and by the database driver, turned into the API's shape: a body the server cannot read is
 * the client's mistake (400/413/415), a database that cannot be reached is 503 `db_unavailable`.
 * Neither is a 500: nothing went wrong in our code.
 */

interface HttpError {
  status?: number;
  statusCode?: number;
  expose?: boolean;
  type?: string;
  code?: string;
  message?: string;
  name?: string;
  fatal?: boolean;
  syscall?: string;
}

/** busboy's and multer's messages for a multipart body it cannot read (busboy/lib/types/multipart.js). */
const MULTIPART = /^(Malformed part header|Unexpected end of (form|file)|Multipart: Boundary not found|Malformed content type|Missing Content-Type|Unsupported content type|Malformed urlencoded form|Request error)/;

export function bodyError(err: unknown, req: Request): AppError | null {
  const e = err as HttpError;
  if (!e || typeof e !== 'object') return null;
  const status = e.status ?? e.statusCode;
  if (e.name === 'MulterError') return new AppError(400, 'malformed_multipart', `The multipart body could not be read: ${e.message}.`, { reason: e.code });
  if (typeof e.message === 'string' && MULTIPART.test(e.message) && req.is('multipart/*')) {
    return new AppError(400, 'malformed_multipart', `The multipart body could not be read: ${e.message}.`, { reason: e.message });
  }
  if (e.expose !== true || typeof status !== 'number' || status < 400 || status > 499) return null;
  // body-parser and raw-body (http-errors, `expose` set): decoding and size problems of the body.
  const encoding = req.headers['content-encoding'];
  if (status === 413) return new AppError(413, 'payload_too_large', 'The request body is larger than the limit.', { reason: e.type });
  if (status === 415) {
    return new AppError(415, 'unsupported_media_type', encoding ? `The content encoding "${encoding}" is not supported; send identity, gzip, deflate or br.` : 'The body encoding is not supported; send UTF-8 JSON.', {
      reason: e.type,
    });
  }
  // zlib's and brotli's own errors reach here as a bare 400 (no `type`): the body did not decode.
  if (status === 400 && e.type === undefined && encoding !== undefined && encoding !== 'identity') {
    return new AppError(400, 'malformed_body', `The request body could not be decoded as Content-Encoding: ${encoding}.`, { encoding, reason: e.code });
  }
  return new AppError(status, 'malformed_body', 'The request body could not be read.', { reason: e.type ?? e.code ?? null });
}

/** mysql2/knex errors that mean the database cannot be reached (as opposed to a bad query). */
const UNREACHABLE = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_ACCESS_DENIED_ERROR',
  'ER_BAD_DB_ERROR',
]);

export function isDbUnavailable(err: unknown): boolean {
  const e = err as HttpError;
  if (!e || typeof e !== 'object') return false;
  if (e.name === 'KnexTimeoutError') return true; // no connection could be had from the pool in time
  if (e.code && UNREACHABLE.has(e.code)) return true;
  // A socket path that is gone (MariaDB stopped) fails with ENOENT on connect.
  return e.syscall === 'connect' || (e.fatal === true && typeof e.code === 'string' && !e.code.startsWith('ER_PARSE'));
}

export const dbUnavailable = () =>
  new AppError(503, 'db_unavailable', 'The database cannot be reached just now. Try again in a moment.', undefined, { 'Retry-After': '5' });
