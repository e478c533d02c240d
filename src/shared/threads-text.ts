// Comment bodies as plain text (excerpts in lists, e-mail subjects, the text shown while the
// Markdown renderer loads). No markdown-it here: the client's thread lists import only this.

/** Plain text of a body (mentions as @Name, Markdown marks dropped), e.g. for excerpts. */
export function commentPlainText(body: string): string {
  return body
    .replace(/@\[([^\]\n]{1,200})\]\(user:[0-9]+\)/g, '@$1')
    .replace(/\[([^\]]*)\]\(([^)\s]*)\)/g, '$1')
    .replace(/[*_`~]+/g, '')
    .replace(/\s+/g, ' ')
    .trim();
}

export function excerpt(body: string, max = 140): string {
  const text = commentPlainText(body);
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}
