import { z } from 'zod';

// In-app notifications (the bell) and the e-mail preferences that go with them.

export const NOTIFICATION_KINDS = ['mention', 'reply'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

export interface NotificationItem {
  id: number;
  kind: NotificationKind;
  /** Who wrote the comment; null when that account was removed. */
  actor: { id: number; displayName: string } | null;
  mappingId: number;
  mappingName: string;
  threadId: number;
  beadId: string;
  commentId: number;
  /** The first words of the comment, as plain text. */
  excerpt: string;
  createdAt: string;
  readAt: string | null;
}

export interface NotificationList {
  unread: number;
  items: NotificationItem[];
}

/** Mark some notifications read, or all of them. */
export const markReadBody = z.union([
  z.strictObject({ ids: z.array(z.number().int().positive()).min(1, 'Name at least one notification.').max(500) }),
  z.strictObject({ all: z.literal(true) }),
]);
export type MarkReadBody = z.infer<typeof markReadBody>;

export const preferencesBody = z.strictObject({
  emailOnMention: z.boolean('Say whether to e-mail you when you are mentioned.'),
  emailOnReply: z.boolean('Say whether to e-mail you about replies.'),
});
export type Preferences = z.infer<typeof preferencesBody>;
export const DEFAULT_PREFERENCES: Preferences = { emailOnMention: true, emailOnReply: true };

/** Whether a notification of this kind should also go out by e-mail. */
export const wantsEmail = (prefs: Preferences, kind: NotificationKind) => (kind === 'mention' ? prefs.emailOnMention : prefs.emailOnReply);

/** Pushed on GET /api/notifications/events whenever the person's list changes. */
export interface NotificationEvent {
  type: 'notifications';
  unread: number;
}
