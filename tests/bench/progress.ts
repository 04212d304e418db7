// npm run bench:progress — POST /api/pieces/:pieceId/progress against the real server on 127.0.0.1 (a SQLite
// transaction per batch of taps, committed with synchronous = FULL before anyone is answered) at 8 connections,
// each tap with its own opId. Target: p99 under 25 ms and no errors. Prints figures; asserts nothing.
//
// Method (see DEVELOPERS.md, "Speed"): autocannon keeps 8 requests in flight for BENCH_SECONDS (default 10) after a
// short warm-up, BENCH_RUNS times (default 3) on the same server, and prints each run and the median of the runs.
// Two figures beside it tell a slow server from a busy machine:
// - the disk's floor: a bare one-row commit with synchronous = FULL in the same folder, 300 times before the runs,
//   p50/p99 — no tap can be acknowledged faster than its fsync (the machine is shared; builds and tests of others
//   move this a lot);
// - the server process's CPU time per answered request (user + system, from /proc on Linux), which the machine's
//   load does not inflate the way it inflates latency.

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import Database from 'better-sqlite3';
import autocannon from 'autocannon';
import { startServer } from '../e2e/server';
import { seedBenchData, signInCookie } from './tally-fixture';

const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const runs = Math.max(1, Number(process.env.BENCH_RUNS ?? 3));

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const pct = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * p))];

/** How long a bare durable commit takes on this disk right now. */
function commitFloor(dir: string) {
  const file = path.join(dir, 'floor.sqlite');
  const db = new Database(file);
  db.pragma('journal_mode = WAL');
  db.pragma('synchronous = FULL');
  db.exec('create table t (id integer primary key, v text)');
  const insert = db.prepare('insert into t (v) values (?)');
  const times: number[] = [];
  for (let i = 0; i < 300; i += 1) {
    const start = performance.now();
    db.transaction(() => insert.run('a tap-sized row of text')).immediate();
    times.push(performance.now() - start);
  }
  db.close();
  for (const suffix of ['', '-wal', '-shm']) fs.rmSync(file + suffix, { force: true });
  times.sort((a, b) => a - b);
  return { p50: pct(times, 0.5), p99: pct(times, 0.99) };
}

/** user + system CPU of a process in ms, or null where /proc is not there. */
function cpuMs(pid: number | undefined) {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    // utime and stime are fields 14 and 15 of stat (13 and 14 after the name), in clock ticks (100 per second on Linux).
    return (Number(fields[11]) + Number(fields[12])) * 10;
  } catch {
    return null;
  }
}

const seed = await seedBenchData();
const floor = commitFloor(seed.root);
const server = await startServer({ dataDir: seed.dataDir, env: { SEED_DEMO: 'false', LOG_LEVEL: 'warn' } });
try {
  const cookie = await signInCookie(server.url, seed.user.email, seed.user.password);
  const path_ = `/api/pieces/${seed.pieceId}/progress`;
  const tap = {
    method: 'POST' as const,
    path: path_,
    headers: { cookie, 'content-type': 'application/json' },
    setupRequest: (req: object) => ({
      ...req,
      body: JSON.stringify({ opId: randomUUID(), action: 'step', at: new Date().toISOString() }),
    }),
  };
  // A short warm-up so the first figures are not the JIT's.
  await autocannon({ url: server.url, connections: 2, amount: 300, requests: [tap] });
  const done = async () =>
    (
      (await (await fetch(`${server.url}${path_}`, { headers: { cookie } })).json()) as {
        progress: { done: number };
      }
    ).progress.done;

  console.log(`POST ${path_} — 8 connections, ${seconds} s a run, ${runs} run(s), unique opIds`);
  console.log(
    `  disk floor (bare one-row commit, synchronous=FULL, WAL): p50 ${floor.p50.toFixed(2)} ms, p99 ${floor.p99.toFixed(2)} ms`,
  );
  const figures: Array<{ p50: number; p99: number; rps: number; cpu: number | null; bad: number }> = [];
  for (let run = 1; run <= runs; run += 1) {
    const before = await done();
    const cpuBefore = cpuMs(server.child.pid);
    const result = await autocannon({ url: server.url, connections: 8, duration: seconds, requests: [tap] });
    const cpuAfter = cpuMs(server.child.pid);
    const counted = (await done()) - before;
    const ok = result['2xx'];
    const cpu = cpuBefore !== null && cpuAfter !== null && ok ? (cpuAfter - cpuBefore) / ok : null;
    const bad = result.errors + result.non2xx + result.timeouts;
    figures.push({
      p50: result.latency.p50,
      p99: result.latency.p99,
      rps: result.requests.average,
      cpu,
      bad,
    });
    console.log(
      `  run ${run}: ${result.requests.total} requests (${Math.round(result.requests.average)}/s), 2xx ${ok}, non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}; ` +
        `latency ms p50 ${result.latency.p50}, p90 ${result.latency.p90}, p99 ${result.latency.p99}, max ${result.latency.max}; ` +
        `server CPU ${cpu === null ? 'n/a' : `${cpu.toFixed(2)} ms`} a request; taps counted ${counted}`,
    );
  }
  const p99 = median(figures.map((f) => f.p99));
  const cpus = figures.map((f) => f.cpu).filter((c): c is number => c !== null);
  const bad = figures.reduce((n, f) => n + f.bad, 0);
  console.log(
    `  median of ${runs}: p50 ${median(figures.map((f) => f.p50))} ms, p99 ${p99} ms, ${Math.round(median(figures.map((f) => f.rps)))} requests/s` +
      (cpus.length ? `, server CPU ${median(cpus).toFixed(2)} ms a request` : ''),
  );
  console.log(
    `  load average now: ${os
      .loadavg()
      .map((l) => l.toFixed(1))
      .join(' ')} (2 cores; above 2 the run shared the CPU)`,
  );
  console.log(
    `  target p99 < 25 ms: ${p99 < 25 ? 'met' : 'NOT met'} (median run); errors: ${bad === 0 ? 'none' : bad}`,
  );
} finally {
  await server.stop();
  fs.rmSync(seed.root, { recursive: true, force: true });
}
