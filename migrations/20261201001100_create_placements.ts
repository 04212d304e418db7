import type { Knex } from 'knex';

// Where a part went on a piece ("left eye" between Rnds 9 and 10), recorded from the Tally.
export async function up(knex: Knex) {
  await knex.schema.createTable('placements', (t) => {
    t.increments('id');
    t.integer('piece_id').unsigned().notNullable().references('project_pieces.id').onDelete('CASCADE').index();
    t.integer('copy').notNullable().defaultTo(1);
    t.integer('round').notNullable(); // the round number as labelled in the pattern
    t.integer('step'); // stitch position within the round, when marked from the Tally
    t.string('label').notNullable();
    t.text('note');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('placements');
}
