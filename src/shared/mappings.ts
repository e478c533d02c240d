import { z } from 'zod';
import { NAME_MAX } from './fields';
import type { Evaluation, Mapping, Resolution } from './chem';

// Mappings of a molecule. The draft itself is a live Yjs document (mapping-doc.ts) edited over
// /collab/:mappingId; REST creates mappings, edits their metadata and reads the draft for non-editors.

export const RESOLUTIONS = ['4:1', '3:1', '2:1'] as const satisfies readonly Resolution[];
export const resolution = z.enum(RESOLUTIONS, 'Choose a resolution of 4:1, 3:1 or 2:1.');

const name = z.string().trim().min(1, 'Enter a mapping name.').max(NAME_MAX, `A name has at most ${NAME_MAX} characters.`);
const description = z.string().trim().max(5000, 'A description has at most 5000 characters.');

const mappingId = z.number('A mapping id is a number.').int('A mapping id is a whole number.').positive('A mapping id is positive.');

/** Which state of a source mapping a copy or transfer starts from (absent: its draft). */
export const sourceVersion = z.union(
  [z.literal('draft'), z.literal('production'), z.number().int('A version number is a whole number.').positive('A version number is positive.')],
  "A version is a number, 'draft' or 'production'.",
);
export type SourceVersion = z.infer<typeof sourceVersion>;

/**
 * How a new mapping's draft starts: empty; the best automatic proposal; a copy of another mapping of
 * the same molecule; or a transfer from a mapping of a molecule of the same project — each of the last
 * two from the source's draft, its locked production version or any saved version (docs/chemistry.md,
 * "Mapping proposals").
 */
export const mappingStart = z.union(
  [
    z.literal('empty'),
    z.literal('proposal'),
    z.strictObject({ copyOf: mappingId, version: sourceVersion.optional() }),
    z.strictObject({ transferFrom: mappingId, version: sourceVersion.optional() }),
  ],
  "Start with 'empty', 'proposal', { copyOf, version? } or { transferFrom, version? }.",
);
export type MappingStart = z.infer<typeof mappingStart>;

export const createMappingBody = z
  .strictObject({
    name,
    resolution,
    description: description.optional(),
    /** Start as a copy of this mapping's current draft (same molecule); the same as `start: { copyOf }`. */
    copyOf: mappingId.optional(),
    start: mappingStart.optional(),
  })
  .refine((b) => b.copyOf === undefined || b.start === undefined, { message: 'Give either copyOf or start, not both.', path: ['start'] });
export type CreateMappingBody = z.infer<typeof createMappingBody>;

export const updateMappingBody = z
  .strictObject({ name, resolution, description })
  .partial()
  .refine((b) => Object.keys(b).length > 0, 'Change at least one field.');
export type UpdateMappingBody = z.infer<typeof updateMappingBody>;

export interface MappingSummary {
  id: number;
  moleculeId: number;
  projectId: number;
  name: string;
  resolution: Resolution;
  description: string;
  /** True while a production version is locked: the draft is read-only for everyone. */
  locked: boolean;
  beadCount: number;
  createdAt: string;
  updatedAt: string;
}

/** A mapping in the project-wide list (GET /api/projects/:id/mappings), with its molecule's name. */
export interface ProjectMappingSummary extends MappingSummary {
  moleculeName: string;
}

export interface MappingDetail extends MappingSummary {
  /** The draft as the chemistry core reads it (from the live document). */
  draft: Mapping;
  /** The evaluation of exactly this draft, or null when it could not be evaluated (see `evaluationError`). */
  evaluation: Evaluation | null;
  evaluationError: { code: string; message: string } | null;
  /** Whether the caller may edit the draft live (role and lock). */
  canEdit: boolean;
}
