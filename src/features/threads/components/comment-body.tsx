import { lazy, Suspense } from 'react';
import { commentPlainText } from '../../../shared/threads-text';

// markdown-it and its helpers are about a fifth of the editor's code; they load when the first
// comment is shown, and the comment reads as plain text until then.
const RenderedCommentBody = lazy(() => import('./rendered-comment-body').then((m) => ({ default: m.RenderedCommentBody })));

/** A comment rendered from its Markdown (see rendered-comment-body.tsx for why that is safe). */
export function CommentBody({ body }: { body: string }) {
  return (
    <Suspense fallback={<p className="text-sm text-ink-900 break-words">{commentPlainText(body)}</p>}>
      <RenderedCommentBody body={body} />
    </Suspense>
  );
}
