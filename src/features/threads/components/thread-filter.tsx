import { useId } from 'react';
import { cn } from '../../../lib/cn';

export type Filter = 'open' | 'resolved' | 'all';
const OPTIONS: { value: Filter; label: string }[] = [
  { value: 'open', label: 'Open' },
  { value: 'resolved', label: 'Resolved' },
  { value: 'all', label: 'All' },
];

/** Open / resolved / all, as a radio group. */
export function ThreadFilter({ value, onChange }: { value: Filter; onChange(v: Filter): void }) {
  const name = useId();
  return (
    <fieldset className="flex gap-1 text-xs">
      <legend className="sr-only">Show threads</legend>
      {OPTIONS.map((o) => (
        <label key={o.value} className={cn('cursor-pointer rounded-full border px-2 py-0.5 font-semibold', value === o.value ? 'border-ink-700 bg-ink-700 text-paper-50' : 'border-paper-300 text-ink-700')}>
          <input type="radio" name={name} value={o.value} checked={value === o.value} onChange={() => onChange(o.value)} className="sr-only" />
          {o.label}
        </label>
      ))}
    </fieldset>
  );
}
