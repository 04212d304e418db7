import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('users', (t) => {
    t.string('id').primary();
    t.string('email').notNullable().unique(); // stored lower-case
    t.string('display_name').notNullable();
    t.string('password_hash').notNullable();
    t.string('role').notNullable().defaultTo('member').checkIn(['member', 'admin']);
    t.string('email_verified_at');
    t.string('disabled_at');
    t.string('last_sign_in_at');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('users');
}
