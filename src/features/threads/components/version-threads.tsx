import { Link } from 'react-router';
import { excerpt } from '../../../shared/threads-text';
import { Badge } from '../../../components/ui/badge';
import { ErrorAlert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { useVersionThreads } from '../api/get-threads';

/** Beside a saved version: the threads on the beads it contains, each opening in the editor above. */
export function VersionThreads({ mappingId, version }: { mappingId: number; version: number }) {
  const threads = useVersionThreads(mappingId, version);
  if (threads.isError) return <ErrorAlert error={threads.error} />;
  if (!threads.data) return <Loading label="Loading the version's threads…" />;
  return (
    <section aria-label={`Threads on the beads of version ${version}`} className="mt-4">
      <h3 className="mb-2 text-sm font-bold text-ink-900">Threads on this version’s beads</h3>
      {!threads.data.length && <p className="text-sm text-ink-600">No thread is attached to a bead of this version.</p>}
      <ul className="flex flex-col gap-1">
        {threads.data.map((t) => (
          <li key={t.id}>
            <Link
              to={`?${new URLSearchParams({ bead: t.beadId, thread: String(t.id) })}`}
              onClick={() => window.scrollTo({ top: 0, behavior: 'smooth' })}
              className="flex flex-wrap items-center gap-2 rounded-md px-2 py-1 text-sm hover:bg-ink-50"
            >
              <span className="font-semibold text-ink-900">{t.beadName}</span>
              {t.resolved ? <Badge tone="ok">Resolved</Badge> : <Badge>Open</Badge>}
              <span className="truncate text-ink-700">{excerpt(t.comments[0]?.body ?? '', 90)}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
