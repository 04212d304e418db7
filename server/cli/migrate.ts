// `npm run db:migrate [-- --rollback]`: brings the database in DATA_DIR up to date (the server also does this at start).
import { parseEnv } from '../env.js';
import { createDb, databaseFile } from '../db/knex.js';
import { migrationSource } from '../db/migration-source.js';

const env = parseEnv();
const db = createDb(databaseFile(env.dataDir));
try {
  if (process.argv.includes('--rollback')) {
    const [batch, names] = await db.migrate.rollback({ migrationSource });
    console.log(names.length ? `Rolled back batch ${batch}: ${names.join(', ')}` : 'Nothing to roll back.');
  } else {
    const [batch, names] = await db.migrate.latest({ migrationSource });
    console.log(names.length ? `Batch ${batch} ran: ${names.join(', ')}` : 'Already up to date.');
  }
} finally {
  await db.destroy();
}
