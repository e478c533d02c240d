import type { ErrorCode } from '../../src/shared/errors';

// Typed errors thrown by services and middleware; the error middleware turns
// them into the one JSON shape. Anything else becomes a 500 without internals.

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
    readonly headers: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (code: ErrorCode, message: string, details?: unknown) => new AppError(400, code, message, details);
export const unauthenticated = (message = 'Sign in first.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role in this project does not allow that.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'That') => new AppError(404, 'not_found', `${what} does not exist or is not visible to you.`);
export const conflict = (code: ErrorCode, message: string, details?: unknown) => new AppError(409, code, message, details);
export const unprocessable = (code: ErrorCode, message: string, details?: unknown) => new AppError(422, code, message, details);
export const tooLarge = (message: string, details?: unknown) => new AppError(413, 'payload_too_large', message, details);
