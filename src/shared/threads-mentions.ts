// Mentions inside a comment body. The composer's autocomplete writes `@[Display Name](user:12)`;
// the id is what counts (names change and repeat), the label is only what readers see.
// On save the server rewrites every mention: a project member's label becomes their current
// display name, and a mention of anyone else becomes plain `@label` text, so it notifies nobody.

export const MENTION_PATTERN = /@\[([^\]\n]{1,200})\]\(user:([1-9][0-9]{0,9})\)/g;

export interface Mention {
  userId: number;
  label: string;
}

export function parseMentions(body: string): Mention[] {
  const out: Mention[] = [];
  for (const m of body.matchAll(MENTION_PATTERN)) out.push({ label: m[1] as string, userId: Number(m[2]) });
  return out;
}

/** Distinct mentioned user ids, in order of first mention. */
export const mentionedIds = (body: string) => [...new Set(parseMentions(body).map((m) => m.userId))];

/** Labels are written into Markdown link text: keep them from closing the brackets or breaking lines. */
export const mentionLabel = (name: string) => name.replace(/[[\]\r\n]+/g, ' ').trim().slice(0, 200) || 'someone';

export const mentionToken = (userId: number, name: string) => `@[${mentionLabel(name)}](user:${userId})`;

/** Rewrites mentions against the project's members (id → display name); see the top of this file. */
export function normaliseMentions(body: string, members: ReadonlyMap<number, string>): string {
  return body.replace(MENTION_PATTERN, (_all, label: string, id: string) => {
    const name = members.get(Number(id));
    return name === undefined ? `@${label}` : mentionToken(Number(id), name);
  });
}

/** The `@query` being typed right before the caret, for the autocomplete; null when there is none. */
export function mentionQueryAt(text: string, caret: number): { start: number; query: string } | null {
  const before = text.slice(0, caret);
  const m = /(^|[\s(])@([^\s@[\]()]{0,40})$/.exec(before);
  if (!m) return null;
  return { start: caret - (m[2] as string).length - 1, query: m[2] as string };
}

/**
 * The composer shows a mention as `@Display Name` (never the raw token) and keeps the picked people
 * aside; these two turn a body into that text and back. Only people picked (or already mentioned)
 * become tokens again, so typing "@Ada" by hand mentions nobody.
 */
export function mentionsAsText(body: string): { text: string; mentions: Mention[] } {
  return { text: body.replace(MENTION_PATTERN, (_all, label: string) => `@${label}`), mentions: parseMentions(body) };
}

export function textWithMentions(text: string, mentions: readonly Mention[]): string {
  const byLabel = new Map(mentions.map((m) => [m.label, m.userId]));
  if (!byLabel.size) return text;
  // Longest label first, so "@Ada Lovelace" wins over "@Ada"; a label ends where a word does.
  const labels = [...byLabel.keys()].sort((a, b) => b.length - a.length).map((l) => l.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  return text.replace(new RegExp(`@(${labels.join('|')})(?![\\p{L}\\p{N}_])`, 'gu'), (_all, label: string) => mentionToken(byLabel.get(label)!, label));
}
