import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { idParam } from '../../src/shared/fields';
import { proposalBody, type ProposalsResponse } from '../../src/shared/proposals';
import type { DraftAccess } from '../mappings/draft-access';
import { authorizeMapping } from '../mappings/mapping-access';
import { proposeFor } from './proposals.service';

const params = z.object({ id: idParam });

export function proposalRoutes(r: RouteTable, ctx: AppContext, drafts: DraftAccess): void {
  // Computes proposals for the mapping's molecule; nothing is written (accepting happens in the draft).
  r.post('/api/mappings/:id/proposal', typed({ params, body: proposalBody }, async ({ params, body }, req, res) => {
    await authorizeMapping(ctx.db, req, params.id, 'mapping:propose');
    const response: ProposalsResponse = { proposals: await proposeFor(ctx.db, drafts, params.id, body) };
    res.json(response);
  }));
}
