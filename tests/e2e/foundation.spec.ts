import { expect, test } from '@playwright/test';

test('a new visitor signs in as the demo maker and sees the demo project on the hook', async ({ page, baseURL }) => {
  const foreign: string[] = [];
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (!['data:', 'blob:'].includes(url.protocol) && url.origin !== new URL(baseURL!).origin) foreign.push(req.url());
  });
  const consoleErrors: string[] = [];
  // The browser itself logs the expected 401 from /api/auth/me while signed out; anything else is a bug.
  page.on('console', (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()));

  await page.goto('/');
  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByRole('heading', { name: 'Welcome back' })).toBeVisible();
  // The demo account is offered on the sign-in page while the server runs with demo data.
  await expect(page.getByText('demo-maker@example.com')).toBeVisible();
  await page.getByLabel('E-mail').fill('demo-maker@example.com');
  await page.getByLabel('Password', { exact: true }).fill('loops-and-rounds');
  await page.getByRole('button', { name: 'Sign in' }).click();

  await expect(page.getByRole('heading', { name: 'On the hook' })).toBeVisible();
  await expect(page.getByText('Bramble for the window sill')).toBeVisible();
  // The demo Body was left at its tenth round; home offers the way straight back into the Tally.
  await expect(page.getByText('Body · round 10 of 17')).toBeVisible();

  // Quicksand is the font actually in use, loaded from our own server.
  const font = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
  expect(font).toContain('Quicksand');
  await page.evaluate(() => document.fonts.ready);
  expect(await page.evaluate(() => document.fonts.check('16px Quicksand'))).toBe(true);

  await page.getByRole('link', { name: /^Go on counting Body/ }).click();
  await expect(page).toHaveURL(/\/projects\/\d+\/pieces\/\d+\/count$/);
  await expect(page.getByText(/Rnd 10\s*of 17/).first()).toBeVisible();

  expect(foreign, 'the page must load nothing from another host').toEqual([]);
  expect(consoleErrors).toEqual([]);
});

test('a wrong password shows a sentence on the page and signs nobody in', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('demo-maker@example.com');
  await page.getByLabel('Password', { exact: true }).fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText(/do not match an account/)).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in/);
});
