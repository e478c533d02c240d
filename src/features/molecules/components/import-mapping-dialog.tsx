import { useState, type ChangeEvent } from 'react';
import { z } from 'zod';
import { useNavigate } from 'react-router';
import { ErrorAlert, errorMessage } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { Modal } from '../../../components/ui/modal';
import { useZodForm } from '../../../hooks/use-zod-form';
import { isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import type { MoleculeDetail } from '../../../shared/molecules';
import { useImportMapping, usePreviewImport, type ImportFile } from '../api/import-mapping';
import { ImportPreviewSummary } from './import-preview-summary';

// The chosen file; what it holds is checked when it is read (JSON, then the server's preview).
const schema = z.object({ file: z.custom<FileList | undefined>() });

/**
 * Import a mapping from a JSON export onto this molecule: choose the file, see where its beads land
 * (the server matches the file's structure to the molecule and writes nothing yet), then import. A
 * file edited after export is refused by its hash check until the person confirms once more.
 */
export function ImportMappingDialog({ molecule, onClose }: { molecule: MoleculeDetail; onClose(): void }) {
  const navigate = useNavigate();
  const preview = usePreviewImport(molecule.id);
  const save = useImportMapping(molecule.id);
  const [file, setFile] = useState<{ name: string; body: ImportFile } | null>(null);
  const form = useZodForm(schema, { file: undefined });
  const setReadError = (message: string) => form.setError('file', { message });
  const hashRefused = isApiError(save.error) && save.error.code === 'content_hash_mismatch';

  const choose = async (chosen: File | undefined) => {
    setFile(null);
    form.clearErrors('file');
    preview.reset();
    save.reset();
    if (!chosen) return;
    let body: unknown;
    try {
      body = JSON.parse(await chosen.text());
    } catch {
      return setReadError(`${chosen.name} is not JSON. Choose a mapping exported from Beadloom as JSON.`);
    }
    if (!body || typeof body !== 'object' || Array.isArray(body)) return setReadError(`${chosen.name} is not a Beadloom mapping export.`);
    setFile({ name: chosen.name, body: body as ImportFile });
    preview.mutate(body as ImportFile);
  };
  const run = (allowModified: boolean) => file && save.mutate({ file: file.body, allowModified }, { onSuccess: (m) => navigate(paths.mapping(m.id)) });

  return (
    <Modal
      title={`Import a mapping onto ${molecule.name}`}
      onCancel={onClose}
      className="max-w-3xl"
      footer={<>
        <Button variant="secondary" onClick={onClose}>Cancel</Button>
        {hashRefused ? (
          <Button variant="danger" pending={save.isPending} onClick={() => run(true)}>Import the edited file</Button>
        ) : (
          <Button disabled={!preview.data} pending={save.isPending} onClick={() => run(false)}>Import</Button>
        )}
      </>}
    >
      {/* The file is read and previewed as soon as it is chosen; the form ties the field to its label and error. */}
      <Form form={form} onSubmit={() => undefined}>
        <FormField
          name="file"
          label="Mapping file (JSON export)"
          type="file"
          accept=".json,application/json"
          onChange={(e: ChangeEvent<HTMLInputElement>) => void choose(e.target.files?.[0])}
          controlClassName="border-0 bg-transparent px-0 py-0 text-sm"
        />
      </Form>
      {preview.isPending && <p role="status">Matching {file?.name} to {molecule.name}…</p>}
      <ErrorAlert error={preview.error} />
      {preview.data && <ImportPreviewSummary preview={preview.data} molecule={molecule} />}
      {hashRefused ? (
        <div role="alert" className="rounded-md border border-alert-600/30 bg-alert-50 px-3 py-2 text-alert-700">
          <p className="font-semibold">This file was changed after it was exported.</p>
          <p>{errorMessage(save.error)} Import it anyway? The new mapping and its audit trail will say that the file was edited.</p>
        </div>
      ) : (
        <ErrorAlert error={save.error} />
      )}
    </Modal>
  );
}
