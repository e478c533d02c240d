import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

const tones = {
  ink: 'bg-ink-100 text-ink-800',
  paper: 'bg-paper-200 text-ink-700',
  ok: 'bg-ok-50 text-ok-700',
  alert: 'bg-alert-50 text-alert-700',
} as const;

export function Badge({ tone = 'ink', children }: { tone?: keyof typeof tones; children: ReactNode }) {
  return (
    <span className={cn('inline-flex items-center rounded-full px-2 py-0.5 text-xs font-semibold', tones[tone])}>
      {children}
    </span>
  );
}
