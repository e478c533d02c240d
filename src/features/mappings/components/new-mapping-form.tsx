import { useNavigate } from 'react-router';
import { z } from 'zod';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form, FormError } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { paths } from '../../../lib/paths';
import { serverFieldErrors } from '../../../lib/server-field-errors';
import { createMappingBody, mappingStart, RESOLUTIONS } from '../../../shared/mappings';
import { useCreateMapping } from '../api/create-mapping';
import { useMappings } from '../api/get-mappings';
import { useProjectMappings } from '../api/get-project-mappings';

const resolutionOptions = RESOLUTIONS.map((r) => ({ value: r, label: `${r} (about ${r[0]} heavy atoms a bead)` }));

// "Start from" holds '' (empty), 'proposal', 'copy:<id>' (a mapping of this molecule) or 'transfer:<id>'
// (a mapping of another molecule of the project, carried over through their common substructure).
function startOf(value: string): z.input<typeof mappingStart> {
  const [kind, id] = value.split(':');
  if (kind === 'proposal') return 'proposal';
  if (kind === 'copy') return { copyOf: Number(id) };
  if (kind === 'transfer') return { transferFrom: Number(id) };
  return 'empty';
}

const schema = z
  .object({ name: z.string(), resolution: z.enum(RESOLUTIONS), start: z.string() })
  .transform(({ start, ...rest }): z.input<typeof createMappingBody> => ({ ...rest, start: startOf(start) }))
  .pipe(createMappingBody);

/**
 * A new mapping of the molecule: empty, the automatic proposal, a copy of another mapping of this
 * molecule, or a transfer from a mapping of another molecule of the project.
 */
export function NewMappingForm({ moleculeId, projectId }: { moleculeId: number; projectId: number }) {
  const create = useCreateMapping(moleculeId);
  const mappings = useMappings(moleculeId);
  const projectMappings = useProjectMappings(projectId);
  const navigate = useNavigate();
  const form = useZodForm(schema, { name: '', resolution: '4:1', start: '' });
  const startOptions = [
    { value: '', label: 'Empty: every atom unassigned' },
    { value: 'proposal', label: 'Automatic proposal (edit it together afterwards)' },
    ...(mappings.data ?? []).map((m) => ({ value: `copy:${m.id}`, label: `Copy of “${m.name}”` })),
    ...(projectMappings.data ?? []).filter((m) => m.moleculeId !== moleculeId).map((m) => ({ value: `transfer:${m.id}`, label: `Transfer from ${m.moleculeName}: “${m.name}”` })),
  ];
  // A refusal about the name shows beside the name; anything else as an alert.
  const nameRefused = !!serverFieldErrors(create.error).name;

  return (
    <Form
      form={form}
      serverError={create.error}
      onSubmit={(body) => create.mutate(body, { onSuccess: (m) => navigate(paths.mapping(m.id)) })}
      aria-label="New mapping"
      className="flex flex-col gap-4"
    >
      <FormField name="name" label="Mapping name" autoComplete="off" />
      <FormField name="resolution" label="Target resolution" as="select" options={resolutionOptions} />
      <FormField name="start" label="Start from" as="select" options={startOptions} />
      <FormError />
      {create.isError && !nameRefused && <ErrorAlert error={create.error} />}
      <div>
        <Button type="submit" pending={create.isPending} pendingText="Creating…">Create and open</Button>
      </div>
    </Form>
  );
}
