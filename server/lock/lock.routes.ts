import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { Rooms } from '../drafts/rooms';
import { typed } from '../http/validate';
import { requireUser } from '../auth/access';
import { idParam } from '../../src/shared/fields';
import { lockBody, unlockBody } from '../../src/shared/versions';
import { authorizeMapping } from '../mappings/mapping-access';
import { lockState, lockVersion, unlockMapping } from './lock.service';

const params = z.object({ id: idParam });

export function lockRoutes(r: RouteTable, ctx: AppContext, rooms: Rooms): void {
  r.get('/api/mappings/:id/lock', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:read');
    res.json(await lockState(ctx.db, id));
  }));

  r.post('/api/mappings/:id/lock', typed({ params, body: lockBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:lock');
    res.json(await lockVersion(ctx, rooms, id, body.version, requireUser(req).id, body.note ?? ''));
  }));

  r.post('/api/mappings/:id/unlock', typed({ params, body: unlockBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:lock');
    res.json(await unlockMapping(ctx, rooms, id, requireUser(req).id, body.reason));
  }));
}
