import type { Knex } from 'knex';

// Resized photos (display + thumbnail JPEGs under UPLOADS_DIR, named by the server-made storage_key).
export async function up(knex: Knex) {
  await knex.schema.createTable('photos', (t) => {
    t.increments('id');
    t.integer('project_id').unsigned().notNullable().references('projects.id').onDelete('CASCADE').index();
    t.integer('entry_id').unsigned().references('journal_entries.id').onDelete('CASCADE').index();
    t.string('owner_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('storage_key').notNullable().unique(); // random, never derived from ids or file names
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.integer('bytes').notNullable();
    t.string('alt').notNullable().defaultTo('');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('photos');
}
