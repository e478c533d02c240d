import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mappings', (t) => {
    t.increments('id');
    t.integer('molecule_id').unsigned().notNullable().references('molecules.id').onDelete('CASCADE');
    t.string('name', 200).notNullable();
    t.enum('resolution', ['4:1', '3:1', '2:1']).notNullable();
    t.text('description').notNullable();
    // Set while a production version is locked (the versions feature sets it); the draft is then read-only.
    t.boolean('locked').notNullable().defaultTo(false);
    // Kept up to date by the collab server after each evaluation, for lists.
    t.integer('bead_count').unsigned().notNullable().defaultTo(0);
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.index(['molecule_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mappings');
}
