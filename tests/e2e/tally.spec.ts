import { expect, test, type APIRequestContext, type BrowserContext, type Page } from '@playwright/test';
import { createMember } from './helpers';

// The Tally in real Chromium against the real server: counting by touch and by keys, a note before a round,
// counting offline through a reload, and two devices on one piece.

// Our own small piece: 6 steps in Rnd 1, a colour change, then 6 increases.
const instructions = ['Rnd 1: 6 sc in MR (6)', 'Change to pink yarn.', 'Rnd 2: inc x6 (12)', 'Rnd 3: (sc, inc) x6 (18)'].join('\n');

async function signInRequest(request: APIRequestContext, who: { email: string; password: string }) {
  const res = await request.post('/api/auth/signin', { data: { email: who.email, password: who.password } });
  expect(res.status()).toBe(200);
}

/** A fresh member with a project of one piece, signed in on this context; returns the Tally's address. */
async function tallyFor(context: BrowserContext, name = 'Tally tester') {
  const member = createMember(name);
  await signInRequest(context.request, member);
  const res = await context.request.post('/api/projects', { data: { title: 'Pink ball', pieces: [{ name: 'Ball', instructions, copies: 2 }] } });
  expect(res.status()).toBe(201);
  const { project } = (await res.json()) as { project: { id: number; pieces: Array<{ id: number }> } };
  const pieceId = project.pieces[0].id;
  return { member, url: `/projects/${project.id}/pieces/${pieceId}/count`, pieceId };
}

const zone = (page: Page) => page.getByTestId('tally-zone');
const serverProgress = async (request: APIRequestContext, pieceId: number) =>
  ((await (await request.get(`/api/pieces/${pieceId}/progress`)).json()) as { progress: { copy: number; round: number; step: number; done: number } }).progress;

test('counts a round by tapping and by keyboard, and stops for the note before the next round', async ({ page, context }) => {
  const { url, pieceId } = await tallyFor(context);
  await page.goto(url);
  await expect(page.getByRole('heading', { name: /Ball\s+1 of 2/ })).toBeVisible();
  await expect(zone(page)).toContainText('Rnd 1');
  await expect(zone(page).locator('mark[data-current-step]')).toHaveText(/6 sc in MR/);
  await expect(zone(page)).toContainText('sc in the magic ring (1 of 6)');

  for (let i = 0; i < 3; i += 1) await zone(page).click();
  await expect(zone(page)).toContainText('sc in the magic ring (4 of 6)');
  await page.keyboard.press('Space');
  await page.keyboard.press('ArrowRight');
  await expect(zone(page)).toContainText('sc in the magic ring (6 of 6)');
  await page.keyboard.press('PageDown');

  // Rnd 1 is done: the colour change is shown large and the next tap only confirms it.
  await expect(zone(page)).toContainText('Change to pink yarn.');
  await expect(zone(page)).toContainText('Before Rnd 2');
  await expect(page.getByRole('button', { name: 'Done: Change to pink yarn.' })).toBeVisible();
  await expect.poll(() => serverProgress(page.request, pieceId)).toMatchObject({ round: 1, step: 0, done: 6 });
  await page.keyboard.press('Enter');
  await expect(zone(page)).toContainText('Rnd 2');
  await expect(zone(page)).toContainText('inc: 2 sc in the next stitch');
  expect((await serverProgress(page.request, pieceId)).done).toBe(6);

  // Undo is one tap away and goes back over the round boundary.
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(zone(page)).toContainText('Rnd 1');
  await expect(zone(page)).toContainText('sc in the magic ring (6 of 6)');
  await expect.poll(() => serverProgress(page.request, pieceId)).toMatchObject({ round: 0, step: 5, done: 5 });
  // Every target is at least 48 px.
  for (const name of ['Undo', 'Round done', 'Mark here', 'Jump', 'Tally settings']) {
    const b = (await page.getByRole('button', { name, exact: true }).boundingBox())!;
    expect(Math.min(b.width, b.height), name).toBeGreaterThanOrEqual(48);
  }
});

test('keeps taps made offline through a reload and syncs them when back online', async ({ page, context }) => {
  const { url, pieceId } = await tallyFor(context, 'Offline tester');
  await page.goto(url);
  await expect(zone(page)).toContainText('sc in the magic ring (1 of 6)');
  // The service worker has the app shell, and the query cache has been written to IndexedDB.
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect.poll(() => page.evaluate(() => Boolean(navigator.serviceWorker.controller))).toBe(true);
  await page.waitForTimeout(1200);

  await context.setOffline(true);
  for (let i = 0; i < 3; i += 1) await zone(page).click();
  await expect(zone(page)).toContainText('sc in the magic ring (4 of 6)');
  await expect(page.getByText('3 taps waiting to sync.')).toBeVisible();

  await page.reload();
  // Cold start with no connection: the shell from the service worker, the round from the persisted cache, and
  // the taps from the outbox.
  await expect(zone(page)).toContainText('sc in the magic ring (4 of 6)');
  await expect(page.getByText('3 taps waiting to sync.')).toBeVisible();
  await zone(page).click();
  await expect(page.getByText('4 taps waiting to sync.')).toBeVisible();

  await context.setOffline(false);
  await expect(page.getByText(/taps? waiting to sync/)).toBeHidden({ timeout: 20_000 });
  await expect(page.getByText('Saved')).toBeVisible();
  await expect.poll(() => serverProgress(page.request, pieceId)).toMatchObject({ round: 0, step: 4, done: 4 });
});

test('two devices on the same piece see each other’s taps', async ({ browser }) => {
  const phone = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const tablet = await browser.newContext({ viewport: { width: 820, height: 1180 } });
  const { member, url, pieceId } = await tallyFor(phone, 'Two-device tester');
  await signInRequest(tablet.request, member);
  const a = await phone.newPage();
  const b = await tablet.newPage();
  await a.goto(url);
  await b.goto(url);
  await expect(zone(a)).toContainText('sc in the magic ring (1 of 6)');
  await expect(zone(b)).toContainText('sc in the magic ring (1 of 6)');
  // Both screens say when they are live with the other device.
  await expect(a.getByTitle('Live with your other devices')).toBeVisible();
  await expect(b.getByTitle('Live with your other devices')).toBeVisible();

  for (let i = 0; i < 3; i += 1) await zone(a).click();
  await expect(zone(b)).toContainText('sc in the magic ring (4 of 6)', { timeout: 5_000 });
  await b.keyboard.press('Space');
  await b.keyboard.press('Space');
  await expect(zone(a)).toContainText('sc in the magic ring (6 of 6)', { timeout: 5_000 });
  // Tapping on both at once: both apply in the server's order and end up on the same stitch.
  await Promise.all([zone(a).click(), zone(b).click()]);
  await expect.poll(() => serverProgress(a.request, pieceId)).toMatchObject({ round: 1, step: 1, done: 7 });
  await expect(zone(a)).toContainText('inc: 2 sc in the next stitch (2 of 6)');
  await expect(zone(b)).toContainText('inc: 2 sc in the next stitch (2 of 6)');
  await phone.close();
  await tablet.close();
});
