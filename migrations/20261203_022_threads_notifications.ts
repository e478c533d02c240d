import type { Knex } from 'knex';

// In-app notifications (a mention, or a reply on a thread one takes part in) and each person's
// e-mail preferences for them. No preferences row means the defaults (e-mail on both).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notifications', (t) => {
    t.increments('id');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.enum('kind', ['mention', 'reply']).notNullable();
    t.integer('thread_id').unsigned().notNullable().references('threads.id').onDelete('CASCADE');
    t.integer('comment_id').unsigned().notNullable().references('thread_comments.id').onDelete('CASCADE');
    t.integer('actor_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.timestamp('read_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['user_id', 'read_at']);
  });
  await knex.schema.createTable('notification_preferences', (t) => {
    t.integer('user_id').unsigned().primary().references('users.id').onDelete('CASCADE');
    t.boolean('email_on_mention').notNullable().defaultTo(true);
    t.boolean('email_on_reply').notNullable().defaultTo(true);
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notification_preferences');
  await knex.schema.dropTable('notifications');
}
