import type { Knex } from 'knex';

// One-time tokens mailed for e-mail verification and password reset. Only the SHA-256 of the token is stored,
// so a leaked database row cannot be turned back into a working link (OWASP Forgot Password Cheat Sheet).
export async function up(knex: Knex) {
  await knex.schema.createTable('auth_tokens', (t) => {
    t.increments('id');
    t.string('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.string('purpose').notNullable().checkIn(['verify_email', 'reset_password']);
    t.string('token_hash').notNullable().unique(); // hex sha256 of the 32-byte random token
    t.string('email').notNullable(); // the address the link was sent to; a verification only counts for it
    t.bigInteger('expires_at').notNullable(); // epoch milliseconds
    t.bigInteger('used_at'); // epoch milliseconds; set once, never cleared
    t.string('created_at').notNullable().defaultTo(knex.raw("(strftime('%Y-%m-%dT%H:%M:%fZ','now'))"));
    t.index(['user_id', 'purpose']);
  });
}

export async function down(knex: Knex) {
  await knex.schema.dropTable('auth_tokens');
}
