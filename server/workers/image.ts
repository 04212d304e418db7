import { Jimp } from 'jimp';

// Runs inside a piscina worker thread (see image-pool.ts): Jimp is pure JavaScript and holds a core for
// seconds on a phone photo, which must never happen on the thread that answers requests.

export interface ImageJob {
  bytes: Uint8Array;
  displayLongSide: number;
  thumbSide: number;
}

export interface ImageResult {
  display: Uint8Array;
  thumb: Uint8Array;
  width: number;
  height: number;
}

// Quality 82/78: visually clean for crochet texture at phone sizes, roughly a third of q95's bytes (common practice).
const DISPLAY_QUALITY = 82;
const THUMB_QUALITY = 78;
// Transparent PNG areas become oat (our page background) rather than JPEG's black.
const OAT = 0xf7f1e6ff;

export default async function processImage(job: ImageJob): Promise<ImageResult> {
  // Jimp.read turns the picture upright from its EXIF orientation; the pixels are all we keep.
  let image = await Jimp.read(Buffer.from(job.bytes.buffer, job.bytes.byteOffset, job.bytes.byteLength));
  const { width, height } = image.bitmap;
  if (!width || !height) throw new Error('the picture has no pixels');

  if (image.hasAlpha()) {
    const flat = new Jimp({ width, height, color: OAT });
    flat.composite(image, 0, 0);
    image = flat as unknown as typeof image;
  }

  const scale = Math.min(1, job.displayLongSide / Math.max(width, height));
  if (scale < 1) image.resize({ w: Math.max(1, Math.round(width * scale)), h: Math.max(1, Math.round(height * scale)) });
  // Re-encoding writes a bare JFIF file: no EXIF, GPS or XMP survives.
  const display = await image.getBuffer('image/jpeg', { quality: DISPLAY_QUALITY });
  const out = { width: image.bitmap.width, height: image.bitmap.height };

  // The thumbnail comes from the display copy, not the original: same look, a fraction of the work.
  image.cover({ w: job.thumbSide, h: job.thumbSide });
  const thumb = await image.getBuffer('image/jpeg', { quality: THUMB_QUALITY });

  return { display: new Uint8Array(display), thumb: new Uint8Array(thumb), ...out };
}
