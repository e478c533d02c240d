import type { Db } from '../db/knex';
import type { BeadTypeRow } from '../../src/shared/bead-types';

// Knex for `bead_types`: a project's library is read in order and replaced as a whole.

export async function libraryFor(db: Db, projectId: number): Promise<BeadTypeRow[]> {
  const rows = await db('bead_types').where({ project_id: projectId }).orderBy('position');
  return rows.map((r) => ({
    name: r.name,
    heavyAtomsPerBead: Number(r.heavy_atoms_per_bead) as BeadTypeRow['heavyAtomsPerBead'],
    charge: r.charge,
    deltaGMin: r.delta_g_min,
    deltaGMax: r.delta_g_max,
    description: r.description,
    // Non-bonded parameters only when set, so libraries without them read as before.
    ...(r.sigma_nm !== null ? { sigma: r.sigma_nm } : {}),
    ...(r.epsilon_kj_per_mol !== null ? { epsilon: r.epsilon_kj_per_mol } : {}),
  }));
}

export async function lastChange(db: Db, projectId: number): Promise<{ updatedAt: string | null; note: string }> {
  const row = await db('bead_type_libraries').where({ project_id: projectId }).first('updated_at', 'note');
  return { updatedAt: row ? new Date(row.updated_at).toISOString() : null, note: row?.note ?? '' };
}

/** Replaces the types; `note` replaces the library's note when given, else the note is kept. */
export async function replaceLibrary(db: Db, projectId: number, types: BeadTypeRow[], userId: number | null, note?: string): Promise<void> {
  await db.transaction(async (trx) => {
    const changed = { updated_by: userId, updated_at: trx.fn.now(), ...(note !== undefined ? { note } : {}) };
    await trx('bead_type_libraries').insert({ project_id: projectId, ...changed }).onConflict('project_id').merge(Object.keys(changed));
    await trx('bead_types').where({ project_id: projectId }).delete();
    if (types.length) {
      await trx('bead_types').insert(
        types.map((t, position) => ({
          project_id: projectId,
          position,
          name: t.name,
          heavy_atoms_per_bead: t.heavyAtomsPerBead,
          charge: t.charge,
          delta_g_min: t.deltaGMin,
          delta_g_max: t.deltaGMax,
          description: t.description,
          sigma_nm: t.sigma ?? null,
          epsilon_kj_per_mol: t.epsilon ?? null,
        })),
      );
    }
  });
}
