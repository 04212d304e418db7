// npm run bench:counter — how fast a tap on the Tally shows: headless Chromium taps the tap zone 200 times and
// each tap is timed from the pointerdown (the event's own timestamp, so input queueing counts) to the first
// frame painted after the count on screen changed. Target: p95 under 16 ms (one frame at 60 Hz).
// Prints figures; asserts nothing.

import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { chromium, type Locator, type Page } from '@playwright/test';
import { chromiumPath } from '../../playwright.config';
import { startServer } from '../e2e/server';
import { seedBenchData, signInCookie } from './tally-fixture';

const TAPS = Number(process.env.BENCH_TAPS ?? 200);
// 8 taps a second: faster than anyone crochets, so every tap also meets the previous one's answer arriving.
const GAP_MS = Number(process.env.BENCH_GAP_MS ?? 125);

interface Timings {
  paint: number[];
  dom: number[];
  /** The browser's own Event Timing durations for pointerdown (8 ms steps), only those of 16 ms and more. */
  slow: number[];
}

/** Runs in the page: times each pointerdown to the DOM change and to just after the next paint. */
function instrument(selector: string) {
  const w = window as unknown as {
    __t: { paint: number[]; dom: number[]; slow: number[] };
    __pending: number | null;
  };
  w.__t = { paint: [], dom: [], slow: [] };
  w.__pending = null;
  const target = document.querySelector(selector)!;
  // Capture phase on window: runs before the page's own listeners.
  window.addEventListener('pointerdown', (e) => (w.__pending = e.timeStamp), { capture: true });
  new MutationObserver(() => {
    const start = w.__pending;
    if (start === null) return;
    w.__pending = null;
    w.__t.dom.push(performance.now() - start);
    // The next animation frame callback runs just before that frame is painted; a message posted from it is
    // handled right after the paint.
    requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => w.__t.paint.push(performance.now() - start);
      channel.port2.postMessage(null);
    });
  }).observe(target, { subtree: true, childList: true, characterData: true });
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) if (e.name === 'pointerdown') w.__t.slow.push(e.duration);
  }).observe({ type: 'event', durationThreshold: 16, buffered: false } as PerformanceObserverInit);
}

async function tapAndRead(page: Page, target: Locator): Promise<Timings> {
  const box = (await target.boundingBox())!;
  const x = box.x + box.width / 2;
  const y = box.y + box.height * 0.6;
  for (let i = 0; i < TAPS; i += 1) {
    await page.mouse.move(x + (i % 7), y + (i % 5));
    await page.mouse.down();
    await page.mouse.up();
    await page.waitForTimeout(GAP_MS);
  }
  await page.waitForTimeout(300);
  return page.evaluate(() => (window as unknown as { __t: Timings }).__t);
}

function pct(list: number[], p: number) {
  const sorted = [...list].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function report(name: string, t: Timings) {
  console.log(
    `  ${name}: measured ${t.paint.length}; to the painted update median ${pct(t.paint, 50).toFixed(1)} ms, p95 ${pct(t.paint, 95).toFixed(1)} ms, max ${Math.max(...t.paint).toFixed(1)} ms`,
  );
  console.log(
    `    pointerdown → DOM updated: median ${pct(t.dom, 50).toFixed(1)} ms, p95 ${pct(t.dom, 95).toFixed(1)} ms`,
  );
  const over = t.slow.filter((d) => d >= 24).length;
  console.log(
    `    Event Timing (browser's own input → next paint): ${t.slow.length} of ${TAPS} reported at 16 ms or more, ${over} at 24 ms or more`,
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

  const tally = await tapAndRead(page, zone);
  const progress = (await (
    await page.request.get(`${server.url}/api/pieces/${seed.pieceId}/progress`)
  ).json()) as { progress: { done: number } };

  // The same taps, timed the same way, on a page with nothing but a counting button: what this machine and
  // headless Chromium cost on their own (input, a frame, a paint), for reading the figures above.
  const floorPage = await context.newPage();
  await floorPage.setContent(
    '<button id="b" style="display:block;width:380px;height:600px;font:700 96px sans-serif">0</button>' +
      "<script>let n=0;const b=document.getElementById('b');b.addEventListener('pointerdown',()=>{b.textContent=String(++n)})</script>",
  );
  await floorPage.evaluate(instrument, '#b');
  const floor = await tapAndRead(floorPage, floorPage.locator('#b'));

  console.log(`Tally tap → painted update, headless Chromium, 390×844, ${TAPS} taps, one every ${GAP_MS} ms`);
  report('Tally', tally);
  console.log(`  taps the server counted: ${progress.progress.done}`);
  report('bare button (floor)', floor);
  console.log(`  target p95 < 16 ms: ${pct(tally.paint, 95) < 16 ? 'met' : 'NOT met'}`);
  await context.close();
} finally {
  await browser.close();
  await server.stop();
  fs.rmSync(seed.root, { recursive: true, force: true });
}
