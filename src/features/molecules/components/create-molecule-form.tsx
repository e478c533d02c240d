import { useNavigate } from 'react-router';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { paths } from '../../../lib/paths';
import { createMoleculeBody } from '../../../shared/molecules';
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
  const submit = form.handleSubmit((body) => create.mutate(body, { onSuccess: (m) => navigate(paths.molecule(m.id)) }));
  // Chemistry refusals (unreadable SMILES, unsupported elements) come back as one message about the structure.
  const chemError = create.error && !form.error('smiles') && !form.error('name') ? create.error : null;

  return (
    <form noValidate aria-label="New molecule from SMILES" onSubmit={submit} className="grid gap-5 md:grid-cols-[1fr_auto]">
      <div className="flex flex-col gap-4">
        <TextField label="Name" autoComplete="off" {...form.field('name')} />
        <TextField label="SMILES" autoComplete="off" spellCheck={false} {...form.field('smiles')} />
        <TextAreaField label="Notes" rows={2} {...form.field('notes')} />
        <TextField label="Tags" hint="Separated by commas, e.g. surfactant, drug." autoComplete="off" {...form.field('tags')} />
        {chemError && <ErrorAlert error={chemError} />}
        <div>
          <Button type="submit" pending={create.isPending} pendingText="Checking the structure…">Add molecule</Button>
        </div>
      </div>
      <SmilesPreview smiles={form.values.smiles} />
    </form>
  );
}
