import { describe, expect, it } from 'vitest';
import { commentPlainText, excerpt, isSafeLink, renderCommentHtml } from '../../../src/shared/threads-markdown';

describe('comment Markdown', () => {
  it('renders the subset: emphasis, lists, code and links', () => {
    const html = renderCommentHtml('*ring* and **methoxy**\n\n- one\n- two\n\n1. first\n\n`C1=CC` and [notes](https://example.org/a)\n\n```\nbead B1\n```');
    expect(html).toContain('<em>ring</em>');
    expect(html).toContain('<strong>methoxy</strong>');
    expect(html).toContain('<ul>\n<li>one</li>');
    expect(html).toContain('<ol>');
    expect(html).toContain('<code>C1=CC</code>');
    expect(html).toContain('<a href="https://example.org/a" rel="noopener noreferrer nofollow" target="_blank">notes</a>');
    expect(html).toContain('<pre><code>bead B1\n</code></pre>');
  });

  it('leaves headings, images and tables as text', () => {
    const html = renderCommentHtml('# Big\n\n![x](https://example.org/x.png)');
    expect(html).not.toContain('<h1');
    expect(html).not.toContain('<img');
  });

  it('escapes raw HTML, event handlers and script tags', () => {
    const html = renderCommentHtml('<script>alert(1)</script> <img src=x onerror="alert(2)"> <b onclick=alert(3)>x</b>');
    expect(html).not.toMatch(/<script|<img|<b /);
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('&lt;img src=x onerror=&quot;alert(2)&quot;&gt;');
  });

  it('refuses javascript:, data: and other schemes as link targets', () => {
    for (const href of ['javascript:alert(1)', 'JaVaScRiPt:alert(1)', 'java\tscript:alert(1)', 'data:text/html,<b>x</b>', 'vbscript:x', '//evil.example/x']) {
      const html = renderCommentHtml(`[click](${href}) <${href}>`);
      expect(html, href).not.toContain('<a ');
    }
    expect(isSafeLink('https://example.org')).toBe(true);
    expect(isSafeLink('mailto:a@example.org')).toBe(true);
    expect(isSafeLink('/mappings/3?bead=b1')).toBe(true);
    expect(isSafeLink(' javascript:alert(1)')).toBe(false);
  });

  it('renders mentions as escaped spans', () => {
    const html = renderCommentHtml('Ask @[Dr <b>Ines</b>](user:12) please');
    expect(html).toContain('<span class="mention" data-user-id="12">@Dr &lt;b&gt;Ines&lt;/b&gt;</span>');
  });

  it('gives plain text and excerpts', () => {
    expect(commentPlainText('Ask **@[Ines](user:2)** about [this](https://x.org)')).toBe('Ask @Ines about this');
    expect(excerpt('a'.repeat(300), 10)).toBe(`${'a'.repeat(9)}…`);
  });
});
