// npm run bench:counter — how fast a tap on the Tally shows. Headless Chromium taps the tap zone 200 times (one
// every 125 ms) and times each tap from the pointerdown (the event's own timestamp, so input queueing counts) to
// the first frame painted after the count on screen changed. Target (issue 6): p95 under 16 ms, one frame at 60 Hz.
// Prints figures; asserts nothing.
//
// Method (also in DEVELOPERS.md, "Speed"). Each tap is split into three parts:
//   input + script   pointerdown timestamp → the zone's DOM changed (MutationObserver): the app's event handler,
//                    React's render and commit, and the browser's input queueing;
//   frame wait       DOM changed → the next requestAnimationFrame callback: the browser waiting for its next
//                    frame (60 Hz here), which no page can shorten;
//   render           that rAF callback → a user-blocking task posted from it runs, i.e. just after that frame's
//                    style, layout, paint and commit: the browser drawing what the app changed.
// "App's cost" = input + script + render: the tap's own work, with the frame wait taken out. It fits one frame
// when it is under 16 ms. The same taps on a page with nothing but a counting button give the floor of this
// machine and browser for every part. The browser's own Event Timing API (PerformanceEventTiming, durations to
// the next paint rounded to 8 ms, reported only from 16 ms up) is printed beside it as a cross-check.
// Flags: `--disable-gpu-vsync --disable-frame-rate-limit` were tried to take the frame wait out at the source;
// on this machine's headless Chromium 156 they make it worse (the wait becomes a steady ~15 ms), so they are not
// used; set BENCH_CHROMIUM_ARGS="…" to try others. BENCH_RUNS (default 3) repeats the taps on the same pages and
// prints the median of the runs; BENCH_TAPS and BENCH_GAP_MS change the taps; BENCH_DUMP=file.json keeps every tap.

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { chromium, type Locator, type Page } from '@playwright/test';
import { chromiumPath } from '../../playwright.config';
import { startServer } from '../e2e/server';
import { seedBenchData, signInCookie } from './tally-fixture';

const TAPS = Number(process.env.BENCH_TAPS ?? 200);
// 8 taps a second (start to start): faster than anyone crochets, so every tap also meets the previous one's answer arriving.
const GAP_MS = Number(process.env.BENCH_GAP_MS ?? 125);
// A finger rests on the glass for a while; a pointerup sent the same millisecond as the pointerdown makes
// Chromium's scheduler hold back ordinary tasks (our "painted" message among them) until the frame after, which
// would count a frame that was in fact already painted (seen in a trace: drawn at 3 ms, message at 17 ms).
// 50 ms is from memory for a quick tap.
const HOLD_MS = Number(process.env.BENCH_HOLD_MS ?? 50);
const RUNS = Math.max(1, Number(process.env.BENCH_RUNS ?? 3));
const EXTRA_ARGS = (process.env.BENCH_CHROMIUM_ARGS ?? '').split(' ').filter(Boolean);

interface Tap {
  /** pointerdown timestamp */
  a: number;
  /** the watched DOM changed */
  b: number;
  /** the next animation frame began */
  c: number;
  /** just after that frame was painted */
  d: number;
}
interface Timings {
  taps: Tap[];
  /** The browser's own Event Timing durations for pointerdown (8 ms steps), only those of 16 ms and more. */
  slow: number[];
}

/** Runs in the page: times each pointerdown to the DOM change, to the next frame and to just after its paint. */
function instrument(selector: string) {
  const w = window as unknown as { __t: Timings; __pending: Tap | null };
  w.__t = { taps: [], slow: [] };
  w.__pending = null;
  const target = document.querySelector(selector)!;
  // Capture phase on window: runs before the page's own listeners.
  window.addEventListener('pointerdown', (e) => (w.__pending = { a: e.timeStamp, b: 0, c: 0, d: 0 }), {
    capture: true,
  });
  new MutationObserver(() => {
    const tap = w.__pending;
    if (tap === null) return;
    w.__pending = null;
    tap.b = performance.now();
    // The next animation frame callback runs just before that frame is painted; a task posted from it is run
    // right after the paint. At 'user-blocking' priority it goes ahead of ordinary tasks queued meanwhile (React's
    // own deferred render is one), which would otherwise be counted as painting time.
    requestAnimationFrame(() => {
      tap.c = performance.now();
      // (Inline functions only: this runs in the page, where the runner's name helper does not exist.)
      const scheduler = (globalThis as { scheduler?: { postTask?: (fn: () => void, o: object) => unknown } })
        .scheduler;
      if (scheduler?.postTask)
        void scheduler.postTask(() => w.__t.taps.push({ ...tap, d: performance.now() }), {
          priority: 'user-blocking',
        });
      else {
        const channel = new MessageChannel();
        channel.port1.onmessage = () => w.__t.taps.push({ ...tap, d: performance.now() });
        channel.port2.postMessage(null);
      }
    });
  }).observe(target, { subtree: true, childList: true, characterData: true });
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) if (e.name === 'pointerdown') w.__t.slow.push(e.duration);
  }).observe({ type: 'event', durationThreshold: 16, buffered: false } as PerformanceObserverInit);
}

async function tapAndRead(page: Page, target: Locator): Promise<Timings> {
  await page.evaluate(() => {
    const w = window as unknown as { __t: Timings };
    w.__t.taps = [];
    w.__t.slow = [];
  });
  const box = (await target.boundingBox())!;
  const x = box.x + box.width / 2;
  const y = box.y + box.height * 0.6;
  for (let i = 0; i < TAPS; i += 1) {
    await page.mouse.move(x + (i % 7), y + (i % 5));
    await page.mouse.down();
    await page.waitForTimeout(HOLD_MS);
    await page.mouse.up();
    await page.waitForTimeout(Math.max(0, GAP_MS - HOLD_MS));
  }
  await page.waitForTimeout(300);
  return page.evaluate(() => (window as unknown as { __t: Timings }).__t);
}

function pct(list: number[], p: number) {
  const sorted = [...list].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}
const median = (xs: number[]) => pct(xs, 50);

interface Figures {
  n: number;
  total50: number;
  total95: number;
  max: number;
  script50: number;
  script95: number;
  wait50: number;
  render50: number;
  render95: number;
  cost50: number;
  cost95: number;
  slow16: number;
  slow24: number;
}

function figures(t: Timings): Figures {
  const total = t.taps.map((x) => x.d - x.a);
  const script = t.taps.map((x) => x.b - x.a);
  const render = t.taps.map((x) => x.d - x.c);
  const cost = t.taps.map((x) => x.b - x.a + (x.d - x.c));
  return {
    n: t.taps.length,
    total50: pct(total, 50),
    total95: pct(total, 95),
    max: Math.max(...total),
    script50: pct(script, 50),
    script95: pct(script, 95),
    wait50: pct(
      t.taps.map((x) => x.c - x.b),
      50,
    ),
    render50: pct(render, 50),
    render95: pct(render, 95),
    cost50: pct(cost, 50),
    cost95: pct(cost, 95),
    slow16: t.slow.length,
    slow24: t.slow.filter((d) => d >= 24).length,
  };
}

const ms = (n: number) => `${n.toFixed(1)} ms`;
function report(name: string, runs: Figures[]) {
  const m = (k: keyof Figures) => median(runs.map((r) => r[k]));
  console.log(
    `  ${name} (median of ${runs.length} run${runs.length > 1 ? 's' : ''}, ${m('n')} taps measured a run):`,
  );
  console.log(
    `    pointerdown → painted update: median ${ms(m('total50'))}, p95 ${ms(m('total95'))} (runs: ${runs.map((r) => r.total95.toFixed(1)).join(', ')}), max ${ms(m('max'))}`,
  );
  console.log(
    `    input + script ${ms(m('script50'))} median, ${ms(m('script95'))} p95 · frame wait ${ms(m('wait50'))} median · render ${ms(m('render50'))} median, ${ms(m('render95'))} p95`,
  );
  console.log(
    `    app's cost (input + script + render, no frame wait): median ${ms(m('cost50'))}, p95 ${ms(m('cost95'))} (runs: ${runs.map((r) => r.cost95.toFixed(1)).join(', ')})`,
  );
  console.log(
    `    Event Timing (browser's own input → next paint): ${m('slow16')} of ${TAPS} at 16 ms or more, ${m('slow24')} at 24 ms or more`,
  );
}

const build = spawnSync(process.execPath, [path.resolve('scripts/ensure-build.mjs')], { stdio: 'inherit' });
if (build.status !== 0) throw new Error('The client build failed.');

const seed = await seedBenchData();
const server = await startServer({ dataDir: seed.dataDir, env: { SEED_DEMO: 'false', LOG_LEVEL: 'warn' } });
const browser = await chromium.launch({
  executablePath: chromiumPath,
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-quic',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    ...EXTRA_ARGS,
  ],
});
try {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, hasTouch: false });
  const cookie = await signInCookie(server.url, seed.user.email, seed.user.password);
  const [name, value] = cookie.split(';')[0].split('=');
  await context.addCookies([{ name, value, url: server.url }]);
  const page = await context.newPage();
  await page.goto(`${server.url}/projects/${seed.projectId}/pieces/${seed.pieceId}/count`);
  const zone = page.getByTestId('tally-zone');
  await zone.waitFor();
  await page.waitForTimeout(500);
  await page.evaluate(instrument, '[data-testid="tally-zone"]');

  // The same taps, timed the same way, on a page with nothing but a counting button: what this machine and
  // headless Chromium cost on their own (input, a frame, a paint), for reading the figures above.
  const floorPage = await context.newPage();
  await floorPage.setContent(
    '<button id="b" style="display:block;width:380px;height:600px;font:700 96px sans-serif">0</button>' +
      "<script>let n=0;const b=document.getElementById('b');b.addEventListener('pointerdown',()=>{b.textContent=String(++n)})</script>",
  );
  await floorPage.evaluate(instrument, '#b');

  const tally: Figures[] = [];
  const floor: Figures[] = [];
  const rawTally: Timings[] = [];
  const rawFloor: Timings[] = [];
  // Alternating, so a busy moment on the shared machine lands on both.
  for (let run = 0; run < RUNS; run += 1) {
    await page.bringToFront();
    rawTally.push(await tapAndRead(page, zone));
    tally.push(figures(rawTally.at(-1)!));
    await floorPage.bringToFront();
    rawFloor.push(await tapAndRead(floorPage, floorPage.locator('#b')));
    floor.push(figures(rawFloor.at(-1)!));
  }
  if (process.env.BENCH_DUMP)
    fs.writeFileSync(process.env.BENCH_DUMP, JSON.stringify({ tally: rawTally, floor: rawFloor }));
  const progress = (await (
    await page.request.get(`${server.url}/api/pieces/${seed.pieceId}/progress`)
  ).json()) as { progress: { done: number } };

  console.log(
    `Tally tap → painted update, headless Chromium, 390×844, ${TAPS} taps a run, one every ${GAP_MS} ms${EXTRA_ARGS.length ? `, extra flags ${EXTRA_ARGS.join(' ')}` : ''}`,
  );
  report('Tally', tally);
  console.log(`    taps the server counted: ${progress.progress.done} of ${TAPS * RUNS}`);
  report('bare button (floor)', floor);
  const total95 = median(tally.map((r) => r.total95));
  const cost95 = median(tally.map((r) => r.cost95));
  const floor95 = median(floor.map((r) => r.total95));
  console.log(
    `  load average now: ${os
      .loadavg()
      .map((l) => l.toFixed(1))
      .join(' ')} (2 cores)`,
  );
  console.log(
    `  target p95 < 16 ms, pointerdown → painted: ${total95 < 16 ? 'met' : 'NOT met'} (${ms(total95)}; the bare button's floor here is ${ms(floor95)})`,
  );
  console.log(
    `  the tap's own work within one frame (app's cost p95 < 16 ms): ${cost95 < 16 ? 'met' : 'NOT met'} (${ms(cost95)})`,
  );
  await context.close();
} finally {
  await browser.close();
  await server.stop();
  fs.rmSync(seed.root, { recursive: true, force: true });
}
