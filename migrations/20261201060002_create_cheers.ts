import type { Knex } from 'knex';

// A cheer is a one-tap reaction on a showcase: at most one per member per project.
export async function up(knex: Knex) {
  await knex.schema.createTable('cheers', (t) => {
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE');
    t.string('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.primary(['project_id', 'user_id']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('cheers');
}
