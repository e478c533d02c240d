import type { RequestHandler } from 'express';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { canSite } from '../../src/shared/permissions';
import { escapeHtml } from './messages';
import { caughtMail } from './dev-mail.service';

// Development-only view of the local SMTP sink. The caught mail holds every
// account's invitation and password-reset links, so reading it is taking over
// any account: only a signed-in site admin may, and everyone else (anonymous
// included) gets the same 404 as when the routes do not exist. Mounted only
// while the sink is in use, and never with NODE_ENV=production unless
// BEADLOOM_DEV_MAIL=1 asks for it; with a real SMTP server these routes do not exist.

/** Whether the app serves /dev/mail at all. */
export function devMailMounted(ctx: AppContext): boolean {
  return ctx.mailSinkInUse && (!ctx.config.production || ctx.config.devMail);
}

/**
 * Unless the caller is a site admin, the request leaves these routes and falls through to the app's
 * unknown-route answer, exactly as when the routes are not mounted.
 */
const mailReaderOnly: RequestHandler = (req, _res, next) => next(req.user && canSite({ isAdmin: req.user.isAdmin, roles: [] }, 'mail:read') ? undefined : 'route');

const linkify = (text: string) => escapeHtml(text).replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

export function devMailRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/dev/mail.json', mailReaderOnly, async (_req, res) => {
    res.json(await caughtMail(ctx.db));
  });

  r.get('/dev/mail', mailReaderOnly, async (_req, res) => {
    const mails = await caughtMail(ctx.db);
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
