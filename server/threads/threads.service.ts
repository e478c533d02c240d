import type { Db } from '../db/knex';
import type { Thread, ThreadStatus } from '../../src/shared/threads';
import { notFound } from '../http/errors';
import type { DraftBeads } from './draft-beads';
import { toComment, toThread, type CommentRow, type ThreadRow } from './thread-view';

// Knex for threads, thread_comments and thread_beads.

async function peopleOf(db: Db, ids: (number | null)[]): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((id): id is number => id !== null))];
  if (!wanted.length) return new Map();
  const rows = await db('users').whereIn('id', wanted).select('id', 'display_name');
  return new Map(rows.map((r) => [r.id as number, r.display_name as string]));
}

/** Threads of a mapping (optionally only open or resolved ones), oldest first, with their comments. */
export async function listThreads(db: Db, mappingId: number, beads: DraftBeads, status: ThreadStatus = 'all', onlyIds?: number[]): Promise<Thread[]> {
  const q = db<ThreadRow>('threads').where({ mapping_id: mappingId }).orderBy('id');
  if (status === 'open') q.whereNull('resolved_at');
  if (status === 'resolved') q.whereNotNull('resolved_at');
  if (onlyIds) q.whereIn('id', onlyIds);
  const threads: ThreadRow[] = await q.select('*');
  if (!threads.length) return [];
  const comments: CommentRow[] = await db('thread_comments').whereIn('thread_id', threads.map((t) => t.id)).orderBy('id').select('*');
  const people = await peopleOf(db, [...threads.flatMap((t) => [t.created_by, t.resolved_by]), ...comments.map((c) => c.author_id)]);
  const names = await recordBeadNames(db, mappingId, threads.map((t) => t.bead_id), beads);
  return threads.map((t) =>
    toThread(
      t,
      comments.filter((c) => c.thread_id === t.id).map((c) => toComment(c, people)),
      people,
      { name: beads.current.get(t.bead_id) ?? names.get(t.bead_id) ?? t.bead_id, removed: !beads.current.has(t.bead_id) },
    ),
  );
}

export async function getThread(db: Db, threadId: number, beads: DraftBeads): Promise<Thread> {
  const row = await db('threads').where({ id: threadId }).first('mapping_id');
  if (!row) throw notFound('That thread');
  const [thread] = await listThreads(db, row.mapping_id, beads, 'all', [threadId]);
  return thread!;
}

/**
 * Keeps `thread_beads` current for the given beads: the last name seen in the draft, so a thread on a
 * deleted bead still shows one. Returns the stored names.
 */
async function recordBeadNames(db: Db, mappingId: number, beadIds: string[], beads: DraftBeads): Promise<Map<string, string>> {
  const stored = new Map<string, string>(
    (await db('thread_beads').where({ mapping_id: mappingId }).whereIn('bead_id', [...new Set(beadIds)]).select('bead_id', 'last_name')).map((r) => [r.bead_id, r.last_name]),
  );
  const changed = [...new Set(beadIds)].filter((id) => beads.current.has(id) && beads.current.get(id) !== stored.get(id));
  for (const id of changed) {
    const name = beads.current.get(id)!;
    await db('thread_beads').insert({ mapping_id: mappingId, bead_id: id, last_name: name, seen_at: db.fn.now() }).onConflict(['mapping_id', 'bead_id']).merge();
    stored.set(id, name);
  }
  return stored;
}

/**
 * Whether a saved version of the mapping holds this bead (mapping_versions.draft is the version's
 * Mapping as JSON). Bead ids are [A-Za-z0-9_-]; LIKE narrows the rows, the parse decides exactly.
 */
export async function beadInVersions(db: Db, mappingId: number, beadId: string): Promise<boolean> {
  const rows = await db('mapping_versions').where({ mapping_id: mappingId }).andWhere('draft', 'like', `%${beadId}%`).select('draft');
  return rows.some((r) => (JSON.parse(r.draft) as { beads: { id: string }[] }).beads.some((b) => b.id === beadId));
}

/** Whether Beadloom itself has a record of this bead id on this mapping (rule 4 in draft-beads.ts). */
export async function beadRecorded(db: Db, mappingId: number, beadId: string): Promise<boolean> {
  return !!(await db('thread_beads').where({ mapping_id: mappingId, bead_id: beadId }).first('bead_id'));
}

export async function createThread(db: Db, t: { mappingId: number; beadId: string; beadName: string | null; userId: number; body: string }): Promise<{ threadId: number; commentId: number }> {
  return db.transaction(async (trx) => {
    const [threadId] = await trx('threads').insert({ mapping_id: t.mappingId, bead_id: t.beadId, created_by: t.userId });
    const [commentId] = await trx('thread_comments').insert({ thread_id: threadId, author_id: t.userId, body: t.body });
    const seen = trx('thread_beads').insert({ mapping_id: t.mappingId, bead_id: t.beadId, last_name: t.beadName ?? t.beadId, seen_at: trx.fn.now() }).onConflict(['mapping_id', 'bead_id']);
    await (t.beadName === null ? seen.ignore() : seen.merge());
    return { threadId: threadId as number, commentId: commentId as number };
  });
}

export async function addComment(db: Db, threadId: number, userId: number, body: string): Promise<number> {
  const [id] = await db('thread_comments').insert({ thread_id: threadId, author_id: userId, body });
  return id as number;
}

export async function setResolved(db: Db, threadId: number, userId: number, resolved: boolean): Promise<void> {
  await db('threads')
    .where({ id: threadId })
    .update(resolved ? { resolved_at: db.fn.now(3), resolved_by: userId } : { resolved_at: null, resolved_by: null });
}

export async function editComment(db: Db, commentId: number, body: string): Promise<void> {
  await db('thread_comments').where({ id: commentId }).update({ body, edited_at: db.fn.now(3) });
}

export async function commentBody(db: Db, commentId: number): Promise<string> {
  return ((await db('thread_comments').where({ id: commentId }).first('body'))?.body as string | undefined) ?? '';
}

export async function deleteComment(db: Db, commentId: number, userId: number): Promise<void> {
  await db('thread_comments').where({ id: commentId }).update({ body: '', deleted_at: db.fn.now(3), deleted_by: userId });
}

/** Who takes part in a thread: its starter and everyone who wrote in it. */
export async function participants(db: Db, threadId: number): Promise<number[]> {
  const t = await db('threads').where({ id: threadId }).first('created_by');
  const rows = await db('thread_comments').where({ thread_id: threadId }).whereNotNull('author_id').distinct('author_id');
  return [...new Set([t?.created_by, ...rows.map((r) => r.author_id)].filter((id): id is number => typeof id === 'number'))];
}

/** Project members: id → display name (mention targets). */
export async function projectMembers(db: Db, projectId: number): Promise<Map<number, string>> {
  const rows = await db('project_members as m').join('users as u', 'u.id', 'm.user_id').where('m.project_id', projectId).whereNull('u.disabled_at').select('u.id', 'u.display_name');
  return new Map(rows.map((r) => [r.id as number, r.display_name as string]));
}
