import type { Knex } from 'knex';

// Optional non-bonded parameters per bead type for the engine exports: Lennard-Jones sigma (nm) and
// epsilon (kJ/mol). Null means "not set": the export then writes a marked placeholder (docs/exports.md).

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bead_types', (t) => {
    t.double('sigma_nm').nullable();
    t.double('epsilon_kj_per_mol').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bead_types', (t) => {
    t.dropColumn('sigma_nm');
    t.dropColumn('epsilon_kj_per_mol');
  });
}
