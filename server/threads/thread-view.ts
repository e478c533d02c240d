import type { PersonRef, Thread, ThreadComment } from '../../src/shared/threads';

// Rows of threads / thread_comments (with their people) into the API's shapes.

export interface ThreadRow {
  id: number;
  mapping_id: number;
  bead_id: string;
  created_by: number | null;
  resolved_at: Date | null;
  resolved_by: number | null;
  created_at: Date;
}

export interface CommentRow {
  id: number;
  thread_id: number;
  author_id: number | null;
  body: string;
  created_at: Date;
  edited_at: Date | null;
  deleted_at: Date | null;
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

export type People = ReadonlyMap<number, string>;

const person = (people: People, id: number | null): PersonRef | null => (id !== null && people.has(id) ? { id, displayName: people.get(id)! } : null);

export function toComment(row: CommentRow, people: People): ThreadComment {
  return {
    id: row.id,
    threadId: row.thread_id,
    author: person(people, row.author_id),
    body: row.deleted_at ? '' : row.body,
    createdAt: iso(row.created_at)!,
    editedAt: iso(row.edited_at),
    deletedAt: iso(row.deleted_at),
  };
}

export function toThread(row: ThreadRow, comments: ThreadComment[], people: People, bead: { name: string; removed: boolean }): Thread {
  return {
    id: row.id,
    mappingId: row.mapping_id,
    beadId: row.bead_id,
    beadName: bead.name,
    beadRemoved: bead.removed,
    resolved: row.resolved_at !== null,
    resolvedAt: iso(row.resolved_at),
    resolvedBy: person(people, row.resolved_by),
    createdBy: person(people, row.created_by),
    createdAt: iso(row.created_at)!,
    comments,
  };
}
