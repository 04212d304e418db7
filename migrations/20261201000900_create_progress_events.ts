import type { Knex } from 'knex';

// Every Tally tap as an event with the client's opId: applied once, kept for undo and history.
export async function up(knex: Knex) {
  await knex.schema.createTable('progress_events', (t) => {
    t.increments('id');
    t.integer('piece_id').unsigned().notNullable().references('project_pieces.id').onDelete('CASCADE');
    t.string('op_id').notNullable();
    t.string('action').notNullable(); // step | undo | round | set
    t.text('payload'); // JSON of the request (at, to)
    t.text('before'); // JSON position before the event, for undo
    t.text('after'); // JSON position after the event
    t.string('at'); // when the maker tapped (client clock), if sent
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.unique(['piece_id', 'op_id']);
    t.index(['piece_id', 'id']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('progress_events');
}
