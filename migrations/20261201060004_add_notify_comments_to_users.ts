import type { Knex } from 'knex';

// Whether a maker gets an e-mail when someone comments on one of their showcases (on unless turned off).
export async function up(knex: Knex) {
  await knex.schema.alterTable('users', (t) => {
    t.boolean('notify_comments').notNullable().defaultTo(true);
  });
}

// SQLite (3.35+) drops a plain column in place; Knex's own dropColumn would rebuild the table.
export async function down(knex: Knex) {
  await knex.raw('ALTER TABLE users DROP COLUMN notify_comments');
}
