/**
 * The one error type the chemistry core throws.
 *
 * `code` is snake_case and stable (the API returns it), `message` is a sentence a modeller can act on,
 * `details` carries the facts (positions, indices, limits), and `status` is a hint for the HTTP layer:
 * 422 for input that cannot be understood or is chemically impossible, 413 for size limits.
 */
export type ChemErrorStatus = 413 | 422;

export class ChemError extends Error {
  override readonly name = 'ChemError';

  constructor(
    readonly code: string,
    message: string,
    readonly details: Record<string, unknown> = {},
    readonly status: ChemErrorStatus = 422,
  ) {
    super(message);
  }

  toJSON(): { code: string; message: string; details: Record<string, unknown> } {
    return { code: this.code, message: this.message, details: this.details };
  }
}

export function isChemError(value: unknown): value is ChemError {
  return value instanceof ChemError;
}

/** Size limits of the core; the route layer and the schemas quote the same numbers. */
export const LIMITS = {
  smilesLength: 5000,
  heavyAtoms: 5000,
  molfileLength: 5_000_000,
} as const;
