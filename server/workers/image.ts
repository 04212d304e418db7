import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { createJimp } from '@jimp/core';
import decodeWebp, { init as initWebpDecoder } from '@jsquash/webp/decode.js';
import { defaultFormats, defaultPlugins } from 'jimp';
import { exifOrientation, type Orientation } from './orientation.js';

// Runs inside a piscina worker thread (see image-pool.ts): Jimp is pure JavaScript and holds a core for
// seconds on a phone photo, which must never happen on the thread that answers requests.

// WebP: libwebp's decoder compiled to wasm (@jsquash/webp, the decoder @jimp/wasm-webp wraps). The format
// is our own rather than @jimp/wasm-webp's, for two reasons found here (Node 20, tsx 4.23, piscina 5):
// that plugin calls @jsquash's init() with no arguments on every picture, and this Emscripten glue is the
// browser build, which loads its .wasm with fetch() on a file: URL — Node's fetch refuses ("not implemented");
// and a static import of '@jimp/wasm-webp' in this worker makes tsx's loader give up on the worker file
// itself (ERR_UNKNOWN_FILE_EXTENSION). So the decoder gets the module compiled from the .wasm on disk, as
// @jsquash's README ("Manual WASM initialisation") describes. Whorlbook only reads WebP; it writes JPEG.
const require = createRequire(import.meta.url);
let webpWasm: Promise<WebAssembly.Module> | undefined;
// The package's .d.ts lists only the options form; its code also takes a compiled WebAssembly.Module.
const initWithModule = initWebpDecoder as unknown as (module: WebAssembly.Module) => Promise<void>;

async function decodeWebpBitmap(data: Buffer) {
  webpWasm ??= WebAssembly.compile(readFileSync(require.resolve('@jsquash/webp/codec/dec/webp_dec.wasm')));
  // A fresh instance per picture (instantiating a compiled module takes about a millisecond): wasm memory
  // only grows, so one instance kept for the worker's life would hold the largest photo's pixels ever decoded.
  await initWithModule(await webpWasm);
  const image = await decodeWebp(
    data.buffer.slice(data.byteOffset, data.byteOffset + data.byteLength) as ArrayBuffer,
  );
  // The decoder hands back a copy outside wasm memory, so the instance can go once this returns.
  return {
    data: Buffer.from(image.data.buffer, image.data.byteOffset, image.data.byteLength),
    width: image.width,
    height: image.height,
  };
}

function webpFormat() {
  return {
    mime: 'image/webp' as const,
    hasAlpha: true,
    decode: decodeWebpBitmap,
    encode: (): Buffer => {
      throw new Error('Whorlbook writes JPEG only');
    },
  };
}

const Jimp = createJimp({ formats: [...defaultFormats, webpFormat], plugins: defaultPlugins });

export type ImageFormat = 'jpg' | 'png' | 'webp';

export interface ImageJob {
  bytes: Uint8Array;
  /** From sniffing the bytes: JPEG cannot carry transparency, so only PNG and WebP are checked for it. */
  format?: ImageFormat;
  displayLongSide: number;
  thumbSide: number;
}

export interface ImageResult {
  display: Uint8Array;
  thumb: Uint8Array;
  width: number;
  height: number;
  /** Wall time this job took inside the worker, for Server-Timing and the benchmark. */
  ms: number;
}

// Quality 82/78: visually clean for crochet texture at phone sizes, roughly a third of q95's bytes (common practice).
const DISPLAY_QUALITY = 82;
const THUMB_QUALITY = 78;
// Transparent PNG and WebP areas become oat (our page background) rather than JPEG's black.
const OAT = 0xf7f1e6ff;

export default async function processImage(job: ImageJob): Promise<ImageResult> {
  const started = performance.now();
  const source = Buffer.from(job.bytes.buffer, job.bytes.byteOffset, job.bytes.byteLength);
  // The EXIF orientation (JPEG and WebP) is read here and applied after the resize, on 2 MP instead of 12: Jimp
  // would turn the full-size bitmap (~0.5 s of a core for a portrait phone photo), and it reads no WebP EXIF at
  // all. The tag in this thread's own copy of the bytes (moved or cloned into it) is set to 1, so Jimp leaves the
  // pixels as stored.
  const orientation = exifOrientation(source, { neutralize: true });
  let image = await Jimp.read(source);
  const { width, height } = image.bitmap;
  if (!width || !height) throw new Error('the picture has no pixels');

  if (job.format !== 'jpg' && image.hasAlpha()) {
    const flat = new Jimp({ width, height, color: OAT });
    flat.composite(image, 0, 0);
    image = flat as unknown as typeof image;
  }

  const scale = Math.min(1, job.displayLongSide / Math.max(width, height));
  const target = { w: Math.max(1, Math.round(width * scale)), h: Math.max(1, Math.round(height * scale)) };
  // Halving by 2×2 averages first is an exact area filter and far cheaper than Jimp's general resampler
  // on 12 MP; Jimp then does the last, small step.
  while (image.bitmap.width >= target.w * 2 && image.bitmap.height >= target.h * 2) halve(image.bitmap);
  if (image.bitmap.width !== target.w || image.bitmap.height !== target.h) image.resize(target);
  upright(image, orientation);
  // Re-encoding writes a bare JFIF file: no EXIF, GPS or XMP survives.
  const display = await image.getBuffer('image/jpeg', { quality: DISPLAY_QUALITY });
  const out = { width: image.bitmap.width, height: image.bitmap.height };

  // The thumbnail comes from the display copy, not the original: same look, a fraction of the work.
  image.cover({ w: job.thumbSide, h: job.thumbSide });
  const thumb = await image.getBuffer('image/jpeg', { quality: THUMB_QUALITY });

  return {
    display: new Uint8Array(display),
    thumb: new Uint8Array(thumb),
    ...out,
    ms: performance.now() - started,
  };
}

/**
 * Turns the picture the way its EXIF orientation says it should be viewed (EXIF 2.32, tag 0x0112; the same
 * mapping Jimp applies to a JPEG). Jimp's rotate() turns counter-clockwise, so -90 is a quarter turn clockwise.
 */
function upright(
  image: { rotate(deg: number): unknown; flip(o: { horizontal?: boolean; vertical?: boolean }): unknown },
  o: Orientation,
) {
  if (o === 2) image.flip({ horizontal: true });
  else if (o === 3) image.rotate(180);
  else if (o === 4) image.flip({ vertical: true });
  else if (o === 5) {
    image.rotate(-90);
    image.flip({ horizontal: true });
  } else if (o === 6) image.rotate(-90);
  else if (o === 7) {
    image.rotate(-90);
    image.flip({ vertical: true });
  } else if (o === 8) image.rotate(90);
}

/** Halves a bitmap in place (RGBA), each output pixel the rounded mean of a 2×2 block. */
function halve(bitmap: { data: Buffer; width: number; height: number }) {
  const { data, width } = bitmap;
  const w = Math.floor(bitmap.width / 2);
  const h = Math.floor(bitmap.height / 2);
  const out = Buffer.allocUnsafe(w * h * 4);
  const row = width * 4;
  for (let y = 0; y < h; y++) {
    let src = y * 2 * row;
    let dst = y * w * 4;
    for (let x = 0; x < w; x++, src += 8, dst += 4) {
      const below = src + row;
      out[dst] = (data[src] + data[src + 4] + data[below] + data[below + 4] + 2) >> 2;
      out[dst + 1] = (data[src + 1] + data[src + 5] + data[below + 1] + data[below + 5] + 2) >> 2;
      out[dst + 2] = (data[src + 2] + data[src + 6] + data[below + 2] + data[below + 6] + 2) >> 2;
      out[dst + 3] = (data[src + 3] + data[src + 7] + data[below + 3] + data[below + 7] + 2) >> 2;
    }
  }
  bitmap.data = out;
  bitmap.width = w;
  bitmap.height = h;
}
