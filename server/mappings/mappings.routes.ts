import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeProject, requireUser } from '../auth/access';
import { can } from '../../src/shared/permissions';
import { idParam } from '../../src/shared/fields';
import { createMappingBody, updateMappingBody, type MappingDetail } from '../../src/shared/mappings';
import type { Mapping } from '../../src/shared/chem';
import { authorizeMolecule } from '../molecules/molecule-access';
import { authorizeMapping } from './mapping-access';
import { assertUnlocked, createMapping, findMapping, listMappings, listProjectMappings, updateMapping } from './mappings.service';
import type { DraftAccess } from './draft-access';
import type { MappingStarts } from './mapping-starts';
import { transferSummary, type TransferReport } from '../../src/shared/proposals';

const params = z.object({ id: idParam });
const DESCRIPTION_MAX = 5000;

function withTransferSummary(description: string | undefined, report: TransferReport, draft: Mapping | null): string {
  const atoms = new Set(draft?.beads.flatMap((b) => b.atoms.map((a) => a.index)) ?? []).size;
  const own = description?.trim() ?? '';
  const summary = transferSummary(report, Math.max(atoms, report.matchedAtoms), DESCRIPTION_MAX - own.length - 2);
  return own ? `${own}\n\n${summary}` : summary;
}

export function mappingRoutes(r: RouteTable, ctx: AppContext, drafts: DraftAccess, starts: MappingStarts): void {
  const detail = async (id: number, canEdit: boolean): Promise<MappingDetail> => {
    // The mapping's row and the draft (a stamp query when it is kept) side by side.
    const [summary, { draft, result }] = await Promise.all([findMapping(ctx.db, id), drafts.read(id)]);
    return { ...summary, draft, evaluation: result.evaluation, evaluationError: result.error, canEdit: canEdit && !summary.locked };
  };

  r.get('/api/molecules/:id/mappings', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMolecule(ctx.db, req, id, 'mapping:read');
    res.json(await listMappings(ctx.db, id));
  }));

  r.post('/api/molecules/:id/mappings', typed({ params, body: createMappingBody }, async ({ params, body }, req, res) => {
    const moleculeId = params.id;
    await authorizeMolecule(ctx.db, req, moleculeId, 'mapping:create');
    const start = body.start ?? (body.copyOf !== undefined ? { copyOf: body.copyOf } : 'empty');
    let draft: Mapping | null = null;
    let transfer: TransferReport | undefined;
    if (start === 'proposal') draft = await starts.proposal(moleculeId, body.resolution);
    else if (typeof start === 'object' && 'copyOf' in start) draft = await starts.copy(moleculeId, start);
    else if (typeof start === 'object') {
      const result = await starts.transfer(moleculeId, start, body.resolution);
      draft = result.draft;
      transfer = result.report;
    }
    // The transfer report stays readable with the mapping: a summary follows the description.
    const description = transfer ? withTransferSummary(body.description, transfer, draft) : body.description;
    const id = await createMapping(ctx.db, moleculeId, { ...body, description }, requireUser(req).id, draft);
    res.status(201).json({ ...(await detail(id, true)), ...(transfer ? { transfer } : {}) });
  }));

  // Every mapping of the project (the sources a new mapping can be transferred from).
  r.get('/api/projects/:id/mappings', typed({ params }, async ({ params }, req, res) => {
    await authorizeProject(ctx.db, req, params.id, 'mapping:read');
    res.json(await listProjectMappings(ctx.db, params.id));
  }));

  r.get('/api/mappings/:id', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    const { role } = await authorizeMapping(ctx.db, req, id, 'mapping:read');
    res.json(await detail(id, can({ isAdmin: requireUser(req).isAdmin, role }, 'mapping:edit')));
  }));

  r.patch('/api/mappings/:id', typed({ params, body: updateMappingBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeMapping(ctx.db, req, id, 'mapping:edit');
    await assertUnlocked(ctx.db, id);
    await updateMapping(ctx.db, id, body);
    drafts.refresh({ mappingId: id });
    res.json(await detail(id, true));
  }));
}
