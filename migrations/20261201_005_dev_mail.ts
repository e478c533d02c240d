import type { Knex } from 'knex';

// Messages caught by the local SMTP sink (development and tests only).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('dev_mail', (t) => {
    t.increments('id');
    t.text('to_addresses').notNullable();
    t.string('from_address', 320).notNullable();
    t.string('subject', 1000).notNullable();
    t.text('text_body', 'mediumtext').notNullable();
    t.text('html_body', 'mediumtext').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('dev_mail');
}
