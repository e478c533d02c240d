import type { ReactNode } from 'react';
import { cn } from '../../../lib/cn';

/** A key cap, e.g. <Kbd>B</Kbd>; `hidden` keeps it out of the accessible name (a hint beside a label). */
export function Kbd({ children, muted = false, hidden = false }: { children: ReactNode; muted?: boolean; hidden?: boolean }) {
  return (
    <kbd aria-hidden={hidden || undefined} className={cn('shrink-0 whitespace-nowrap rounded border px-1 font-sans text-[11px] leading-4 font-semibold', muted ? 'border-paper-300 bg-paper-100 text-ink-500' : 'border-ink-200 bg-paper-50 text-ink-800 shadow-[0_1px_0_var(--color-ink-200)]')}>
      {children}
    </kbd>
  );
}
