import type { AppContext } from '../context';
import { wantsEmail, type NotificationEvent } from '../../src/shared/notifications';
import { mentionedIds } from '../../src/shared/threads-mentions';
import { threadLink } from '../../src/shared/threads';
import { userChannel, type LiveHub } from '../http/live-hub';
import type { JobQueue } from '../jobs/job-queue';
import { recipients } from './recipients';
import { notificationMail } from './notification-mail';
import { emailAddressee, getPreferences, insertNotifications, mappingName, unreadCount } from './notifications.service';

// After a comment is stored: notify the people it concerns (recipients.ts) in the app, live, and by
// e-mail as their preferences say. An edited comment notifies only the people it newly mentions.
// The e-mail is a job (jobs/job-queue.ts): it goes out after the answer, and a failing one is logged;
// it never undoes the comment.

export interface NewComment {
  projectId: number;
  mappingId: number;
  threadId: number;
  commentId: number;
  beadId: string;
  beadName: string;
  author: { id: number; displayName: string };
  body: string;
  /** Set when the comment was edited: its body before. */
  previousBody?: string;
}

/** Who could hear about it, given by the thread's side: the project's members and the thread's earlier writers. */
export interface Audience {
  members: ReadonlySet<number>;
  participants: readonly number[];
}

/** Where notifications go out: the live hub (the bell, at once) and the job queue (e-mail, after the answer). */
export interface NotifyChannels {
  live: LiveHub;
  jobs: JobQueue;
}

export async function notifyComment(ctx: AppContext, { live, jobs }: NotifyChannels, c: NewComment, audience: Audience): Promise<void> {
  const edited = c.previousBody !== undefined;
  const before = new Set(edited ? mentionedIds(c.previousBody!) : []);
  const earlier = edited ? [] : audience.participants.filter((id) => id !== c.author.id);
  const mentioned = mentionedIds(c.body).filter((id) => !before.has(id));
  const targets = recipients({ authorId: c.author.id, mentioned, participants: earlier, members: audience.members });
  if (!targets.length) return;
  await insertNotifications(ctx.db, targets.map((t) => ({ ...t, threadId: c.threadId, commentId: c.commentId, actorId: c.author.id })));

  const mapping = await mappingName(ctx.db, c.mappingId);
  const link = threadLink(ctx.config.appUrl, c.mappingId, c.beadId, c.threadId);
  for (const t of targets) {
    const event: NotificationEvent = { type: 'notifications', unread: await unreadCount(ctx.db, t.userId) };
    live.publish(userChannel(t.userId), event.type, event);
    if (!wantsEmail(await getPreferences(ctx.db, t.userId), t.kind)) continue;
    const mail = notificationMail({
      to: await emailAddressee(ctx.db, t.userId),
      kind: t.kind,
      actorName: c.author.displayName,
      mappingName: mapping ?? `Mapping ${c.mappingId}`,
      beadName: c.beadName,
      body: c.body,
      link,
    });
    jobs.enqueue({ kind: 'mail', mail, about: `notification e-mail to user ${t.userId}` });
  }
}
