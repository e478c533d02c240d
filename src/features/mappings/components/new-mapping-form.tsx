import { useNavigate } from 'react-router';
import { z } from 'zod';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form, FormError } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { paths } from '../../../lib/paths';
import { serverFieldErrors } from '../../../lib/server-field-errors';
import { createMappingBody, RESOLUTIONS } from '../../../shared/mappings';
import { useCreateMapping } from '../api/create-mapping';
import { useMappings } from '../api/get-mappings';

const resolutionOptions = RESOLUTIONS.map((r) => ({ value: r, label: `${r} (about ${r[0]} heavy atoms a bead)` }));

// "Start from" holds '' (empty) or the id of the mapping to copy.
const schema = z
  .object({ name: z.string(), resolution: createMappingBody.shape.resolution, start: z.string() })
  .transform(({ start, ...rest }) => ({ ...rest, ...(start ? { copyOf: Number(start) } : {}) }))
  .pipe(createMappingBody);

/** A new mapping of the molecule: empty, or starting as a copy of another mapping's draft. */
export function NewMappingForm({ moleculeId }: { moleculeId: number }) {
  const create = useCreateMapping(moleculeId);
  const mappings = useMappings(moleculeId);
  const navigate = useNavigate();
  const form = useZodForm(schema, { name: '', resolution: '4:1', start: '' });
  const startOptions = [{ value: '', label: 'Empty: every atom unassigned' }, ...(mappings.data ?? []).map((m) => ({ value: String(m.id), label: `Copy of “${m.name}”` }))];
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
