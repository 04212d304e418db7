// npm run bench:photos — three 12-megapixel JPEGs uploaded at once to the real server while another client
// calls /api/health every 25 ms. Prints figures only (no assertions): total time, each photo's time,
// the health call's latency percentiles, and the server's peak memory (VmHWM from /proc).
// Targets (issue 7, on the 2-core machine): health p99 < 50 ms, each photo < 4 s, peak < 1 GB.
// BENCH_RUNS (default 3) repeats the run, each on a fresh server (peak memory is a per-process high-water mark),
// and prints the median of the runs. BENCH_ROTATED=1 gives every photo EXIF orientation 6, as a phone held upright
// writes it.
import fs from 'node:fs';
import os from 'node:os';
import { Jimp } from 'jimp';
import { startServer } from '../e2e/server';
import { withExif } from '../factories/images';

const PHOTOS = 3;
const RUNS = Math.max(1, Number(process.env.BENCH_RUNS ?? 3));
const ROTATED = process.env.BENCH_ROTATED === '1';
const WIDTH = 4000;
const HEIGHT = 3000; // 12 MP, a common phone sensor size

/** A gradient with grain and a few hard edges, so JPEG has phone-photo amounts of detail to keep. */
async function phonePhoto(seed: number) {
  const img = new Jimp({ width: WIDTH, height: HEIGHT, color: 0x000000ff });
  const d = img.bitmap.data;
  let s = seed;
  for (let y = 0; y < HEIGHT; y++) {
    for (let x = 0; x < WIDTH; x++) {
      const i = (y * WIDTH + x) * 4;
      s = (s * 1103515245 + 12345) & 0x7fffffff;
      const n = ((s >> 16) % 24) - 12;
      const stripe = ((x >> 6) + (y >> 6) + seed) % 5 === 0 ? 60 : 0;
      d[i] = Math.max(0, Math.min(255, ((x * 255) / WIDTH + n + stripe) | 0));
      d[i + 1] = Math.max(0, Math.min(255, ((y * 255) / HEIGHT + n) | 0));
      d[i + 2] = Math.max(0, Math.min(255, (((x + y + seed * 40) % 256) + n) | 0));
    }
  }
  const jpeg = Buffer.from(await img.getBuffer('image/jpeg', { quality: 90 }));
  return new Uint8Array(ROTATED ? withExif(jpeg, { orientation: 6 }) : jpeg);
}

function vm(pid: number, field: 'VmHWM' | 'VmRSS') {
  const m = fs.readFileSync(`/proc/${pid}/status`, 'utf8').match(new RegExp(`${field}:\\s+(\\d+) kB`));
  return m ? Number(m[1]) / 1024 : NaN;
}

const pct = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
const ms = (n: number) => `${n.toFixed(1)} ms`;

interface RunFigures {
  photoSeconds: number[];
  total: number;
  healthP99: number;
  peakMb: number;
}

async function runOnce(photos: Uint8Array<ArrayBuffer>[]): Promise<RunFigures> {
  const server = await startServer({ env: { SEED_DEMO: 'true', LOG_LEVEL: 'warn' } });
  const pid = server.child.pid!;
  try {
    const base = server.url;
    const signin = await fetch(`${base}/api/auth/signin`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'demo-maker@example.com', password: 'loops-and-rounds' }),
    });
    if (!signin.ok) throw new Error(`sign-in failed: ${signin.status} ${await signin.text()}`);
    const cookie = signin.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    const get = async (path: string) => (await fetch(`${base}${path}`, { headers: { cookie } })).json();
    const { projects } = (await get('/api/projects')) as { projects: Array<{ id: number }> };
    const entryRes = await fetch(`${base}/api/projects/${projects[0].id}/entries`, {
      method: 'POST',
      headers: { cookie, 'Content-Type': 'application/json' },
      body: JSON.stringify({ body: 'Benchmark photos', entryDate: '2026-12-01' }),
    });
    const { entry } = (await entryRes.json()) as { entry: { id: number } };
    // Opening the journal starts the photo worker, as it does for a member on the project page.
    await get(`/api/projects/${projects[0].id}/entries`);
    await new Promise((r) => setTimeout(r, 2000));
    const rssBefore = vm(pid, 'VmRSS');

    // The other client: /api/health every 25 ms for the whole run.
    const health: number[] = [];
    let polling = true;
    const poller = (async () => {
      while (polling) {
        const t0 = performance.now();
        const r = await fetch(`${base}/api/health`);
        await r.arrayBuffer();
        health.push(performance.now() - t0);
        await new Promise((r) => setTimeout(r, 25));
      }
    })();
    let rssPeakSampled = rssBefore;
    const sampler = setInterval(() => (rssPeakSampled = Math.max(rssPeakSampled, vm(pid, 'VmRSS'))), 50);

    await new Promise((r) => setTimeout(r, 500)); // a quiet baseline first
    const t0 = performance.now();
    const results = await Promise.all(
      photos.map(async (data, i) => {
        const form = new FormData();
        form.append('photos', new Blob([data], { type: 'image/jpeg' }), `bench-${i + 1}.jpg`);
        const start = performance.now();
        const res = await fetch(`${base}/api/entries/${entry.id}/photos`, {
          method: 'POST',
          headers: { cookie },
          body: form,
        });
        const body = (await res.json()) as {
          photos?: Array<{ width: number; height: number }>;
          error?: string;
        };
        const timing = Object.fromEntries(
          (res.headers.get('server-timing') ?? '')
            .split(',')
            .map(
              (p) =>
                p
                  .trim()
                  .match(/^(\w+);dur=(\d+)/)
                  ?.slice(1) ?? [],
            )
            .filter((p) => p.length),
        );
        return {
          status: res.status,
          seconds: (performance.now() - start) / 1000,
          body,
          resize: Number(timing.resize) / 1000,
          queued: Number(timing.queue) / 1000,
        };
      }),
    );
    const total = (performance.now() - t0) / 1000;
    await new Promise((r) => setTimeout(r, 500));
    polling = false;
    await poller;
    clearInterval(sampler);

    const sorted = [...health].sort((a, b) => a - b);
    console.log('\nPhotos (three requests at once, one photo each):');
    results.forEach((r, i) => {
      const p = r.body.photos?.[0];
      console.log(
        `  photo ${i + 1}: ${r.status} in ${r.seconds.toFixed(2)} s (waited ${r.queued.toFixed(2)} s for the worker, resized in ${r.resize.toFixed(2)} s)${p ? ` → ${p.width} × ${p.height}` : ` (${r.body.error})`}`,
      );
    });
    const resize = results.map((r) => r.resize);
    console.log(
      `  total: ${total.toFixed(2)} s; resize time per photo: mean ${(resize.reduce((a, b) => a + b, 0) / PHOTOS).toFixed(2)} s, max ${Math.max(...resize).toFixed(2)} s`,
    );
    console.log(
      `\n/api/health during the run: ${health.length} calls; p50 ${ms(pct(sorted, 50))}, p95 ${ms(pct(sorted, 95))}, p99 ${ms(pct(sorted, 99))}, max ${ms(sorted.at(-1)!)}`,
    );
    const peakMb = vm(pid, 'VmHWM');
    console.log(
      `\nServer memory: RSS before uploads ${rssBefore.toFixed(0)} MB; peak (VmHWM) ${peakMb.toFixed(0)} MB; highest sampled RSS ${rssPeakSampled.toFixed(0)} MB`,
    );
    return {
      photoSeconds: results.map((r) => r.seconds).sort((a, b) => a - b),
      total,
      healthP99: pct(sorted, 99),
      peakMb,
    };
  } finally {
    await server.stop();
    fs.rmSync(server.dataDir.replace(/\/data$/, ''), { recursive: true, force: true });
  }
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

async function main() {
  console.log(
    `Making ${PHOTOS} test photos of ${WIDTH} × ${HEIGHT} px${ROTATED ? ' with EXIF orientation 6' : ''}…`,
  );
  const photos = await Promise.all(Array.from({ length: PHOTOS }, (_, i) => phonePhoto(i + 1)));
  console.log(`  sizes: ${photos.map((p) => `${(p.length / 1024 / 1024).toFixed(1)} MB`).join(', ')}`);
  const runs: RunFigures[] = [];
  for (let run = 1; run <= RUNS; run += 1) {
    console.log(`\n— run ${run} of ${RUNS}`);
    runs.push(await runOnce(photos));
  }
  // Photos ranked by when they were ready (first, second, third), each the median over the runs.
  const ranked = Array.from({ length: PHOTOS }, (_, i) =>
    median(runs.map((r) => r.photoSeconds[i])).toFixed(2),
  );
  const p99 = median(runs.map((r) => r.healthP99));
  const peak = median(runs.map((r) => r.peakMb));
  console.log(
    `\nMedian of ${RUNS} run(s): photos ready after ${ranked.join(' / ')} s (first / second / third); total ${median(runs.map((r) => r.total)).toFixed(2)} s; health p99 ${ms(p99)}; peak ${peak.toFixed(0)} MB`,
  );
  console.log(
    `  load average now: ${os
      .loadavg()
      .map((l) => l.toFixed(1))
      .join(' ')} (2 cores)`,
  );
  console.log(
    `Targets: health p99 < 50 ms ${p99 < 50 ? 'met' : 'NOT met'}; each photo < 4 s ${Number(ranked.at(-1)) < 4 ? 'met' : 'NOT met'}; peak < 1024 MB ${peak < 1024 ? 'met' : 'NOT met'}.`,
  );
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
