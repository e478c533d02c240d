import { Link } from 'react-router';
import { ErrorAlert } from '../../../components/ui/alert';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { formatDate, plural } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { useMappings } from '../api/get-mappings';

/** The mappings of one molecule, each opening the live editor. */
export function MappingList({ moleculeId }: { moleculeId: number }) {
  const mappings = useMappings(moleculeId);
  if (mappings.isPending) return <Loading label="Loading mappings…" />;
  if (mappings.isError) return <ErrorAlert error={mappings.error} />;
  if (mappings.data.length === 0) return <EmptyState title="No mappings yet" />;
  return (
    <ul aria-label="Mappings" className="divide-y divide-paper-200">
      {mappings.data.map((m) => (
        <li key={m.id}>
          <Link to={paths.mapping(m.id)} className="flex flex-wrap items-baseline justify-between gap-2 rounded-md px-1 py-3 hover:bg-ink-50/60">
            <span>
              <span className="font-semibold text-ink-900">{m.name}</span>
              <span className="ml-2 rounded-full bg-ink-100 px-2 py-0.5 text-xs font-semibold text-ink-800">{m.resolution}</span>
              {m.locked && <span className="ml-2 rounded-full bg-paper-200 px-2 py-0.5 text-xs font-semibold text-ink-800">Locked</span>}
              {m.description && <span className="block whitespace-pre-line text-sm text-ink-700">{m.description}</span>}
            </span>
            <span className="text-xs text-ink-600">{plural(m.beadCount, 'bead')} · updated {formatDate(m.updatedAt)}</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
