import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { notificationRoutes } from '../notifications/notifications.routes';
import { LiveHub } from './live-hub';
import { threadRoutes } from './threads.routes';

/** Threads and notifications share one live hub (server-sent events); app.ts registers both here. */
export function registerThreads(r: RouteTable, ctx: AppContext): LiveHub {
  const live = new LiveHub();
  threadRoutes(r, ctx, live);
  notificationRoutes(r, ctx, live);
  return live;
}
