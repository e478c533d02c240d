import type { Knex } from 'knex';
import { hashPassword } from '../server/auth/passwords';
import { DEMO_LIBRARY, parseMolecule } from '../server/chem/index';
import { DEMO_LIBRARY_NOTE } from '../server/chem/demo-library';
import { insertMolecule } from '../server/molecules/molecules.service';
import { createMapping } from '../server/mappings/mappings.service';
import { replaceLibrary } from '../server/bead-types/bead-types.service';
import { DEMO_ACCOUNTS, DEMO_MAPPINGS, DEMO_MOLECULES, DEMO_PASSWORD, DEMO_PROJECT } from './demo-data';

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
  // The server's canonical model is stored with each molecule, as for any molecule created in the app.
  const models = await Promise.all(DEMO_MOLECULES.map((m) => parseMolecule({ smiles: m.smiles })));
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
    const modeller = ids.get('modeller@example.org')!;
    await replaceLibrary(trx, projectId, DEMO_LIBRARY.map((t) => ({ ...t, description: '' })), ids.get('supervisor@example.org')!, DEMO_LIBRARY_NOTE);
    for (const [i, m] of DEMO_MOLECULES.entries()) {
      const moleculeId = await insertMolecule(trx, { projectId, userId: modeller, name: m.name, notes: m.notes, source: 'smiles', smiles: m.smiles, model: models[i] });
      const plan = DEMO_MAPPINGS[m.name];
      const draft = { beads: plan.beads.map((b) => ({ id: b.id, name: b.name, type: b.type, centre: 'mass' as const, atoms: b.atoms.map(([index, weight]) => ({ index, weight })) })) };
      await createMapping(trx, moleculeId, { name: plan.name, resolution: plan.resolution, description: plan.description }, modeller, draft);
    }
  });
  return true;
}
