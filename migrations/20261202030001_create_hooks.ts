import type { Knex } from 'knex';

// The hook roll: a maker's own hooks. Sizes are kept in mm; the US name is looked up from the chart when answering,
// so a correction to the chart reaches every stored hook.
export async function up(knex: Knex) {
  await knex.schema.createTable('hooks', (t) => {
    t.increments('id');
    t.string('owner_id').notNullable().references('users.id').onDelete('CASCADE').index();
    t.float('size_mm').notNullable();
    t.string('material'); // aluminium | steel | wood | bamboo | plastic | ergonomic | other (src/schemas/hooks.ts)
    t.string('brand');
    t.text('note');
    t.integer('quantity').notNullable().defaultTo(1);
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('hooks');
}
