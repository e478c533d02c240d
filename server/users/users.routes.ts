import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeSite } from '../auth/access';
import { createUserBody, updateUserBody } from '../../src/shared/users';
import { idParam } from '../../src/shared/fields';
import { listUsers, toUserSummary, updateAccount } from './users.service';
import { createInvitedAccount } from './invitations.service';

const userParams = z.object({ id: idParam });

export function userRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/api/users', async (req, res) => {
    await authorizeSite(ctx.db, req, 'users:manage');
    res.json((await listUsers(ctx.db)).map(toUserSummary));
  });

  r.post('/api/users', typed({ body: createUserBody }, async ({ body }, req, res) => {
    const admin = await authorizeSite(ctx.db, req, 'users:manage');
    const row = await createInvitedAccount(ctx, body, admin.displayName, null);
    res.status(201).json(toUserSummary(row));
  }));

  r.patch('/api/users/:id', typed({ params: userParams, body: updateUserBody }, async ({ params, body }, req, res) => {
    const admin = await authorizeSite(ctx.db, req, 'users:manage');
    res.json(await updateAccount(ctx, admin.id, params.id, body));
  }));
}
