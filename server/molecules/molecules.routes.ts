import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { validate } from '../http/validate';
import { authorizeProject } from '../auth/access';
import { idParam } from '../../src/shared/fields';

const projectParams = z.object({ id: idParam });

export function moleculeRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/api/projects/:id/molecules', validate({ params: projectParams }), async (req, res) => {
    const id = Number(req.params.id);
    await authorizeProject(ctx.db, req, id, 'molecule:read');
    const rows = await ctx.db('molecules').where({ project_id: id }).orderBy('name').select('id', 'name', 'smiles', 'created_at');
    res.json(rows.map((m) => ({ id: m.id, name: m.name, smiles: m.smiles, createdAt: new Date(m.created_at).toISOString() })));
  });
}
