import type { NotificationKind } from '../../src/shared/notifications';

// Who hears about a new comment. A project member mentioned in it gets a 'mention'; everyone else
// who takes part in the thread (started it or wrote in it) gets a 'reply'. The author never hears
// about their own comment, and nobody outside the project hears anything.

export interface RecipientInput {
  authorId: number;
  /** Mentioned user ids (already limited to the comment's text). */
  mentioned: readonly number[];
  /** The thread's starter and earlier commenters. */
  participants: readonly number[];
  /** Current project members (and site admins who may read the project). */
  members: ReadonlySet<number>;
}

export function recipients(input: RecipientInput): { userId: number; kind: NotificationKind }[] {
  const out = new Map<number, NotificationKind>();
  for (const id of input.mentioned) if (input.members.has(id) && id !== input.authorId) out.set(id, 'mention');
  for (const id of input.participants) if (input.members.has(id) && id !== input.authorId && !out.has(id)) out.set(id, 'reply');
  return [...out].map(([userId, kind]) => ({ userId, kind }));
}
