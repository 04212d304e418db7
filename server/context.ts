import type { Knex } from 'knex';
import type { Env } from './env.js';
import type { AppLucia } from './lib/auth.js';
import type { Logger } from './lib/logger.js';
import type { Mailer } from './lib/mail.js';

/** Everything a router or service needs, built once in server/index.ts (or per test) and passed down. */
export interface AppContext {
  db: Knex;
  env: Env;
  lucia: AppLucia;
  logger: Logger;
  mailer: Mailer;
}
