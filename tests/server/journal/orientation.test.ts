import { Jimp, intToRGBA } from 'jimp';
import piexif from 'piexifjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createProject } from '../../factories/journal.js';
import { makeJpeg, withExif } from '../../factories/images.js';
import { binary } from './helpers.js';
import { makeWebpWithExif } from './webp.js';
import { closeImagePool } from '../../../server/workers/image-pool.js';
import { exifOrientation } from '../../../server/workers/orientation.js';

// Photos come out the way they are meant to be viewed, from the EXIF orientation of a JPEG or a WebP.
// Orientation values (EXIF 2.32, JEITA CP-3451, tag 0x0112): 1 as stored, 2 mirrored left-right, 3 turned 180°,
// 4 mirrored top-bottom, 5 mirrored along the top-left/bottom-right diagonal, 6 "turn 90° clockwise to view",
// 7 mirrored along the other diagonal, 8 "turn 90° counter-clockwise to view".
// The test pictures are 300 × 200, blue with a red block in the stored top-left corner; where that block ends up,
// and whether the sides swap, tells the eight apart.
const expected: Record<
  number,
  { corner: 'top-left' | 'top-right' | 'bottom-left' | 'bottom-right'; swapped: boolean }
> = {
  1: { corner: 'top-left', swapped: false },
  2: { corner: 'top-right', swapped: false },
  3: { corner: 'bottom-right', swapped: false },
  4: { corner: 'bottom-left', swapped: false },
  5: { corner: 'top-left', swapped: true },
  6: { corner: 'top-right', swapped: true },
  7: { corner: 'bottom-right', swapped: true },
  8: { corner: 'bottom-left', swapped: true },
};

const exifWith = (orientation: number, gps = false) =>
  piexif.dump({
    '0th': { [piexif.ImageIFD.Make]: 'Whorlbook Test Camera', [piexif.ImageIFD.Orientation]: orientation },
    Exif: {},
    GPS: gps
      ? {
          [piexif.GPSIFD.GPSLatitudeRef]: 'N',
          [piexif.GPSIFD.GPSLatitude]: piexif.GPSHelper.degToDmsRational(51.5072),
          [piexif.GPSIFD.GPSLongitudeRef]: 'W',
          [piexif.GPSIFD.GPSLongitude]: piexif.GPSHelper.degToDmsRational(0.1276),
        }
      : {},
  });

/** A TIFF structure written by hand in little-endian ("II") order with one entry: orientation. */
function littleEndianTiff(orientation: number) {
  const t = Buffer.alloc(26);
  t.write('II', 0, 'ascii');
  t.writeUInt16LE(42, 2);
  t.writeUInt32LE(8, 4); // IFD0 right after the header
  t.writeUInt16LE(1, 8); // one entry
  t.writeUInt16LE(0x0112, 10);
  t.writeUInt16LE(3, 12); // SHORT
  t.writeUInt32LE(1, 14); // one value
  t.writeUInt16LE(orientation, 18);
  t.writeUInt32LE(0, 22); // no next IFD
  return t;
}

describe('reading the EXIF orientation from the bytes', () => {
  it('reads every orientation from a JPEG (big-endian TIFF, as piexifjs writes it)', async () => {
    const plain = await makeJpeg({ width: 32, height: 24 });
    expect(exifOrientation(plain)).toBe(1);
    for (let o = 1; o <= 8; o += 1) expect(exifOrientation(withExif(plain, { orientation: o }))).toBe(o);
  });

  it('reads it from a WebP EXIF chunk, raw TIFF or with the "Exif\\0\\0" prefix, in either byte order', async () => {
    expect(exifOrientation(await makeWebpWithExif(exifWith(6), { width: 32, height: 24 }))).toBe(6);
    expect(
      exifOrientation(await makeWebpWithExif(exifWith(8), { width: 32, height: 24, exifPrefix: true })),
    ).toBe(8);
    const le = 'Exif\0\0' + littleEndianTiff(3).toString('binary');
    expect(exifOrientation(await makeWebpWithExif(le, { width: 32, height: 24 }))).toBe(3);
  });

  it('rewrites the tag to 1 in place when asked, so a decoder leaves the pixels as stored', async () => {
    const jpeg = withExif(await makeJpeg({ width: 32, height: 24 }), { orientation: 6 });
    expect(exifOrientation(jpeg, { neutralize: true })).toBe(6);
    expect(exifOrientation(jpeg)).toBe(1);
    // Only those two bytes changed: the rest of the EXIF (the camera make) is still there for the decoder to skip.
    expect(jpeg.includes(Buffer.from('Whorlbook Test Camera'))).toBe(true);
  });

  it('says 1 for damaged or missing EXIF rather than guessing', async () => {
    const jpeg = withExif(await makeJpeg({ width: 32, height: 24 }), { orientation: 6 });
    const tiff = jpeg.indexOf(Buffer.from('Exif\0\0', 'binary')) + 6;
    const badOffset = Buffer.from(jpeg);
    badOffset.writeUInt32BE(0xfffffff0, tiff + 4); // IFD0 far past the end of the segment
    expect(exifOrientation(badOffset)).toBe(1);
    const badValue = Buffer.from(littleEndianTiff(9));
    expect(
      exifOrientation(
        await makeWebpWithExif('Exif\0\0' + badValue.toString('binary'), { width: 32, height: 24 }),
      ),
    ).toBe(1);
    expect(exifOrientation(Buffer.from('not a picture at all'))).toBe(1);
    expect(exifOrientation(jpeg.subarray(0, tiff + 4))).toBe(1);
  });
});

let t: TestContext;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let entryId: number;

beforeAll(async () => {
  t = await createTestContext();
  owner = await signedInAgent(t.app, t.db);
  const project = await createProject(t.db, owner.user.id, { title: 'Turnip the bunny', pieces: ['Head'] });
  const res = await owner.agent
    .post(`/api/projects/${project.id}/entries`)
    .send({ body: 'Ears on.', entryDate: '2026-11-30' });
  expect(res.status).toBe(201);
  entryId = res.body.entry.id;
});
afterAll(async () => {
  await closeImagePool();
  await t.close();
});

async function uploadAndLook(data: Buffer, name: string, type: string) {
  const res = await owner.agent
    .post(`/api/entries/${entryId}/photos`)
    .attach('photos', data, { filename: name, contentType: type });
  expect(res.status).toBe(201);
  const got = await owner.agent.get(res.body.photos[0].url).buffer(true).parse(binary);
  expect(got.status).toBe(200);
  const img = await Jimp.read(got.body);
  return { photo: res.body.photos[0] as { width: number; height: number }, img, body: got.body as Buffer };
}

function redCorner(img: Awaited<ReturnType<typeof Jimp.read>>) {
  const { width: w, height: h } = img.bitmap;
  const corners = {
    'top-left': [5, 5],
    'top-right': [w - 6, 5],
    'bottom-left': [5, h - 6],
    'bottom-right': [w - 6, h - 6],
  } as const;
  const red = Object.entries(corners).filter(([, [x, y]]) => {
    const c = intToRGBA(img.getPixelColor(x, y));
    return c.r > 200 && c.b < 60;
  });
  // Exactly one corner is red and the others are blue, or the picture is not what the test thinks it is.
  expect(red).toHaveLength(1);
  return red[0][0];
}

describe('photos come out upright', () => {
  it.each(Object.entries(expected))('a JPEG with orientation %s', async (o, want) => {
    const { photo, img } = await uploadAndLook(
      withExif(await makeJpeg({ width: 300, height: 200 }), { orientation: Number(o) }),
      `o${o}.jpg`,
      'image/jpeg',
    );
    expect([photo.width, photo.height]).toEqual(want.swapped ? [200, 300] : [300, 200]);
    expect([img.bitmap.width, img.bitmap.height]).toEqual([photo.width, photo.height]);
    expect(redCorner(img)).toBe(want.corner);
  });

  it.each([3, 6, 8])('a WebP with orientation %s (its EXIF chunk is read too)', async (o) => {
    const { photo, img } = await uploadAndLook(
      await makeWebpWithExif(exifWith(o)),
      `o${o}.webp`,
      'image/webp',
    );
    expect([photo.width, photo.height]).toEqual(expected[o].swapped ? [200, 300] : [300, 200]);
    expect(redCorner(img)).toBe(expected[o].corner);
  });

  it('keeps none of a WebP’s EXIF (a GPS position included) in what it serves', async () => {
    const data = await makeWebpWithExif(exifWith(6, true));
    // The test file really carries the position, or this would prove nothing.
    expect(data.includes(Buffer.from('Whorlbook Test Camera'))).toBe(true);
    const { body } = await uploadAndLook(data, 'park.webp', 'image/webp');
    expect(body.includes(Buffer.from('Exif\0\0', 'binary'))).toBe(false);
    expect(body.includes(Buffer.from('Whorlbook Test Camera'))).toBe(false);
  });
});
