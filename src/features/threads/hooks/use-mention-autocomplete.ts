import { useMemo, useState, type KeyboardEvent, type RefObject } from 'react';
import { mentionLabel, mentionQueryAt, type Mention } from '../../../shared/threads-mentions';
import type { MentionCandidate } from '../api/get-mention-candidates';

/**
 * The @ autocomplete's state: which members match the `@query` before the caret, and picking one.
 * A pick writes `@Display Name` into the text and reports the person through `onPick`; the composer
 * turns picked names back into mention tokens when it sends (shared/threads-mentions.ts).
 */
export function useMentionAutocomplete(ref: RefObject<HTMLTextAreaElement | null>, value: string, setValue: (v: string) => void, members: readonly MentionCandidate[], onPick: (m: Mention) => void) {
  const [caret, setCaret] = useState(0);
  const [active, setActive] = useState(0);
  const [dismissed, setDismissed] = useState<number | null>(null);
  const query = mentionQueryAt(value, caret);
  const options = useMemo(() => {
    if (!query || dismissed === query.start) return [];
    const q = query.query.toLowerCase();
    return members.filter((m) => m.displayName.toLowerCase().includes(q) || m.email.toLowerCase().startsWith(q)).slice(0, 8);
  }, [query, members, dismissed]);

  const pick = (c: MentionCandidate) => {
    if (!query) return;
    const label = mentionLabel(c.displayName);
    onPick({ userId: c.userId, label });
    const token = `@${label} `;
    const next = value.slice(0, query.start) + token + value.slice(caret);
    setValue(next);
    const at = query.start + token.length;
    setCaret(at);
    requestAnimationFrame(() => ref.current?.setSelectionRange(at, at));
  };

  const onKeyDown = (e: KeyboardEvent<HTMLTextAreaElement>) => {
    if (!options.length) return;
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      setActive((a) => (a + (e.key === 'ArrowDown' ? 1 : options.length - 1)) % options.length);
    } else if (e.key === 'Enter' || e.key === 'Tab') {
      e.preventDefault();
      pick(options[Math.min(active, options.length - 1)]!);
    } else if (e.key === 'Escape') {
      e.preventDefault();
      setDismissed(query?.start ?? null);
    }
  };

  const track = () => setCaret(ref.current?.selectionStart ?? value.length);
  return { options, active: Math.min(active, Math.max(0, options.length - 1)), pick, onKeyDown, track };
}
