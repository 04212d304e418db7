import { expect, request, test } from '@playwright/test';
import { Jimp } from 'jimp';
import { signIn } from './helpers';

// A maker writes a journal entry on their own new project, attaches a photo made here on the spot,
// watches it go up and sees its thumbnail; a signed-out browser cannot fetch that private photo.

async function smallJpeg() {
  const img = new Jimp({ width: 640, height: 480, color: 0x3f6b4eff });
  img.scan(0, 0, 320, 240, (_x, _y, idx) => {
    img.bitmap.data[idx] = 0xb8;
    img.bitmap.data[idx + 1] = 0x5c;
    img.bitmap.data[idx + 2] = 0x38;
  });
  return Buffer.from(await img.getBuffer('image/jpeg', { quality: 90 }));
}

test('write an entry, attach a photo, see the progress bar and the thumbnail', async ({ page, baseURL }) => {
  const consoleErrors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && !/status of 401/.test(m.text()) && consoleErrors.push(m.text()));
  await signIn(page);

  const made = await page.request.post('/api/projects', { data: { title: `Pip the pear ${Date.now()}`, pieces: [{ name: 'Body' }, { name: 'Ear', copies: 2 }] } });
  expect(made.status()).toBe(201);
  const { project } = (await made.json()) as { project: { id: number } };

  try {
    await page.goto(`/projects/${project.id}`);
    await expect(page.getByRole('heading', { name: 'Journal', exact: true })).toBeVisible();
    await expect(page.getByText('No entries yet')).toBeVisible();

    await page.getByRole('button', { name: 'Write an entry' }).click();
    const form = page.getByRole('form', { name: 'New journal entry' });
    await form.getByLabel('What did you do?').fill('Body to **Rnd 8**, stuffed halfway.');
    await form.getByLabel('Working time (minutes)').fill('30');
    await form.getByLabel('Piece', { exact: true }).selectOption({ label: 'Body' });
    const progress = form.getByRole('button', { name: 'Progress' });
    await progress.click();
    await expect(progress).toHaveAttribute('aria-pressed', 'true');

    const chooser = page.waitForEvent('filechooser');
    await form.getByRole('button', { name: 'Choose photos' }).click();
    await (await chooser).setFiles({ name: 'body-rnd-8.jpg', mimeType: 'image/jpeg', buffer: await smallJpeg() });
    await expect(form.getByRole('list', { name: 'Photos to add' })).toContainText('body-rnd-8.jpg');

    // Hold the upload a moment before it reaches the real server, so the bar is on screen long enough to see.
    await page.route('**/api/entries/*/photos', async (route) => {
      await new Promise((r) => setTimeout(r, 1500));
      await route.continue();
    });
    await form.getByRole('button', { name: 'Save entry' }).click();

    await expect(page.getByRole('progressbar', { name: /body-rnd-8/ })).toBeVisible();
    const entry = page.getByRole('list', { name: 'Journal entries, newest first' }).getByRole('listitem').first();
    await expect(entry).toContainText('Rnd 8');
    await expect(entry.locator('strong')).toHaveText('Rnd 8');
    await expect(entry).toContainText('30 min');
    await expect(entry).toContainText('Body');

    const thumb = entry.getByRole('button', { name: /^Open photo: Body — / });
    await expect(thumb).toBeVisible({ timeout: 20_000 });
    const img = thumb.locator('img');
    await expect.poll(() => img.evaluate((el: HTMLImageElement) => el.complete && el.naturalWidth)).toBe(400);
    const src = await img.getAttribute('src');

    // The larger view opens with the default description, which can be edited.
    await thumb.click();
    const dialog = page.getByRole('dialog', { name: 'Photo' });
    await expect(dialog.getByRole('img')).toBeVisible();
    const description = dialog.getByLabel('Description for people who cannot see the photo');
    await expect(description).toHaveValue(/^Body — /);
    await description.fill('Bramble’s body, stuffed halfway');
    await dialog.getByRole('button', { name: 'Save description' }).click();
    await dialog.getByRole('button', { name: 'Use as cover' }).click();
    await expect(dialog.getByText('This is the project’s cover')).toBeVisible();
    await dialog.getByRole('button', { name: 'Close' }).click();
    await expect(entry.getByRole('button', { name: 'Open photo: Bramble’s body, stuffed halfway' })).toBeVisible();

    // Private by default: a browser that is not signed in gets 404 for the photo's own address.
    expect(src).toMatch(/^\/media\/photos\/[A-Za-z0-9_-]{24}\/thumb\.jpg$/);
    const stranger = await request.newContext({ baseURL });
    expect((await stranger.get(src!)).status()).toBe(404);
    expect((await page.request.get(src!)).status()).toBe(200);
    await stranger.dispose();

    expect(consoleErrors).toEqual([]);
  } finally {
    await page.request.delete(`/api/projects/${project.id}`);
  }
});
