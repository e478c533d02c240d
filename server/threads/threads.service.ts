import type { Db } from '../db/knex';
import type { Thread, ThreadStatus } from '../../src/shared/threads';
import { notFound } from '../http/errors';
import type { DraftBeads } from './draft-beads';
import { toComment, toThread, type CommentRow, type ThreadRow } from './thread-view';

// Knex for threads, thread_comments and thread_beads.

/** One row per comment (or one per thread without comments) of the one-query thread list, people and stored bead name joined. */
interface ThreadListRow extends ThreadRow {
  created_by_name: string | null;
  resolved_by_name: string | null;
  stored_name: string | null;
  c_id: number | null;
  c_author_id: number | null;
  c_author_name: string | null;
  c_body: string | null;
  c_created_at: Date | null;
  c_edited_at: Date | null;
  c_deleted_at: Date | null;
}

/**
 * Threads of a mapping (optionally only open or resolved ones), oldest first, with their comments. One
 * query: the threads, their comments, the people named and the stored bead names, joined (the list is
 * read on every page load of a mapping; it was four queries one after another). `beads` may still be
 * on its way (its stamp query runs beside this one).
 */
export async function listThreads(db: Db, mappingId: number, beads: DraftBeads | Promise<DraftBeads>, status: ThreadStatus = 'all', onlyIds?: number[]): Promise<Thread[]> {
  const q = db('threads as t')
    .leftJoin('thread_comments as c', 'c.thread_id', 't.id')
    .leftJoin('users as uc', 'uc.id', 't.created_by')
    .leftJoin('users as ur', 'ur.id', 't.resolved_by')
    .leftJoin('users as ua', 'ua.id', 'c.author_id')
    .leftJoin('thread_beads as tb', function joinBead() {
      this.on('tb.mapping_id', '=', 't.mapping_id').andOn('tb.bead_id', '=', 't.bead_id');
    })
    .where('t.mapping_id', mappingId)
    .orderBy([{ column: 't.id' }, { column: 'c.id' }]);
  if (status === 'open') q.whereNull('t.resolved_at');
  if (status === 'resolved') q.whereNotNull('t.resolved_at');
  if (onlyIds) q.whereIn('t.id', onlyIds);
  const [rows, draft] = await Promise.all([
    q.select<ThreadListRow[]>(
      't.*',
      'uc.display_name as created_by_name',
      'ur.display_name as resolved_by_name',
      'tb.last_name as stored_name',
      'c.id as c_id',
      'c.author_id as c_author_id',
      'ua.display_name as c_author_name',
      'c.body as c_body',
      'c.created_at as c_created_at',
      'c.edited_at as c_edited_at',
      'c.deleted_at as c_deleted_at',
    ),
    beads,
  ]);
  if (!rows.length) return [];
  const people = new Map<number, string>();
  const named = (id: number | null, name: string | null) => id !== null && name !== null && people.set(id, name);
  const byThread = new Map<number, { thread: ThreadListRow; comments: CommentRow[] }>();
  for (const r of rows) {
    named(r.created_by, r.created_by_name);
    named(r.resolved_by, r.resolved_by_name);
    named(r.c_author_id, r.c_author_name);
    let entry = byThread.get(r.id);
    if (!entry) byThread.set(r.id, (entry = { thread: r, comments: [] }));
    if (r.c_id !== null) entry.comments.push({ id: r.c_id, thread_id: r.id, author_id: r.c_author_id, body: r.c_body ?? '', created_at: r.c_created_at!, edited_at: r.c_edited_at, deleted_at: r.c_deleted_at });
  }
  const threads = [...byThread.values()];
  const stored = new Map<string, string>();
  for (const { thread } of threads) if (thread.stored_name !== null) stored.set(thread.bead_id, thread.stored_name);
  const names = await recordBeadNames(db, mappingId, new Set(threads.map((t) => t.thread.bead_id)), stored, draft);
  return threads.map(({ thread, comments }) =>
    toThread(
      thread,
      comments.map((c) => toComment(c, people)),
      people,
      { name: draft.current.get(thread.bead_id) ?? names.get(thread.bead_id) ?? thread.bead_id, removed: !draft.current.has(thread.bead_id) },
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
 * deleted bead still shows one. `stored`: the names stored now (bead id → name), updated and returned.
 * Writes only when a bead was renamed since (rare).
 */
async function recordBeadNames(db: Db, mappingId: number, beadIds: Set<string>, stored: Map<string, string>, beads: DraftBeads): Promise<Map<string, string>> {
  const changed = [...beadIds].filter((id) => beads.current.has(id) && beads.current.get(id) !== stored.get(id));
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
