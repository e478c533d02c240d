import type { Knex } from 'knex';

// Each project's bead type library (src/shared/bead-types.ts), in the order the project keeps it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('bead_types', (t) => {
    t.increments('id');
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE');
    t.integer('position').unsigned().notNullable();
    t.string('name', 40).notNullable();
    t.enum('size_class', ['regular', 'small', 'tiny']).notNullable();
    t.integer('charge').notNullable();
    t.double('delta_g_min').notNullable();
    t.double('delta_g_max').notNullable();
    t.string('description', 500).notNullable();
    t.unique(['project_id', 'name']);
  });
  // When and by whom each project's library was last replaced.
  await knex.schema.createTable('bead_type_libraries', (t) => {
    t.integer('project_id').unsigned().primary().references('projects.id').onDelete('CASCADE');
    t.integer('updated_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('bead_type_libraries');
  await knex.schema.dropTable('bead_types');
}
