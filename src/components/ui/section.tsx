import { useId, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

interface SectionProps {
  title: string;
  description?: ReactNode;
  actions?: ReactNode;
  className?: string;
  children: ReactNode;
}

/** A paper card with a heading; the heading names the region for assistive technology. */
export function Section({ title, description, actions, className, children }: SectionProps) {
  const id = useId();
  return (
    <section aria-labelledby={id} className={cn('rounded-lg border border-paper-300 bg-paper-50 p-5 shadow-card', className)}>
      <div className="mb-4 flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id={id} className="text-lg font-bold text-ink-900">
            {title}
          </h2>
          {description && <p className="mt-0.5 text-sm text-ink-600">{description}</p>}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}
