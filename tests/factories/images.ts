import zlib from 'node:zlib';
import { Jimp } from 'jimp';
import piexif from 'piexifjs';

// Test pictures made on the spot: no binary fixtures in the repository.

export const RED = 0xff0000ff;
export const BLUE = 0x0000ffff;

/**
 * A JPEG of `width` × `height`, blue, with a red block in its stored top-left corner so a test can tell
 * which way up it came out. `noise` adds grain so the file is photo-sized rather than tiny.
 */
export async function makeJpeg({ width = 300, height = 200, quality = 92, noise = 0 } = {}) {
  const img = new Jimp({ width, height, color: BLUE });
  img.scan(0, 0, Math.ceil(width / 4), Math.ceil(height / 4), (_x, _y, idx) => {
    img.bitmap.data[idx] = 255;
    img.bitmap.data[idx + 1] = 0;
    img.bitmap.data[idx + 2] = 0;
  });
  if (noise > 0) {
    const d = img.bitmap.data;
    let s = 1;
    for (let i = 0; i < d.length; i += 4) {
      s = (s * 1103515245 + 12345) & 0x7fffffff;
      const n = ((s >> 16) % (2 * noise)) - noise;
      d[i] = Math.max(0, Math.min(255, d[i] + n));
      d[i + 1] = Math.max(0, Math.min(255, d[i + 1] + n));
      d[i + 2] = Math.max(0, Math.min(255, d[i + 2] + n));
    }
  }
  return Buffer.from(await img.getBuffer('image/jpeg', { quality }));
}

export async function makePng({ width = 120, height = 80 } = {}) {
  const img = new Jimp({ width, height, color: BLUE });
  return Buffer.from(await img.getBuffer('image/png'));
}

/** Adds EXIF to a JPEG: an orientation tag and/or a GPS position (and a camera make, to see it is all gone). */
export function withExif(jpeg: Buffer, { orientation, gps }: { orientation?: number; gps?: { lat: number; lon: number } }) {
  const zeroth: Record<number, number | string> = { [piexif.ImageIFD.Make]: 'Whorlbook Test Camera' };
  if (orientation) zeroth[piexif.ImageIFD.Orientation] = orientation;
  const exif: Parameters<typeof piexif.dump>[0] = { '0th': zeroth, Exif: {}, GPS: {} };
  if (gps) {
    exif.GPS = {
      [piexif.GPSIFD.GPSLatitudeRef]: gps.lat >= 0 ? 'N' : 'S',
      [piexif.GPSIFD.GPSLatitude]: piexif.GPSHelper.degToDmsRational(Math.abs(gps.lat)),
      [piexif.GPSIFD.GPSLongitudeRef]: gps.lon >= 0 ? 'E' : 'W',
      [piexif.GPSIFD.GPSLongitude]: piexif.GPSHelper.degToDmsRational(Math.abs(gps.lon)),
    };
  }
  const out = piexif.insert(piexif.dump(exif), jpeg.toString('binary'));
  return Buffer.from(out, 'binary');
}

function chunk(type: string, data: Buffer) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(body));
  return Buffer.concat([len, body, crc]);
}

/**
 * A tiny, valid-looking PNG whose IHDR declares `width` × `height` (PNG spec 11.2.2: width, height,
 * bit depth, colour type, compression, filter, interlace), with one small IDAT and IEND. Decoding it
 * would need width × height × 4 bytes; only the header may be read.
 */
export function pngDeclaring(width: number, height: number) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 6; // RGBA
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', zlib.deflateSync(Buffer.alloc(64))), chunk('IEND', Buffer.alloc(0))]);
}
