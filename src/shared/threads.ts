import { z } from 'zod';
import { BEAD_ID_MAX } from './mapping-doc';

// Comment threads anchored to a bead (by its stable id) of a mapping. Bodies are a small Markdown
// subset (threads-markdown.ts); mentions are written `@[Name](user:ID)` (threads-mentions.ts).

/** The most characters one comment body may hold; longer bodies answer 413. */
export const COMMENT_MAX = 10_000;

export const commentText = z
  .string()
  .trim()
  .min(1, 'Write something first.')
  .max(COMMENT_MAX, `A comment has at most ${COMMENT_MAX.toLocaleString('en')} characters.`);

export const beadIdField = z
  .string()
  .trim()
  .min(1, 'Choose a bead.')
  .max(BEAD_ID_MAX, 'That is not a bead id.')
  .regex(/^[A-Za-z0-9_-]+$/, 'That is not a bead id.');

export const createThreadBody = z.strictObject({ beadId: beadIdField, body: commentText });
export type CreateThreadBody = z.infer<typeof createThreadBody>;

export const createCommentBody = z.strictObject({ body: commentText });
export type CreateCommentBody = z.infer<typeof createCommentBody>;

export const updateCommentBody = createCommentBody;
export type UpdateCommentBody = CreateCommentBody;

export const updateThreadBody = z.strictObject({ resolved: z.boolean('Say whether the thread is resolved.') });
export type UpdateThreadBody = z.infer<typeof updateThreadBody>;

export const THREAD_STATUSES = ['all', 'open', 'resolved'] as const;
export type ThreadStatus = (typeof THREAD_STATUSES)[number];
export const listThreadsQuery = z.strictObject({
  status: z.enum(THREAD_STATUSES).default('all'),
  /** Only threads on beads that this saved version of the mapping contains. */
  version: z.coerce.number().int().positive().max(2 ** 31 - 1).optional(),
});
export type ListThreadsQuery = z.infer<typeof listThreadsQuery>;

export interface PersonRef {
  id: number;
  displayName: string;
}

export interface ThreadComment {
  id: number;
  threadId: number;
  /** Null when the author's account was removed. */
  author: PersonRef | null;
  /** Markdown source; empty once deleted. */
  body: string;
  createdAt: string;
  editedAt: string | null;
  deletedAt: string | null;
}

export interface Thread {
  id: number;
  mappingId: number;
  beadId: string;
  /** The bead's name now, or the last name Beadloom saw when the bead has been removed. */
  beadName: string;
  /** The bead is no longer in the draft: the thread stays readable. */
  beadRemoved: boolean;
  resolved: boolean;
  resolvedAt: string | null;
  resolvedBy: PersonRef | null;
  createdBy: PersonRef | null;
  createdAt: string;
  comments: ThreadComment[];
}

/** Open threads per bead id, for badges. */
export function openThreadCounts(threads: readonly Thread[]): Map<string, number> {
  const counts = new Map<string, number>();
  for (const t of threads) if (!t.resolved) counts.set(t.beadId, (counts.get(t.beadId) ?? 0) + 1);
  return counts;
}

/** Events on a mapping's thread stream (GET /api/mappings/:id/events, server-sent events). */
export interface ThreadEvent {
  type: 'thread';
  /** The whole thread as it is now; the client puts it into its cache. */
  thread: Thread;
}

/** The editor's deep link to one thread on one bead. */
export function threadLink(appUrl: string, mappingId: number, beadId: string, threadId: number): string {
  const query = new URLSearchParams({ bead: beadId, thread: String(threadId) });
  return `${appUrl.replace(/\/+$/, '')}/mappings/${mappingId}?${query.toString()}`;
}
