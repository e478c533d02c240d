import type { Db } from '../../server/db/knex';

// Small database fixtures for API tests. New accounts reuse a demo account's
// password hash, so they sign in with the demo password without another bcrypt run.

export async function demoProjectId(db: Db): Promise<number> {
  const row = await db('projects').orderBy('id').first('id');
  return row.id;
}

export async function userId(db: Db, email: string): Promise<number> {
  const row = await db('users').where({ email }).first('id');
  if (!row) throw new Error(`no account ${email}`);
  return row.id;
}

export async function createAccount(db: Db, email: string, opts: { displayName?: string; projectId?: number; role?: string } = {}): Promise<number> {
  const { password_hash } = await db('users').where({ email: 'modeller@example.org' }).first('password_hash');
  const [id] = await db('users').insert({ email, display_name: opts.displayName ?? email.split('@')[0], password_hash });
  if (opts.projectId && opts.role) await db('project_members').insert({ project_id: opts.projectId, user_id: id, role: opts.role });
  return id;
}

/** A snapshot of the tables a bad request must not change. */
export async function snapshot(db: Db, tables = ['users', 'projects', 'project_members', 'password_tokens', 'molecules']): Promise<string> {
  const parts = [];
  for (const t of tables) parts.push(JSON.stringify(await db(t).select('*').orderBy(1)));
  return parts.join('\n');
}

/** The first demo molecule and its demo mapping. */
export async function demoMoleculeId(db: Db): Promise<number> {
  const row = await db('molecules').orderBy('id').first('id');
  return row.id;
}

export async function demoMappingId(db: Db): Promise<number> {
  const row = await db('mappings').orderBy('id').first('id');
  return row.id;
}

/** A fresh molecule (ethanol unless told) in a project, stored with its canonical model like the app does. */
export async function createMolecule(db: Db, projectId: number, name = 'Fixture molecule', smiles = 'CCO'): Promise<number> {
  const { parseMolecule } = await import('../../server/chem/index');
  const { insertMolecule } = await import('../../server/molecules/molecules.service');
  return insertMolecule(db, { projectId, userId: null, name, source: 'smiles', smiles, model: await parseMolecule({ smiles }) });
}
