import type { BeadEvaluation } from '../../../shared/chem';
import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { useVersion } from '../api/get-version';
import { VersionPicture } from './version-picture';

const fmt = (v: number | null | undefined, d: number) => (typeof v === 'number' ? v.toFixed(d) : '–');
/** The ΔG the version's suggestions used ("n/a (ionic)" for a charged bead); older evaluations have only the atom sum. */
const partition = (e: BeadEvaluation | undefined) => (e?.ionic ? 'n/a (ionic)' : fmt(e?.partitionDeltaG ?? e?.deltaG, 1));

/** One version, read-only: its picture and its bead table as saved (with the evaluation of then). */
export function VersionView({ mappingId, number }: { mappingId: number; number: number }) {
  const v = useVersion(mappingId, number);
  if (v.isError) return <ErrorAlert error={v.error} />;
  if (!v.data) return <Loading label={`Loading version ${number}…`} />;
  const evals = new Map(v.data.evaluation?.beads.map((b) => [b.id, b]) ?? []);
  return (
    <div role="region" aria-label={`Version ${number}, read-only`} className="grid gap-3 lg:grid-cols-2">
      <VersionPicture mappingId={mappingId} state={number} alt={`Version ${number} of the mapping`} />
      <div className="overflow-x-auto">
        <p className="mb-2 text-sm text-ink-700">Read-only. sha256 <code className="break-all text-xs">{v.data.sha256}</code></p>
        <table className="w-full text-sm">
          <thead>
            <tr className="text-left text-ink-600"><th scope="col">Bead</th><th scope="col">Type</th><th scope="col">Atoms</th><th scope="col">Mass</th><th scope="col">ΔG_OW</th></tr>
          </thead>
          <tbody>
            {v.data.draft.beads.map((b) => (
              <tr key={b.id}>
                <th scope="row" className="text-left">{b.name}</th>
                <td>{b.type ?? '–'}</td>
                <td>{b.atoms.map((a) => a.index + 1).join(' ')}</td>
                <td>{fmt(evals.get(b.id)?.mass, 2)}</td>
                <td>{partition(evals.get(b.id))}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
