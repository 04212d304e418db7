import { expect, test } from '@playwright/test';
import { Jimp } from 'jimp';
import { createMember, signIn } from './helpers';

// A maker shares a finished piece by link; a friend opens it signed out, sees the photo and the credit; the maker
// makes a new link, which retires the old page and its photo URLs; the friend opens the new one, signs in from
// the page and leaves a comment. The project is the test's own, so the demo stays as it was.

async function photoJpeg() {
  const img = new Jimp({ width: 800, height: 600, color: 0xe4d9c6ff });
  for (let x = 250; x < 550; x++) for (let y = 150; y < 450; y++) if ((x - 400) ** 2 + (y - 300) ** 2 < 150 ** 2) img.setPixelColor(0x3f6b4eff, x, y);
  return Buffer.from(await img.getBuffer('image/jpeg'));
}

test('share a finished piece by link, open it signed out, then comment as a friend', async ({ page, browser, baseURL }) => {
  test.setTimeout(120_000);
  await signIn(page);

  // The maker's own project, started from the demo pattern so the credit comes along.
  const patterns = await (await page.request.get('/api/patterns')).json();
  const pattern = patterns.patterns.find((p: { title: string }) => p.title.startsWith('Bramble'));
  const title = `Showcase owl ${Date.now()}`;
  const created = await page.request.post('/api/projects', {
    data: { title, patternId: pattern.id, status: 'finished', startedOn: '2026-11-02', finishedOn: '2026-11-20', recipient: 'my cousin Vera', notions: [{ kind: 'safety_eyes', sizeMm: 8, quantity: 2 }] },
  });
  expect(created.status()).toBe(201);
  const project = (await created.json()).project;

  const entryRes = await page.request.post(`/api/projects/${project.id}/entries`, { data: { body: 'Eyes in, all stuffed, done!', minutes: 50, onShowcase: true, tags: ['finished'] } });
  expect(entryRes.status()).toBe(201);
  const entry = (await entryRes.json()).entry;
  const upload = await page.request.post(`/api/entries/${entry.id}/photos`, { multipart: { photos: { name: 'owl.jpg', mimeType: 'image/jpeg', buffer: await photoJpeg() } } });
  expect(upload.status()).toBe(201);
  const [photo] = (await upload.json()).photos;
  expect((await page.request.patch(`/api/photos/${photo.id}`, { data: { alt: 'The owl on a fence post', cover: true } })).status()).toBe(200);
  await page.request.post(`/api/projects/${project.id}/entries`, { data: { body: 'PRIVATE: this one is just for me.', minutes: 10 } });

  // Share it from the project page's Sharing panel.
  await page.goto(`/projects/${project.id}`);
  await expect(page.getByRole('heading', { name: 'Sharing' })).toBeVisible();
  await page.getByRole('radio', { name: /Anyone with the link/ }).check();
  const linkBox = page.getByRole('textbox', { name: 'The link' });
  await expect(linkBox).toHaveValue(/\/p\/[A-Za-z0-9_-]{22,}$/);
  const link = await linkBox.inputValue();
  await expect(page.getByTestId('share-qr')).toBeVisible();

  // A friend opens the link in a fresh, signed-out browser.
  const friendContext = await browser.newContext({ baseURL, viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true });
  const friend = await friendContext.newPage();
  const response = await friend.goto(link);
  expect(response?.status()).toBe(200);
  await expect(friend.getByRole('heading', { level: 1, name: title })).toBeVisible();
  const cover = friend.getByRole('img', { name: 'The owl on a fence post' });
  await expect(cover).toBeVisible();
  await expect.poll(() => cover.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBeGreaterThan(0);
  await expect(friend.getByText('Bramble, the blackberry sprite').first()).toBeVisible();
  await expect(friend.getByText('Designed by Whorlbook demo studio')).toBeVisible();
  await expect(friend.getByText('Eyes in, all stuffed, done!')).toBeVisible();
  await expect(friend.getByRole('alert').filter({ hasText: 'Small parts' })).toBeVisible();
  const text = await friend.locator('body').innerText();
  expect(text).not.toContain('PRIVATE: this one is just for me.');
  expect(text).not.toContain('my cousin Vera');
  expect(text).not.toMatch(/@example\.com/);
  // The page's photos go through this link, not the owner's own photo URL, which a visitor cannot load.
  const oldPhotoUrl = (await cover.getAttribute('src'))!;
  expect(oldPhotoUrl).toMatch(new RegExp(`^/media/shared/${link.split('/p/')[1]}/[A-Za-z0-9_-]{24}/display\\.jpg$`));
  expect((await friend.request.get(photo.url)).status()).toBe(404);
  // The link preview meta came from the server.
  expect(await friend.locator('meta[property="og:title"]').getAttribute('content')).toBe(title);
  expect(await friend.locator('meta[property="og:image"]').getAttribute('content')).toBe(new URL(oldPhotoUrl, link).toString());

  // Tap to enlarge the cover.
  await cover.click();
  await expect(friend.getByText('Photo 1 of 1')).toBeVisible();
  await friend.getByRole('button', { name: 'Close the photos' }).click();

  // The maker makes a new link: for the friend, still signed out, the old page and a photo URL saved from it
  // both stop working at once, even with the photo in the browser's cache.
  expect((await friend.request.get(oldPhotoUrl)).status()).toBe(200);
  await page.getByRole('button', { name: 'Make a new link' }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Make a new link' }).click();
  await expect(page.getByText('New link made. The old one no longer works.')).toBeVisible();
  await expect(linkBox).not.toHaveValue(link);
  const newLink = await linkBox.inputValue();
  expect(newLink).toMatch(/\/p\/[A-Za-z0-9_-]{22,}$/);
  const retired = await friend.goto(link);
  expect(retired?.status()).toBe(404);
  await expect(friend.getByText('This page is not shared')).toBeVisible();
  expect((await friend.request.get(oldPhotoUrl)).status()).toBe(404);
  const oldPhotoLoads = await friend.evaluate(
    (src) => new Promise<boolean>((resolve) => {
      const img = new Image();
      img.onload = () => resolve(img.naturalWidth > 0);
      img.onerror = () => resolve(false);
      img.src = src;
    }),
    oldPhotoUrl,
  );
  expect(oldPhotoLoads).toBe(false);

  // The new link shows the page and its photo again, under a new photo URL.
  expect((await friend.goto(newLink))?.status()).toBe(200);
  await expect(cover).toBeVisible();
  await expect.poll(() => cover.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBeGreaterThan(0);
  expect(await cover.getAttribute('src')).not.toBe(oldPhotoUrl);

  // Sign in from the page as a friend and come straight back.
  const member = createMember('Fennel Friend');
  await friend.getByRole('link', { name: 'Sign in to comment' }).click();
  await friend.getByLabel('E-mail').fill(member.email);
  await friend.getByLabel('Password', { exact: true }).fill(member.password);
  await friend.getByRole('button', { name: 'Sign in' }).click();
  await expect(friend).toHaveURL(newLink);
  const comment = `What a lovely owl! <b>not bold</b> ${Date.now()}`;
  await friend.getByLabel('Leave a comment').fill(comment);
  await friend.getByRole('button', { name: 'Post comment' }).click();
  await expect(friend.getByTestId('comment-body').filter({ hasText: comment })).toBeVisible();
  await expect(friend.locator('#comments b')).toHaveCount(0);
  await friend.getByRole('button', { name: /^Cheer/ }).click();
  await expect(friend.getByRole('button', { name: /You cheered/ })).toHaveAttribute('aria-pressed', 'true');

  // The maker hides the comment from their own page (through the page's link); the friend no longer sees it.
  const ownerView = await page.context().newPage();
  await ownerView.goto(newLink);
  const ownersCopy = ownerView.getByRole('listitem').filter({ has: ownerView.getByTestId('comment-body').filter({ hasText: comment }) });
  await ownersCopy.getByRole('button', { name: 'Hide' }).click();
  await expect(ownersCopy.getByText('Hidden. Only you can see it.')).toBeVisible();
  await friend.reload();
  await expect(friend.getByRole('heading', { level: 1, name: title })).toBeVisible();
  await expect(friend.getByTestId('comment-body').filter({ hasText: comment })).toHaveCount(0);
  await ownerView.close();

  // The maker makes it private again: the link stops working at once.
  await page.getByRole('radio', { name: /Private/ }).check();
  await expect(linkBox).toHaveCount(0);
  const closed = await friend.goto(newLink);
  expect(closed?.status()).toBe(404);
  await expect(friend.getByText('This page is not shared')).toBeVisible();
  await friendContext.close();
});
