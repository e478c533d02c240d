import { useCallback, useMemo, type ReactNode } from 'react';
import { useSearchParams } from 'react-router';
import { openThreadCounts } from '../../../shared/threads';
import { useThreads } from '../api/get-threads';
import { ThreadPanel } from './thread-panel';
import { useThreadEvents } from '../hooks/use-thread-events';

interface Options {
  mappingId: number;
  projectId: number;
  /** The signed-in person and whether they may delete anyone's comment (supervisors, admins). */
  me: { id: number; canModerate: boolean };
}

/**
 * Threads for the mapping editor: open-thread counts per bead for the badges, the panel beside the
 * canvas, and the deep link. Panel state lives in the URL (`?bead=<id>&thread=<id>`), so a link from an
 * e-mail or the bell opens the editor with that bead selected and that thread open.
 */
export function useEditorThreads({ mappingId, projectId, me }: Options) {
  const threads = useThreads(mappingId);
  useThreadEvents(mappingId);
  const [params, setParams] = useSearchParams();
  const bead = params.get('bead');
  const thread = Number(params.get('thread')) || null;

  const counts = useMemo(() => openThreadCounts(threads.data ?? []), [threads.data]);
  const show = useCallback(
    (next: { bead: string | null; thread?: number | null }) =>
      setParams(
        (p) => {
          const q = new URLSearchParams(p);
          for (const [k, v] of [['bead', next.bead], ['thread', next.thread ? String(next.thread) : null]] as const) {
            if (v) q.set(k, v);
            else q.delete(k);
          }
          return q;
        },
        { replace: true },
      ),
    [setParams],
  );

  const onOpen = useCallback((beadId: string) => show({ bead: beadId }), [show]);
  const panel = (active: { id: string; name: string } | null): ReactNode =>
    bead ? (
      <ThreadPanel
        mappingId={mappingId}
        projectId={projectId}
        me={me}
        beadId={bead}
        beadName={active?.id === bead ? active.name : null}
        active={active}
        onShowBead={onOpen}
        threads={threads}
        openThread={thread}
        onOpenThread={(id) => show({ bead, thread: id })}
        onClose={() => show({ bead: null })}
      />
    ) : null;

  return { counts, onOpen, panel, selectBead: bead };
}
