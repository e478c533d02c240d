import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { formatDate } from '../../../lib/format';
import { useMolecules } from '../api/get-molecules';

export function MoleculeList({ projectId }: { projectId: number }) {
  const molecules = useMolecules(projectId);

  if (molecules.isPending) return <Loading label="Loading molecules…" />;
  if (molecules.isError) return <ErrorAlert error={molecules.error} />;
  if (molecules.data.length === 0) return <EmptyState title="No molecules yet" />;

  return (
    <ul aria-label="Molecules" className="divide-y divide-paper-200">
      {molecules.data.map((molecule) => (
        <li key={molecule.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-3">
          <div className="min-w-0">
            <p className="font-semibold text-ink-900">{molecule.name}</p>
            <p className="truncate font-mono text-xs text-ink-600" title={molecule.smiles}>
              {molecule.smiles}
            </p>
          </div>
          <p className="text-xs text-ink-600">Added {formatDate(molecule.createdAt)}</p>
        </li>
      ))}
    </ul>
  );
}
