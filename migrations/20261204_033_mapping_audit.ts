import type { Knex } from 'knex';

// The append-only audit trail of saves, restores, locks and unlocks. The application has no code path
// that updates or deletes a row, and triggers refuse both in the database as well. (Rows still go with
// their mapping through the foreign key's cascade, which MariaDB runs without firing triggers.)
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mapping_audit', (t) => {
    t.bigIncrements('id');
    t.integer('mapping_id').unsigned().notNullable().references('mappings.id').onDelete('CASCADE');
    t.enum('action', ['save', 'restore', 'lock', 'unlock']).notNullable();
    t.integer('actor_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.integer('version_number').unsigned().nullable();
    t.text('reason').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['mapping_id', 'id']);
  });
  for (const op of ['UPDATE', 'DELETE']) {
    await knex.raw(
      `CREATE TRIGGER mapping_audit_no_${op.toLowerCase()} BEFORE ${op} ON mapping_audit FOR EACH ROW
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'mapping_audit is append-only'`,
    );
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP TRIGGER IF EXISTS mapping_audit_no_update');
  await knex.raw('DROP TRIGGER IF EXISTS mapping_audit_no_delete');
  await knex.schema.dropTable('mapping_audit');
}
