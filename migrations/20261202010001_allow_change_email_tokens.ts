import type { Knex } from 'knex';

// Adds 'change_email' to the purposes an auth token may have (the link sent to a new address; its `email` is the
// new address). SQLite cannot change a CHECK constraint in place, so the table is rebuilt with its rows; nothing
// references auth_tokens, so foreign keys are not in the way.
const rebuild = (purposes: string[]) => async (knex: Knex) => {
  const list = purposes.map((p) => `'${p}'`).join(',');
  await knex.raw(`CREATE TABLE \`auth_tokens_next\` (\`id\` integer not null primary key autoincrement, \`user_id\` varchar(255) not null, \`purpose\` varchar(255) not null check (\`purpose\` in (${list})), \`token_hash\` varchar(255) not null, \`email\` varchar(255) not null, \`expires_at\` bigint not null, \`used_at\` bigint, \`created_at\` varchar(255) not null default (strftime('%Y-%m-%dT%H:%M:%fZ','now')), foreign key(\`user_id\`) references \`users\`(\`id\`) on delete CASCADE)`);
  await knex.raw(
    `INSERT INTO auth_tokens_next (id, user_id, purpose, token_hash, email, expires_at, used_at, created_at) SELECT id, user_id, purpose, token_hash, email, expires_at, used_at, created_at FROM auth_tokens WHERE purpose IN (${list})`,
  );
  await knex.raw('DROP TABLE auth_tokens');
  await knex.raw('ALTER TABLE auth_tokens_next RENAME TO auth_tokens');
  await knex.raw('CREATE UNIQUE INDEX `auth_tokens_token_hash_unique` on `auth_tokens` (`token_hash`)');
  await knex.raw('CREATE INDEX `auth_tokens_user_id_purpose_index` on `auth_tokens` (`user_id`, `purpose`)');
};

export const up = rebuild(['verify_email', 'reset_password', 'change_email']);
export const down = rebuild(['verify_email', 'reset_password']);
