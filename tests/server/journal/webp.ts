import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import createEncoder, { type EncodeOptions, type WebPModule } from '@jsquash/webp/codec/enc/webp_enc.js';
import { defaultOptions } from '@jsquash/webp/meta.js';

// WebP test pictures made on the spot with libwebp's own encoder (@jsquash/webp, installed with
// @jimp/wasm-webp). Its glue is the browser build, which fetches its .wasm and fails under Node, so the
// bytes are handed to it directly. The plain (non-SIMD) build runs everywhere.

const require = createRequire(import.meta.url);
let encoder: Promise<WebPModule> | undefined;

function webpEncoder(): Promise<WebPModule> {
  if (encoder) return encoder;
  const wasmBinary = readFileSync(require.resolve('@jsquash/webp/codec/enc/webp_enc.wasm'));
  // The package's option types are partial (and name a namespace it does not load), hence the casts.
  const made = (createEncoder as (opts: object) => Promise<WebPModule>)({ noInitialRun: true, wasmBinary });
  encoder = made;
  return made;
}

export const OAT_RGB = [0xf7, 0xf1, 0xe6] as const;
export const MOSS_RGB = [0x3f, 0x6b, 0x4e] as const;

/**
 * A WebP of `width` × `height`, blue with a red block in its top-left quarter (as makeJpeg), so a test can
 * tell it came out the right way up. With `transparentLeft`, the left half is fully transparent and the
 * right half moss, to see what the transparency turns into.
 */
export async function makeWebp({ width = 300, height = 200, transparentLeft = false, lossless = false } = {}) {
  const rgba = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 4;
      const px = transparentLeft
        ? x < width / 2 ? [0, 0, 0, 0] : [...MOSS_RGB, 255]
        : x < width / 4 && y < height / 4 ? [255, 0, 0, 255] : [0, 0, 255, 255];
      rgba.set(px, i);
    }
  }
  const options: EncodeOptions = { ...defaultOptions, quality: 90, lossless: lossless ? 1 : 0, exact: 1 };
  const out = (await webpEncoder()).encode(rgba, width, height, options);
  if (!out) throw new Error('the WebP encoder gave nothing back');
  return Buffer.from(out);
}

function riffChunk(fourcc: string, payload: Buffer) {
  const header = Buffer.alloc(8);
  header.write(fourcc, 0, 'ascii');
  header.writeUInt32LE(payload.length, 4);
  // RIFF chunks are padded to an even length.
  return Buffer.concat([header, payload, Buffer.alloc(payload.length % 2)]);
}

/**
 * A real small WebP re-wrapped as an extended file whose VP8X chunk declares a `width` × `height` canvas
 * (WebP container spec: flags byte, 3 reserved bytes, then canvas width − 1 and height − 1 as 24-bit
 * little-endian numbers). `flags` 0x02 marks it animated. Decoding it as declared would need
 * width × height × 4 bytes; only the header may be read.
 * Source: developers.google.com/speed/webp/docs/riff_container ("Extended File Format").
 */
export async function webpDeclaring(width: number, height: number, { flags = 0 } = {}) {
  const small = await makeWebp({ width: 16, height: 16 });
  const imageChunks = small.subarray(12); // everything after "RIFF", size, "WEBP": the VP8 chunk
  const vp8x = Buffer.alloc(10);
  vp8x[0] = flags;
  vp8x.writeUIntLE(width - 1, 4, 3);
  vp8x.writeUIntLE(height - 1, 7, 3);
  const body = Buffer.concat([Buffer.from('WEBP', 'ascii'), riffChunk('VP8X', vp8x), imageChunks]);
  const head = Buffer.alloc(8);
  head.write('RIFF', 0, 'ascii');
  head.writeUInt32LE(body.length, 4);
  return Buffer.concat([head, body]);
}

/**
 * A WebP carrying EXIF, as a phone or an editor writes it: the extended format, whose VP8X chunk sets the EXIF flag
 * (0x08) and states the canvas, then the image chunk, then an "EXIF" chunk holding the raw TIFF structure (WebP
 * container spec, "Extended File Format"; some writers add the JPEG-style "Exif\0\0" in front, `exifPrefix` does).
 * `exif` is piexifjs's dump (which starts with that prefix).
 */
export async function makeWebpWithExif(exif: string, { width = 300, height = 200, exifPrefix = false } = {}) {
  const simple = await makeWebp({ width, height });
  const imageChunks = simple.subarray(12);
  const vp8x = Buffer.alloc(10);
  vp8x[0] = 0x08;
  vp8x.writeUIntLE(width - 1, 4, 3);
  vp8x.writeUIntLE(height - 1, 7, 3);
  const dumped = Buffer.from(exif, 'binary');
  const payload = exifPrefix ? dumped : dumped.subarray(6);
  const body = Buffer.concat([Buffer.from('WEBP', 'ascii'), riffChunk('VP8X', vp8x), imageChunks, riffChunk('EXIF', payload)]);
  const head = Buffer.alloc(8);
  head.write('RIFF', 0, 'ascii');
  head.writeUInt32LE(body.length, 4);
  return Buffer.concat([head, body]);
}
