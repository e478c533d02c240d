import { useMemo } from 'react';
import { renderCommentHtml } from '../../../shared/threads-markdown';

/**
 * A comment rendered from its Markdown. Setting HTML is safe here only because renderCommentHtml
 * (markdown-it, raw HTML off, links limited to http(s)/mailto/same-site) escapes everything else.
 */
export function RenderedCommentBody({ body }: { body: string }) {
  const html = useMemo(() => renderCommentHtml(body), [body]);
  return (
    <div
      className="comment-body text-sm text-ink-900 break-words [&_a]:text-ink-700 [&_a]:underline [&_code]:rounded [&_code]:bg-paper-200 [&_code]:px-1 [&_ol]:list-decimal [&_ol]:pl-5 [&_p]:my-1 [&_pre]:overflow-x-auto [&_pre]:rounded [&_pre]:bg-paper-200 [&_pre]:p-2 [&_ul]:list-disc [&_ul]:pl-5 [&_.mention]:rounded [&_.mention]:bg-ink-100 [&_.mention]:px-1 [&_.mention]:font-semibold"
      dangerouslySetInnerHTML={{ __html: html }}
    />
  );
}
