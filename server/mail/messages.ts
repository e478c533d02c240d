import type { OutgoingMail } from './mailer';

// The texts of the e-mails Beadloom sends. Every value placed into HTML is escaped.

export const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);

interface Person {
  email: string;
  displayName: string;
}

function linkMail(to: Person, subject: string, lines: string[], link: string, action: string): OutgoingMail {
  const text = [...lines, '', `${action}: ${link}`, '', 'The link works once and expires in 48 hours.', '', '— Beadloom'].join('\n');
  const html = [
    ...lines.map((l) => `<p>${escapeHtml(l)}</p>`),
    `<p><a href="${escapeHtml(link)}">${escapeHtml(action)}</a></p>`,
    '<p>The link works once and expires in 48 hours.</p>',
    '<p>— Beadloom</p>',
  ].join('\n');
  return { to: { name: to.displayName, address: to.email }, subject, text, html };
}

export function invitationMail(to: Person, link: string, invitedBy: string | null, projectName: string | null): OutgoingMail {
  const where = projectName ? ` to the project “${projectName}”` : '';
  const who = invitedBy ? `${invitedBy} has invited you${where} on Beadloom.` : `An account has been created for you on Beadloom.`;
  return linkMail(to, 'Your Beadloom account: set your password', [`Hello ${to.displayName},`, who, 'Choose a password to start.'], link, 'Set your password');
}

export function resetMail(to: Person, link: string): OutgoingMail {
  return linkMail(
    to,
    'Reset your Beadloom password',
    [`Hello ${to.displayName},`, 'Someone asked to reset the password of this Beadloom account. If it was not you, ignore this message.'],
    link,
    'Choose a new password',
  );
}

export function addedToProjectMail(to: Person, projectName: string, appUrl: string): OutgoingMail {
  const text = `Hello ${to.displayName},\n\nYou have been added to the project “${projectName}” on Beadloom.\n\n${appUrl}\n\n— Beadloom`;
  const html = `<p>Hello ${escapeHtml(to.displayName)},</p><p>You have been added to the project “${escapeHtml(projectName)}” on Beadloom.</p><p><a href="${escapeHtml(appUrl)}">Open Beadloom</a></p>`;
  return { to: { name: to.displayName, address: to.email }, subject: `Added to ${projectName.replace(/[\r\n]+/g, ' ')} on Beadloom`, text, html };
}
