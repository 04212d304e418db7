import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('project_pieces', (t) => {
    t.increments('id');
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE').index();
    t.integer('position').notNullable().defaultTo(0);
    t.string('name').notNullable();
    t.integer('copies').notNullable().defaultTo(1);
    t.float('hook_mm');
    t.text('yarns').notNullable().defaultTo('[]');
    // A copy of the pattern piece's text taken when the project started: later pattern edits never shift counts.
    t.text('instructions').notNullable().defaultTo('');
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('project_pieces');
}
