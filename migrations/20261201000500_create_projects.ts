import type { Knex } from 'knex';

export async function up(knex: Knex) {
  await knex.schema.createTable('projects', (t) => {
    t.increments('id');
    t.string('owner_id').notNullable().references('users.id').onDelete('CASCADE').index();
    t.integer('pattern_id').unsigned().references('patterns.id').onDelete('SET NULL');
    t.string('title').notNullable();
    t.string('status')
      .notNullable()
      .defaultTo('planned')
      .checkIn(['planned', 'on_the_hook', 'resting', 'finished', 'frogged']);
    t.string('terms').notNullable().defaultTo('us').checkIn(['us', 'uk']);
    // Frozen copy of the pattern's credit at the time the project started, so the showcase can credit it
    // even after the pattern is edited or deleted. JSON: { title, designerCredit, sourceUrl }
    t.text('pattern_credit');
    t.string('started_on');
    t.string('finished_on');
    t.string('recipient');
    t.boolean('for_young_child').notNullable().defaultTo(false);
    t.text('materials').notNullable().defaultTo('{}'); // JSON: { yarns: [], hooks: [], notions: [] }
    t.text('notes');
    t.string('visibility').notNullable().defaultTo('private').checkIn(['private', 'link', 'public']);
    t.string('share_token').unique();
    t.integer('cover_photo_id');
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.string('updated_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.index(['owner_id', 'status']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('projects');
}
