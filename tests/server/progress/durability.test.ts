import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import Database from 'better-sqlite3';
import { createDb, databaseFile, migrateLatest } from '../../../server/db/knex.js';
import { startServer, type RunningServer } from '../../e2e/server.js';
import { createTestUser } from '../../factories/users.js';
import { createTallyProject, newOpId } from '../../factories/progress.js';

// The real server process, killed with SIGKILL in the middle of a burst of taps: every tap it answered 200 to
// must still be there after a restart on the same DATA_DIR (the answer is sent only after the commit).

const root = fs.mkdtempSync(path.join(os.tmpdir(), 'whorlbook-durability-'));
const dataDir = path.join(root, 'data');
const running: RunningServer[] = [];
afterAll(async () => {
  for (const s of running) await s.stop('SIGKILL');
  fs.rmSync(root, { recursive: true, force: true });
});

const longPiece = ['Rnd 1: 6 sc in MR (6)', 'Rnd 2: inc x6 (12)', 'Rnds 3-30: sc around (12)'].join('\n');

async function signIn(url: string, email: string, password: string) {
  const res = await fetch(`${url}/api/auth/signin`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
  expect(res.status).toBe(200);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

describe('durability', () => {
  it('keeps every acknowledged tap through a SIGKILL and a restart', { timeout: 180_000 }, async () => {
    const db = createDb(databaseFile(dataDir));
    await migrateLatest(db);
    const user = await createTestUser(db);
    const { pieceIds } = await createTallyProject(db, user.id, [{ name: 'Tube', instructions: longPiece }]);
    await db.destroy();
    const pieceId = pieceIds[0];

    const first = await startServer({ dataDir, env: { SEED_DEMO: 'false' } });
    running.push(first);
    const cookie = await signIn(first.url, user.email, user.password);

    const acked: string[] = [];
    let killed = false;
    const KILL_AFTER = 60;
    const worker = async () => {
      while (!killed) {
        const opId = newOpId();
        try {
          const res = await fetch(`${first.url}/api/pieces/${pieceId}/progress`, {
            method: 'POST',
            headers: { cookie, 'content-type': 'application/json' },
            body: JSON.stringify({ opId, action: 'step', at: new Date().toISOString() }),
          });
          if (res.status !== 200) throw new Error(`tap answered ${res.status}`);
          await res.json();
          acked.push(opId);
        } catch (e) {
          if (killed) return;
          throw e;
        }
        if (acked.length >= KILL_AFTER && !killed) {
          killed = true;
          // Other taps are still in flight at this moment.
          first.child.kill('SIGKILL');
        }
      }
    };
    await Promise.all([worker(), worker(), worker(), worker()]);
    await new Promise<void>((resolve) =>
      first.child.exitCode !== null || first.child.signalCode
        ? resolve()
        : first.child.once('exit', () => resolve()),
    );
    expect(first.child.signalCode).toBe('SIGKILL');
    expect(acked.length).toBeGreaterThanOrEqual(KILL_AFTER);

    const second = await startServer({ dataDir, env: { SEED_DEMO: 'false' } });
    running.push(second);
    const cookie2 = await signIn(second.url, user.email, user.password);
    const res = await fetch(`${second.url}/api/pieces/${pieceId}/progress`, { headers: { cookie: cookie2 } });
    const { progress } = (await res.json()) as { progress: { done: number; version: number } };

    const file = new Database(databaseFile(dataDir), { readonly: true });
    const kept = new Set(
      file
        .prepare('select op_id from progress_events where piece_id = ?')
        .all(pieceId)
        .map((r: any) => r.op_id as string),
    );
    file.close();
    const lost = acked.filter((id) => !kept.has(id));
    expect(lost).toEqual([]);
    // Nothing counted twice or half-written: every kept event is one step, and the position agrees with the log.
    expect(progress.done).toBe(kept.size);
    expect(progress.version).toBe(kept.size);
    expect(progress.done).toBeGreaterThanOrEqual(acked.length);

    // The restarted server goes on counting from there.
    const more = await fetch(`${second.url}/api/pieces/${pieceId}/progress`, {
      method: 'POST',
      headers: { cookie: cookie2, 'content-type': 'application/json' },
      body: JSON.stringify({ opId: newOpId(), action: 'step' }),
    });
    expect(((await more.json()) as { progress: { done: number } }).progress.done).toBe(kept.size + 1);
  });
});
