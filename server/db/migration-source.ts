import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Knex } from 'knex';

// Knex's own directory loader calls Node's import(), which cannot load .ts under Vitest. This source
// lists migrations/ itself and imports each file from here, where tsx and Vitest both transform TypeScript.
const dir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../migrations');

interface Migration {
  up: (knex: Knex) => Promise<void>;
  down: (knex: Knex) => Promise<void>;
}

export const migrationSource: Knex.MigrationSource<string> = {
  async getMigrations() {
    return fs
      .readdirSync(dir)
      .filter((f) => /^\d{14}_[a-z0-9_]+\.ts$/.test(f))
      .sort();
  },
  getMigrationName(file) {
    return file;
  },
  async getMigration(file) {
    return (await import(pathToFileURL(path.join(dir, file)).href)) as Migration;
  },
};
