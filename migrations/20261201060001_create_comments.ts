import type { Knex } from 'knex';

// Comments friends leave on a showcase. Bodies are stored exactly as typed and only ever rendered as text.
export async function up(knex: Knex) {
  await knex.schema.createTable('comments', (t) => {
    t.increments('id');
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE');
    t.string('author_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('body').notNullable(); // at most 2000 characters, checked by the shared schema
    t.string('hidden_at'); // set by the page owner or by an admin resolving a report
    t.string('hidden_by').references('users.id').onDelete('SET NULL');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.index(['project_id', 'created_at']);
    t.index(['author_id']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('comments');
}
