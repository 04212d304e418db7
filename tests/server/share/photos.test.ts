import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Jimp } from 'jimp';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { createShowcaseProject } from '../../factories/share.js';
import { writePhotoFiles } from '../../../server/lib/storage.js';
import { sharedPhotoRef } from '../../../server/services/share.js';

// A shared page hands out photo URLs of its own link (/media/shared/<token>/<ref>/…). These checks make sure they
// load for a visitor exactly while that link is the project's current one and the photo is one the page shows, and
// that the owner's own URLs (/media/photos/<key>/…) serve the owner and nobody else.
let t: TestContext;
let jpeg: Uint8Array;
beforeAll(async () => {
  t = await createTestContext();
  const image = new Jimp({ width: 40, height: 30, color: 0x3f6b4eff });
  jpeg = new Uint8Array(await image.getBuffer('image/jpeg'));
});
afterAll(() => t.close());

type Photo = { url: string; thumbUrl: string; alt: string; cover: boolean };

/** A shared project whose three photos (cover, shown entry, private entry) have real files on disk. */
async function sharedWithFiles(ownerId: string, visibility: 'link' | 'public' = 'link') {
  const p = await createShowcaseProject(t.db, ownerId, { visibility });
  for (const key of [p.coverKey, p.shownEntryPhotoKey, p.privateEntryPhotoKey]) await writePhotoFiles(t.env.uploadsDir, p.id, key, { display: jpeg, thumb: jpeg });
  return p;
}

const view = async (token: string) => (await request(t.app).get(`/api/share/${token}`)).body.showcase as { photos: Photo[] };
const ownUrl = (key: string, file = 'display.jpg') => `/media/photos/${key}/${file}`;
const sharedUrl = (token: string, key: string, file = 'display.jpg') => `/media/shared/${token}/${sharedPhotoRef(token, key)}/${file}`;
const status = async (url: string) => (await request(t.app).get(url)).status;

describe('photos on a shared page', () => {
  it('load for a signed-out visitor while shared, cached publicly but asked again each time, and stop when the project goes private', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await sharedWithFiles(owner.user.id);
    const cover = (await view(p.token)).photos[0]!;

    const shown = await request(t.app).get(cover.url);
    expect(shown.status).toBe(200);
    expect(shown.headers['content-type']).toBe('image/jpeg');
    expect(shown.headers['cache-control']).toBe('public, no-cache');
    // The answer depends on the link alone, and no header gives the storage key away.
    expect(shown.headers.vary ?? '').not.toMatch(/cookie/i);
    expect(JSON.stringify(shown.headers)).not.toContain(p.coverKey);
    const etag = shown.headers.etag as string;
    expect((await request(t.app).get(cover.url).set('If-None-Match', etag)).status).toBe(304);
    expect(await status(cover.thumbUrl)).toBe(200);
    expect((await request(t.app).head(cover.url)).status).toBe(200);

    await owner.agent.patch(`/api/projects/${p.id}`).send({ visibility: 'private' });
    expect(await status(cover.url)).toBe(404);
    expect(await status(cover.thumbUrl)).toBe(404);
    // A cached copy asking again is refused too, not told it is still good.
    expect((await request(t.app).get(cover.url).set('If-None-Match', etag)).status).toBe(404);
    const stranger = await signedInAgent(t.app, t.db);
    expect((await stranger.agent.get(cover.url)).status).toBe(404);
    // The owner still sees their own photo at its own URL.
    expect((await owner.agent.get(ownUrl(p.coverKey))).status).toBe(200);
  });

  it('a new link retires every photo URL of the old page at once, and the new page’s photos load', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await sharedWithFiles(owner.user.id);
    const before = (await view(p.token)).photos;
    expect(before).toHaveLength(2);
    const etags: string[] = [];
    for (const photo of before) {
      const res = await request(t.app).get(photo.url);
      expect(res.status).toBe(200);
      etags.push(res.headers.etag as string);
    }

    const rotated = await owner.agent.post(`/api/projects/${p.id}/share-link`).send({});
    expect(rotated.status).toBe(200);
    const fresh: string = rotated.body.shareUrl.split('/p/')[1];

    for (const [i, photo] of before.entries()) {
      expect(await status(photo.url)).toBe(404);
      expect(await status(photo.thumbUrl)).toBe(404);
      expect((await request(t.app).get(photo.url).set('If-None-Match', etags[i]!)).status).toBe(404);
      // An old photo's name does not work under the new link either.
      expect(await status(photo.url.replace(p.token, fresh))).toBe(404);
    }
    const after = (await view(fresh)).photos;
    expect(after.map((x) => x.alt)).toEqual(before.map((x) => x.alt));
    for (const photo of after) {
      expect(before.map((x) => x.url)).not.toContain(photo.url);
      expect(await status(photo.url)).toBe(200);
      expect(await status(photo.thumbUrl)).toBe(200);
      // …and a new photo's name does not work under the old link.
      expect(await status(photo.url.replace(fresh, p.token))).toBe(404);
    }
  });

  it('the owner’s own photo URL serves the owner only, even while the project is shared', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await sharedWithFiles(owner.user.id, 'public');
    const stranger = await signedInAgent(t.app, t.db);
    for (const url of [ownUrl(p.coverKey), ownUrl(p.coverKey, 'thumb.jpg'), ownUrl(p.shownEntryPhotoKey)]) {
      expect(await status(url)).toBe(404);
      expect((await stranger.agent.get(url)).status).toBe(404);
      expect((await request(t.app).get(url).set('If-None-Match', `"${p.coverKey}-display"`)).status).toBe(404);
      const own = await owner.agent.get(url);
      expect(own.status).toBe(200);
      // The owner's copy never sits in a shared cache.
      expect(own.headers['cache-control']).toBe('private, max-age=3600');
      expect(own.headers.vary).toMatch(/Cookie/);
    }
  });

  it('never serves through a share URL a photo of an entry that is not on the showcase, not even the chosen cover', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await sharedWithFiles(owner.user.id);
    // Its name under the current link can be worked out by anyone who knows the key; it still is not served.
    expect(await status(sharedUrl(p.token, p.privateEntryPhotoKey))).toBe(404);
    expect(await status(sharedUrl(p.token, p.privateEntryPhotoKey, 'thumb.jpg'))).toBe(404);

    const privatePhoto = await t.db('photos').where({ storage_key: p.privateEntryPhotoKey }).first('id');
    await t.db('projects').where({ id: p.id }).update({ cover_photo_id: privatePhoto.id });
    const page = await view(p.token);
    expect(page.photos.map((x) => x.alt)).toEqual(['The body after stuffing', 'Moss the hedgehog on a windowsill']);
    // The first photo the page may show stands in as the cover, for the page and for link previews.
    expect(page.photos.map((x) => x.cover)).toEqual([true, false]);
    const html = (await request(t.app).get(`/p/${p.token}`)).text;
    expect(html).toContain(`/media/shared/${p.token}/${sharedPhotoRef(p.token, p.shownEntryPhotoKey)}/display.jpg`);
    expect(html).not.toContain(sharedPhotoRef(p.token, p.privateEntryPhotoKey));
    expect(await status(sharedUrl(p.token, p.privateEntryPhotoKey))).toBe(404);
    expect(await status(ownUrl(p.privateEntryPhotoKey))).toBe(404);
    // The owner is told why the page opens with another photo.
    const share = (await owner.agent.get(`/api/projects/${p.id}/share`)).body.share;
    expect(share).toMatchObject({ coverHidden: true, photoCount: 2 });
  });

  it('taking an entry off the showcase stops its photos at once; putting it back brings them back', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await sharedWithFiles(owner.user.id);
    const url = sharedUrl(p.token, p.shownEntryPhotoKey);
    expect(await status(url)).toBe(200);
    const { entry_id: entryId } = await t.db('photos').where({ storage_key: p.shownEntryPhotoKey }).first('entry_id');

    expect((await owner.agent.patch(`/api/entries/${entryId}`).send({ onShowcase: false })).status).toBe(200);
    expect(await status(url)).toBe(404);
    expect((await view(p.token)).photos.map((x) => x.alt)).toEqual(['Moss the hedgehog on a windowsill']);

    expect((await owner.agent.patch(`/api/entries/${entryId}`).send({ onShowcase: true })).status).toBe(200);
    expect(await status(url)).toBe(200);
  });

  it('a link names only its own project’s photos', async () => {
    const owner = await createTestUser(t.db);
    const a = await sharedWithFiles(owner.id);
    const b = await sharedWithFiles(owner.id);
    expect(await status(sharedUrl(b.token, b.coverKey))).toBe(200);
    expect(await status(sharedUrl(a.token, b.coverKey))).toBe(404);
  });

  it('stops when an admin takes the page down or the maker’s account is disabled', async () => {
    const owner = await createTestUser(t.db);
    const p = await sharedWithFiles(owner.id);
    const url = sharedUrl(p.token, p.coverKey);
    expect(await status(url)).toBe(200);
    await t.db('projects').where({ id: p.id }).update({ showcase_hidden_at: new Date().toISOString(), showcase_hidden_by: owner.id });
    expect(await status(url)).toBe(404);
    await t.db('projects').where({ id: p.id }).update({ showcase_hidden_at: null, showcase_hidden_by: null });
    expect(await status(url)).toBe(200);
    await t.db('users').where({ id: owner.id }).update({ disabled_at: new Date().toISOString() });
    expect(await status(url)).toBe(404);
  });

  it('answers a JSON 404, not the app’s page, for made-up names, variants and paths under /media', async () => {
    const owner = await createTestUser(t.db);
    const p = await sharedWithFiles(owner.id);
    const good = sharedUrl(p.token, p.coverKey);
    for (const url of [
      good.replace('display.jpg', 'original.jpg'),
      `/media/shared/${p.token}/${'A'.repeat(24)}/display.jpg`,
      `/media/shared/${p.token}/..%2F..%2Fdata/display.jpg`,
      `/media/shared/${'B'.repeat(24)}/${sharedPhotoRef('B'.repeat(24), p.coverKey)}/display.jpg`,
      `/media/shared/not-a-token/${sharedPhotoRef('not-a-token', p.coverKey)}/display.jpg`,
      '/media/anything/else',
    ]) {
      const res = await request(t.app).get(url);
      expect(res.status, url).toBe(404);
      expect(res.type).toMatch(/json/);
    }
  });

  it('the maker profile shows each page’s cover through that page’s current link', async () => {
    const owner = await signedInAgent(t.app, t.db);
    const p = await sharedWithFiles(owner.user.id, 'public');
    const first = (await request(t.app).get(`/api/makers/${owner.user.id}`)).body.projects[0].cover;
    expect(first.url).toBe(sharedUrl(p.token, p.coverKey));
    expect(await status(first.url)).toBe(200);
    const rotated = await owner.agent.post(`/api/projects/${p.id}/share-link`).send({});
    const fresh: string = rotated.body.shareUrl.split('/p/')[1];
    expect(await status(first.url)).toBe(404);
    const second = (await request(t.app).get(`/api/makers/${owner.user.id}`)).body.projects[0].cover;
    expect(second.url).toBe(sharedUrl(fresh, p.coverKey));
    expect(await status(second.url)).toBe(200);

    // A cover on an entry that is not shown is not the profile's to show either.
    const privatePhoto = await t.db('photos').where({ storage_key: p.privateEntryPhotoKey }).first('id');
    await t.db('projects').where({ id: p.id }).update({ cover_photo_id: privatePhoto.id });
    const third = (await request(t.app).get(`/api/makers/${owner.user.id}`)).body.projects[0].cover;
    expect(third.url).toBe(sharedUrl(fresh, p.shownEntryPhotoKey));
  });
});
