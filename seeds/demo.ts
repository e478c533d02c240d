import type { Knex } from 'knex';
import { hashPassword } from '../server/auth/passwords';
import { DEMO_ACCOUNTS, DEMO_MOLECULES, DEMO_PASSWORD, DEMO_PROJECT } from './demo-data';

/** True when the database has no accounts yet: the demo only ever goes into an empty database. */
export async function isEmpty(db: Knex): Promise<boolean> {
  const row = await db('users').count({ n: '*' }).first();
  return Number(row?.n ?? 0) === 0;
}

/** Seeds the demo scenario into an empty database; returns false (and does nothing) otherwise. */
export async function seedDemo(db: Knex, bcryptCost: number): Promise<boolean> {
  if (!(await isEmpty(db))) return false;
  // One hash for the shared demo password keeps seeding quick; real accounts each get their own.
  const hash = await hashPassword(DEMO_PASSWORD, bcryptCost);
  await db.transaction(async (trx) => {
    const ids = new Map<string, number>();
    for (const a of DEMO_ACCOUNTS) {
      const [id] = await trx('users').insert({ email: a.email, display_name: a.displayName, is_admin: a.isAdmin, password_hash: hash });
      ids.set(a.email, id);
    }
    const [projectId] = await trx('projects').insert({ ...DEMO_PROJECT, created_by: ids.get('supervisor@example.org') });
    for (const a of DEMO_ACCOUNTS) {
      if (a.role) await trx('project_members').insert({ project_id: projectId, user_id: ids.get(a.email), role: a.role });
    }
    for (const m of DEMO_MOLECULES) {
      await trx('molecules').insert({ project_id: projectId, ...m, created_by: ids.get('modeller@example.org') });
    }
  });
  return true;
}
