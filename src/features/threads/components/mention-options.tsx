import type { MentionCandidate } from '../api/get-mention-candidates';
import { cn } from '../../../lib/cn';

interface MentionOptionsProps {
  id: string;
  options: readonly MentionCandidate[];
  active: number;
  onPick(candidate: MentionCandidate): void;
}

/** The @ autocomplete: a listbox under the composer, driven by the textarea's arrow keys. */
export function MentionOptions({ id, options, active, onPick }: MentionOptionsProps) {
  if (!options.length) return null;
  return (
    <ul id={id} role="listbox" aria-label="Project members" className="mt-1 max-h-40 overflow-y-auto rounded-md border border-paper-300 bg-paper-50 py-1 text-sm shadow-card">
      {options.map((c, i) => (
        <li
          key={c.userId}
          id={`${id}-${c.userId}`}
          role="option"
          aria-selected={i === active}
          onMouseDown={(e) => {
            e.preventDefault();
            onPick(c);
          }}
          className={cn('cursor-pointer px-3 py-1', i === active ? 'bg-ink-100 text-ink-900' : 'text-ink-800 hover:bg-paper-200')}
        >
          <span className="font-semibold">{c.displayName}</span> <span className="text-xs text-ink-600">{c.email}</span>
        </li>
      ))}
    </ul>
  );
}
