import { useRef } from 'react';
import { useNavigate } from 'react-router';
import { isApiError } from '../../../lib/api-client';
import { DuplicateLink, duplicateOf } from './duplicate-link';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { paths } from '../../../lib/paths';
import { createMoleculeBody, type CreateMoleculeBody } from '../../../shared/molecules';
import { useCreateMolecule } from '../api/create-molecule';
import { SmilesPreview } from './smiles-preview';

const initial = { name: '', smiles: '', notes: '', tags: '' };

/** A molecule from SMILES: an instant preview while typing, the server's verdict on submit. */
export function CreateMoleculeForm({ projectId }: { projectId: number }) {
  const create = useCreateMolecule(projectId);
  const navigate = useNavigate();
  const form = useForm(createMoleculeBody, initial, {
    serverError: create.error,
    toInput: (v) => ({
      name: v.name,
      smiles: v.smiles,
      notes: v.notes.trim() || undefined,
      tags: v.tags.split(',').map((t) => t.trim()).filter(Boolean),
    }),
  });
  const last = useRef<CreateMoleculeBody | null>(null);
  const send = (body: CreateMoleculeBody) => {
    last.current = body;
    create.mutate(body, { onSuccess: (m) => navigate(paths.molecule(m.id)) });
  };
  const submit = form.handleSubmit((body) => send(body));
  // The same structure is already in the project: say which molecule, link it, offer to add it anyway.
  const duplicate = isApiError(create.error) ? duplicateOf(create.error.code, create.error.details) : null;
  // Chemistry refusals (unreadable SMILES, unsupported elements) come back as one message about the structure.
  const chemError = create.error && !duplicate && !form.error('smiles') && !form.error('name') ? create.error : null;

  return (
    <form noValidate aria-label="New molecule from SMILES" onSubmit={submit} className="grid gap-5 md:grid-cols-[1fr_auto]">
      <div className="flex flex-col gap-4">
        <TextField label="Name" autoComplete="off" {...form.field('name')} />
        <TextField label="SMILES" autoComplete="off" spellCheck={false} {...form.field('smiles')} />
        <TextAreaField label="Notes" rows={2} {...form.field('notes')} />
        <TextField label="Tags" hint="Separated by commas, e.g. surfactant, drug." autoComplete="off" {...form.field('tags')} />
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
      <SmilesPreview smiles={form.values.smiles} />
    </form>
  );
}
