import { useState, type ReactNode } from 'react';
import { useFieldArray } from 'react-hook-form';
import { z } from 'zod';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Form } from '../../../components/ui/form';
import { Loading } from '../../../components/ui/loading';
import { useZodForm } from '../../../hooks/use-zod-form';
import { putBeadTypesBody, type BeadTypeLibrary as Library, type BeadTypeRow } from '../../../shared/bead-types';
import { beadTypesCsvUrl, useBeadTypes } from '../api/get-bead-types';
import { usePutBeadTypes } from '../api/put-bead-types';
import { CsvImportButton } from './csv-import-button';
import { BeadTypeRowEditor, BeadTypeRowView } from './bead-type-row';

// The inputs hold text; numbers are read from it (empty is "no number"), then the route's own schema.
const number = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));
const rowText = z.object({ name: z.string(), heavyAtomsPerBead: z.string(), charge: z.string(), deltaGMin: z.string(), deltaGMax: z.string(), description: z.string() });
const schema = z
  .object({ types: z.array(rowText) })
  .transform((v): z.input<typeof putBeadTypesBody> => ({
    types: v.types.map((t) => ({ ...t, heavyAtomsPerBead: number(t.heavyAtomsPerBead) as BeadTypeRow['heavyAtomsPerBead'], charge: number(t.charge), deltaGMin: number(t.deltaGMin), deltaGMax: number(t.deltaGMax) })),
  }))
  .pipe(putBeadTypesBody);
type RowText = z.input<typeof rowText>;

const asText = (t: BeadTypeRow): RowText => ({ ...t, heavyAtomsPerBead: String(t.heavyAtomsPerBead), charge: String(t.charge), deltaGMin: String(t.deltaGMin), deltaGMax: String(t.deltaGMax) });
const blank: RowText = { name: '', heavyAtomsPerBead: '4', charge: '0', deltaGMin: '-5', deltaGMax: '5', description: '' };

const HEADERS = ['Name', 'Heavy atoms per bead', 'Charge', 'ΔG_OW min (kJ/mol)', 'ΔG_OW max (kJ/mol)', 'Description'];

/** The project's bead type library: a table everyone reads and modellers edit, saved as a whole. */
export function BeadTypeLibrary({ projectId, canEdit }: { projectId: number; canEdit: boolean }) {
  const library = useBeadTypes(projectId);
  const save = usePutBeadTypes(projectId);
  const [editing, setEditing] = useState(false);

  if (library.isPending) return <Loading label="Loading the bead type library…" />;
  if (library.isError) return <ErrorAlert error={library.error} />;
  const exportLink = (
    <a href={beadTypesCsvUrl(projectId)} download className="rounded-md px-2.5 py-1 text-sm font-semibold text-ink-700 underline decoration-ink-300 underline-offset-2 hover:decoration-ink-700">
      Export CSV
    </a>
  );

  return (
    <div className="flex flex-col gap-3">
      {library.data.note && <p role="note" className="rounded-md border border-paper-300 bg-paper-100 px-3 py-2 text-sm text-ink-700">{library.data.note}</p>}
      {canEdit && editing ? (
        // A fresh form for each saved state of the library, so it starts from what the server holds.
        <LibraryForm key={library.data.updatedAt ?? ''} save={save} library={library.data} onDone={() => setEditing(false)} exportLink={exportLink} />
      ) : (
        <>
          <LibraryTable editable={false}>{library.data.types.map((row, i) => <BeadTypeRowView key={i} row={row} />)}</LibraryTable>
          {library.data.types.length === 0 && <p className="text-sm text-ink-600">The library is empty, so beads get no type suggestions.</p>}
          {save.isSuccess && <Notice>The library is saved; open mappings re-evaluate with it.</Notice>}
          <div className="flex flex-wrap items-center gap-2">
            {canEdit && (
              <Button
                variant="secondary"
                size="sm"
                onClick={() => {
                  save.reset();
                  setEditing(true);
                }}
              >
                Edit library
              </Button>
            )}
            {exportLink}
          </div>
        </>
      )}
    </div>
  );
}

function LibraryTable({ editable, children }: { editable: boolean; children: ReactNode }) {
  return (
    <div className="overflow-x-auto">
      <table aria-label="Bead types" className="w-full border-collapse text-sm">
        <thead>
          <tr className="border-b border-paper-300 text-left text-xs text-ink-600">
            {[...HEADERS, ...(editable ? [''] : [])].map((h, i) => (
              <th key={i} scope="col" className="px-2 py-1.5 font-semibold whitespace-nowrap">{h || <span className="sr-only">Actions</span>}</th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

function LibraryForm({ save, library, onDone, exportLink }: { save: ReturnType<typeof usePutBeadTypes>; library: Library; onDone(): void; exportLink: ReactNode }) {
  const form = useZodForm(schema, { types: library.types.map(asText) });
  const rows = useFieldArray({ control: form.control, name: 'types' });
  const dirty = form.formState.isDirty;
  // A rule over the whole table (unique names) comes back under `types`.
  const tableError = form.formState.errors.types?.root?.message ?? form.formState.errors.types?.message;

  return (
    <Form form={form} serverError={save.error} onSubmit={(body) => save.mutate(body, { onSuccess: onDone })} aria-label="Edit the bead type library" className="flex flex-col gap-3">
      <LibraryTable editable>
        {rows.fields.map((field, i) => <BeadTypeRowEditor key={field.id} index={i} onRemove={() => rows.remove(i)} />)}
      </LibraryTable>
      {rows.fields.length === 0 && <p className="text-sm text-ink-600">The library is empty, so beads get no type suggestions.</p>}
      {tableError && <ErrorAlert>{tableError}</ErrorAlert>}
      {save.isError && <ErrorAlert error={save.error} />}
      <div className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" size="sm" onClick={() => rows.append(blank)}>Add a type</Button>
        <Button type="submit" size="sm" disabled={!dirty} pending={save.isPending} pendingText="Saving…">Save library</Button>
        <Button variant="ghost" size="sm" onClick={onDone}>{dirty ? 'Discard changes' : 'Done'}</Button>
        <CsvImportButton onImport={(csv) => save.mutate({ csv }, { onSuccess: onDone })} pending={save.isPending} />
        {exportLink}
      </div>
    </Form>
  );
}
