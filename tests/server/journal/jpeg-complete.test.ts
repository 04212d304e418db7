import { describe, expect, it } from 'vitest';
import { jpegIsComplete } from '../../../server/services/photos.js';
import { makeJpeg, withExif } from '../../factories/images.js';

// ITU-T T.81 (JPEG), B.1.1: a file ends with the EOI marker FF D9; inside a scan FF is followed by 00 or RSTn.
describe('jpegIsComplete', () => {
  it('says yes for a whole JPEG, also with bytes after the end marker (phone trailers) and with EXIF', async () => {
    const jpeg = await makeJpeg({ width: 320, height: 240, noise: 40 });
    expect(jpegIsComplete(jpeg)).toBe(true);
    expect(jpegIsComplete(Buffer.concat([jpeg, Buffer.from('trailer of a motion photo')]))).toBe(true);
    expect(jpegIsComplete(withExif(jpeg, { orientation: 6 }))).toBe(true);
  });

  it('says no for a JPEG cut anywhere inside its scan or before it', async () => {
    const jpeg = await makeJpeg({ width: 320, height: 240, noise: 40 });
    for (const fraction of [0.05, 0.3, 0.6, 0.9, 0.999]) {
      expect(jpegIsComplete(jpeg.subarray(0, Math.floor(jpeg.length * fraction)))).toBe(false);
    }
    expect(jpegIsComplete(jpeg.subarray(0, jpeg.length - 2))).toBe(false);
  });
});
