import { useId, type ReactNode } from 'react';
import { cn } from '../../../lib/cn';

/** A compact titled panel of the editor (lighter than a page Section). */
export function Panel({ title, className, children }: { title: string; className?: string; children: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="flex flex-col overflow-hidden rounded-lg border border-paper-300 bg-paper-50 shadow-card">
      <h2 id={id} className="border-b border-paper-200 px-3 py-1.5 text-sm font-bold text-ink-800">{title}</h2>
      <div className={cn('min-h-0 flex-1 p-3', className)}>{children}</div>
    </section>
  );
}
