import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import type { Collab } from '../drafts/collab-server';
import { typed } from '../http/validate';
import { requireUser } from '../auth/access';
import { idParam } from '../../src/shared/fields';
import { compareQuery, restoreBody, saveVersionBody, versionNumber, type RestoreResponse } from '../../src/shared/versions';
import { authorizeMapping } from '../mappings/mapping-access';
import { getVersion, listVersions, saveVersion } from './versions.service';
import { restoreVersion } from './restore';
import { compareStates, type MappingState } from './compare';

const params = z.object({ id: idParam });
const versionParams = z.object({ id: idParam, n: versionNumber });

export function versionRoutes(r: RouteTable, ctx: AppContext, collab: Collab): void {
  const state = async (mappingId: number, ref: number | 'draft'): Promise<MappingState> => {
    if (ref === 'draft') {
      const { draft, result } = await collab.read(mappingId);
      return { ref, draft, evaluation: result.evaluation };
    }
    const v = await getVersion(ctx.db, mappingId, ref);
    return { ref, draft: v.draft, evaluation: v.evaluation };
  };

  r.get('/api/mappings/:id/versions', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:read');
    res.json(await listVersions(ctx.db, id));
  }));

  r.post('/api/mappings/:id/versions', typed({ params, body: saveVersionBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'version:save');
    res.status(201).json(await saveVersion(ctx.db, collab, id, requireUser(req).id, body.message ?? ''));
  }));

  r.get('/api/mappings/:id/versions/:n', typed({ params: versionParams }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:read');
    const { id: _rowId, ...version } = await getVersion(ctx.db, id, params.n);
    res.json(version);
  }));

  r.post('/api/mappings/:id/versions/:n/restore', typed({ params: versionParams, body: restoreBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'version:restore');
    const result = await restoreVersion(ctx.db, collab.rooms, id, params.n, requireUser(req).id, body.clientId);
    const { draft } = await collab.read(id);
    res.json({ ...result, draft } satisfies RestoreResponse);
  }));

  r.get('/api/mappings/:id/compare', typed({ params, query: compareQuery }, async ({ params, query }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:read');
    const { from, to } = query;
    res.json(compareStates(await state(id, from), await state(id, to)));
  }));
}
