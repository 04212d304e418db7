import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Jimp, intToRGBA } from 'jimp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createProject, setVisibility } from '../../factories/journal.js';
import { makeJpeg, makePng, pngDeclaring, withExif } from '../../factories/images.js';
import { binary, filesUnder, photoCount } from './helpers.js';
import { MOSS_RGB, OAT_RGB, makeWebp, webpDeclaring } from './webp.js';
import { closeImagePool } from '../../../server/workers/image-pool.js';
import { canViewPhoto } from '../../../server/services/photos.js';

let t: TestContext;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let project: Awaited<ReturnType<typeof createProject>>;
let entryId: number;

beforeAll(async () => {
  t = await createTestContext();
  owner = await signedInAgent(t.app, t.db);
  project = await createProject(t.db, owner.user.id, { title: 'Moss the moth', pieces: ['Body', 'Wing'] });
  const res = await owner.agent
    .post(`/api/projects/${project.id}/entries`)
    .send({ body: 'Body done to Rnd 12.', pieceId: project.pieces[0].id, entryDate: '2026-11-25', tags: ['progress'] });
  expect(res.status).toBe(201);
  entryId = res.body.entry.id;
});
afterAll(async () => {
  await closeImagePool();
  await t.close();
});

const upload = (files: Array<{ data: Buffer; name: string; type?: string }>, who = owner.agent, id = entryId) => {
  let req = who.post(`/api/entries/${id}/photos`);
  for (const f of files) req = req.attach('photos', f.data, { filename: f.name, contentType: f.type ?? 'image/jpeg' });
  return req;
};
const fetchImage = (url: string, who: ReturnType<typeof request.agent> | ReturnType<typeof request> = owner.agent) =>
  (who as ReturnType<typeof request.agent>).get(url).buffer(true).parse(binary);

async function expectHealthy() {
  const res = await request(t.app).get('/api/health');
  expect(res.status).toBe(200);
  expect(res.body).toEqual({ ok: true });
}

describe('uploading photos to an entry', () => {
  it('answers 201 with PhotoOut: unguessable URLs, display size, and alt text from the piece and the day', async () => {
    const res = await upload([{ data: await makeJpeg({ width: 300, height: 200 }), name: 'rnd-12.jpg' }]);
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(1);
    const p = res.body.photos[0];
    expect(Object.keys(p).sort()).toEqual(['alt', 'height', 'id', 'thumbUrl', 'url', 'width']);
    expect(p.url).toMatch(/^\/media\/photos\/[A-Za-z0-9_-]{24}\/display\.jpg$/);
    expect(p.thumbUrl).toBe(p.url.replace('display.jpg', 'thumb.jpg'));
    // Smaller than 1600 px: kept at its own size, never enlarged.
    expect([p.width, p.height]).toEqual([300, 200]);
    expect(p.alt).toBe('Body — 25 Nov 2026');
    expect(res.headers['server-timing']).toMatch(/^queue;dur=\d+, resize;dur=\d+$/);
    // The name a person gave the file appears nowhere on disk.
    const files = filesUnder(t.env.uploadsDir);
    expect(files.some((f) => f.includes('rnd-12'))).toBe(false);
    expect(files).toHaveLength(2);

    const thumb = await fetchImage(p.thumbUrl);
    expect(thumb.status).toBe(200);
    const th = await Jimp.read(thumb.body);
    expect([th.bitmap.width, th.bitmap.height]).toEqual([400, 400]);
  });

  it('shrinks a large photo to 1600 px on the long side and keeps its proportions', async () => {
    const res = await upload([{ data: await makeJpeg({ width: 2400, height: 1800 }), name: 'big.jpg' }]);
    expect(res.status).toBe(201);
    expect([res.body.photos[0].width, res.body.photos[0].height]).toEqual([1600, 1200]);
    const img = await Jimp.read((await fetchImage(res.body.photos[0].url)).body);
    expect([img.bitmap.width, img.bitmap.height]).toEqual([1600, 1200]);
  });

  it('turns an EXIF orientation-6 photo upright: the sides swap and the stored top-left corner ends up top-right', async () => {
    // Orientation 6 = "rotate 90° clockwise to view" (EXIF 2.32, tag 0x0112).
    const data = withExif(await makeJpeg({ width: 300, height: 200 }), { orientation: 6 });
    const res = await upload([{ data, name: 'sideways.jpg' }]);
    expect(res.status).toBe(201);
    expect([res.body.photos[0].width, res.body.photos[0].height]).toEqual([200, 300]);
    const img = await Jimp.read((await fetchImage(res.body.photos[0].url)).body);
    expect([img.bitmap.width, img.bitmap.height]).toEqual([200, 300]);
    const topRight = intToRGBA(img.getPixelColor(img.bitmap.width - 5, 5));
    const topLeft = intToRGBA(img.getPixelColor(5, 5));
    expect(topRight.r).toBeGreaterThan(200);
    expect(topRight.b).toBeLessThan(60);
    expect(topLeft.b).toBeGreaterThan(200);
    expect(topLeft.r).toBeLessThan(60);
  });

  it('keeps no EXIF at all, so a GPS position never leaves the server', async () => {
    const data = withExif(await makeJpeg({ width: 640, height: 480 }), { gps: { lat: 51.5072, lon: -0.1276 } });
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wb-exif-'));
    const exif = (file: string) => JSON.parse(execFileSync('exiftool', ['-j', '-G', '-a', file]).toString())[0] as Record<string, unknown>;
    try {
      fs.writeFileSync(path.join(dir, 'in.jpg'), data);
      const before = exif(path.join(dir, 'in.jpg'));
      // The test image really carries a position and camera data, or this test would prove nothing.
      expect(Object.keys(before).some((k) => k.startsWith('EXIF:GPS'))).toBe(true);
      expect(before['EXIF:Make']).toBe('Whorlbook Test Camera');

      const res = await upload([{ data, name: 'at-the-park.jpg' }]);
      expect(res.status).toBe(201);
      for (const url of [res.body.photos[0].url, res.body.photos[0].thumbUrl]) {
        const body = (await fetchImage(url)).body;
        fs.writeFileSync(path.join(dir, 'out.jpg'), body);
        const after = exif(path.join(dir, 'out.jpg'));
        expect(Object.keys(after).filter((k) => /^(EXIF|XMP|IPTC|MakerNotes|Composite:GPS)/.test(k))).toEqual([]);
        // No APP1 "Exif\0\0" segment anywhere in the bytes either.
        expect(body.includes(Buffer.from('Exif\0\0', 'binary'))).toBe(false);
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('takes a PNG and serves it as a JPEG', async () => {
    const res = await upload([{ data: await makePng({ width: 120, height: 80 }), name: 'scan.png', type: 'image/png' }]);
    expect(res.status).toBe(201);
    const got = await fetchImage(res.body.photos[0].url);
    expect(got.headers['content-type']).toBe('image/jpeg');
    expect(got.body.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
  });

  it('takes several photos in one request', async () => {
    const res = await upload([
      { data: await makeJpeg({ width: 200, height: 200 }), name: 'a.jpg' },
      { data: await makeJpeg({ width: 220, height: 160 }), name: 'b.jpg' },
      { data: await makeJpeg({ width: 160, height: 220 }), name: 'c.jpg' },
    ]);
    expect(res.status).toBe(201);
    expect(res.body.photos.map((p: { width: number }) => p.width)).toEqual([200, 220, 160]);
  });
});

describe('WebP photos', () => {
  it('takes a WebP and serves a 1600 px JPEG display copy and a 400 px JPEG thumbnail, the right way up', async () => {
    const data = await makeWebp({ width: 2400, height: 1800 });
    // The test file really is a WebP (RIFF…WEBP), or this would prove nothing.
    expect(data.subarray(0, 4).toString('ascii')).toBe('RIFF');
    expect(data.subarray(8, 12).toString('ascii')).toBe('WEBP');
    const res = await upload([{ data, name: 'on-the-sill.webp', type: 'image/webp' }]);
    expect(res.status).toBe(201);
    const p = res.body.photos[0];
    expect([p.width, p.height]).toEqual([1600, 1200]);
    expect(p.url).toMatch(/^\/media\/photos\/[A-Za-z0-9_-]{24}\/display\.jpg$/);

    const display = await fetchImage(p.url);
    expect(display.headers['content-type']).toBe('image/jpeg');
    expect(display.body.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    const img = await Jimp.read(display.body);
    expect([img.bitmap.width, img.bitmap.height]).toEqual([1600, 1200]);
    // The red block stays in the top-left corner: the pixels are the picture's, not a blank or a flip.
    const topLeft = intToRGBA(img.getPixelColor(20, 20));
    const bottomRight = intToRGBA(img.getPixelColor(1580, 1180));
    expect(topLeft.r).toBeGreaterThan(200);
    expect(topLeft.b).toBeLessThan(60);
    expect(bottomRight.b).toBeGreaterThan(200);
    expect(bottomRight.r).toBeLessThan(60);

    const thumb = await fetchImage(p.thumbUrl);
    expect(thumb.body.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    const th = await Jimp.read(thumb.body);
    expect([th.bitmap.width, th.bitmap.height]).toEqual([400, 400]);
  });

  it('flattens a WebP’s transparent areas onto oat, not black', async () => {
    const data = await makeWebp({ width: 200, height: 100, transparentLeft: true, lossless: true });
    const res = await upload([{ data, name: 'cut-out.webp', type: 'image/webp' }]);
    expect(res.status).toBe(201);
    const img = await Jimp.read((await fetchImage(res.body.photos[0].url)).body);
    const near = (px: { r: number; g: number; b: number }, rgb: readonly number[]) =>
      // JPEG re-encoding moves colours a little; a few levels either way is still the same colour.
      Math.max(Math.abs(px.r - rgb[0]), Math.abs(px.g - rgb[1]), Math.abs(px.b - rgb[2]));
    expect(near(intToRGBA(img.getPixelColor(40, 50)), OAT_RGB)).toBeLessThanOrEqual(8);
    expect(near(intToRGBA(img.getPixelColor(160, 50)), MOSS_RGB)).toBeLessThanOrEqual(8);
  });

  it('takes a lossless WebP too', async () => {
    const res = await upload([{ data: await makeWebp({ width: 120, height: 90, lossless: true }), name: 'lossless.webp', type: 'image/webp' }]);
    expect(res.status).toBe(201);
    expect([res.body.photos[0].width, res.body.photos[0].height]).toEqual([120, 90]);
  });
});

describe('refusing bad files, clearly, with the server still healthy', () => {
  const refused = async (files: Parameters<typeof upload>[0], status: number, pattern: RegExp) => {
    const photosBefore = await photoCount(t.db);
    const filesBefore = filesUnder(t.env.uploadsDir);
    const res = await upload(files);
    expect(res.status).toBe(status);
    expect(res.type).toMatch(/json/);
    expect(res.body.error).toMatch(pattern);
    // Nothing half-written: no rows, no files.
    expect(await photoCount(t.db)).toBe(photosBefore);
    expect(filesUnder(t.env.uploadsDir)).toEqual(filesBefore);
    await expectHealthy();
    return res;
  };

  it('a text file named .jpg → 415 naming the file and the formats that work', async () => {
    await refused([{ data: Buffer.from('Rnd 1: MR, 6 sc (6)\nRnd 2: inc x6 (12)\n'), name: 'pattern-notes.jpg' }], 415, /“pattern-notes\.jpg” is not a photo[\s\S]*JPEG, PNG or WebP/);
  });

  it('a truncated JPEG → 422 "cut off"', async () => {
    const jpeg = await makeJpeg({ width: 400, height: 300, noise: 20 });
    await refused([{ data: jpeg.subarray(0, Math.floor(jpeg.length * 0.6)), name: 'half.jpg' }], 422, /“half\.jpg” is cut off/);
  });

  it('a JPEG missing only its last bytes → 422 too', async () => {
    const jpeg = await makeJpeg({ width: 400, height: 300, noise: 20 });
    await refused([{ data: jpeg.subarray(0, jpeg.length - 2), name: 'almost.jpg' }], 422, /“almost\.jpg” is cut off/);
  });

  it('a PNG whose header declares 20000 × 20000 px → 422 before anything decodes it', async () => {
    const png = pngDeclaring(20_000, 20_000);
    expect(png.length).toBeLessThan(200);
    await refused([{ data: png, name: 'huge.png', type: 'image/png' }], 422, /“huge\.png” is 20000 × 20000 pixels[\s\S]*40 megapixels/);
  });

  it('a WebP whose VP8X header declares 20000 × 20000 px → 422 before anything decodes it', async () => {
    const webp = await webpDeclaring(20_000, 20_000);
    expect(webp.length).toBeLessThan(400);
    await refused([{ data: webp, name: 'huge.webp', type: 'image/webp' }], 422, /“huge\.webp” is 20000 × 20000 pixels[\s\S]*40 megapixels/);
  });

  it('a truncated WebP → 422 "cut off"', async () => {
    const webp = await makeWebp({ width: 300, height: 200 });
    await refused([{ data: webp.subarray(0, Math.floor(webp.length * 0.7)), name: 'half.webp', type: 'image/webp' }], 422, /“half\.webp” is cut off/);
  });

  it('an animated WebP → 415 asking for a still photo', async () => {
    await refused([{ data: await webpDeclaring(16, 16, { flags: 0x02 }), name: 'wave.webp', type: 'image/webp' }], 415, /“wave\.webp” is an animated WebP/);
  });

  it('a 9000 × 5000 picture (45 megapixels, each side allowed) → 422 on the megapixel limit', async () => {
    await refused([{ data: pngDeclaring(9000, 5000), name: 'wide.png', type: 'image/png' }], 422, /9000 × 5000 pixels/);
  });

  it('an empty file → 400', async () => {
    await refused([{ data: Buffer.alloc(0), name: 'nothing.jpg' }], 400, /“nothing\.jpg” is empty/);
  });

  it('9 files at once → 413 naming the limit of 8', async () => {
    const small = await makeJpeg({ width: 40, height: 40 });
    await refused(
      Array.from({ length: 9 }, (_, i) => ({ data: small, name: `p${i}.jpg` })),
      413,
      /at most 8 photos at a time/,
    );
  });

  it('a file over 15 MB → 413 naming the file', async () => {
    const big = Buffer.alloc(15 * 1024 * 1024 + 10, 7);
    await refused([{ data: big, name: 'enormous.jpg' }], 413, /“enormous\.jpg” is larger than 15 MB/);
  });

  it('a HEIC photo → 415 saying which formats work', async () => {
    // An ISO-BMFF "ftyp" box with the heic brand (ISO/IEC 23008-12), the start of every HEIC file.
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from('ftypheic'), Buffer.from([0, 0, 0, 0]), Buffer.from('mif1heic'), Buffer.alloc(200)]);
    await refused([{ data: heic, name: 'IMG_0420.HEIC', type: 'image/heic' }], 415, /“IMG_0420\.HEIC” is a HEIC photo[\s\S]*JPEG, PNG or WebP/);
  });

  it('one bad file in a batch refuses the whole request and says exactly which file failed', async () => {
    const good = await makeJpeg({ width: 100, height: 100 });
    const res = await refused(
      [
        { data: good, name: 'good-1.jpg' },
        { data: Buffer.from('not a picture'), name: 'oops.jpg' },
        { data: good, name: 'good-2.jpg' },
      ],
      415,
      /“oops\.jpg” is not a photo[\s\S]*Nothing from this upload was saved/,
    );
    expect(res.body.error).not.toMatch(/good-1|good-2/);
    expect(res.body.issues).toEqual([{ path: 'photos.1', message: expect.stringMatching(/oops\.jpg/) }]);
  });

  it('a request with no photo, or photos under another field name, is refused with a sentence', async () => {
    const none = await owner.agent.post(`/api/entries/${entryId}/photos`).field('note', 'hi');
    expect(none.status).toBe(422);
    expect(none.body.error).toMatch(/at least one photo/);
    const wrong = await owner.agent.post(`/api/entries/${entryId}/photos`).attach('picture', await makeJpeg(), 'x.jpg');
    expect(wrong.status).toBe(400);
    expect(wrong.body.error).toMatch(/field "photos"/);
    const json = await owner.agent.post(`/api/entries/${entryId}/photos`).send({ photos: [] });
    expect(json.status).toBe(415);
  });

  it('still takes a good photo after all of that', async () => {
    const res = await upload([{ data: await makeJpeg({ width: 90, height: 60 }), name: 'after.jpg' }]);
    expect(res.status).toBe(201);
  });
});

/** The photos a visitor of the project's shared page gets, through the page's own link (issue 8). */
async function sharedPagePhotos(projectId: number): Promise<Array<{ url: string; thumbUrl: string; alt: string }>> {
  const { share_token: token } = await t.db('projects').where({ id: projectId }).first('share_token');
  const res = await request(t.app).get(`/api/share/${token}`);
  return res.status === 200 ? res.body.showcase.photos : [];
}

describe('who can see a photo', () => {
  let photo: { id: number; url: string; thumbUrl: string };
  let other: Awaited<ReturnType<typeof signedInAgent>>;
  let privateProject: Awaited<ReturnType<typeof createProject>>;

  beforeAll(async () => {
    other = await signedInAgent(t.app, t.db);
    privateProject = await createProject(t.db, owner.user.id, { title: 'Secret gift' });
    // The entry is marked for the showcase, so its photo is one a visitor may see once the project is shared.
    const entry = await owner.agent
      .post(`/api/projects/${privateProject.id}/entries`)
      .send({ body: 'A surprise.', entryDate: '2026-12-01', onShowcase: true });
    const res = await upload([{ data: await makeJpeg({ width: 120, height: 90 }), name: 'gift.jpg' }], owner.agent, entry.body.entry.id);
    expect(res.status).toBe(201);
    photo = res.body.photos[0];
    expect(res.body.photos[0].alt).toBe('Secret gift — 1 Dec 2026');
  });

  it('the owner gets it, with private caching and a strong ETag that answers 304', async () => {
    const res = await fetchImage(photo.url);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expect(res.headers['cache-control']).toBe('private, max-age=3600');
    expect(res.headers.etag).toMatch(/^"[A-Za-z0-9_-]{24}-display"$/);
    const again = await owner.agent.get(photo.url).set('If-None-Match', res.headers.etag);
    expect(again.status).toBe(304);
  });

  it('another member and a signed-out visitor get 404 for both sizes of a private photo, revalidation included', async () => {
    for (const url of [photo.url, photo.thumbUrl]) {
      const member = await other.agent.get(url);
      expect(member.status).toBe(404);
      expect(member.headers['content-type']).toMatch(/json/);
      const visitor = await request(t.app).get(url);
      expect(visitor.status).toBe(404);
      const sneaky = await request(t.app).get(url).set('If-None-Match', `"${url.split('/')[3]}-display"`);
      expect(sneaky.status).toBe(404);
    }
  });

  it('a made-up key, a bad variant or a path trick is 404', async () => {
    for (const url of ['/media/photos/AAAAAAAAAAAAAAAAAAAAAAAA/display.jpg', photo.url.replace('display.jpg', 'original.jpg'), '/media/photos/..%2F..%2Fdata/display.jpg']) {
      expect((await owner.agent.get(url)).status).toBe(404);
    }
  });

  it('its own URL serves the owner only, even while the project is shared; visitors get it through the page’s link', async () => {
    await setVisibility(t.db, privateProject.id, 'link');
    try {
      expect((await request(t.app).get(photo.url)).status).toBe(404);
      expect((await other.agent.get(photo.thumbUrl)).status).toBe(404);
      const own = await fetchImage(photo.url);
      expect(own.status).toBe(200);
      expect(own.headers['cache-control']).toBe('private, max-age=3600');
      const [onPage] = await sharedPagePhotos(privateProject.id);
      const shared = await fetchImage(onPage!.url, request(t.app));
      expect(shared.status).toBe(200);
      expect(shared.body).toEqual(own.body);
      await setVisibility(t.db, privateProject.id, 'private');
      expect((await request(t.app).get(onPage!.url)).status).toBe(404);
    } finally {
      await setVisibility(t.db, privateProject.id, 'private');
    }
  });

  it('while shared, a photo of an entry not on the showcase stays private, even as the cover', async () => {
    const diary = await owner.agent
      .post(`/api/projects/${privateProject.id}/entries`)
      .send({ body: 'Frogged the ear twice.', entryDate: '2026-12-01' });
    const res = await upload([{ data: await makeJpeg({ width: 60, height: 60 }), name: 'messy.jpg' }], owner.agent, diary.body.entry.id);
    const hidden = res.body.photos[0];
    await setVisibility(t.db, privateProject.id, 'link');
    try {
      expect((await request(t.app).get(hidden.url)).status).toBe(404);
      expect((await other.agent.get(hidden.thumbUrl)).status).toBe(404);
      expect((await owner.agent.get(hidden.url)).status).toBe(200);
      // The page shows the showcase entry's photo, not this one.
      expect((await sharedPagePhotos(privateProject.id)).map((p) => p.alt)).toEqual(['Secret gift — 1 Dec 2026']);
      await t.db('projects').where({ id: privateProject.id }).update({ cover_photo_id: hidden.id });
      expect((await sharedPagePhotos(privateProject.id)).map((p) => p.alt)).toEqual(['Secret gift — 1 Dec 2026']);
      expect((await request(t.app).get(hidden.url)).status).toBe(404);
    } finally {
      await t.db('projects').where({ id: privateProject.id }).update({ cover_photo_id: null });
      await setVisibility(t.db, privateProject.id, 'private');
    }
  });

  it('a shared project whose showcase an admin took down serves its photos to the owner only, privately cached', async () => {
    await setVisibility(t.db, privateProject.id, 'link');
    const [onPage] = await sharedPagePhotos(privateProject.id);
    expect((await request(t.app).get(onPage!.url)).status).toBe(200);
    await t.db('projects').where({ id: privateProject.id }).update({ showcase_hidden_at: new Date().toISOString(), showcase_hidden_by: other.user.id });
    try {
      for (const url of [photo.url, photo.thumbUrl, onPage!.url, onPage!.thumbUrl]) {
        expect((await request(t.app).get(url)).status).toBe(404);
        expect((await other.agent.get(url)).status).toBe(404);
      }
      const own = await fetchImage(photo.url);
      expect(own.status).toBe(200);
      // The owner's copy must not sit in a shared cache where a visitor could still be handed it.
      expect(own.headers['cache-control']).toBe('private, max-age=3600');
    } finally {
      await t.db('projects').where({ id: privateProject.id }).update({ showcase_hidden_at: null, showcase_hidden_by: null });
      await setVisibility(t.db, privateProject.id, 'private');
    }
  });

  it('a disabled owner’s photos are served to no one, though the project is public', async () => {
    const maker = await signedInAgent(t.app, t.db);
    const shared = await createProject(t.db, maker.user.id, { title: 'Shared then closed', visibility: 'public' });
    const entry = await maker.agent.post(`/api/projects/${shared.id}/entries`).send({ body: 'Done.', entryDate: '2026-12-02', onShowcase: true });
    const up = await upload([{ data: await makeJpeg({ width: 80, height: 60 }), name: 'done.jpg' }], maker.agent, entry.body.entry.id);
    expect(up.status).toBe(201);
    const p = up.body.photos[0];
    const [onPage] = await sharedPagePhotos(shared.id);
    expect((await request(t.app).get(onPage!.url)).status).toBe(200);
    const row = await t.db('photos').where({ id: p.id }).first();
    expect(await canViewPhoto(t.db, { id: maker.user.id }, row)).toBe(true);

    const admin = await signedInAgent(t.app, t.db, { role: 'admin' });
    expect((await admin.agent.post(`/api/admin/users/${maker.user.id}/disable`)).status).toBe(200);
    for (const url of [p.url, p.thumbUrl, onPage!.url]) {
      expect((await request(t.app).get(url)).status).toBe(404);
      expect((await other.agent.get(url)).status).toBe(404);
      expect((await maker.agent.get(url)).status).toBe(404);
    }
    // Not only because a disabled member's session is refused: the rule itself says no, even to the owner.
    expect(await canViewPhoto(t.db, { id: maker.user.id }, row)).toBe(false);
    expect(await canViewPhoto(t.db, null, row)).toBe(false);

    // And it is the account's state that decides: opened again, the public photo is public again.
    expect((await admin.agent.post(`/api/admin/users/${maker.user.id}/enable`)).status).toBe(200);
    expect((await request(t.app).get(onPage!.url)).status).toBe(200);
  });

  it('another member cannot add photos to, or change, someone else’s entry and photo', async () => {
    const res = await upload([{ data: await makeJpeg(), name: 'intruder.jpg' }], other.agent);
    expect(res.status).toBe(404);
    expect((await other.agent.patch(`/api/photos/${photo.id}`).send({ alt: 'mine now' })).status).toBe(404);
    expect((await other.agent.delete(`/api/photos/${photo.id}`)).status).toBe(404);
    expect((await request(t.app).delete(`/api/photos/${photo.id}`)).status).toBe(401);
  });
});

describe('changing and deleting photos', () => {
  it('edits the alt text and makes a photo the project cover, and clears the cover when it is deleted', async () => {
    const up = await upload([{ data: await makeJpeg({ width: 100, height: 80 }), name: 'cover.jpg' }]);
    const photo = up.body.photos[0];
    const alt = await owner.agent.patch(`/api/photos/${photo.id}`).send({ alt: '  The finished moth on the sill  ' });
    expect(alt.status).toBe(200);
    expect(alt.body.photo.alt).toBe('The finished moth on the sill');
    const blank = await owner.agent.patch(`/api/photos/${photo.id}`).send({ alt: '   ' });
    expect(blank.status).toBe(422);

    const cover = await owner.agent.patch(`/api/photos/${photo.id}`).send({ cover: true });
    expect(cover.status).toBe(200);
    expect(cover.body.cover).toBe(true);
    expect((await t.db('projects').where({ id: project.id }).first()).cover_photo_id).toBe(photo.id);
    const list = await owner.agent.get(`/api/projects/${project.id}/entries`);
    const listed = list.body.entries.flatMap((e: { photos: Array<{ id: number; cover: boolean }> }) => e.photos);
    expect(listed.filter((p: { cover: boolean }) => p.cover).map((p: { id: number }) => p.id)).toEqual([photo.id]);

    const files = filesUnder(t.env.uploadsDir);
    const key = photo.url.split('/')[3];
    expect(files.filter((f) => f.includes(key))).toHaveLength(2);
    const del = await owner.agent.delete(`/api/photos/${photo.id}`);
    expect(del.status).toBe(204);
    expect(filesUnder(t.env.uploadsDir).filter((f) => f.includes(key))).toEqual([]);
    expect((await t.db('projects').where({ id: project.id }).first()).cover_photo_id).toBeNull();
    expect((await owner.agent.get(photo.url)).status).toBe(404);
  });

  it('deleting an entry removes its photos and their files', async () => {
    const entry = await owner.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'Frogged the wing.', entryDate: '2026-11-26' });
    const up = await upload([{ data: await makeJpeg(), name: 'w1.jpg' }, { data: await makeJpeg(), name: 'w2.jpg' }], owner.agent, entry.body.entry.id);
    expect(up.status).toBe(201);
    const keys = up.body.photos.map((p: { url: string }) => p.url.split('/')[3]);
    await owner.agent.patch(`/api/photos/${up.body.photos[0].id}`).send({ cover: true });
    const del = await owner.agent.delete(`/api/entries/${entry.body.entry.id}`);
    expect(del.status).toBe(204);
    expect(filesUnder(t.env.uploadsDir).filter((f) => keys.some((k: string) => f.includes(k)))).toEqual([]);
    expect(await t.db('photos').whereIn('id', up.body.photos.map((p: { id: number }) => p.id))).toEqual([]);
    expect((await t.db('projects').where({ id: project.id }).first()).cover_photo_id).toBeNull();
  });

  it('deleteProjectPhotoFiles removes a deleted project’s files', async () => {
    const { deleteProjectPhotoFiles } = await import('../../../server/lib/storage.js');
    const doomed = await createProject(t.db, owner.user.id, { title: 'Doomed' });
    const entry = await owner.agent.post(`/api/projects/${doomed.id}/entries`).send({ body: 'Start.' });
    const up = await upload([{ data: await makeJpeg(), name: 'x.jpg' }], owner.agent, entry.body.entry.id);
    const key = up.body.photos[0].url.split('/')[3];
    const otherFiles = filesUnder(t.env.uploadsDir).filter((f) => !f.includes(key));
    await t.db('projects').where({ id: doomed.id }).delete();
    await deleteProjectPhotoFiles(t, doomed.id);
    expect(filesUnder(t.env.uploadsDir)).toEqual(otherFiles);
  });
});
