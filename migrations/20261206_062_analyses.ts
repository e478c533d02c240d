import type { Knex } from 'knex';

// A mapping at one version applied to a reference (issue 15): the job's state, progress and cancel
// flag (seen by every app server and viewer), the settings that make it reproducible (resolved
// version number or the draft's content hash, temperature, bins) and the term table as JSON. The
// bead centres of every frame and copy are a file under the data folder.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('analyses', (t) => {
    t.increments('id');
    t.integer('mapping_id').unsigned().notNullable().references('mappings.id').onDelete('CASCADE');
    t.integer('reference_id').unsigned().notNullable().references('simulation_references.id').onDelete('CASCADE');
    t.string('version_ref', 16).notNullable();
    t.integer('version_number').unsigned().nullable();
    t.string('content_sha256', 64).notNullable();
    t.double('temperature').notNullable();
    t.integer('bins').unsigned().notNullable();
    t.string('status', 16).notNullable();
    t.integer('progress_done').unsigned().notNullable().defaultTo(0);
    t.integer('progress_total').unsigned().notNullable().defaultTo(0);
    t.boolean('cancel_requested').notNullable().defaultTo(false);
    t.specificType('mapping_state', 'LONGTEXT').notNullable();
    t.specificType('result', 'LONGTEXT').nullable();
    t.string('error_code', 64).nullable();
    t.text('error').nullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.timestamp('started_at', { precision: 3 }).nullable();
    t.timestamp('finished_at', { precision: 3 }).nullable();
    t.index(['mapping_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('analyses');
}
