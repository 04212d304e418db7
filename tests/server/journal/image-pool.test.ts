import { afterAll, describe, expect, it } from 'vitest';
import { HttpError } from '../../../server/lib/http-error.js';
import { ImagePool } from '../../../server/workers/image-pool.js';
import { makeJpeg } from '../../factories/images.js';

const pool = new ImagePool({ maxThreads: 1, maxPending: 2 });
afterAll(() => pool.close());

const job = async (width = 200, height = 150) => ({ bytes: new Uint8Array(await makeJpeg({ width, height })), displayLongSide: 1600, thumbSide: 400 });

describe('the photo worker pool', () => {
  it('resizes in a worker thread and returns both JPEGs', async () => {
    const [r] = await pool.runBatch([await job(2000, 1000)]);
    if (r instanceof Error) throw r;
    expect([r.width, r.height]).toEqual([1600, 800]);
    expect(r.display.subarray(0, 2)).toEqual(new Uint8Array([0xff, 0xd8]));
    expect(r.thumb.byteLength).toBeGreaterThan(100);
  });

  it('refuses a batch that would overfill the queue with 503 and Retry-After, and admits it again once drained', async () => {
    const running = pool.runBatch([await job(), await job()]);
    expect(pool.load).toBe(2);
    let refused: unknown;
    try {
      await pool.runBatch([await job()]);
    } catch (err) {
      refused = err;
    }
    expect(refused).toBeInstanceOf(HttpError);
    expect((refused as HttpError).status).toBe(503);
    expect(Number((refused as HttpError).headers?.['Retry-After'])).toBeGreaterThanOrEqual(5);
    expect((refused as HttpError).message).toMatch(/try again in about \d+ seconds/);
    expect(() => pool.assertAccepting()).toThrow(HttpError);
    const done = await running;
    expect(done.every((r) => !(r instanceof Error))).toBe(true);
    expect(pool.load).toBe(0);
    expect(() => pool.assertAccepting()).not.toThrow();
  });

  it('hands back a decoding failure as an Error for that file only, and keeps working', async () => {
    const broken = { bytes: new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 1, 2, 3, 4]), displayLongSide: 1600, thumbSide: 400 };
    const [bad, good] = await pool.runBatch([broken, await job()]);
    expect(bad).toBeInstanceOf(Error);
    expect(good).not.toBeInstanceOf(Error);
  });
});

describe('handing photos to the worker', () => {
  it('moves bytes that have their own buffer (no copy on the request thread) and copies a slice of a shared one', async () => {
    const own = await job(64, 48);
    const shared = Buffer.concat([Buffer.alloc(16), await makeJpeg({ width: 64, height: 48 })]);
    const slice = { ...(await job(64, 48)), bytes: new Uint8Array(shared.buffer, shared.byteOffset + 16, shared.byteLength - 16) };
    const sliceLength = slice.bytes.byteLength;
    const [a, b] = await pool.runBatch([own, slice]);
    expect(a).not.toBeInstanceOf(Error);
    expect(b).not.toBeInstanceOf(Error);
    // A moved buffer is left empty behind; the shared one is untouched, and so is whatever else lives in it.
    expect(own.bytes.byteLength).toBe(0);
    expect(slice.bytes.byteLength).toBe(sliceLength);
    expect(shared.byteLength).toBe(sliceLength + 16);
  });
});
