import { isChemError } from '../chem/errors';
import { AppError } from '../http/errors';

/**
 * The chemistry core's errors in the API's shape (its status hint: 422, or 413 for size limits), for
 * per-record upload results that report an error as data. A thrown ChemError needs no wrapping: the
 * error middleware maps it.
 */
export function chemToAppError(err: unknown): unknown {
  if (!isChemError(err)) return err;
  return new AppError(err.status, err.code, err.message, err.details);
}
