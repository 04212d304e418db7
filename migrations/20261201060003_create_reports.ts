import type { Knex } from 'knex';

// A member's report of a comment or a whole showcase page, for the admins to hide or dismiss.
export async function up(knex: Knex) {
  await knex.schema.createTable('reports', (t) => {
    t.increments('id');
    t.string('reporter_id').notNullable().references('users.id').onDelete('CASCADE');
    t.integer('comment_id').unsigned().references('comments.id').onDelete('CASCADE');
    t.integer('project_id').unsigned().references('projects.id').onDelete('CASCADE'); // the page, or the comment's page
    t.string('target').notNullable().checkIn(['comment', 'project']);
    t.text('reason').notNullable();
    t.string('status').notNullable().defaultTo('open').checkIn(['open', 'hidden', 'dismissed']);
    t.string('handled_by').references('users.id').onDelete('SET NULL');
    t.string('handled_at');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.index(['status', 'created_at']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('reports');
}
