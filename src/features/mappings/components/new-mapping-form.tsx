import { useEffect } from 'react';
import { useNavigate } from 'react-router';
import { z } from 'zod';
import { ErrorAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form, FormError } from '../../../components/ui/form';
import { FormField } from '../../../components/ui/form-field';
import { useZodForm } from '../../../hooks/use-zod-form';
import { formatDate } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { serverFieldErrors } from '../../../lib/server-field-errors';
import { createMappingBody, mappingStart, RESOLUTIONS, type SourceVersion } from '../../../shared/mappings';
import { useCreateMapping } from '../api/create-mapping';
import { useMappings } from '../api/get-mappings';
import { useProjectMappings } from '../api/get-project-mappings';
import { useSourceVersions } from '../api/get-source-versions';
import type { TransferReportState } from './transfer-report';

const resolutionOptions = RESOLUTIONS.map((r) => ({ value: r, label: `${r} (about ${r[0]} heavy atoms a bead)` }));

// "Start from" holds '' (empty), 'proposal', 'copy:<id>' (a mapping of this molecule) or 'transfer:<id>'
// (a mapping of another molecule of the project, carried over through their common substructure).
// "Version" holds 'draft', 'production' or a saved version's number, for a copy or a transfer.
const sourceOf = (start: string): number | null => (/^(copy|transfer):\d+$/.test(start) ? Number(start.split(':')[1]) : null);
const versionOf = (v: string): SourceVersion => (v === 'draft' || v === 'production' ? v : Number(v));

function startOf(value: string, version: string): z.input<typeof mappingStart> {
  const [kind, id] = value.split(':');
  if (kind === 'proposal') return 'proposal';
  if (kind === 'copy') return { copyOf: Number(id), version: versionOf(version) };
  if (kind === 'transfer') return { transferFrom: Number(id), version: versionOf(version) };
  return 'empty';
}

const schema = z
  .object({ name: z.string(), resolution: z.enum(RESOLUTIONS), start: z.string(), version: z.string() })
  .transform(({ start, version, ...rest }): z.input<typeof createMappingBody> => ({ ...rest, start: startOf(start, version) }))
  .pipe(createMappingBody);

/**
 * A new mapping of the molecule: empty, the automatic proposal, a copy of another mapping of this
 * molecule, or a transfer from a mapping of another molecule of the project — a copy or a transfer
 * from the source's draft, its production version or any saved version. After a transfer the mapping
 * opens with the transfer report on show.
 */
export function NewMappingForm({ moleculeId, projectId }: { moleculeId: number; projectId: number }) {
  const create = useCreateMapping(moleculeId);
  const mappings = useMappings(moleculeId);
  const projectMappings = useProjectMappings(projectId);
  const navigate = useNavigate();
  const form = useZodForm(schema, { name: '', resolution: '4:1', start: '', version: 'draft' });
  const start = form.watch('start');
  const sourceId = sourceOf(start);
  const versions = useSourceVersions(sourceId);
  const transferable = (projectMappings.data ?? []).filter((m) => m.moleculeId !== moleculeId);
  const source = [...(mappings.data ?? []), ...transferable].find((m) => m.id === sourceId);
  const startOptions = [
    { value: '', label: 'Empty: every atom unassigned' },
    { value: 'proposal', label: 'Automatic proposal (edit it together afterwards)' },
    ...(mappings.data ?? []).map((m) => ({ value: `copy:${m.id}`, label: `Copy of “${m.name}”` })),
    ...transferable.map((m) => ({ value: `transfer:${m.id}`, label: `Transfer from ${m.moleculeName}: “${m.name}”` })),
  ];
  const versionOptions = [
    { value: 'draft', label: 'Its draft (as it is now)' },
    ...(source?.locked ? [{ value: 'production', label: 'Its production version (locked)' }] : []),
    ...(versions.data ?? [])
      .slice()
      .sort((a, b) => b.number - a.number)
      .map((v) => ({ value: String(v.number), label: `Version ${v.number}${v.production ? ' (production)' : ''} · ${formatDate(v.createdAt)}${v.message ? ` · ${v.message.slice(0, 60)}` : ''}` })),
  ];
  // A new source starts from its draft again.
  const { setValue } = form;
  useEffect(() => setValue('version', 'draft'), [sourceId, setValue]);
  // A refusal about the name shows beside the name; anything else as an alert.
  const nameRefused = !!serverFieldErrors(create.error).name;

  return (
    <Form
      form={form}
      serverError={create.error}
      onSubmit={(body) =>
        create.mutate(body, {
          onSuccess: (m) => navigate(paths.mapping(m.id), m.transfer ? { state: { transfer: m.transfer } satisfies TransferReportState } : undefined),
        })
      }
      aria-label="New mapping"
      className="flex flex-col gap-4"
    >
      <FormField name="name" label="Mapping name" autoComplete="off" />
      <FormField name="resolution" label="Target resolution" as="select" options={resolutionOptions} />
      <FormField name="start" label="Start from" as="select" options={startOptions} />
      {sourceId !== null && (
        <FormField
          name="version"
          label="Version of the source"
          as="select"
          options={versionOptions}
          hint={versions.isPending ? 'Loading its saved versions…' : 'The draft, the locked production version or any saved version.'}
        />
      )}
      <FormError />
      {create.isError && !nameRefused && <ErrorAlert error={create.error} />}
      <div>
        <Button type="submit" pending={create.isPending} pendingText="Creating…">Create and open</Button>
      </div>
    </Form>
  );
}
