import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../../server/app.js';
import type { AppContext } from '../../server/context.js';
import { createDb, migrateLatest } from '../../server/db/knex.js';
import { parseEnv } from '../../server/env.js';
import { createLucia } from '../../server/lib/auth.js';
import { createLogger } from '../../server/lib/logger.js';
import { createMailer, type Mailer } from '../../server/lib/mail.js';

export interface TestContext extends AppContext {
  app: ReturnType<typeof createApp>;
  close: () => Promise<void>;
}

/**
 * A real app over a fresh, migrated in-memory SQLite database and its own temporary uploads folder.
 * Pass env overrides (e.g. { SMTP_URL }) or a mailer to replace the default one.
 */
export async function createTestContext(
  overrides: Record<string, string> = {},
  options: { mailer?: Mailer } = {},
): Promise<TestContext> {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'whorlbook-test-'));
  const env = parseEnv({
    NODE_ENV: 'test',
    DATA_DIR: path.join(tmp, 'data'),
    UPLOADS_DIR: path.join(tmp, 'uploads'),
    SEED_DEMO: 'false',
    LOG_LEVEL: 'silent',
    ...overrides,
  });
  fs.mkdirSync(env.uploadsDir, { recursive: true });
  const db = createDb(':memory:');
  await migrateLatest(db);
  const logger = createLogger('silent');
  const mailer = options.mailer ?? (await createMailer(env, logger));
  const ctx: AppContext = { db, env, logger, mailer, lucia: createLucia(db, false) };
  const app = createApp(ctx);
  return {
    ...ctx,
    app,
    async close() {
      await mailer.close();
      await db.destroy();
      fs.rmSync(tmp, { recursive: true, force: true });
    },
  };
}

/** A supertest agent that keeps cookies, like one browser. */
export function agent(t: TestContext) {
  return request.agent(t.app);
}
