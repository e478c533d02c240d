import type { Knex } from 'knex';

// A bead type's size class becomes what it means: the heavy atoms a bead of the type stands for
// (4, 3, 2) in its own column, instead of the words regular / small / tiny. Only the size values are
// converted; every project keeps its types and their names.
const WORDS: [string, number][] = [['regular', 4], ['small', 3], ['tiny', 2]];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bead_types', (t) => {
    t.tinyint('heavy_atoms_per_bead').unsigned().nullable();
  });
  for (const [word, n] of WORDS) await knex('bead_types').where({ size_class: word }).update({ heavy_atoms_per_bead: n });
  await knex.schema.alterTable('bead_types', (t) => {
    t.tinyint('heavy_atoms_per_bead').unsigned().notNullable().alter();
    t.dropColumn('size_class');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bead_types', (t) => {
    t.enum('size_class', ['regular', 'small', 'tiny']).nullable();
  });
  for (const [word, n] of WORDS) await knex('bead_types').where({ heavy_atoms_per_bead: n }).update({ size_class: word });
  await knex.schema.alterTable('bead_types', (t) => {
    t.enum('size_class', ['regular', 'small', 'tiny']).notNullable().alter();
    t.dropColumn('heavy_atoms_per_bead');
  });
}
