import type { Knex } from 'knex';

// Single-use tokens for first-use invitations and password resets. Only a
// SHA-256 of the token is stored; the token itself exists only in the e-mail.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_tokens', (t) => {
    t.increments('id');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.specificType('token_hash', 'char(64)').notNullable().unique();
    t.enum('purpose', ['invite', 'reset']).notNullable();
    t.timestamp('expires_at').notNullable();
    t.timestamp('used_at').nullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_tokens');
}
