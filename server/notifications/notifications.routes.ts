import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { requireUser } from '../auth/access';
import { AppError } from '../http/errors';
import { markReadBody, preferencesBody, type NotificationEvent } from '../../src/shared/notifications';
import { userChannel, wantsEventStream, type LiveHub } from '../http/live-hub';
import { getPreferences, listNotifications, markRead, putPreferences } from './notifications.service';

// The signed-in person's own notifications and e-mail preferences; nobody sees anyone else's.

export function notificationRoutes(r: RouteTable, ctx: AppContext, live: LiveHub): void {
  r.get('/api/notifications', async (req, res) => {
    res.json(await listNotifications(ctx.db, requireUser(req).id));
  });

  r.post('/api/notifications/read', typed({ body: markReadBody }, async ({ body }, req, res) => {
    const user = requireUser(req);
    const event: NotificationEvent = { type: 'notifications', unread: await markRead(ctx.db, user.id, body) };
    live.publish(userChannel(user.id), event.type, event);
    res.json({ unread: event.unread });
  }));

  r.get('/api/notifications/events', async (req, res) => {
    const user = requireUser(req);
    if (!wantsEventStream(req)) throw new AppError(406, 'not_acceptable', 'This is a server-sent event stream: ask for text/event-stream.');
    live.stream(req, res, userChannel(user.id));
  });

  r.get('/api/me/preferences', async (req, res) => {
    res.json(await getPreferences(ctx.db, requireUser(req).id));
  });

  r.put('/api/me/preferences', typed({ body: preferencesBody }, async ({ body }, req, res) => {
    res.json(await putPreferences(ctx.db, requireUser(req).id, body));
  }));
}
