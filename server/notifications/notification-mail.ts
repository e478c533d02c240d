import type { OutgoingMail } from '../mail/mailer';
import { escapeHtml } from '../mail/messages';
import type { NotificationKind } from '../../src/shared/notifications';
import { commentPlainText, renderCommentHtml } from '../../src/shared/threads-markdown';

// The e-mail for one notification: plain text and HTML, with the deep link into the editor.
// Names come from people and are untrusted: in the subject, control characters are flattened to
// spaces (a CR/LF there could start a new header); in HTML every value is escaped, and the comment
// goes through the same Markdown renderer as the app (no raw HTML).

export interface NotificationMailInput {
  to: { email: string; displayName: string };
  kind: NotificationKind;
  actorName: string;
  mappingName: string;
  beadName: string;
  body: string;
  link: string;
}

/** One line, no control characters, at most `max` characters. */
export const headerSafe = (s: string, max = 80) => {
  const flat = s.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, ' ').replace(/\s+/g, ' ').trim();
  return flat.length > max ? `${flat.slice(0, max - 1)}…` : flat;
};

export function notificationMail(m: NotificationMailInput): OutgoingMail {
  const actor = headerSafe(m.actorName);
  const what = m.kind === 'mention' ? `${actor} mentioned you` : `${actor} replied in a thread you take part in`;
  const where = `on bead ${headerSafe(m.beadName, 60)} of ${headerSafe(m.mappingName, 80)}`;
  const subject = headerSafe(m.kind === 'mention' ? `${actor} mentioned you on ${headerSafe(m.beadName, 40)}` : `New reply on ${headerSafe(m.beadName, 40)} in ${headerSafe(m.mappingName, 60)}`, 150);
  const text = [
    `Hello ${headerSafe(m.to.displayName)},`,
    '',
    `${what} ${where}:`,
    '',
    ...commentPlainText(m.body).match(/.{1,76}(\s|$)|\S+/g)!.map((l) => `> ${l.trim()}`),
    '',
    `Open the thread: ${m.link}`,
    '',
    'You get these e-mails because of your notification settings on your Beadloom account page.',
    '— Beadloom',
  ].join('\n');
  const html = [
    `<p>Hello ${escapeHtml(headerSafe(m.to.displayName))},</p>`,
    `<p>${escapeHtml(what)} ${escapeHtml(where)}:</p>`,
    `<blockquote>${renderCommentHtml(m.body)}</blockquote>`,
    `<p><a href="${escapeHtml(m.link)}">Open the thread</a></p>`,
    '<p>You get these e-mails because of your notification settings on your Beadloom account page.</p>',
    '<p>— Beadloom</p>',
  ].join('\n');
  return { to: { name: headerSafe(m.to.displayName, 200), address: m.to.email }, subject, text, html };
}
