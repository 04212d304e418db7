// `npm run user:create -- --email a@b.c --password '…' --name 'Ada' [--admin]`: adds a member (or admin)
// straight to the database in DATA_DIR, e.g. to make the first admin of a fresh install.
import { parseArgs } from 'node:util';
import { parseEnv } from '../env.js';
import { createDb, databaseFile, migrateLatest } from '../db/knex.js';
import { createUser } from '../services/users.js';
import { EmailSchema, PasswordSchema } from '../../src/schemas/auth.js';

const usage = 'usage: npm run user:create -- --email EMAIL --password PASSWORD --name "DISPLAY NAME" [--admin] [--unverified]';
let args;
try {
  args = parseArgs({
    options: { email: { type: 'string' }, password: { type: 'string' }, name: { type: 'string' }, admin: { type: 'boolean' }, unverified: { type: 'boolean' } },
  }).values;
} catch (e) {
  console.error(`${(e as Error).message}\n${usage}`);
  process.exit(2);
}
const email = EmailSchema.safeParse(args.email);
const password = PasswordSchema.safeParse(args.password);
if (!email.success || !password.success || !args.name?.trim()) {
  console.error([!email.success && 'a valid --email', !password.success && 'a --password of 10 to 256 characters', !args.name?.trim() && 'a --name'].filter(Boolean).join(', ') + ' is needed.');
  console.error(usage);
  process.exit(2);
}
const env = parseEnv();
const db = createDb(databaseFile(env.dataDir));
try {
  await migrateLatest(db);
  const user = await createUser(db, { email: email.data, password: password.data, displayName: args.name, role: args.admin ? 'admin' : 'member', emailVerified: !args.unverified });
  console.log(JSON.stringify({ id: user.id, email: user.email, role: user.role }));
} catch (e) {
  console.error((e as Error).message);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
