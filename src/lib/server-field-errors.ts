import { isApiError } from './api-client';

/** Field name → the first message about it. '' holds messages about the whole form. */
export type FieldErrors = Partial<Record<string, string>>;

interface IssueLike {
  path?: unknown;
  message?: unknown;
}

/**
 * Field messages inside a server's `validation_failed` answer. The server runs
 * the same schemas, so its details are zod issues (a list, or under `issues`).
 */
export function serverFieldErrors(error: unknown): FieldErrors {
  if (!isApiError(error) || error.code !== 'validation_failed') return {};
  const details = error.details as { issues?: unknown } | unknown[] | undefined;
  const list = Array.isArray(details) ? details : Array.isArray(details?.issues) ? details.issues : [];
  const errors: FieldErrors = {};
  for (const item of list as IssueLike[]) {
    if (typeof item?.message !== 'string') continue;
    const path = Array.isArray(item.path) ? item.path : typeof item.path === 'string' ? item.path.split('.') : [];
    // Params and query problems are not about a form field.
    const start = path[0] === 'body' ? 1 : 0;
    const key = path.length > start ? String(path[start]) : '';
    errors[key] ??= item.message;
  }
  return errors;
}
