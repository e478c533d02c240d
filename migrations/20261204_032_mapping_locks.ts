import type { Knex } from 'knex';

// The production lock: at most one row per mapping (the primary key), so of two supervisors locking
// at once exactly one insert succeeds. `mappings.locked` mirrors it for the draft's readers.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mapping_locks', (t) => {
    t.integer('mapping_id').unsigned().primary().references('mappings.id').onDelete('CASCADE');
    t.integer('version_id').unsigned().notNullable().references('mapping_versions.id').onDelete('CASCADE');
    t.integer('locked_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.text('note').notNullable();
    t.timestamp('locked_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mapping_locks');
}
