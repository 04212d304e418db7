import type { Knex } from 'knex';

// Undo reverts the most recent event that is not yet undone: each reverted event records which undo reverted it,
// so the undo stack is simply the live events newest first, and the log still holds every tap for history.
export async function up(knex: Knex) {
  await knex.schema.alterTable('progress_events', (t) => {
    t.integer('undone_by'); // id of the undo event that reverted this one; null while it counts
    t.integer('version'); // piece_progress.version right after this event
  });
}

export async function down(knex: Knex) {
  await knex.schema.alterTable('progress_events', (t) => {
    t.dropColumn('version');
    t.dropColumn('undone_by');
  });
}
