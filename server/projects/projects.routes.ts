import { z } from 'zod';
import type { AppContext } from '../context';
import type { RouteTable } from '../http/route-table';
import { typed } from '../http/validate';
import { authorizeProject, authorizeSite, requireUser } from '../auth/access';
import { addMemberBody, changeRoleBody, createProjectBody, updateProjectBody } from '../../src/shared/projects';
import { idParam } from '../../src/shared/fields';
import { createProject, getProject, listProjects, updateProject } from './projects.service';
import { addMember, changeMembership, listMembers } from './members.service';

const projectParams = z.object({ id: idParam });
const memberParams = z.object({ id: idParam, userId: idParam });

export function projectRoutes(r: RouteTable, ctx: AppContext): void {
  r.get('/api/projects', async (req, res) => {
    res.json(await listProjects(ctx.db, requireUser(req)));
  });

  r.post('/api/projects', typed({ body: createProjectBody }, async ({ body }, req, res) => {
    const user = await authorizeSite(ctx.db, req, 'project:create');
    const id = await createProject(ctx.db, user, body.name, body.description ?? '');
    res.status(201).json(await getProject(ctx.db, user, id));
  }));

  r.get('/api/projects/:id', typed({ params: projectParams }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'project:read');
    res.json(await getProject(ctx.db, requireUser(req), id));
  }));

  r.patch('/api/projects/:id', typed({ params: projectParams, body: updateProjectBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'project:update');
    await updateProject(ctx.db, id, body);
    res.json(await getProject(ctx.db, requireUser(req), id));
  }));

  r.get('/api/projects/:id/members', typed({ params: projectParams }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'members:read');
    res.json(await listMembers(ctx, id));
  }));

  r.post('/api/projects/:id/members', typed({ params: projectParams, body: addMemberBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'members:manage');
    res.status(201).json(await addMember(ctx, id, body, requireUser(req)));
  }));

  r.patch('/api/projects/:id/members/:userId', typed({ params: memberParams, body: changeRoleBody }, async ({ params, body }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'members:manage');
    res.json(await changeMembership(ctx, id, params.userId, body.role));
  }));

  r.delete('/api/projects/:id/members/:userId', typed({ params: memberParams }, async ({ params }, req, res) => {
    const id = params.id;
    await authorizeProject(ctx.db, req, id, 'members:manage');
    await changeMembership(ctx, id, params.userId, null);
    res.status(204).end();
  }));
}
