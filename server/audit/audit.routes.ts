import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { idParam } from '../../src/shared/fields';
import { authorizeMapping } from '../mappings/mapping-access';
import { listAudit } from './audit.service';

const params = z.object({ id: idParam });

export function auditRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/api/mappings/:id/audit', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:read');
    res.json(await listAudit(ctx.db, id));
  }));
}
