import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { Collab } from '../drafts/collab-server';
import { typed } from '../http/validate';
import { requireUser } from '../auth/access';
import { idParam } from '../../src/shared/fields';
import { bondedTermsPutBody } from '../../src/shared/bonded-terms';
import { authorizeMapping } from '../mappings/mapping-access';
import { fillFromAnalysis, readBondedTerms, writeBondedTerms } from './bonded-terms.service';

const params = z.object({ id: idParam });

export function bondedTermRoutes(r: RouteTable, ctx: AppContext, collab: Collab): void {
  r.get('/api/mappings/:id/bonded-terms', typed({ params }, async ({ params }, req, res) => {
    await authorizeMapping(ctx.db, req, params.id, 'mapping:read');
    res.json(await readBondedTerms(ctx.db, collab, params.id));
  }));

  r.put('/api/mappings/:id/bonded-terms', typed({ params, body: bondedTermsPutBody }, async ({ params, body }, req, res) => {
    await authorizeMapping(ctx.db, req, params.id, 'mapping:edit');
    const userId = requireUser(req).id;
    res.json('fromAnalysis' in body ? await fillFromAnalysis(ctx.db, collab.rooms, collab, params.id, body.fromAnalysis, userId) : await writeBondedTerms(ctx.db, collab.rooms, collab, params.id, body, userId));
  }));
}
