import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('journal_entries', (t) => {
    t.increments('id');
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE').index();
    t.integer('piece_id').unsigned().references('project_pieces.id').onDelete('SET NULL');
    t.string('author_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('body').notNullable();
    t.string('entry_date').notNullable(); // YYYY-MM-DD, the maker's day
    t.integer('minutes');
    t.text('tags').notNullable().defaultTo('[]'); // JSON: progress | change | placement | problem | finished
    t.boolean('on_showcase').notNullable().defaultTo(false); // owner chose to show it on the shared page
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('journal_entries');
}
