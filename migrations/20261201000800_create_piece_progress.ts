import type { Knex } from 'knex';

// The Tally's current position per project piece, derived from progress_events and kept for fast reads.
export async function up(knex: Knex) {
  await knex.schema.createTable('piece_progress', (t) => {
    t.integer('piece_id').unsigned().primary().references('project_pieces.id').onDelete('CASCADE');
    t.integer('copy').notNullable().defaultTo(1); // 1-based copy being worked ("ear 2 of 2")
    t.integer('round').notNullable().defaultTo(0); // 0-based index into the piece's checked rounds
    t.integer('step').notNullable().defaultTo(0); // steps done in the current round
    t.integer('done').notNullable().defaultTo(0); // total steps completed on this piece across all copies
    t.integer('version').notNullable().defaultTo(0); // bumps on every applied event
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('piece_progress');
}
