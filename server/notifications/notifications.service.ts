import type { Db } from '../db/knex';
import { DEFAULT_PREFERENCES, type MarkReadBody, type NotificationItem, type NotificationKind, type NotificationList, type Preferences } from '../../src/shared/notifications';
import { excerpt } from '../../src/shared/threads-markdown';

// Knex for notifications and notification_preferences.

export async function insertNotifications(db: Db, rows: { userId: number; kind: NotificationKind; threadId: number; commentId: number; actorId: number }[]): Promise<void> {
  if (!rows.length) return;
  await db('notifications').insert(rows.map((r) => ({ user_id: r.userId, kind: r.kind, thread_id: r.threadId, comment_id: r.commentId, actor_id: r.actorId })));
}

export async function unreadCount(db: Db, userId: number): Promise<number> {
  const row = await db('notifications').where({ user_id: userId }).whereNull('read_at').count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

/** The person's newest notifications (the bell's list), with the unread count. */
export async function listNotifications(db: Db, userId: number, limit = 50): Promise<NotificationList> {
  const [rows, unread] = await Promise.all([db('notifications as n')
    .join('threads as t', 't.id', 'n.thread_id')
    .join('thread_comments as c', 'c.id', 'n.comment_id')
    .join('mappings as p', 'p.id', 't.mapping_id')
    .leftJoin('users as a', 'a.id', 'n.actor_id')
    .where('n.user_id', userId)
    .orderBy('n.id', 'desc')
    .limit(limit)
    .select('n.id', 'n.kind', 'n.actor_id', 'a.display_name as actor_name', 't.mapping_id', 'p.name as mapping_name', 'n.thread_id', 't.bead_id', 'n.comment_id', 'c.body', 'c.deleted_at', 'n.created_at', 'n.read_at'), unreadCount(db, userId)]);
  const items: NotificationItem[] = rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    actor: r.actor_id !== null && r.actor_name !== null ? { id: r.actor_id, displayName: r.actor_name } : null,
    mappingId: r.mapping_id,
    mappingName: r.mapping_name,
    threadId: r.thread_id,
    beadId: r.bead_id,
    commentId: r.comment_id,
    excerpt: r.deleted_at ? '' : excerpt(r.body),
    createdAt: new Date(r.created_at).toISOString(),
    readAt: r.read_at ? new Date(r.read_at).toISOString() : null,
  }));
  return { unread, items };
}

/** Marks the person's own notifications read (ids of others are ignored); returns the unread count. */
export async function markRead(db: Db, userId: number, body: MarkReadBody): Promise<number> {
  const q = db('notifications').where({ user_id: userId }).whereNull('read_at');
  if ('ids' in body) q.whereIn('id', body.ids);
  await q.update({ read_at: db.fn.now(3) });
  return unreadCount(db, userId);
}

export async function getPreferences(db: Db, userId: number): Promise<Preferences> {
  const row = await db('notification_preferences').where({ user_id: userId }).first('email_on_mention', 'email_on_reply');
  return row ? { emailOnMention: !!row.email_on_mention, emailOnReply: !!row.email_on_reply } : { ...DEFAULT_PREFERENCES };
}

export async function putPreferences(db: Db, userId: number, prefs: Preferences): Promise<Preferences> {
  await db('notification_preferences')
    .insert({ user_id: userId, email_on_mention: prefs.emailOnMention, email_on_reply: prefs.emailOnReply, updated_at: db.fn.now() })
    .onConflict('user_id')
    .merge();
  return getPreferences(db, userId);
}

/** A mapping's name for a notification's text (null when it is gone). */
export async function mappingName(db: Db, mappingId: number): Promise<string | null> {
  return (await db('mappings').where({ id: mappingId }).first('name'))?.name ?? null;
}

/** Where a person's notification e-mail goes. */
export async function emailAddressee(db: Db, userId: number): Promise<{ email: string; displayName: string }> {
  const row = await db('users').where({ id: userId }).first('email', 'display_name');
  return { email: row.email, displayName: row.display_name };
}
