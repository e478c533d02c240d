import { useNavigate } from 'react-router';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useForm } from '../../../hooks/use-form';
import { paths } from '../../../lib/paths';
import { createMappingBody, RESOLUTIONS } from '../../../shared/mappings';
import { useCreateMapping } from '../api/create-mapping';
import { useMappings } from '../api/get-mappings';

const resolutionOptions = RESOLUTIONS.map((r) => ({ value: r, label: `${r} (about ${r[0]} heavy atoms a bead)` }));

/** A new mapping of the molecule: empty, or starting as a copy of another mapping's draft. */
export function NewMappingForm({ moleculeId }: { moleculeId: number }) {
  const create = useCreateMapping(moleculeId);
  const mappings = useMappings(moleculeId);
  const navigate = useNavigate();
  const form = useForm(createMappingBody, { name: '', resolution: '4:1', start: '' }, {
    serverError: create.error,
    toInput: (v) => ({ name: v.name, resolution: v.resolution, ...(v.start ? { copyOf: Number(v.start) } : {}) }),
  });
  const startOptions = [{ value: '', label: 'Empty: every atom unassigned' }, ...(mappings.data ?? []).map((m) => ({ value: String(m.id), label: `Copy of “${m.name}”` }))];
  const submit = form.handleSubmit((body) => create.mutate(body, { onSuccess: (m) => navigate(paths.mapping(m.id)) }));

  return (
    <form noValidate aria-label="New mapping" onSubmit={submit} className="flex flex-col gap-4">
      <TextField label="Mapping name" autoComplete="off" {...form.field('name')} />
      <SelectField label="Target resolution" options={resolutionOptions} {...form.field('resolution')} />
      <SelectField label="Start from" options={startOptions} {...form.field('start')} />
      {form.formError && <ErrorAlert>{form.formError}</ErrorAlert>}
      {create.isError && !form.error('name') && <ErrorAlert error={create.error} />}
      <div>
        <Button type="submit" pending={create.isPending} pendingText="Creating…">Create and open</Button>
      </div>
    </form>
  );
}
