import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-client';
import type { ReferenceSelection } from '../../../shared/references-selection';
import { useMatchReferenceAgain } from '../api/match-reference-again';

/**
 * For a reference whose search did not find the molecule (its files were kept): another place to
 * look, and matching again without uploading the files again. The server checks the selection.
 */
export function MatchAgainForm({ moleculeId, referenceId, name }: { moleculeId: number; referenceId: number; name: string }) {
  const [selection, setSelection] = useState('');
  const [notJson, setNotJson] = useState(false);
  const again = useMatchReferenceAgain(moleculeId);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    let parsed: ReferenceSelection | null = null;
    if (selection.trim()) {
      try {
        parsed = JSON.parse(selection) as ReferenceSelection;
      } catch {
        setNotJson(true);
        return;
      }
    }
    setNotJson(false);
    again.mutate({ id: referenceId, selection: parsed });
  };

  return (
    <form onSubmit={submit} className="mt-2 flex flex-col gap-1" aria-label={`Match ${name} again`}>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Look elsewhere (the files are kept)</span>
        <input className="rounded border border-ink-300 px-2 py-1 font-mono" value={selection} onChange={(e) => setSelection(e.target.value)} placeholder='{ "residue": "SDS" }' />
      </label>
      {notJson && <p role="alert" className="text-alert-700">Not JSON: write {'{ "residue": "SDS" }'} or {'{ "start": 1, "atomsPerCopy": 42, "copies": 100 }'}, or leave it empty for the whole system.</p>}
      {again.error && <p role="alert" className="text-alert-700">{isApiError(again.error) ? again.error.message : 'Matching again failed.'}</p>}
      <Button type="submit" size="sm" disabled={again.isPending}>
        Match again
      </Button>
    </form>
  );
}
