import type { Check, Severity } from '../../../shared/chem';
import { cn } from '../../../lib/cn';

const SEVERITY: Record<Severity, { label: string; className: string }> = {
  error: { label: 'Error', className: 'bg-alert-50 text-alert-700 border-alert-600/30' },
  warning: { label: 'Warning', className: 'bg-bead-orange/15 text-ink-900 border-bead-orange/50' },
  info: { label: 'Note', className: 'bg-ink-50 text-ink-800 border-ink-200' },
};

interface ChecksPanelProps {
  checks: readonly Check[] | null;
  active: Check | null;
  onShow(check: Check | null): void;
}

/** The server's findings; pressing one rings its atoms on the drawing. */
export function ChecksPanel({ checks, active, onShow }: ChecksPanelProps) {
  if (checks === null) return <p className="text-sm text-ink-600">Waiting for the server's evaluation…</p>;
  if (checks.length === 0) return <p role="status" className="text-sm font-semibold text-ok-700">No findings: every atom is in a bead and nothing looks off.</p>;
  return (
    <ul aria-label="Checks" className="flex flex-col gap-2">
      {checks.map((c, i) => {
        const pressed = active === c;
        return (
          <li key={`${c.code}-${i}`}>
            <button
              type="button"
              aria-pressed={pressed}
              onClick={() => onShow(pressed ? null : c)}
              className={cn('w-full rounded-md border px-3 py-2 text-left text-sm', SEVERITY[c.severity].className, pressed && 'ring-2 ring-ink-500')}
            >
              <span className="mr-2 text-xs font-bold uppercase tracking-wide">{SEVERITY[c.severity].label}</span>
              <span className="font-semibold">{c.message}</span>
              {c.hint && <span className="mt-0.5 block text-xs opacity-80">{c.hint}</span>}
              {c.atoms.length > 0 && <span className="mt-0.5 block text-xs opacity-70">{pressed ? 'Shown on the drawing' : `Show ${c.atoms.length} atom${c.atoms.length === 1 ? '' : 's'}`}</span>}
            </button>
          </li>
        );
      })}
    </ul>
  );
}
