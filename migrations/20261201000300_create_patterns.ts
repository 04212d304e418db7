import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('patterns', (t) => {
    t.increments('id');
    t.string('owner_id').notNullable().references('users.id').onDelete('CASCADE').index();
    t.string('title').notNullable();
    t.string('designer_credit');
    t.string('source_url');
    t.string('terms').notNullable().defaultTo('us').checkIn(['us', 'uk']);
    t.text('gauge'); // JSON: { stitches, rows, over: '10cm' | '4in', stitch?, hookMm? }
    t.text('skill_notes');
    t.text('materials').notNullable().defaultTo('{}'); // JSON: { yarns: [], hooks: [], notions: [] }
    t.string('visibility').notNullable().defaultTo('private').checkIn(['private', 'testers', 'public']);
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('patterns');
}
