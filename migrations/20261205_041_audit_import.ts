import type { Knex } from 'knex';

// Imports of a JSON export are recorded in the audit trail too (with whether the file had been
// edited after export). Widening the enum changes no row, so the append-only triggers stay as they are.
export async function up(knex: Knex): Promise<void> {
  await knex.raw("ALTER TABLE mapping_audit MODIFY action ENUM('save', 'restore', 'lock', 'unlock', 'import') NOT NULL");
}

export async function down(knex: Knex): Promise<void> {
  // Rows of the removed action go with their mappings only; refuse rather than lose them.
  const row = await knex('mapping_audit').where({ action: 'import' }).first('id');
  if (row) throw new Error('mapping_audit has import entries; delete those mappings before migrating down.');
  await knex.raw("ALTER TABLE mapping_audit MODIFY action ENUM('save', 'restore', 'lock', 'unlock') NOT NULL");
}
