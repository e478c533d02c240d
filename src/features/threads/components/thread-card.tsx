import type { Thread } from '../../../shared/threads';
import { excerpt } from '../../../shared/threads-text';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { useAddComment } from '../api/add-comment';
import { useResolveThread } from '../api/resolve-thread';
import { CommentComposer } from './comment-composer';
import { CommentItem } from './comment-item';

interface ThreadCardProps {
  thread: Thread;
  projectId: number;
  me: { id: number; canModerate: boolean };
  open: boolean;
  onOpen(): void;
}

/** One thread: a summary line, or (when open) its comments, a reply box and resolve / reopen. */
export function ThreadCard({ thread, projectId, me, open, onOpen }: ThreadCardProps) {
  const reply = useAddComment(thread.mappingId, thread.id);
  const resolve = useResolveThread(thread.id);
  const first = thread.comments[0];
  const title = first ? excerpt(first.body, 80) || 'Deleted comment' : 'Thread';

  if (!open) {
    return (
      <li>
        <button type="button" onClick={onOpen} className="flex w-full flex-col items-start gap-1 rounded-md border border-paper-300 px-3 py-2 text-left hover:bg-ink-50" aria-label={`Open thread: ${title}`}>
          <span className="text-sm text-ink-900">{title}</span>
          <span className="flex gap-2 text-xs text-ink-600">
            {thread.resolved ? <Badge tone="ok">Resolved</Badge> : <Badge>Open</Badge>}
            {thread.comments.length} comment{thread.comments.length === 1 ? '' : 's'}
          </span>
        </button>
      </li>
    );
  }
  return (
    <li className="rounded-md border border-ink-300 px-3 py-2" aria-label="Open thread" data-thread={thread.id}>
      <div className="flex items-center justify-between gap-2">
        {thread.resolved ? <Badge tone="ok">Resolved{thread.resolvedBy ? ` by ${thread.resolvedBy.displayName}` : ''}</Badge> : <Badge>Open</Badge>}
        <Button size="sm" variant="secondary" pending={resolve.isPending} pendingText="Saving…" onClick={() => resolve.mutate(!thread.resolved)}>
          {thread.resolved ? 'Reopen' : 'Resolve'}
        </Button>
      </div>
      {!!resolve.error && <ErrorAlert error={resolve.error} />}
      <ol aria-label="Comments">
        {thread.comments.map((c) => (
          <CommentItem key={c.id} comment={c} mappingId={thread.mappingId} projectId={projectId} me={me} />
        ))}
      </ol>
      <CommentComposer projectId={projectId} label="Reply" submitText="Reply" pending={reply.isPending} error={reply.error} onSubmit={(body) => reply.mutateAsync(body)} />
    </li>
  );
}
