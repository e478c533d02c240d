import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { useCan } from '../../../lib/authorization';
import { isApiError } from '../../../lib/api-client';
import { useReferences } from '../api/get-references';
import { useUploadReference } from '../api/upload-reference';
import { useDeleteReference } from '../api/delete-reference';
import { MatchAgainForm } from './match-again-form';
import { ProgressBar } from './progress-bar';

const STATUS: Record<string, string> = { queued: 'Queued', matching: 'Finding copies', ready: 'Ready', failed: 'Failed' };

/** A molecule's atomistic references: upload (with progress) and the list with each one's state. */
export function ReferencesPanel({ moleculeId, projectId }: { moleculeId: number; projectId: number }) {
  const canUpload = useCan('reference:create', projectId);
  const refs = useReferences(moleculeId);
  const [sent, setSent] = useState(0);
  const upload = useUploadReference(moleculeId, setSent);
  const remove = useDeleteReference(moleculeId);
  const [name, setName] = useState('');
  const [selection, setSelection] = useState('');
  const [structure, setStructure] = useState<File | null>(null);
  const [trajectory, setTrajectory] = useState<File | null>(null);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!structure) return;
    setSent(0);
    upload.mutate({ name, structure, trajectory, selection }, { onSuccess: () => setName('') });
  };

  return (
    <div className="flex flex-col gap-4">
      {refs.data && refs.data.length === 0 && <p className="text-sm text-ink-600">No reference simulation yet.</p>}
      <ul className="flex flex-col gap-2" aria-label="References">
        {refs.data?.map((r) => (
          <li key={r.id} className="rounded border border-paper-300 p-2 text-sm">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span className="font-semibold text-ink-900">{r.name}</span>
              <span className="text-ink-700">{STATUS[r.status]}</span>
            </div>
            {r.status === 'ready' && <p className="text-ink-600">{r.copies} copies × {r.frames} frames, {r.atomsPerCopy} atoms per copy</p>}
            {(r.status === 'queued' || r.status === 'matching') && <ProgressBar progress={{ done: Math.round(r.progress.done / 10), total: r.progress.total ? 100 : 0 }} label={`Matching ${r.name}`} />}
            {r.error && <p role="alert" className="text-alert-700">{r.error.message}</p>}
            {canUpload && r.status === 'failed' && r.error?.retryable && <MatchAgainForm moleculeId={moleculeId} referenceId={r.id} name={r.name} />}
            {canUpload && (
              <Button size="sm" variant="ghost" onClick={() => remove.mutate(r.id)} aria-label={`Delete reference ${r.name}`}>
                Delete
              </Button>
            )}
          </li>
        ))}
      </ul>
      {canUpload && (
        <form onSubmit={submit} className="flex flex-col gap-2 text-sm" aria-label="Upload a reference">
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Name</span>
            <input className="rounded border border-ink-300 px-2 py-1" value={name} onChange={(e) => setName(e.target.value)} maxLength={200} />
          </label>
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Structure (.gro, .pdb, .mol)</span>
            <input type="file" accept=".gro,.pdb,.ent,.mol,.sdf" required onChange={(e) => setStructure(e.target.files?.[0] ?? null)} />
          </label>
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Trajectory (optional: .xtc, .trr, .dcd, .pdb, .gro, .xyz)</span>
            <input type="file" accept=".xtc,.trr,.dcd,.pdb,.gro,.xyz" onChange={(e) => setTrajectory(e.target.files?.[0] ?? null)} />
          </label>
          <label className="flex flex-col gap-1">
            <span className="font-semibold">Where to look (optional)</span>
            <input className="rounded border border-ink-300 px-2 py-1 font-mono" value={selection} onChange={(e) => setSelection(e.target.value)} placeholder='{ "residue": "SDS" }' aria-describedby="selection-hint" />
            <span id="selection-hint" className="text-xs text-ink-600">
              A residue name, or {'{ "start": 1, "atomsPerCopy": 42, "copies": 100 }'} (1-based). Leave empty to search the whole system.
            </span>
          </label>
          {upload.isPending && <ProgressBar progress={{ done: Math.round(sent * 100), total: 100 }} label="Upload" />}
          {upload.error && <p role="alert" className="text-alert-700">{isApiError(upload.error) ? upload.error.message : 'The upload failed.'}</p>}
          <Button type="submit" size="sm" disabled={!structure || upload.isPending}>
            Upload reference
          </Button>
        </form>
      )}
    </div>
  );
}
