import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { escapeHtml } from './messages';

// Development-only view of the local SMTP sink. Mounted only while the sink is
// in use; with a real SMTP server configured these routes do not exist.

interface DevMail {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string;
  html: string;
  createdAt: string;
}

async function caughtMail(ctx: AppContext): Promise<DevMail[]> {
  const rows = await ctx.db('dev_mail').orderBy('id', 'desc').limit(200);
  return rows.map((r) => ({
    id: r.id,
    to: String(r.to_addresses).split(', ').filter(Boolean),
    from: r.from_address,
    subject: r.subject,
    text: r.text_body,
    html: r.html_body,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}

const linkify = (text: string) => escapeHtml(text).replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

export function devMailRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/dev/mail.json', async (_req, res) => {
    res.json(await caughtMail(ctx));
  });

  r.get('/dev/mail', async (_req, res) => {
    const mails = await caughtMail(ctx);
    const items = mails
      .map(
        (m) => `<article><h2>${escapeHtml(m.subject)}</h2><p class="meta">To ${escapeHtml(m.to.join(', '))} · ${escapeHtml(m.createdAt)}</p><pre>${linkify(m.text)}</pre></article>`,
      )
      .join('\n');
    res.type('html').send(`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Caught mail · Beadloom</title>
<style>body{font-family:sans-serif;background:#faf7f0;color:#12393f;max-width:60rem;margin:2rem auto;padding:0 1rem}article{border-top:1px solid #cfc8b8;padding:.5rem 0}pre{white-space:pre-wrap}.meta{color:#4b6b70;font-size:.9rem}</style>
</head><body><h1>Caught mail</h1><p>Messages the local SMTP sink received (development only; nothing was delivered).</p>${items || '<p>No mail yet.</p>'}</body></html>`);
  });
}
