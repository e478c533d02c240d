import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import type { VersionSummary } from '../../../shared/versions';
import { VersionPicture } from './version-picture';

interface VersionListProps {
  mappingId: number;
  versions: VersionSummary[];
  canRestore: boolean;
  restoring: number | null;
  onView(n: number): void;
  onCompareWithDraft(n: number): void;
  onRestore(n: number): void;
}

/** Every version, newest first, each with its picture, author, time and message. */
export function VersionList({ mappingId, versions, canRestore, restoring, onView, onCompareWithDraft, onRestore }: VersionListProps) {
  if (!versions.length) return <p className="text-sm text-ink-600">No versions yet.</p>;
  return (
    <ol aria-label="Versions" className="flex flex-col gap-2">
      {versions.map((v) => (
        <li key={v.number} aria-label={`Version ${v.number}`} className="flex gap-3 rounded-md border border-paper-300 p-2">
          <VersionPicture mappingId={mappingId} state={v.number} alt={`Picture of version ${v.number}`} className="h-16 w-24 shrink-0 rounded border border-paper-300 bg-paper-50 object-contain" />
          <div className="flex min-w-0 flex-1 flex-col gap-1">
            <p className="flex flex-wrap items-center gap-2 text-sm">
              <strong className="text-ink-900">Version {v.number}</strong>
              {v.production && <Badge tone="ok">Production</Badge>}
              <span className="text-ink-600">
                {v.author?.displayName ?? 'A former member'} · <time dateTime={v.createdAt}>{new Date(v.createdAt).toLocaleString()}</time> · {v.beadCount} beads
              </span>
            </p>
            {v.message && <p className="truncate text-sm text-ink-800">{v.message}</p>}
            <div className="flex flex-wrap gap-1">
              <Button size="sm" variant="secondary" onClick={() => onView(v.number)}>View</Button>
              <Button size="sm" variant="secondary" onClick={() => onCompareWithDraft(v.number)}>Compare with draft</Button>
              {canRestore && (
                <Button size="sm" variant="ghost" pending={restoring === v.number} onClick={() => onRestore(v.number)}>
                  Restore into draft
                </Button>
              )}
            </div>
          </div>
        </li>
      ))}
    </ol>
  );
}
