import fs from 'node:fs';
import path from 'node:path';
import knex, { type Knex } from 'knex';
import { migrationSource } from './migration-source.js';

/** Opens the SQLite database (a file path, or ':memory:' for tests) with the pragmas Whorlbook relies on. */
export function createDb(filename: string): Knex {
  if (filename !== ':memory:') fs.mkdirSync(path.dirname(filename), { recursive: true });
  return knex({
    client: 'better-sqlite3',
    connection: { filename },
    useNullAsDefault: true,
    // One connection: SQLite serialises writers anyway, and an in-memory database exists per connection.
    pool: {
      min: 1,
      max: 1,
      afterCreate(conn: { pragma: (s: string) => unknown }, done: (err: Error | null, conn: unknown) => void) {
        conn.pragma('foreign_keys = ON');
        conn.pragma('journal_mode = WAL');
        // FULL: a committed tap survives a power cut too, not only a crash (WAL with NORMAL may lose the last commits).
        conn.pragma('synchronous = FULL');
        conn.pragma('busy_timeout = 5000');
        done(null, conn);
      },
    },
    migrations: { migrationSource },
  });
}

export async function migrateLatest(db: Knex) {
  await db.migrate.latest({ migrationSource });
}

export function databaseFile(dataDir: string) {
  return path.join(dataDir, 'whorlbook.sqlite');
}
