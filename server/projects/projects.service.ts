import type { Db } from '../db/knex';
import type { ProjectSummary } from '../../src/shared/projects';
import type { ProjectRole } from '../../src/shared/roles';

function summaryQuery(db: Db, userId: number) {
  return db('projects as p')
    .leftJoin('project_members as mine', function joinMine() {
      this.on('mine.project_id', '=', 'p.id').andOn('mine.user_id', '=', db.raw('?', [userId]));
    })
    .select(
      'p.id',
      'p.name',
      'p.description',
      'p.created_at',
      'mine.role',
      db.raw('(SELECT COUNT(*) FROM project_members pm WHERE pm.project_id = p.id) AS member_count'),
      db.raw('(SELECT COUNT(*) FROM molecules mo WHERE mo.project_id = p.id) AS molecule_count'),
    )
    .orderBy('p.name');
}

function toSummary(row: Record<string, unknown>): ProjectSummary {
  return {
    id: row.id as number,
    name: row.name as string,
    description: row.description as string,
    role: (row.role as ProjectRole | null) ?? null,
    memberCount: Number(row.member_count),
    moleculeCount: Number(row.molecule_count),
    createdAt: new Date(row.created_at as string).toISOString(),
  };
}

export async function listProjects(db: Db, user: Express.User): Promise<ProjectSummary[]> {
  const q = summaryQuery(db, user.id);
  if (!user.isAdmin) q.whereNotNull('mine.role');
  return (await q).map(toSummary);
}

export async function getProject(db: Db, user: Express.User, id: number): Promise<ProjectSummary> {
  const row = await summaryQuery(db, user.id).where('p.id', id).first();
  return toSummary(row);
}

export async function createProject(db: Db, user: Express.User, name: string, description: string): Promise<number> {
  return db.transaction(async (trx) => {
    const [id] = await trx('projects').insert({ name, description, created_by: user.id });
    await trx('project_members').insert({ project_id: id, user_id: user.id, role: 'supervisor' });
    return id as number;
  });
}

export async function updateProject(db: Db, id: number, changes: { name?: string; description?: string }): Promise<void> {
  await db('projects').where({ id }).update(changes);
}
