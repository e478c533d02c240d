import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import type { VersionSummary } from '../../../shared/versions';

interface RestoreDialogProps {
  version: VersionSummary;
  /** Beads in the draft now (the editor's live count when the page has one). */
  draftBeads: number;
  /** The newest version, which the draft is compared with before it is replaced. */
  newest: number;
  pending: boolean;
  onConfirm(): void;
  onCancel(): void;
}

/** Says what a restore replaces and how the draft is kept before it does. */
export function RestoreDialog({ version, draftBeads, newest, pending, onConfirm, onCancel }: RestoreDialogProps) {
  const n = version.number;
  return (
    <ConfirmDialog title={`Restore version ${n} into the draft?`} confirmLabel={`Restore version ${n}`} pending={pending} onConfirm={onConfirm} onCancel={onCancel}>
      <p>
        The whole draft — its {draftBeads} {draftBeads === 1 ? 'bead' : 'beads'}, their names, types, centre rules and atoms — is replaced by
        version {n} ({version.beadCount} {version.beadCount === 1 ? 'bead' : 'beads'}{version.message ? `, “${version.message}”` : ''}) for everyone editing it.
      </p>
      <p>
        If the draft differs from version {newest}, it is first saved as a new version “before restore of v{n}”, so nothing is lost.
        In the editor, Undo takes the restore back.
      </p>
    </ConfirmDialog>
  );
}
