import { useWatch } from 'react-hook-form';
import { Link } from 'react-router';
import { z } from 'zod';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { paths } from '../../../lib/paths';
import { UPLOAD_MAX_BYTES } from '../../../shared/molecules';
import { useUploadMolecules } from '../api/upload-molecules';
import { DuplicateLink, duplicateOf } from './duplicate-link';

// The file input holds a FileList; the form hands on its one file, refused above the server's limit.
const schema = z.object({
  file: z
    .custom<FileList | undefined>()
    .transform((files) => files?.[0])
    .pipe(z.instanceof(File, { message: 'Choose a molfile or SD file.' }).refine((f) => f.size <= UPLOAD_MAX_BYTES, 'That file is larger than 2 MB.')),
});

/** A molfile or SDF upload; a multi-record SDF becomes one molecule per record, each reported. */
export function UploadMoleculesForm({ projectId }: { projectId: number }) {
  const upload = useUploadMolecules(projectId);
  // Checked as soon as a file is chosen, so a file that is too large is said at once.
  const form = useZodForm(schema, { file: undefined }, { mode: 'onChange' });
  const files = useWatch({ control: form.control, name: 'file' });
  const usable = !!files?.length && !form.formState.errors.file;
  // Offered only when nothing was imported and every refusal is a duplicate: sending the file again
  // with the flag then adds exactly the refused records, never a second copy of an imported one.
  const onlyDuplicates = !!upload.data && upload.data.created === 0 && upload.data.records.every((r) => !r.ok && duplicateOf(r.error.code, r.error.details));

  return (
    <Form form={form} serverError={upload.error} onSubmit={({ file }) => upload.mutate({ file })} aria-label="Upload a structure file" className="flex flex-col gap-4">
      <FormField
        name="file"
        label="Molfile or SD file"
        type="file"
        accept=".mol,.sdf,.sd,chemical/x-mdl-molfile,chemical/x-mdl-sdfile"
        hint="Up to 2 MB. 3D coordinates in the file are kept for bead centres."
        controlClassName="border-0 bg-transparent px-0 py-0 text-sm text-ink-800 file:mr-3 file:rounded-md file:border file:border-ink-300 file:bg-paper-50 file:px-3 file:py-1.5 file:font-semibold file:text-ink-800"
      />
      {upload.isError && <ErrorAlert error={upload.error} />}
      <div>
        <Button type="submit" variant="secondary" disabled={!usable} pending={upload.isPending} pendingText="Reading the file…">Upload</Button>
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
          {onlyDuplicates && upload.variables && (
            <Button className="mt-2" size="sm" variant="secondary" pending={upload.isPending} onClick={() => upload.mutate({ file: upload.variables!.file, allowDuplicate: true })}>
              Add it anyway
            </Button>
          )}
        </div>
      )}
    </Form>
  );
}
