/**
 * Comment bodies to HTML with markdown-it, for the thread panel and for e-mails.
 *
 * Only a small subset is on: paragraphs and line breaks, emphasis (and strike-through), bullet and
 * numbered lists, inline code and code blocks, links — plus mentions (`@[Name](user:ID)`, see
 * threads-mentions.ts). Raw HTML is off (`html: false`: tags come out as escaped text), images,
 * headings, tables and the rest are off, and a link must be http(s), mailto or a same-site path:
 * `javascript:`, `data:` and every other scheme stay plain text. markdown-it escapes all text.
 */
import MarkdownIt, { type StateInline } from 'markdown-it';

const SAFE_LINK = /^(https?:\/\/|mailto:|\/(?!\/)|#)/i;

/** A link target the renderer accepts (after markdown-it's own normalisation). */
export function isSafeLink(url: string): boolean {
  // Browsers ignore control characters and spaces inside a scheme ("java\tscript:"); so do we.
  const compact = url.replace(/[\u0000-\u0020\u007f]+/g, '');
  return SAFE_LINK.test(compact);
}

const MENTION = /^@\[([^\]\n]{1,200})\]\(user:([1-9][0-9]{0,9})\)/;

function mentionRule(state: StateInline, silent: boolean): boolean {
  if (state.src.charCodeAt(state.pos) !== 0x40 /* @ */) return false;
  const m = MENTION.exec(state.src.slice(state.pos));
  if (!m) return false;
  if (!silent) {
    const token = state.push('mention', '', 0);
    token.content = m[1] as string;
    token.info = m[2] as string;
  }
  state.pos += m[0].length;
  return true;
}

function createRenderer() {
  const md = new MarkdownIt('zero', { html: false, linkify: false, breaks: true });
  md.enable(['paragraph', 'list', 'code', 'fence', 'newline', 'escape', 'backticks', 'emphasis', 'strikethrough', 'link', 'entity', 'autolink']);
  md.validateLink = isSafeLink;
  md.inline.ruler.before('link', 'mention', mentionRule);
  md.renderer.rules.mention = (tokens, idx) => {
    const t = tokens[idx]!;
    return `<span class="mention" data-user-id="${Number(t.info)}">@${md.utils.escapeHtml(t.content)}</span>`;
  };
  const defaultLinkOpen = md.renderer.rules.link_open ?? ((tokens, idx, options, _env, self) => self.renderToken(tokens, idx, options));
  md.renderer.rules.link_open = (tokens, idx, options, env, self) => {
    const t = tokens[idx]!;
    t.attrSet('rel', 'noopener noreferrer nofollow');
    if (/^(https?:|mailto:)/i.test(String(t.attrGet('href') ?? ''))) t.attrSet('target', '_blank');
    return defaultLinkOpen(tokens, idx, options, env, self);
  };
  return md;
}

const renderer = createRenderer();

/** Safe HTML for a comment body. */
export function renderCommentHtml(body: string): string {
  return renderer.render(body);
}

// Plain-text helpers live apart so the client can show excerpts without loading markdown-it.
export { commentPlainText, excerpt } from './threads-text';
