import { ApiError } from '@/lib/api-client';
import type { PlacementInput, ProgressOp } from '@/schemas/progress';
import type { PieceProgress, Placement } from '@/types/api';
import { postProgress } from '../api/post-progress';
import { createPlacement } from '../api/create-placement';
import { isDurable, keyedStore } from './storage';

// Every tap becomes an outbox item before anything else happens: kept in IndexedDB (one record per tap), sent
// one at a time in the order it was made, and removed only when the server has answered. The server applies
// each opId once, so resending after a lost answer, a reload or a crash never counts a tap twice.

export type OutboxItem =
  | {
      kind: 'progress';
      key: string;
      opId: string;
      pieceId: number;
      memberId: string;
      op: ProgressOp;
      queuedAt: number;
    }
  | {
      kind: 'placement';
      key: string;
      opId: string;
      pieceId: number;
      memberId: string;
      input: PlacementInput;
      queuedAt: number;
    };

// Changes only when something goes wrong or comes right again, not with every tap (each change redraws the Tally).
export type OutboxStatus = 'idle' | 'offline' | 'retrying' | 'signed-out';

export interface Rejected {
  opId: string;
  pieceId: number;
  kind: OutboxItem['kind'];
  message: string;
}

export interface OutboxState {
  loaded: boolean;
  items: OutboxItem[];
  status: OutboxStatus;
  rejected: Rejected[];
  durable: boolean;
  /** The last attempt failed for want of a connection or a server: true until a send succeeds again. */
  failing: boolean;
}

export interface OutboxHandlers {
  progress?: (item: Extract<OutboxItem, { kind: 'progress' }>, progress: PieceProgress) => void;
  placement?: (item: Extract<OutboxItem, { kind: 'placement' }>, placement: Placement) => void;
  rejected?: (item: OutboxItem, error: ApiError) => void;
  drained?: (pieceIds: number[]) => void;
}

type Sender = {
  progress: (pieceId: number, op: ProgressOp) => Promise<PieceProgress>;
  placement: (pieceId: number, input: PlacementInput) => Promise<Placement>;
};

type PostTask = (fn: () => void, options: { priority: 'background' | 'user-visible' }) => Promise<void>;

/**
 * Runs `fn` once the next frame is painted, behind whatever the browser still has to do for it, and in any case
 * within 100 ms (a hidden tab paints no frames).
 */
function afterPaint(fn: () => void) {
  let done = false;
  const run = () => {
    if (done) return;
    done = true;
    fn();
  };
  setTimeout(run, 100);
  if (typeof requestAnimationFrame !== 'function') return;
  requestAnimationFrame(() => {
    const scheduler = (globalThis as { scheduler?: { postTask?: PostTask } }).scheduler;
    if (typeof scheduler?.postTask === 'function') void scheduler.postTask(run, { priority: 'background' });
    else setTimeout(run, 0);
  });
}

const RETRY_MS = [1_000, 2_000, 5_000, 10_000, 30_000];
type NewItem =
  | { kind: 'progress'; pieceId: number; op: ProgressOp }
  | { kind: 'placement'; pieceId: number; input: PlacementInput & { opId: string } };

export class Outbox {
  private state: OutboxState = {
    loaded: false,
    items: [],
    status: 'idle',
    rejected: [],
    durable: isDurable(),
    failing: false,
  };
  private listeners = new Set<() => void>();
  private store: ReturnType<typeof keyedStore>;
  private loading: Promise<void> | null = null;
  private flushing = false;
  private again = false;
  private attempt = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private memberId: string | null = null;
  private handlers: OutboxHandlers = {};
  private seq = 0;
  private touched = new Set<number>();

  constructor(
    dbName = 'whorlbook-tally-outbox',
    private send: Sender = { progress: postProgress, placement: createPlacement },
  ) {
    this.store = keyedStore(dbName);
  }

  subscribe = (fn: () => void) => {
    this.listeners.add(fn);
    return () => this.listeners.delete(fn);
  };

  getSnapshot = () => this.state;

  private update(patch: Partial<OutboxState>) {
    this.state = { ...this.state, ...patch, durable: isDurable() };
    for (const fn of this.listeners) fn();
  }

  /** Reads what earlier visits (or other tabs) left in IndexedDB; safe to call often. */
  load(): Promise<void> {
    this.loading ??= this.store
      .all<OutboxItem>()
      .then((records) => {
        const known = new Set(this.state.items.map((i) => i.key));
        const merged = [
          ...this.state.items,
          ...records.map(([, v]) => v).filter((v) => !known.has(v.key)),
        ].sort((a, b) => (a.key < b.key ? -1 : 1));
        this.update({ loaded: true, items: merged });
      })
      .catch(() => this.update({ loaded: true }))
      .finally(() => {
        this.loading = null;
      });
    return this.loading;
  }

  setHandlers(handlers: OutboxHandlers) {
    this.handlers = handlers;
  }

  /** Only the signed-in member's taps are sent; another member's stay queued for when they sign in again. */
  setMember(memberId: string | null) {
    const changed = memberId !== this.memberId;
    this.memberId = memberId;
    if (changed && memberId) void this.flush(true);
  }

  get member() {
    return this.memberId;
  }

  /** Keeps a tap (or a mark) for `memberId` and starts sending. */
  enqueue(item: NewItem, memberId: string): OutboxItem {
    const queuedAt = Date.now();
    this.seq += 1;
    const opId = item.kind === 'progress' ? item.op.opId : item.input.opId;
    // Keys sort in the order taps were made, across reloads and tabs.
    const key = `${String(queuedAt).padStart(15, '0')}-${String(this.seq).padStart(6, '0')}-${opId}`;
    const full = { ...item, key, opId, memberId, queuedAt } as OutboxItem;
    this.update({ items: [...this.state.items, full] });
    // Kept on the device first (IndexedDB writes happen off the main thread); the request waits until the count
    // on screen is painted, a frame at most, so the tap shows at once.
    void this.store.put(key, full);
    afterPaint(() => void this.flush());
    return full;
  }

  /** Back to an empty outbox (tests start from one). */
  async reset() {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    for (const i of this.state.items) await this.store.remove(i.key);
    this.attempt = 0;
    this.touched.clear();
    this.update({ items: [], rejected: [], status: 'idle', failing: false });
  }

  /** The stream reported this tap as applied before its own answer came back. */
  acknowledge(opId: string) {
    const item = this.state.items.find((i) => i.opId === opId);
    if (item) this.remove(item);
  }

  dismissRejected(opId?: string) {
    this.update({ rejected: opId ? this.state.rejected.filter((r) => r.opId !== opId) : [] });
  }

  private remove(item: OutboxItem) {
    if (!this.state.items.includes(item)) return;
    this.update({ items: this.state.items.filter((i) => i !== item) });
    void this.store.remove(item.key);
  }

  private schedule() {
    if (this.timer) return;
    const wait = RETRY_MS[Math.min(this.attempt, RETRY_MS.length - 1)];
    this.attempt += 1;
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.flush();
    }, wait);
  }

  /** Retry now (back online, the stream reconnected, the screen came back into view). */
  wake() {
    if (this.timer) {
      clearTimeout(this.timer);
      this.timer = null;
    }
    this.attempt = 0;
    void this.load().then(() => this.flush(true));
  }

  /** Sends what is queued; after a 401 it waits for a sign-in (setMember) or an explicit wake. */
  async flush(force = false): Promise<void> {
    if (this.state.status === 'signed-out' && !force) return;
    if (this.flushing) {
      this.again = true;
      return;
    }
    this.flushing = true;
    try {
      do {
        this.again = false;
        await this.drain();
      } while (this.again);
    } finally {
      this.flushing = false;
    }
  }

  private async drain() {
    for (;;) {
      const next = this.state.items.find((i) => i.memberId === this.memberId);
      if (!next || !this.memberId) {
        if (this.touched.size) {
          const pieces = [...this.touched];
          this.touched.clear();
          this.handlers.drained?.(pieces);
        }
        return;
      }
      try {
        if (next.kind === 'progress') {
          const progress = await this.send.progress(next.pieceId, next.op);
          this.remove(next);
          this.handlers.progress?.(next, progress);
        } else {
          const placement = await this.send.placement(next.pieceId, next.input);
          this.remove(next);
          this.handlers.placement?.(next, placement);
        }
        this.touched.add(next.pieceId);
        this.attempt = 0;
        if (this.state.failing || this.state.status !== 'idle')
          this.update({ status: 'idle', failing: false });
      } catch (e) {
        const error = e instanceof ApiError ? e : new ApiError(0, 'Whorlbook cannot reach the server.');
        if (error.status === 0) {
          this.update({ status: 'offline', failing: true });
          this.schedule();
          return;
        }
        if (error.status === 401) {
          // Kept for when the member signs in again on this device.
          this.update({ status: 'signed-out' });
          return;
        }
        if (error.status >= 500 || error.status === 408 || error.status === 429) {
          this.update({ status: 'retrying', failing: true });
          this.schedule();
          return;
        }
        // The server will never take this one (the piece is finished, it was deleted…): say so, go on.
        this.remove(next);
        this.touched.add(next.pieceId);
        this.update({
          rejected: [
            ...this.state.rejected,
            { opId: next.opId, pieceId: next.pieceId, kind: next.kind, message: error.message },
          ],
        });
        this.handlers.rejected?.(next, error);
      }
    }
  }
}

const markCache = new Map<number, { key: string; list: Array<Extract<OutboxItem, { kind: 'placement' }>> }>();
/**
 * The marks still queued for a piece, as the same array for as long as they stay the same, so a screen can
 * leave its silhouette alone while ordinary taps come and go.
 */
export function queuedMarks(items: OutboxItem[], pieceId: number) {
  const list = items.filter(
    (i): i is Extract<OutboxItem, { kind: 'placement' }> => i.kind === 'placement' && i.pieceId === pieceId,
  );
  const key = list.map((i) => i.opId).join(',');
  const cached = markCache.get(pieceId);
  if (cached && cached.key === key) return cached.list;
  markCache.set(pieceId, { key, list });
  return list;
}

/** The app's one outbox. */
export const outbox = new Outbox();
