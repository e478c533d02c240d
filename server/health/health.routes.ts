import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { dbIsUp } from '../db/knex';

export function healthRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/api/health', async (_req, res) => {
    const up = await dbIsUp(ctx.db);
    res.status(up ? 200 : 503).json({ ok: up, db: up ? 'up' : 'down' });
  });
}
