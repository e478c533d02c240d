import type { PartitionBasis } from './chem';

// The limits of what a modeller may enter about a bead's partition: a measured or literature value
// with its source, and the mapping's partition basis. Shared by the live draft's contract
// (mapping-doc.ts, mapping-doc-check.ts), the API's schemas and the chemistry core; no Yjs here.

export const PARTITION_BASES: readonly PartitionBasis[] = ['fragment', 'atoms'];
/** A measured logP lies within ±20 and a measured ΔG_OW within ±150 kJ/mol (far beyond any real value). */
export const MEASURED_LIMITS = { logP: 20, deltaG: 150 } as const;
export const MEASURED_SOURCE_MAX = 300;

/** The problem with a measured value, or null when it is within the limits. */
export function measuredProblem(m: unknown): string | null {
  if (typeof m !== 'object' || m === null || Array.isArray(m)) return 'A measured value is an object { kind, value, source }.';
  const { kind, value, source, ...rest } = m as Record<string, unknown>;
  if (Object.keys(rest).length) return `A measured value has only kind, value and source; "${Object.keys(rest)[0]}" is not allowed.`;
  if (kind !== 'logP' && kind !== 'deltaG') return 'A measured value is a logP or a deltaG (kJ/mol).';
  const limit = MEASURED_LIMITS[kind];
  if (typeof value !== 'number' || !Number.isFinite(value) || Math.abs(value) > limit) return `A measured ${kind} is a number from −${limit} to ${limit}.`;
  if (typeof source !== 'string' || source.trim().length === 0 || source.length > MEASURED_SOURCE_MAX) return `A measured value needs its source: text of 1 to ${MEASURED_SOURCE_MAX} characters.`;
  return null;
}
