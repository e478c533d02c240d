import { ChemError } from '../chem/errors';

/**
 * The time budget of one chemistry job (a parse, a preview evaluation, a draft evaluation) in a
 * worker thread: `CHEM_JOB_TIMEOUT_MS`, 10 s by default. A job over it has its thread ended and
 * restarted, and its caller gets 422 `input_too_complex` naming the limit. Set once by createApp.
 */
export const DEFAULT_CHEM_JOB_TIMEOUT_MS = 10_000;

let timeoutMs = DEFAULT_CHEM_JOB_TIMEOUT_MS;

export function setChemJobTimeout(ms: number): void {
  if (Number.isFinite(ms) && ms > 0) timeoutMs = ms;
}

export const chemJobTimeout = (): number => timeoutMs;

export function tooComplex(limitMs: number): ChemError {
  const seconds = limitMs / 1000;
  return new ChemError(
    'input_too_complex',
    `The structure took longer than the ${seconds} s limit for one chemistry job and was stopped; simplify it, or ask the site admin to raise CHEM_JOB_TIMEOUT_MS.`,
    { limitMs },
  );
}
