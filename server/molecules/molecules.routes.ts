import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeProject, requireUser } from '../auth/access';
import { idParam } from '../../src/shared/fields';
import { createMoleculeBody, listMoleculesQuery, updateMoleculeBody } from '../../src/shared/molecules';
import { parseInThread } from '../workers/parse-thread';
import { authorizeMolecule } from './molecule-access';
import { toDetail, toSummary } from './molecule-view';
import { deleteOrArchive, findMolecule, insertMolecule, listMolecules, refuseDuplicate, updateMolecule } from './molecules.service';
import type { Conformers } from './conformer-queue';
import { PROJECT_OF_TOPIC } from '../auth/access-cache';

const params = z.object({ id: idParam });

export function moleculeRoutes(r: RouteTable, ctx: AppContext, conformers: Conformers): void {
  const detail = async (id: number) => toDetail(await findMolecule(ctx.db, id, true), conformers.position(id));

  r.get('/api/projects/:id/molecules', typed({ params, query: listMoleculesQuery }, async ({ params, query }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'molecule:read');
    const rows = await listMolecules(ctx.db, id, query);
    res.json(rows.map((row) => toSummary(row, conformers.position(row.id))));
  }));

  r.post('/api/projects/:id/molecules', typed({ params, body: createMoleculeBody }, async ({ params, body }, req, res) => {
    const projectId = params.id;
    await authorizeProject(ctx.db, req, projectId, 'molecule:create');
    const model = await parseInThread(body.smiles !== undefined ? { smiles: body.smiles } : { molfile: body.molfile! });
    await refuseDuplicate(ctx.db, projectId, model.canonicalSmiles, body.allowDuplicate);
    const id = await insertMolecule(ctx.db, {
      projectId,
      userId: requireUser(req).id,
      name: body.name,
      notes: body.notes,
      tags: body.tags,
      source: body.smiles !== undefined ? 'smiles' : 'molfile',
      smiles: body.smiles,
      model,
    });
    if (!model.coordinates) conformers.enqueue(id);
    res.status(201).json(await detail(id));
  }));

  r.get('/api/molecules/:id', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMolecule(ctx.db, req, id, 'molecule:read');
    res.json(await detail(id));
  }));

  r.patch('/api/molecules/:id', typed({ params, body: updateMoleculeBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeMolecule(ctx.db, req, id, 'molecule:update');
    await updateMolecule(ctx.db, id, body);
    res.json(await detail(id));
  }));

  r.delete('/api/molecules/:id', typed({ params }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeMolecule(ctx.db, req, id, 'molecule:delete');
    if ((await deleteOrArchive(ctx.db, id)) === 'deleted') {
      // Its mappings went with it: every instance forgets which project they were in (auth/access-cache.ts).
      ctx.invalidation.publish(PROJECT_OF_TOPIC, `molecule:${id}`);
      return void res.status(204).end();
    }
    res.json({ archived: true, molecule: toSummary(await findMolecule(ctx.db, id), null) });
  }));
}
