import type { Knex } from 'knex';

// A note on a whole bead type library (e.g. the demo library's "illustrative only"), shown once
// above its table instead of repeated in every row's description.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bead_type_libraries', (t) => {
    t.string('note', 500).notNullable().defaultTo('');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bead_type_libraries', (t) => {
    t.dropColumn('note');
  });
}
