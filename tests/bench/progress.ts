// npm run bench:progress — POST /api/pieces/:pieceId/progress against the real server on 127.0.0.1 (a SQLite
// transaction per tap, committed before the answer) at 8 connections, each tap with its own opId.
// Target: p99 under 25 ms and no errors. Prints figures; asserts nothing.

import fs from 'node:fs';
import { randomUUID } from 'node:crypto';
import autocannon from 'autocannon';
import { startServer } from '../e2e/server';
import { seedBenchData, signInCookie } from './tally-fixture';

const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const seed = await seedBenchData();
const server = await startServer({ dataDir: seed.dataDir, env: { SEED_DEMO: 'false', LOG_LEVEL: 'warn' } });
try {
  const cookie = await signInCookie(server.url, seed.user.email, seed.user.password);
  const path = `/api/pieces/${seed.pieceId}/progress`;
  // A short warm-up so the first figures are not the JIT's.
  await autocannon({ url: server.url, connections: 2, amount: 200, requests: [{ method: 'POST', path, headers: { cookie, 'content-type': 'application/json' }, setupRequest: (r) => ({ ...r, body: JSON.stringify({ opId: randomUUID(), action: 'step' }) }) }] });
  const before = (await (await fetch(`${server.url}${path}`, { headers: { cookie } })).json()) as { progress: { done: number } };

  const result = await autocannon({
    url: server.url,
    connections: 8,
    duration: seconds,
    requests: [
      {
        method: 'POST',
        path,
        headers: { cookie, 'content-type': 'application/json' },
        setupRequest: (req) => ({ ...req, body: JSON.stringify({ opId: randomUUID(), action: 'step', at: new Date().toISOString() }) }),
      },
    ],
  });
  const after = (await (await fetch(`${server.url}${path}`, { headers: { cookie } })).json()) as { progress: { done: number } };
  const ok = result['2xx'];
  console.log(`POST ${path} — 8 connections, ${seconds} s, unique opIds`);
  console.log(`  requests: ${result.requests.total} (${Math.round(result.requests.average)}/s), 2xx: ${ok}, non-2xx: ${result.non2xx}, errors: ${result.errors}, timeouts: ${result.timeouts}`);
  console.log(`  latency ms: p50 ${result.latency.p50}, p90 ${result.latency.p90}, p97.5 ${result.latency.p97_5}, p99 ${result.latency.p99}, max ${result.latency.max}`);
  console.log(`  taps counted by the server during the run: ${after.progress.done - before.progress.done} (answered 2xx: ${ok})`);
  console.log(`  target p99 < 25 ms: ${result.latency.p99 < 25 ? 'met' : 'NOT met'}; errors: ${result.errors + result.non2xx === 0 ? 'none' : 'some'}`);
} finally {
  await server.stop();
  fs.rmSync(seed.root, { recursive: true, force: true });
}
