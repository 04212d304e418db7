import { Piscina } from 'piscina';
import { HttpError } from '../lib/http-error.js';
import type { ImageJob, ImageResult } from './image.js';

// The one pool of photo workers for the whole process.
//
// maxThreads 1 (the issue allows two): on this 2-core machine one Jimp job already costs ~3 s of a core and
// ~0.5 GB at its peak for a 12 MP photo; two at once would leave the request thread fighting for the
// second core and double the peak past our 1 GB budget. One thread keeps /api/health fast and memory
// bounded, and photos simply queue. niceIncrement lowers the worker's scheduling priority so the request
// thread always wins a core when it wakes up. Measured with tests/bench/photos.ts (three 12 MP photos at
// once, machine shared with other work): 1 thread peaked at 644–699 MB with /api/health p99 32–58 ms;
// 2 threads peaked at 1043 MB with p99 105–132 ms and finished no sooner.
// Tried again on a quiet machine (DEVELOPERS.md, "Speed"): two threads 4.3 / 5.1 / 7.3 s for the three photos
// and ~1050 MB; two threads taking turns at the decode (a shared lock) still ~1010 MB, because each thread's
// malloc arena keeps its own decode's high-water mark; two threads as a decode → encode line 3.7–4.2 / 5.9–6.5 /
// 7.5–8.2 s and ~800 MB, against one thread's 3.1–3.5 / 5.9–6.5 / 8.5–9.4 s and ~650 MB: too little for the
// memory. What sets the pace is Jimp's JPEG decoder (jpeg-js, ~1.5 s and ~0.4 GB for 12 MP).
export const IMAGE_THREADS = 1;
/** Jobs waiting or running before new uploads are refused with 503; at least one full batch of 8 fits. */
export const MAX_PENDING_JOBS = 16;
/** Rough seconds per job, for Retry-After. From tests/bench/photos.ts on a 12 MP photo: ~3 s. */
const SECONDS_PER_JOB = 3;
/** A job that runs this long is stuck, not slow. */
const JOB_TIMEOUT_MS = 60_000;

export interface ImagePoolOptions {
  maxThreads?: number;
  maxPending?: number;
}

export class ImagePool {
  private pool: Piscina<ImageJob, ImageResult>;
  private pending = 0;
  readonly maxPending: number;
  readonly threads: number;

  constructor({ maxThreads = IMAGE_THREADS, maxPending = MAX_PENDING_JOBS }: ImagePoolOptions = {}) {
    this.threads = maxThreads;
    this.maxPending = maxPending;
    this.pool = new Piscina<ImageJob, ImageResult>({
      filename: new URL('./image.ts', import.meta.url).href,
      // A .ts worker needs tsx's loader; the server runs under tsx, Vitest does not pass it on by itself.
      execArgv: ['--import', 'tsx'],
      minThreads: 1,
      maxThreads,
      idleTimeout: 60_000,
      niceIncrement: 10,
      // Bitmaps live in Buffers outside the V8 heap; this caps the JavaScript side so a runaway job
      // ends its own worker (piscina starts a fresh one) instead of the server.
      resourceLimits: { maxOldGenerationSizeMb: 256, maxYoungGenerationSizeMb: 48 },
    });
  }

  /** Jobs queued or running right now. */
  get load() {
    return this.pending;
  }

  private busy() {
    const seconds = Math.min(120, Math.max(5, Math.ceil((this.pending * SECONDS_PER_JOB) / this.threads)));
    return new HttpError(
      503,
      `Whorlbook is busy preparing other photos. Please try again in about ${seconds} seconds.`,
      undefined,
      { 'Retry-After': String(seconds) },
    );
  }

  /** Throws 503 before an upload is even read when the queue is already full. */
  assertAccepting() {
    if (this.pending >= this.maxPending) throw this.busy();
  }

  /**
   * Runs one job per input, all or none: the whole batch is admitted only if it fits in the queue,
   * so a request never ends up with half of its photos waiting. Results come back in input order;
   * each entry is the job's result or the Error it failed with. A job's bytes are handed over: the caller
   * must not read them afterwards.
   */
  async runBatch(jobs: ImageJob[]): Promise<Array<ImageResult | Error>> {
    if (this.pending + jobs.length > this.maxPending) throw this.busy();
    this.pending += jobs.length;
    return Promise.all(
      jobs.map(async (job) => {
        try {
          return await this.pool.run(job, {
            signal: AbortSignal.timeout(JOB_TIMEOUT_MS),
            ...(ownsItsBuffer(job.bytes) ? { transferList: [job.bytes.buffer as ArrayBuffer] } : {}),
          });
        } catch (err) {
          return err instanceof Error ? err : new Error(String(err));
        } finally {
          this.pending -= 1;
        }
      }),
    );
  }

  close() {
    return this.pool.close();
  }
}

/**
 * Whether a photo's bytes fill an ArrayBuffer of their own, so they can move to the worker rather than be copied
 * (copying a 4 MB photo holds the request thread ~10 ms). multer gives every upload such a buffer; small Buffers
 * are slices of Node's shared pool, which must never be moved, and are copied.
 */
function ownsItsBuffer(bytes: Uint8Array) {
  return (
    bytes.buffer instanceof ArrayBuffer &&
    bytes.byteOffset === 0 &&
    bytes.byteLength === bytes.buffer.byteLength
  );
}

let shared: ImagePool | null = null;

/** The process-wide pool, started on first use so CLIs and tests that upload nothing start no thread. */
export function imagePool() {
  shared ??= new ImagePool();
  return shared;
}

/** For tests and shutdown: stops the shared pool's threads (a later call to imagePool() starts a new one). */
export async function closeImagePool() {
  const p = shared;
  shared = null;
  await p?.close();
}
