import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('pattern_pieces', (t) => {
    t.increments('id');
    t.integer('pattern_id').unsigned().notNullable().references('patterns.id').onDelete('CASCADE').index();
    t.integer('position').notNullable().defaultTo(0);
    t.string('name').notNullable();
    t.integer('copies').notNullable().defaultTo(1);
    t.float('hook_mm');
    t.text('yarns').notNullable().defaultTo('[]'); // JSON: names/ids of the pattern's yarns this piece uses
    t.text('instructions').notNullable().defaultTo('');
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('pattern_pieces');
}
