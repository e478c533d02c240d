import type { Knex } from 'knex';

// Immutable, numbered snapshots of a mapping's draft. `number` runs 1, 2, 3… per mapping; the unique
// key is the backstop behind the service's row lock, so two saves can never share a number.
// `draft` and `evaluation` are JSON (src/shared/chem.ts Mapping / Evaluation) as the server had them.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mapping_versions', (t) => {
    t.increments('id');
    t.integer('mapping_id').unsigned().notNullable().references('mappings.id').onDelete('CASCADE');
    t.integer('number').unsigned().notNullable();
    t.text('message').notNullable();
    t.integer('author_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.specificType('draft', 'LONGTEXT').notNullable();
    t.specificType('evaluation', 'LONGTEXT').nullable();
    t.text('evaluation_error').nullable();
    t.text('canonical_smiles').notNullable();
    t.string('resolution', 8).notNullable();
    t.string('content_sha256', 64).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['mapping_id', 'number']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mapping_versions');
}
