import type { Knex } from 'knex';

// A placement marked on the Tally while offline is queued on the device and replayed later; its client-made id
// lets the server keep it once however often the device retries.
export async function up(knex: Knex) {
  await knex.schema.alterTable('placements', (t) => {
    t.string('op_id');
    t.unique(['piece_id', 'op_id']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('placements', (t) => {
    t.dropUnique(['piece_id', 'op_id']);
    t.dropColumn('op_id');
  });
}
