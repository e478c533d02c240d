import { isChemError } from '../chem/index';
import { AppError } from '../http/errors';

/** The chemistry core's errors in the API's shape (its status hint: 422, or 413 for size limits). */
export function chemToAppError(err: unknown): unknown {
  if (!isChemError(err)) return err;
  return new AppError(err.status, err.code, err.message, err.details);
}

export async function withChemErrors<T>(work: () => Promise<T> | T): Promise<T> {
  try {
    return await work();
  } catch (err) {
    throw chemToAppError(err);
  }
}
