import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('sessions', (t) => {
    t.string('id').primary();
    t.string('user_id').notNullable().references('users.id').onDelete('CASCADE').index();
    t.bigInteger('expires_at').notNullable(); // epoch milliseconds
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('sessions');
}
