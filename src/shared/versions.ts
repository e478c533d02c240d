import { z } from 'zod';
import type { Evaluation, Mapping, Resolution } from './chem';

// Versions of a mapping: immutable, numbered snapshots of the draft that the server takes of its own
// live document. A version is named by its number; `draft` names the live draft and `production`
// the locked version, where a route accepts them.

const message = z.string().trim().max(2000, 'A message has at most 2000 characters.');

export const saveVersionBody = z.strictObject({ message: message.optional() });
export type SaveVersionBody = z.infer<typeof saveVersionBody>;

/**
 * A restore may name the editor connection that asked for it (its Yjs awareness client id): that
 * connection receives the restore as a step its undo can take back.
 */
export const restoreBody = z.strictObject({ clientId: z.number('A client id is a number.').int().nonnegative().max(2 ** 32 - 1).optional() });
export type RestoreBody = z.infer<typeof restoreBody>;

export interface RestoreResponse {
  restored: number;
  /** The version that keeps the draft as it was before ("before restore of vN"); null when the newest version already equals it. */
  snapshot: number | null;
  draft: Mapping;
}

export const lockBody = z.strictObject({
  version: z.number('Say which version to lock.').int().positive(),
  note: message.optional(),
});
export type LockBody = z.infer<typeof lockBody>;

export const unlockBody = z.strictObject({
  reason: z.string('Give a reason for unlocking.').trim().min(1, 'Give a reason for unlocking.').max(2000, 'A reason has at most 2000 characters.'),
});
export type UnlockBody = z.infer<typeof unlockBody>;

/** A version number in a path or query: positive integer text. */
export const versionNumber = z.coerce.number().int().positive().max(2 ** 31 - 1);

export type VersionRef = number | 'draft' | 'production';
/** `draft`, `production` or a version number, as text in a query string. */
export const versionRef = z.union([z.literal('draft'), z.literal('production'), z.string().regex(/^[1-9][0-9]{0,9}$/, 'A version is a number, draft or production.').transform(Number)]);
/** Compare takes a version or the draft, not `production`. */
export const compareRef = z.union([z.literal('draft'), z.string().regex(/^[1-9][0-9]{0,9}$/, 'Compare a version number or draft.').transform(Number)]);
export const compareQuery = z.strictObject({ from: compareRef, to: compareRef });

export interface VersionSummary {
  number: number;
  message: string;
  author: { id: number; displayName: string } | null;
  createdAt: string;
  beadCount: number;
  /** SHA-256 of the version's content (docs/exports.md says which bytes). */
  sha256: string;
  /** True for the mapping's locked production version. */
  production: boolean;
}

export interface VersionDetail extends VersionSummary {
  mappingId: number;
  canonicalSmiles: string;
  resolution: Resolution;
  draft: Mapping;
  evaluation: Evaluation | null;
  evaluationError: string | null;
}

export interface LockState {
  locked: boolean;
  /** The production version, while locked. */
  version: number | null;
  lockedBy: { id: number; displayName: string } | null;
  lockedAt: string | null;
  note: string;
}

/** What changed between two states of a mapping; beads are matched by their id. */
export interface Comparison {
  from: number | 'draft';
  to: number | 'draft';
  added: { id: string; name: string }[];
  removed: { id: string; name: string }[];
  renamed: { id: string; from: string; to: string }[];
  retyped: { id: string; name: string; from: string | null; to: string | null }[];
  /** Centre rule changes. */
  recentred: { id: string; name: string; from: string; to: string }[];
  /** Atoms whose bead membership (or weight) differs; bead ids with weights on each side. */
  moved: { atom: number; from: Record<string, number>; to: Record<string, number> }[];
  /** Per bead present on both sides: property differences (to − from); null where unknown. */
  deltas: { id: string; name: string; mass: number | null; charge: number | null; logP: number | null; deltaG: number | null; heavyAtoms: number | null }[];
}
