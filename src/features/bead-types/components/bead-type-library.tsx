import { useEffect, useState } from 'react';
import { ErrorAlert, Notice } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { putBeadTypesBody, type BeadTypeRow } from '../../../shared/bead-types';
import { beadTypesCsvUrl, useBeadTypes } from '../api/get-bead-types';
import { usePutBeadTypes } from '../api/put-bead-types';
import { CsvImportButton } from './csv-import-button';
import { BeadTypeRowEditor } from './bead-type-row';

const blank = (): BeadTypeRow => ({ name: '', heavyAtomsPerBead: 4, charge: 0, deltaGMin: -5, deltaGMax: 5, description: '' });

/** The project's bead type library: a table everyone reads and modellers edit, saved as a whole. */
export function BeadTypeLibrary({ projectId, canEdit }: { projectId: number; canEdit: boolean }) {
  const library = useBeadTypes(projectId);
  const save = usePutBeadTypes(projectId);
  const [rows, setRows] = useState<BeadTypeRow[] | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [editing, setEditing] = useState(false);
  const editable = canEdit && editing;
  useEffect(() => {
    if (library.data) setRows(library.data.types);
  }, [library.data]);

  if (library.isPending || !rows) return <Loading label="Loading the bead type library…" />;
  if (library.isError) return <ErrorAlert error={library.error} />;
  const dirty = JSON.stringify(rows) !== JSON.stringify(library.data.types);

  const submit = () => {
    const parsed = putBeadTypesBody.safeParse({ types: rows });
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const row = typeof issue.path[1] === 'number' ? ` (row ${issue.path[1] + 1})` : '';
      return setProblem(`${issue.message}${row}`);
    }
    setProblem(null);
    save.mutate(parsed.data, { onSuccess: () => setEditing(false) });
  };

  return (
    <div className="flex flex-col gap-3">
      {library.data.note && <p role="note" className="rounded-md border border-paper-300 bg-paper-100 px-3 py-2 text-sm text-ink-700">{library.data.note}</p>}
      <div className="overflow-x-auto">
        <table aria-label="Bead types" className="w-full border-collapse text-sm">
          <thead>
            <tr className="border-b border-paper-300 text-left text-xs text-ink-600">
              {['Name', 'Heavy atoms per bead', 'Charge', 'ΔG_OW min (kJ/mol)', 'ΔG_OW max (kJ/mol)', 'Description', ...(editable ? [''] : [])].map((h, i) => (
                <th key={i} scope="col" className="px-2 py-1.5 font-semibold whitespace-nowrap">{h || <span className="sr-only">Actions</span>}</th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((row, i) => (
              <BeadTypeRowEditor
                key={i}
                row={row}
                index={i}
                canEdit={editable}
                onChange={(next) => setRows(rows.map((r, j) => (j === i ? next : r)))}
                onRemove={() => setRows(rows.filter((_, j) => j !== i))}
              />
            ))}
          </tbody>
        </table>
      </div>
      {rows.length === 0 && <p className="text-sm text-ink-600">The library is empty, so beads get no type suggestions.</p>}
      {problem && <ErrorAlert>{problem}</ErrorAlert>}
      {save.isError && <ErrorAlert error={save.error} />}
      {save.isSuccess && !dirty && <Notice>The library is saved; open mappings re-evaluate with it.</Notice>}
      <div className="flex flex-wrap items-center gap-2">
        {canEdit && !editing && <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>Edit library</Button>}
        {editable && (
          <>
            <Button variant="secondary" size="sm" onClick={() => setRows([...rows, blank()])}>Add a type</Button>
            <Button size="sm" disabled={!dirty} pending={save.isPending} pendingText="Saving…" onClick={submit}>Save library</Button>
            <Button variant="ghost" size="sm" onClick={() => (setRows(library.data.types), setEditing(false), setProblem(null))}>{dirty ? 'Discard changes' : 'Done'}</Button>
            <CsvImportButton onImport={(csv) => save.mutate({ csv }, { onSuccess: () => setEditing(false) })} pending={save.isPending} />
          </>
        )}
        <a href={beadTypesCsvUrl(projectId)} download className="rounded-md px-2.5 py-1 text-sm font-semibold text-ink-700 underline decoration-ink-300 underline-offset-2 hover:decoration-ink-700">
          Export CSV
        </a>
      </div>
    </div>
  );
}
