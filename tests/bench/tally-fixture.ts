import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createDb, databaseFile, migrateLatest } from '../../server/db/knex';
import { createTestUser } from '../factories/users';
import { createTallyProject } from '../factories/progress';

/** A long piece of our own (grow to 60, then even rounds), made 50 times: tens of thousands of steps to tap. */
export const benchPiece = [
  'Rnd 1: 6 sc in MR (6)',
  'Rnd 2: inc x6 (12)',
  ...Array.from({ length: 8 }, (_, i) => `Rnd ${i + 3}: (${i + 1 === 1 ? 'sc' : `${i + 1} sc`}, inc) x6 (${(i + 3) * 6})`),
  'Rnds 11-60: sc around (60)',
].join('\n');

/** A fresh DATA_DIR with one member and one project whose piece the benchmarks count on. */
export async function seedBenchData() {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'whorlbook-bench-'));
  const dataDir = path.join(root, 'data');
  const db = createDb(databaseFile(dataDir));
  await migrateLatest(db);
  const user = await createTestUser(db);
  const { projectId, pieceIds } = await createTallyProject(db, user.id, [{ name: 'Long tube', instructions: benchPiece, copies: 50 }]);
  await db.destroy();
  return { root, dataDir, user, projectId, pieceId: pieceIds[0] };
}

export async function signInCookie(url: string, email: string, password: string) {
  const res = await fetch(`${url}/api/auth/signin`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}
