import { useRef } from 'react';
import { useWatch } from 'react-hook-form';
import { useNavigate } from 'react-router';
import { z } from 'zod';
import { isApiError } from '../../../lib/api-client';
import { DuplicateLink, duplicateOf } from './duplicate-link';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { paths } from '../../../lib/paths';
import { serverFieldErrors } from '../../../lib/server-field-errors';
import { createMoleculeBody, type CreateMoleculeBody } from '../../../shared/molecules';
import { useCreateMolecule } from '../api/create-molecule';
import { SmilesPreview } from './smiles-preview';

// What the inputs hold, turned into the shared body: empty notes are none, tags are comma-separated.
const schema = z
  .object({ name: z.string(), smiles: z.string(), notes: z.string(), tags: z.string() })
  .transform((v): z.input<typeof createMoleculeBody> => ({
    name: v.name,
    smiles: v.smiles,
    notes: v.notes.trim() || undefined,
    tags: v.tags.split(',').map((t) => t.trim()).filter(Boolean),
  }))
  .pipe(createMoleculeBody);

/** A molecule from SMILES: an instant preview while typing, the server's verdict on submit. */
export function CreateMoleculeForm({ projectId }: { projectId: number }) {
  const create = useCreateMolecule(projectId);
  const navigate = useNavigate();
  const form = useZodForm(schema, { name: '', smiles: '', notes: '', tags: '' });
  const smiles = useWatch({ control: form.control, name: 'smiles' });
  const last = useRef<CreateMoleculeBody | null>(null);
  const send = (body: CreateMoleculeBody) => {
    last.current = body;
    create.mutate(body, { onSuccess: (m) => navigate(paths.molecule(m.id)) });
  };
  // The same structure is already in the project: say which molecule, link it, offer to add it anyway.
  const duplicate = isApiError(create.error) ? duplicateOf(create.error.code, create.error.details) : null;
  // Chemistry refusals (unreadable SMILES, unsupported elements) come back as one message about the structure;
  // a message about the name or the SMILES field shows beside that field instead.
  const fieldRefusal = serverFieldErrors(create.error);
  const fieldError = form.formState.errors.smiles || form.formState.errors.name || fieldRefusal.smiles || fieldRefusal.name;
  const chemError = create.error && !duplicate && !fieldError ? create.error : null;

  return (
    <Form form={form} serverError={create.error} onSubmit={send} aria-label="New molecule from SMILES" className="grid gap-5 md:grid-cols-[1fr_auto]">
      <div className="flex flex-col gap-4">
        <FormField name="name" label="Name" autoComplete="off" />
        <FormField name="smiles" label="SMILES" autoComplete="off" spellCheck={false} />
        <FormField name="notes" label="Notes" as="textarea" rows={2} />
        <FormField name="tags" label="Tags" hint="Separated by commas, e.g. surfactant, drug." autoComplete="off" />
        {chemError && <ErrorAlert error={chemError} />}
        {duplicate && (
          <div role="alert" className="flex flex-col items-start gap-2 rounded-md border border-alert-600/30 bg-alert-50 px-3 py-2 text-sm text-alert-700">
            <p><DuplicateLink duplicate={duplicate} /> Open it, or add this one as a separate molecule (e.g. for another atom order).</p>
            <Button size="sm" variant="secondary" pending={create.isPending} onClick={() => last.current && send({ ...last.current, allowDuplicate: true })}>Add it anyway</Button>
          </div>
        )}
        <div>
          <Button type="submit" pending={create.isPending} pendingText="Checking the structure…">Add molecule</Button>
        </div>
      </div>
      <SmilesPreview smiles={smiles} />
    </Form>
  );
}
