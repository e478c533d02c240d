import type { Knex } from 'knex';

// The stored canonical model of each molecule (atom indices never change after creation), its
// 3D coordinates with their source, the background conformer job's state, tags and archiving.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('molecules', (t) => {
    t.enum('source', ['smiles', 'molfile']).notNullable().defaultTo('smiles');
    t.text('canonical_smiles').notNullable().defaultTo('');
    t.string('formula', 500).notNullable().defaultTo('');
    t.double('molecular_weight').notNullable().defaultTo(0);
    t.double('log_p').notNullable().defaultTo(0);
    t.integer('heavy_atoms').unsigned().notNullable().defaultTo(0);
    t.integer('net_charge').notNullable().defaultTo(0);
    // JSON of src/shared/chem.ts Molecule; null only for rows written before this migration.
    t.specificType('model', 'LONGTEXT').nullable();
    t.specificType('xyz', 'LONGTEXT').nullable();
    t.enum('xyz_source', ['upload', 'conformer']).nullable();
    t.enum('conformer_status', ['none', 'queued', 'running', 'done', 'failed']).notNullable().defaultTo('none');
    t.text('conformer_error').nullable();
    t.text('tags').notNullable().defaultTo('[]');
    t.boolean('archived').notNullable().defaultTo(false);
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('molecules', (t) => {
    t.dropColumns(
      'source', 'canonical_smiles', 'formula', 'molecular_weight', 'log_p', 'heavy_atoms', 'net_charge', 'model',
      'xyz', 'xyz_source', 'conformer_status', 'conformer_error', 'tags', 'archived', 'updated_at',
    );
  });
}
