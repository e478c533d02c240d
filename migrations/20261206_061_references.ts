import type { Knex } from 'knex';

// Atomistic reference simulations of a molecule (issue 15). The files live under the data folder
// (server/references/reference-files.ts); this row holds what was uploaded, the matching job's state
// and what it found. `references` is a reserved word in MariaDB, hence the table's name. Progress and
// the cancel flag are here so every app server and every viewer sees the same job state.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('simulation_references', (t) => {
    t.increments('id');
    t.integer('molecule_id').unsigned().notNullable().references('molecules.id').onDelete('CASCADE');
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE');
    t.string('name', 200).notNullable();
    t.string('status', 16).notNullable();
    t.integer('progress_done').unsigned().notNullable().defaultTo(0);
    t.integer('progress_total').unsigned().notNullable().defaultTo(0);
    t.string('structure_name', 255).notNullable();
    t.string('structure_format', 8).notNullable();
    t.string('trajectory_name', 255).nullable();
    t.string('trajectory_format', 8).nullable();
    t.text('selection').nullable();
    t.bigInteger('bytes').unsigned().notNullable();
    t.integer('copies').unsigned().nullable();
    t.integer('frames').unsigned().nullable();
    t.integer('atoms_per_copy').unsigned().nullable();
    t.integer('atoms_total').unsigned().nullable();
    t.string('source_format', 8).nullable();
    t.string('error_code', 64).nullable();
    t.text('error').nullable();
    t.text('error_details').nullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['project_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('simulation_references');
}
