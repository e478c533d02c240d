import { useState } from 'react';
import type { UseQueryResult } from '@tanstack/react-query';
import type { Thread } from '../../../shared/threads';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { useCreateThread } from '../api/create-thread';
import { CommentComposer } from './comment-composer';
import { ThreadCard } from './thread-card';
import { ThreadFilter, type Filter } from './thread-filter';

interface ThreadPanelProps {
  mappingId: number;
  projectId: number;
  me: { id: number; canModerate: boolean };
  beadId: string;
  /** The bead's name in the live draft, when it is there. */
  beadName: string | null;
  /** The bead selected in the editor, which may be another one. */
  active: { id: string; name: string } | null;
  onShowBead(beadId: string): void;
  threads: UseQueryResult<Thread[]>;
  openThread: number | null;
  onOpenThread(id: number | null): void;
  onClose(): void;
}

/** The threads of one bead, beside the canvas: filter, the threads, and a box to start one. */
export function ThreadPanel(p: ThreadPanelProps) {
  const [filter, setFilter] = useState<Filter>('open');
  const create = useCreateThread(p.mappingId);
  const onBead = (p.threads.data ?? []).filter((t) => t.beadId === p.beadId);
  const shown = onBead.filter((t) => filter === 'all' || (filter === 'resolved') === t.resolved || t.id === p.openThread);
  const name = p.beadName ?? onBead[0]?.beadName ?? p.beadId;
  const removed = p.beadName === null && onBead.some((t) => t.beadRemoved);

  return (
    <section aria-label={`Threads on bead ${name}`} className="flex flex-col gap-2 rounded-lg border border-ink-300 bg-paper-50 p-3 shadow-card">
      <div className="flex items-center justify-between gap-2">
        <h2 className="text-sm font-bold text-ink-800">
          Threads on <span className="text-ink-900">{name}</span>
        </h2>
        <Button size="sm" variant="ghost" onClick={p.onClose} aria-label="Close threads">
          Close
        </Button>
      </div>
      {p.active && p.active.id !== p.beadId && (
        <Button size="sm" variant="secondary" onClick={() => p.onShowBead(p.active!.id)}>
          Show threads on {p.active.name}
        </Button>
      )}
      {removed && <p className="rounded bg-paper-200 px-2 py-1 text-xs text-ink-700">This bead has been removed from the draft; its threads stay readable.</p>}
      <ThreadFilter value={filter} onChange={setFilter} />
      {p.threads.isError && <ErrorAlert error={p.threads.error} />}
      <ul className="flex flex-col gap-2">
        {shown.map((t) => (
          <ThreadCard key={t.id} thread={t} projectId={p.projectId} me={p.me} open={t.id === p.openThread} onOpen={() => p.onOpenThread(t.id)} />
        ))}
      </ul>
      {!shown.length && <p className="text-sm text-ink-600">{filter === 'resolved' ? 'No resolved threads here.' : 'No open threads on this bead.'}</p>}
      <CommentComposer
        projectId={p.projectId}
        label="Start a new thread"
        submitText="Start thread"
        pending={create.isPending}
        error={create.error}
        onSubmit={(body) => create.mutateAsync({ beadId: p.beadId, body }).then((t) => p.onOpenThread(t.id))}
      />
    </section>
  );
}
