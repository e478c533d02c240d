import type { Knex } from 'knex';

// Comment threads on beads. A thread is anchored to a bead id of a mapping (not to its name, so it
// survives renames); `thread_beads` is Beadloom's own record of the bead ids (and their last seen
// names) that threads have been started on or seen beside, so a thread stays readable, with a name,
// after its bead is deleted from the draft.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('threads', (t) => {
    t.increments('id');
    t.integer('mapping_id').unsigned().notNullable().references('mappings.id').onDelete('CASCADE');
    t.string('bead_id', 64).notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('resolved_at', { precision: 3 }).nullable();
    t.integer('resolved_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['mapping_id', 'bead_id']);
  });
  await knex.schema.createTable('thread_comments', (t) => {
    t.increments('id');
    t.integer('thread_id').unsigned().notNullable().references('threads.id').onDelete('CASCADE');
    t.integer('author_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.text('body').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('edited_at', { precision: 3 }).nullable();
    // A deleted comment keeps its row (the thread reads "deleted" there); its body is emptied.
    t.timestamp('deleted_at', { precision: 3 }).nullable();
    t.integer('deleted_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.index(['thread_id', 'id']);
  });
  await knex.schema.createTable('thread_beads', (t) => {
    t.integer('mapping_id').unsigned().notNullable().references('mappings.id').onDelete('CASCADE');
    t.string('bead_id', 64).notNullable();
    t.string('last_name', 200).notNullable();
    t.timestamp('seen_at').notNullable().defaultTo(knex.fn.now());
    t.primary(['mapping_id', 'bead_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('thread_beads');
  await knex.schema.dropTable('thread_comments');
  await knex.schema.dropTable('threads');
}
