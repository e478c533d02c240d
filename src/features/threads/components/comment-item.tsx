import { useState } from 'react';
import type { ThreadComment } from '../../../shared/threads';
import { Button } from '../../../components/ui/button';
import { ErrorAlert } from '../../../components/ui/alert';
import { useEditComment } from '../api/edit-comment';
import { CommentBody } from './comment-body';
import { CommentComposer } from './comment-composer';

interface CommentItemProps {
  comment: ThreadComment;
  mappingId: number;
  projectId: number;
  me: { id: number; canModerate: boolean };
}

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** One comment: who and when, edited/deleted marks, and edit/delete for those allowed. */
export function CommentItem({ comment, mappingId, projectId, me }: CommentItemProps) {
  const [editing, setEditing] = useState(false);
  const { edit, remove } = useEditComment(mappingId, comment.id);
  const mine = comment.author?.id === me.id;
  const deleted = comment.deletedAt !== null;

  return (
    <li className="flex flex-col gap-1 border-b border-paper-200 py-2 last:border-0" data-comment={comment.id}>
      <p className="text-xs text-ink-600">
        {/* Names are React text: never HTML. */}
        <span className="font-semibold text-ink-800">{comment.author?.displayName ?? 'A removed account'}</span> · <time dateTime={comment.createdAt}>{when(comment.createdAt)}</time>
        {comment.editedAt && !deleted && <span> · edited</span>}
      </p>
      {deleted ? (
        <p className="text-sm text-ink-500 italic">This comment was deleted.</p>
      ) : editing ? (
        <CommentComposer
          projectId={projectId}
          label="Edit your comment"
          submitText="Save"
          initial={comment.body}
          pending={edit.isPending}
          error={edit.error}
          onSubmit={(body) => edit.mutateAsync(body).then(() => setEditing(false))}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <CommentBody body={comment.body} />
      )}
      {!deleted && !editing && (mine || me.canModerate) && (
        <div className="flex gap-1">
          {mine && (
            <Button size="sm" variant="ghost" onClick={() => setEditing(true)}>
              Edit
            </Button>
          )}
          <Button size="sm" variant="ghost" pending={remove.isPending} pendingText="Deleting…" onClick={() => window.confirm('Delete this comment?') && remove.mutate()}>
            Delete
          </Button>
        </div>
      )}
      {!!remove.error && <ErrorAlert error={remove.error} />}
    </li>
  );
}
