import type { Knex } from 'knex';

// The yarn shelf: a maker's own yarns. How much is left is computed from projects' materials (shelfYarnId).
export async function up(knex: Knex) {
  await knex.schema.createTable('yarns', (t) => {
    t.increments('id');
    t.string('owner_id').notNullable().references('users.id').onDelete('CASCADE').index();
    t.string('name').notNullable();
    t.string('colour');
    t.string('fibre');
    t.integer('weight'); // Craft Yarn Council Standard Yarn Weight System category 0–7
    t.string('ply'); // as written on the band, e.g. "8 ply"
    t.float('meters_per_skein');
    t.float('yards_per_skein');
    t.float('skeins_owned').notNullable().defaultTo(1); // part skeins happen
    t.text('notes');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('yarns');
}
