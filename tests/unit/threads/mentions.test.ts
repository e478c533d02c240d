import { describe, expect, it } from 'vitest';
import { mentionedIds, mentionQueryAt, mentionsAsText, mentionToken, normaliseMentions, parseMentions, textWithMentions } from '../../../src/shared/threads-mentions';

describe('mentions', () => {
  it('parses mention tokens, ids first-seen and distinct', () => {
    const body = 'Hi @[Ines](user:2) and @[Tomas](user:3), @[Ines M](user:2)! mail@example.org is not one; @[x](user:0) neither';
    expect(parseMentions(body).map((m) => m.userId)).toEqual([2, 3, 2]);
    expect(mentionedIds(body)).toEqual([2, 3]);
  });

  it('rewrites labels to members’ names and drops mentions of non-members to text', () => {
    const members = new Map([[2, 'Dr Ines Marlow']]);
    expect(normaliseMentions('@[boss](user:2) and @[Stranger](user:99)', members)).toBe('@[Dr Ines Marlow](user:2) and @Stranger');
  });

  it('keeps a hostile display name from breaking the token', () => {
    const token = mentionToken(5, 'Eve](javascript:x)\n[');
    expect(parseMentions(token)).toEqual([{ userId: 5, label: 'Eve (javascript:x)' }]);
  });

  it('finds the @query before the caret', () => {
    expect(mentionQueryAt('Ask @In', 7)).toEqual({ start: 4, query: 'In' });
    expect(mentionQueryAt('@', 1)).toEqual({ start: 0, query: '' });
    expect(mentionQueryAt('mail@exa', 8)).toBeNull();
    expect(mentionQueryAt('Ask @In now', 11)).toBeNull();
  });

  it('shows mentions as @Name in the composer and turns picked names back into tokens', () => {
    const body = `Hi ${mentionToken(2, 'Ada Lovelace')} and ${mentionToken(3, 'Ada')}!`;
    const { text, mentions } = mentionsAsText(body);
    expect(text).toBe('Hi @Ada Lovelace and @Ada!');
    expect(textWithMentions(text, mentions)).toBe(body);
    // Only picked people become tokens; a hand-typed @name and a longer word stay text.
    expect(textWithMentions('@Ada and @Adam and @Bob', [{ userId: 3, label: 'Ada' }])).toBe(`${mentionToken(3, 'Ada')} and @Adam and @Bob`);
    expect(textWithMentions('no one', [])).toBe('no one');
  });
});
