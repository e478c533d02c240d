import { useId, useState } from 'react';
import { Link } from 'react-router';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../lib/paths';
import { UPLOAD_MAX_BYTES } from '../../../shared/molecules';
import { useUploadMolecules } from '../api/upload-molecules';
import { DuplicateLink, duplicateOf } from './duplicate-link';

/** A molfile or SDF upload; a multi-record SDF becomes one molecule per record, each reported. */
export function UploadMoleculesForm({ projectId }: { projectId: number }) {
  const upload = useUploadMolecules(projectId);
  const [file, setFile] = useState<File | null>(null);
  const inputId = useId();
  const tooBig = file !== null && file.size > UPLOAD_MAX_BYTES;

  return (
    <form
      aria-label="Upload a structure file"
      onSubmit={(e) => {
        e.preventDefault();
        if (file && !tooBig) upload.mutate(file);
      }}
      className="flex flex-col gap-4"
    >
      <div className="flex flex-col gap-1">
        <label htmlFor={inputId} className="text-sm font-semibold text-ink-800">Molfile or SD file</label>
        <input id={inputId} type="file" accept=".mol,.sdf,.sd,chemical/x-mdl-molfile,chemical/x-mdl-sdfile" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="text-sm text-ink-800 file:mr-3 file:rounded-md file:border file:border-ink-300 file:bg-paper-50 file:px-3 file:py-1.5 file:font-semibold file:text-ink-800" />
        <p className="text-xs text-ink-600">Up to 2 MB. 3D coordinates in the file are kept for bead centres.</p>
      </div>
      {tooBig && <ErrorAlert>That file is larger than 2 MB.</ErrorAlert>}
      {upload.isError && <ErrorAlert error={upload.error} />}
      <div>
        <Button type="submit" variant="secondary" disabled={!file || tooBig} pending={upload.isPending} pendingText="Reading the file…">Upload</Button>
      </div>
      {upload.data && (
        <div role="status">
          <p className="mb-2 text-sm font-semibold text-ink-800">
            {upload.data.created} imported, {upload.data.failed} refused.
          </p>
          <ol aria-label="Records in the file" className="flex flex-col gap-1 text-sm">
            {upload.data.records.map((r) => (
              <li key={r.record} className={r.ok ? 'text-ok-700' : 'text-alert-700'}>
                <span className="font-semibold">Record {r.record}</span> {r.name && `(${r.name})`}:{' '}
                {r.ok ? (
                  <Link className="underline" to={paths.molecule(r.molecule.id)}>added as {r.molecule.name}</Link>
                ) : duplicateOf(r.error.code, r.error.details) ? (
                  <DuplicateLink duplicate={duplicateOf(r.error.code, r.error.details)!} />
                ) : (
                  r.error.message
                )}
              </li>
            ))}
          </ol>
        </div>
      )}
    </form>
  );
}
