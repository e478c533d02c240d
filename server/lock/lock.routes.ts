import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { Rooms } from '../drafts/rooms';
import { validate } from '../http/validate';
import { requireUser } from '../auth/access';
import { idParam } from '../../src/shared/fields';
import { lockBody, unlockBody, type LockBody, type UnlockBody } from '../../src/shared/versions';
import { authorizeMapping } from '../mappings/mapping-access';
import { lockState, lockVersion, unlockMapping } from './lock.service';

const params = z.object({ id: idParam });

export function lockRoutes(r: RouteTable, ctx: AppContext, rooms: Rooms): void {
  r.get('/api/mappings/:id/lock', validate({ params }), async (req, res) => {
    const id = Number(req.params.id);
    await authorizeMapping(ctx.db, req, id, 'mapping:read');
    res.json(await lockState(ctx.db, id));
  });

  r.post('/api/mappings/:id/lock', validate({ params, body: lockBody }), async (req, res) => {
    const id = Number(req.params.id);
    await authorizeMapping(ctx.db, req, id, 'mapping:lock');
    const body = req.body as LockBody;
    res.json(await lockVersion(ctx, rooms, id, body.version, requireUser(req).id, body.note ?? ''));
  });

  r.post('/api/mappings/:id/unlock', validate({ params, body: unlockBody }), async (req, res) => {
    const id = Number(req.params.id);
    await authorizeMapping(ctx.db, req, id, 'mapping:lock');
    res.json(await unlockMapping(ctx, rooms, id, requireUser(req).id, (req.body as UnlockBody).reason));
  });
}
