import { cn } from '../../lib/cn';

/** The Beadloom mark — three beads on a thread — with or without the word. */
export function Logo({ withName = true, className }: { withName?: boolean; className?: string }) {
  return (
    <span className={cn('inline-flex items-center gap-2', className)}>
      <svg viewBox="0 0 32 32" aria-hidden="true" className="size-7 shrink-0">
        <rect width="32" height="32" rx="7" className="fill-ink-700" />
        <path d="M4 21 C10 9, 22 9, 28 21" fill="none" className="stroke-paper-100" strokeWidth="1.6" strokeLinecap="round" />
        <circle cx="8.5" cy="15.5" r="4" className="fill-bead-orange" />
        <circle cx="16" cy="12" r="4.4" className="fill-bead-sky" />
        <circle cx="23.5" cy="15.5" r="4" className="fill-bead-green" />
      </svg>
      {withName && <span className="text-lg font-bold tracking-tight text-ink-900">Beadloom</span>}
    </span>
  );
}
