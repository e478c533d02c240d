import { describe, expect, it } from 'vitest';
import { recipients } from '../../../server/notifications/recipients';
import { headerSafe, notificationMail } from '../../../server/notifications/notification-mail';
import { wantsEmail } from '../../../src/shared/notifications';

describe('who is notified', () => {
  const members = new Set([1, 2, 3, 4]);
  it('mentions win over replies; the author and non-members hear nothing', () => {
    expect(recipients({ authorId: 1, mentioned: [2, 1, 99], participants: [1, 2, 3], members })).toEqual([
      { userId: 2, kind: 'mention' },
      { userId: 3, kind: 'reply' },
    ]);
  });
  it('a participant who left the project gets nothing', () => {
    expect(recipients({ authorId: 1, mentioned: [], participants: [5, 4], members })).toEqual([{ userId: 4, kind: 'reply' }]);
  });
  it('e-mail follows the preferences', () => {
    expect(wantsEmail({ emailOnMention: true, emailOnReply: false }, 'mention')).toBe(true);
    expect(wantsEmail({ emailOnMention: true, emailOnReply: false }, 'reply')).toBe(false);
    expect(wantsEmail({ emailOnMention: false, emailOnReply: false }, 'mention')).toBe(false);
  });
});

describe('notification e-mail', () => {
  const base = {
    to: { email: 'ines@example.org', displayName: 'Ines' },
    kind: 'mention' as const,
    mappingName: 'Dye 4:1',
    beadName: 'Ring',
    body: 'Look at **this** <script>alert(1)</script>',
    link: 'http://app.example/mappings/3?bead=b1&thread=7',
  };
  it('has text and HTML with the deep link, HTML escaped', () => {
    const mail = notificationMail({ ...base, actorName: 'Tomas <b>' });
    expect(mail.subject).toBe('Tomas <b> mentioned you on Ring');
    expect(mail.text).toContain('Open the thread: http://app.example/mappings/3?bead=b1&thread=7');
    expect(mail.html).toContain('href="http://app.example/mappings/3?bead=b1&amp;thread=7"');
    expect(mail.html).toContain('Tomas &lt;b&gt; mentioned you');
    expect(mail.html).toContain('&lt;script&gt;');
    expect(mail.html).not.toContain('<script');
  });
  it('flattens line breaks in names so nothing reaches the headers', () => {
    const mail = notificationMail({ ...base, actorName: 'Eve\r\nBcc: victim@example.org' });
    expect(mail.subject).toBe('Eve Bcc: victim@example.org mentioned you on Ring');
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(headerSafe('a\u2028b\tc')).toBe('a b c');
  });
});
