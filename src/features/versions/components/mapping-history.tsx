import { useState } from 'react';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { Section } from '../../../components/ui/section';
import type { MappingDetail } from '../../../shared/mappings';
import { useVersions } from '../api/get-versions';
import { useLock } from '../api/get-lock';
import { useRestoreVersion } from '../api/restore-version';
import type { StateRef } from '../api/get-compare';
import { AuditTrail } from './audit-trail';
import { CompareForm } from './compare-form';
import { CompareView } from './compare-view';
import { LockControls } from './lock-controls';
import { SaveVersionForm } from './save-version-form';
import { VersionList } from './version-list';
import { VersionView } from './version-view';
import { RestoreDialog } from './restore-dialog';

type Open = { kind: 'view'; n: number } | { kind: 'compare'; from: StateRef; to: StateRef } | null;

interface MappingHistoryProps {
  mapping: MappingDetail;
  /** The caller's role may save and restore. */
  canEdit: boolean;
  /** The caller may lock and unlock (supervisors, admins). */
  canLock: boolean;
  /** Where the export menu goes (it lives in its own feature). */
  exportMenu?: (states: { ref: number | 'draft' | 'production'; label: string }[], versions: number[]) => React.ReactNode;
  /** The threads of a version's beads, shown with the version (they live in their own feature). */
  versionThreads?: (number: number) => React.ReactNode;
  /** The open editor: its connection id (a restore comes back to it as one undoable step) and its live bead count. */
  editor?: () => { clientId: number; beadCount: number } | null;
}

/** History of a mapping: save, the version list, view, compare, restore, the lock and the audit trail. */
export function MappingHistory({ mapping, canEdit, canLock, exportMenu, versionThreads, editor }: MappingHistoryProps) {
  const versions = useVersions(mapping.id);
  const lock = useLock(mapping.id);
  const restore = useRestoreVersion(mapping.id, () => editor?.()?.clientId);
  const [open, setOpen] = useState<Open>(null);
  const [confirming, setConfirming] = useState<number | null>(null);
  const names = new Map(mapping.draft.beads.map((b) => [b.id, b.name]));
  if (versions.isError || lock.isError) return <ErrorAlert error={versions.error ?? lock.error} />;
  if (!versions.data || !lock.data) return <Loading label="Loading the history…" />;
  const list = versions.data;
  const locked = lock.data.locked;
  const options = [...list.map((v) => ({ value: String(v.number), label: `Version ${v.number}` })), { value: 'draft', label: 'Draft' }];
  const from = list[1] ? String(list[1].number) : list[0] ? String(list[0].number) : 'draft';
  const states = [{ ref: 'draft' as const, label: 'The draft' }, ...(locked ? [{ ref: 'production' as const, label: `Production (version ${lock.data.version})` }] : [])];

  return (
    <Section
      title="History"
      description={locked ? `Version ${lock.data.version} is locked for production; the draft is read-only.` : 'Versions are immutable snapshots the server takes of the draft.'}
      actions={<div className="flex items-center gap-2">{locked && <Badge tone="ok">Production: version {lock.data.version}</Badge>}{exportMenu?.(states, list.map((v) => v.number))}</div>}
    >
      <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="flex flex-col gap-3">
          {canEdit && !locked && <SaveVersionForm mappingId={mapping.id} />}
          <ErrorAlert error={restore.error} />
          <VersionList
            mappingId={mapping.id}
            versions={list}
            canRestore={canEdit && !locked}
            restoring={restore.isPending ? (restore.variables ?? null) : null}
            onView={(n) => setOpen({ kind: 'view', n })}
            onCompareWithDraft={(n) => setOpen({ kind: 'compare', from: n, to: 'draft' })}
            onRestore={(n) => setConfirming(n)}
          />
          {restore.data?.snapshot && <Notice>Restored version {restore.data.restored}; the draft as it was is kept as version {restore.data.snapshot}.</Notice>}
          {confirming !== null && list.some((v) => v.number === confirming) && (
            <RestoreDialog
              version={list.find((v) => v.number === confirming)!}
              draftBeads={editor?.()?.beadCount ?? mapping.draft.beads.length}
              newest={list[0]!.number}
              pending={restore.isPending}
              onCancel={() => setConfirming(null)}
              onConfirm={() => restore.mutate(confirming, { onSettled: () => setConfirming(null) })}
            />
          )}
          {list.length > 0 && (
            <CompareForm options={options} from={from} onCompare={(f, t) => setOpen({ kind: 'compare', from: f, to: t })} />
          )}
        </div>
        <div className="flex flex-col gap-4">
          {canLock && (
            <div>
              <h3 className="mb-2 font-bold text-ink-900">Production lock</h3>
              <LockControls mappingId={mapping.id} lock={lock.data} versions={list} />
            </div>
          )}
          <div>
            <h3 className="mb-2 font-bold text-ink-900">Audit trail</h3>
            <AuditTrail mappingId={mapping.id} />
          </div>
        </div>
      </div>
      {open && (
        <div className="mt-5 border-t border-paper-300 pt-4">
          <div className="mb-2 flex justify-end"><Button size="sm" variant="ghost" onClick={() => setOpen(null)}>Close</Button></div>
          {open.kind === 'view' ? <>
              <VersionView mappingId={mapping.id} number={open.n} />
              {versionThreads?.(open.n)}
            </> : <CompareView mappingId={mapping.id} from={open.from} to={open.to} names={names} />}
        </div>
      )}
    </Section>
  );
}
