import type { Knex } from 'knex';

// The live draft of each mapping, stored as Yjs updates: every accepted update is appended to
// mapping_updates before it is broadcast; compaction folds them into mapping_snapshots (one row per
// mapping: the merged state and the id of the last update it contains) and deletes them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mapping_updates', (t) => {
    t.bigIncrements('id');
    t.integer('mapping_id').unsigned().notNullable().references('mappings.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.specificType('data', 'MEDIUMBLOB').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['mapping_id', 'id']);
  });
  await knex.schema.createTable('mapping_snapshots', (t) => {
    t.integer('mapping_id').unsigned().primary().references('mappings.id').onDelete('CASCADE');
    t.specificType('state', 'LONGBLOB').notNullable();
    t.bigInteger('last_update_id').unsigned().notNullable();
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mapping_snapshots');
  await knex.schema.dropTable('mapping_updates');
}
