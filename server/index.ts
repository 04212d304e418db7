import fs from 'node:fs';
import { parseEnv } from './env.js';
import { createDb, databaseFile, migrateLatest } from './db/knex.js';
import { createLucia } from './lib/auth.js';
import { createLogger } from './lib/logger.js';
import { createMailer } from './lib/mail.js';
import { createApp } from './app.js';
import { seedDemo } from './services/demo.js';
import type { AppContext } from './context.js';

// A local .env (see .env.example) is optional; real environment variables win over it.
if (fs.existsSync('.env')) process.loadEnvFile('.env');
const env = parseEnv();
const logger = createLogger(env.LOG_LEVEL);
fs.mkdirSync(env.dataDir, { recursive: true });
fs.mkdirSync(env.uploadsDir, { recursive: true });

const db = createDb(databaseFile(env.dataDir));
await migrateLatest(db);
if (env.SEED_DEMO) await seedDemo(db, logger);

const mailer = await createMailer(env, logger);
const ctx: AppContext = {
  db,
  env,
  logger,
  mailer,
  lucia: createLucia(db, env.APP_ORIGIN?.startsWith('https:') ?? false),
};
const app = createApp(ctx);

const server = app.listen(env.PORT, env.HOST, () => {
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.PORT;
  const host = env.HOST === '127.0.0.1' || env.HOST === '0.0.0.0' ? 'localhost' : env.HOST;
  // Tools (the e2e set-up) read this line to learn the port when PORT=0.
  console.log(`Whorlbook is ready at http://${host === 'localhost' ? '127.0.0.1' : host}:${port} (open http://localhost:${port})`);
});

async function shutdown(signal: string) {
  logger.info({ signal }, 'shutting down');
  server.close();
  await mailer.close();
  await db.destroy();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
