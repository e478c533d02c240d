import * as Y from 'yjs';
import type { Db } from '../../server/db/knex';
import { loadDraft } from '../../server/drafts/drafts.service';
import type { ConnectionOptions } from 'mysql2';
import { UpdateLog } from '../../server/drafts/update-log';
import { createMolecule, demoProjectId } from '../helpers/fixtures';

// Fixtures for the versions, lock, export and import tests. Drafts are edited the way the collab
// server stores an accepted edit: a Yjs update appended to mapping_updates (no room is open).

export async function editDraft(db: Db, mappingId: number, edit: (doc: Y.Doc) => void, userId: number | null = null): Promise<void> {
  const { doc } = await loadDraft(db, mappingId);
  const updates: Uint8Array[] = [];
  doc.on('update', (u: Uint8Array) => updates.push(u));
  edit(doc);
  if (!updates.length) return;
  const log = new UpdateLog(db.client.config.connection as ConnectionOptions); // the pool's own settings
  try {
    await log.append(mappingId, [{ userId, data: Y.mergeUpdates(updates) }]);
  } finally {
    await log.close();
  }
}

/** A fresh mapping of 1-propanol (C0–C1–C2–O3) with two beads, ids a and b. */
export async function propanolMapping(db: Db, name = 'Propanol 2:1'): Promise<{ moleculeId: number; mappingId: number }> {
  const projectId = await demoProjectId(db);
  const moleculeId = await createMolecule(db, projectId, `Propanol for ${name}`, 'CCCO');
  const { createMapping } = await import('../../server/mappings/mappings.service');
  const draft = {
    beads: [
      { id: 'a', name: 'A', type: 'C1', centre: 'mass' as const, atoms: [{ index: 0, weight: 1 }, { index: 1, weight: 1 }] },
      { id: 'b', name: 'B', centre: 'mass' as const, atoms: [{ index: 2, weight: 1 }, { index: 3, weight: 1 }] },
    ],
  };
  const mappingId = await createMapping(db, moleculeId, { name, resolution: '2:1' }, null as unknown as number, draft);
  return { moleculeId, mappingId };
}

/** The draft as the server reads it when no room is open (collab-server.ts `read`), for saving fixtures. */
export async function storedDrafts(db: Db) {
  const { readStoredDraft } = await import('../../server/drafts/drafts.service');
  return {
    async read(mappingId: number) {
      const stored = await readStoredDraft(db, mappingId);
      if (!stored) throw new Error(`no mapping ${mappingId}`);
      return stored;
    },
    refresh() {},
    async storedDerived() {
      throw new Error('not used by the fixtures');
    },
  };
}

/** A fresh propanol mapping with `versions` saved versions (by nobody in particular: the supervisor). */
export async function versionedMapping(db: Db, name: string, versions = 1): Promise<{ moleculeId: number; mappingId: number }> {
  const { saveVersion } = await import('../../server/versions/versions.service');
  const made = await propanolMapping(db, name);
  const author = (await db('users').where({ email: 'supervisor@example.org' }).first('id')).id;
  for (let i = 0; i < versions; i++) await saveVersion(db, await storedDrafts(db), made.mappingId, author, `fixture ${i + 1}`);
  return made;
}

/** A fresh mapping whose version 1 is locked for production (rows written as the lock service does). */
export async function lockedMapping(db: Db, name: string): Promise<number> {
  const { mappingId } = await versionedMapping(db, name);
  const v = await db('mapping_versions').where({ mapping_id: mappingId, number: 1 }).first('id');
  await db('mapping_locks').insert({ mapping_id: mappingId, version_id: v.id, locked_by: null, note: '' });
  await db('mappings').where({ id: mappingId }).update({ locked: true });
  return mappingId;
}

/** A valid import body (a JSON export's essentials) for a molecule's first `atoms` atoms in one bead. */
export async function importBodyFor(db: Db, moleculeId: number, atoms = 2) {
  const { contentSha256 } = await import('../../server/versions/content-hash');
  const { versionContent } = await import('../../src/shared/exports');
  const { canonical_smiles: smiles, model } = await db('molecules').where({ id: moleculeId }).first('canonical_smiles', 'model');
  const mapping = { beads: [{ id: 'imp1', name: 'I1', centre: 'mass' as const, atoms: Array.from({ length: atoms }, (_, index) => ({ index, weight: 1 })) }] };
  // The molecule's graph, as a JSON export carries it: the import places the beads by matching it.
  const m = JSON.parse(model) as { atoms: { index: number; element: string; isotope: number | null; charge: number; hydrogens: number }[]; bonds: { a: number; b: number; order: number; aromatic: boolean }[] };
  const molecule = {
    atoms: m.atoms.map((a) => ({ number: a.index + 1, element: a.element, isotope: a.isotope, charge: a.charge, hydrogens: a.hydrogens })),
    bonds: m.bonds.map((b) => ({ a: b.a + 1, b: b.b + 1, order: b.order, aromatic: b.aromatic })),
  };
  return { format: 'beadloom-mapping', formatVersion: 1, mapping: { name: 'Imported', resolution: '4:1' }, molecule, content: versionContent(smiles, mapping), sha256: contentSha256(smiles, mapping) };
}
