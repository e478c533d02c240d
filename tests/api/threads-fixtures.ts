import type { Db } from '../../server/db/knex';
import { beadsOfDoc } from '../../server/threads/draft-beads';
import { loadDraft } from '../../server/drafts/drafts.service';
import { demoMappingId, userId } from '../helpers/fixtures';

// Fixtures for thread tests and the route × role table: threads and comments written straight into
// MariaDB, on a bead the demo mapping really has.

export async function firstBeadId(db: Db, mappingId: number): Promise<string> {
  const [id] = beadsOfDoc((await loadDraft(db, mappingId)).doc).current.keys();
  if (!id) throw new Error(`mapping ${mappingId} has no beads`);
  return id;
}

/** A thread on the demo mapping's first bead, opened by `email` with one comment. */
export async function createThreadFixture(db: Db, email = 'modeller@example.org', body = 'Fixture comment.'): Promise<{ threadId: number; commentId: number; mappingId: number }> {
  const mappingId = await demoMappingId(db);
  const author = await userId(db, email);
  const [threadId] = await db('threads').insert({ mapping_id: mappingId, bead_id: await firstBeadId(db, mappingId), created_by: author });
  const [commentId] = await db('thread_comments').insert({ thread_id: threadId, author_id: author, body });
  return { threadId: threadId as number, commentId: commentId as number, mappingId };
}

let shared: Promise<{ threadId: number; commentId: number; mappingId: number }> | null = null;
let sharedDb: Db | null = null;
/** One fixture thread per database, reused across callers. */
export function sharedThread(db: Db) {
  if (!shared || sharedDb !== db) {
    sharedDb = db;
    shared = createThreadFixture(db);
  }
  return shared;
}

/** Changes the stored draft the way an accepted collab update does. */
export { editDraft } from './versions-fixtures';

/** A project of its own (supervisor only) with a molecule and a one-bead mapping. */
export async function otherProjectMapping(db: Db): Promise<{ projectId: number; mappingId: number }> {
  const { createMolecule } = await import('../helpers/fixtures');
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const sup = await userId(db, 'supervisor@example.org');
  const [projectId] = await db('projects').insert({ name: 'Elsewhere', description: '', created_by: sup });
  await db('project_members').insert({ project_id: projectId, user_id: sup, role: 'supervisor' });
  const moleculeId = await createMolecule(db, projectId as number, 'Ethanol elsewhere');
  const draft = { beads: [{ id: 'bx1', name: 'E', centre: 'mass' as const, atoms: [0, 1, 2].map((index) => ({ index, weight: 1 })) }] };
  const mappingId = await createMapping(db, moleculeId, { name: 'Other', resolution: '2:1' }, sup, draft);
  return { projectId: projectId as number, mappingId };
}
