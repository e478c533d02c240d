import { Loading } from '../../../components/ui/loading';
import { ErrorAlert } from '../../../components/ui/alert';
import type { AuditAction } from '../../../shared/audit';
import { useAudit } from '../api/get-audit';

const VERB: Record<AuditAction, string> = { save: 'saved version', restore: 'restored version', lock: 'locked version', unlock: 'unlocked version', import: 'imported the mapping' };

/** The append-only trail of saves, restores, locks and unlocks, newest first. */
export function AuditTrail({ mappingId }: { mappingId: number }) {
  const audit = useAudit(mappingId);
  if (audit.isError) return <ErrorAlert error={audit.error} />;
  if (!audit.data) return <Loading label="Loading the audit trail…" />;
  if (!audit.data.length) return <p className="text-sm text-ink-600">Nothing recorded yet.</p>;
  return (
    <ol aria-label="Audit trail" className="flex flex-col gap-1 text-sm">
      {audit.data.map((e) => (
        <li key={e.id} className="text-ink-800">
          <time dateTime={e.at} className="text-ink-600">{new Date(e.at).toLocaleString()}</time> · <strong>{e.actor?.displayName ?? 'A former member'}</strong> {VERB[e.action]} {e.version}
          {e.reason && <span className="text-ink-700"> — “{e.reason}”</span>}
        </li>
      ))}
    </ol>
  );
}
