import type { Knex } from 'knex';

// last_comment_mail_at: the one-e-mail-per-hour limit for comment notices on this project's showcase.
// showcase_hidden_at/by: an admin took the page down after a report; the link answers 404 and the owner
// cannot reopen it by sharing again. hidden_by is kept without a foreign key so the column drops cleanly.
export async function up(knex: Knex) {
  await knex.schema.alterTable('projects', (t) => {
    t.string('last_comment_mail_at');
    t.string('showcase_hidden_at');
    t.string('showcase_hidden_by');
  });
}

export async function down(knex: Knex) {
  for (const column of ['last_comment_mail_at', 'showcase_hidden_at', 'showcase_hidden_by']) {
    await knex.raw(`ALTER TABLE projects DROP COLUMN ${column}`);
  }
}
