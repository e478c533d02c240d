import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id');
    t.string('email', 254).notNullable().unique();
    t.string('display_name', 200).notNullable();
    // Null until the person sets a password from their invitation.
    t.string('password_hash', 100).nullable();
    t.boolean('is_admin').notNullable().defaultTo(false);
    t.timestamp('disabled_at').nullable();
    // Bumped to end every session of the account (disable, password change).
    t.integer('session_version').unsigned().notNullable().defaultTo(1);
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}
