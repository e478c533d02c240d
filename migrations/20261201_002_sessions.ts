import type { Knex } from 'knex';

// The table express-mysql-session reads and writes (its default column names).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (t) => {
    t.specificType('session_id', 'varchar(128) COLLATE utf8mb4_bin').primary();
    t.integer('expires').unsigned().notNullable().index();
    t.specificType('data', 'mediumtext COLLATE utf8mb4_bin');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
