import { useCallback, useEffect, useReducer, useRef } from 'react';
import { ApiError } from '@/lib/api-client';
import type { PhotoOut } from '@/types/api';
import { UploadBusyError, uploadPhoto } from '../api/upload-photo';
import { refuseLocally, shrinkPhoto, tooBigToSend } from '../lib/shrink-photo';

// Each photo goes in its own request, so each has its own progress bar, its own cancel and its own answer.
// Two at a time: the server prepares one photo after another anyway, and a phone's upload link is narrow.
const CONCURRENT = 2;
const MAX_BUSY_RETRIES = 3;
const AUTO_CLEAR_MS = 5000;

export type UploadStatus = 'queued' | 'shrinking' | 'sending' | 'preparing' | 'waiting' | 'done' | 'refused' | 'cancelled';

export interface UploadItem {
  id: string;
  entryId: number;
  file: File;
  name: string;
  preview: string | null;
  status: UploadStatus;
  /** 0..1 of the current stage (shrinking or sending). */
  progress: number;
  message?: string;
  tries: number;
}

type Action =
  | { type: 'add'; items: UploadItem[] }
  | { type: 'update'; id: string; patch: Partial<UploadItem> }
  | { type: 'remove'; ids: string[] };

function reducer(state: UploadItem[], action: Action): UploadItem[] {
  switch (action.type) {
    case 'add':
      return [...state, ...action.items];
    case 'update':
      return state.map((i) => (i.id === action.id ? { ...i, ...action.patch } : i));
    case 'remove':
      return state.filter((i) => !action.ids.includes(i.id));
  }
}

export const isFinished = (s: UploadStatus) => s === 'done' || s === 'refused' || s === 'cancelled';
const isRunning = (s: UploadStatus) => s === 'shrinking' || s === 'sending' || s === 'preparing';

let seq = 0;
const preview = (file: File) => {
  try {
    return URL.createObjectURL(file);
  } catch {
    return null;
  }
};
const revoke = (url: string | null) => {
  if (url) {
    try {
      URL.revokeObjectURL(url);
    } catch {
      /* nothing to free */
    }
  }
};

export function usePhotoUploads({ onUploaded }: { onUploaded?: (entryId: number, photos: PhotoOut[]) => void } = {}) {
  const [items, dispatch] = useReducer(reducer, []);
  const controllers = useRef(new Map<string, AbortController>());
  const timers = useRef(new Map<string, ReturnType<typeof setTimeout>>());
  const onUploadedRef = useRef(onUploaded);
  useEffect(() => {
    onUploadedRef.current = onUploaded;
  }, [onUploaded]);

  const update = useCallback((id: string, patch: Partial<UploadItem>) => dispatch({ type: 'update', id, patch }), []);

  const run = useCallback(
    async (item: UploadItem) => {
      const controller = new AbortController();
      controllers.current.set(item.id, controller);
      const { signal } = controller;
      try {
        update(item.id, { status: 'shrinking', progress: 0, message: undefined });
        const shrunk = await shrinkPhoto(item.file, { signal, onProgress: (p) => update(item.id, { progress: p }) });
        const tooBig = tooBigToSend(shrunk.file, item.name);
        if (tooBig) {
          update(item.id, { status: 'refused', message: tooBig });
          return;
        }
        update(item.id, { status: 'sending', progress: 0 });
        const photos = await uploadPhoto(item.entryId, shrunk.file, shrunk.name, {
          signal,
          onProgress: (p) => update(item.id, p >= 1 ? { status: 'preparing', progress: 1 } : { progress: p }),
        });
        update(item.id, { status: 'done', progress: 1 });
        onUploadedRef.current?.(item.entryId, photos);
      } catch (err) {
        if (signal.aborted || (err instanceof DOMException && err.name === 'AbortError')) {
          update(item.id, { status: 'cancelled', message: undefined });
        } else if (err instanceof UploadBusyError && item.tries < MAX_BUSY_RETRIES) {
          const seconds = Math.min(60, err.retryAfterSeconds);
          update(item.id, { status: 'waiting', tries: item.tries + 1, message: `Whorlbook is busy with other photos; trying again in ${seconds} s.` });
          timers.current.set(
            item.id,
            setTimeout(() => {
              timers.current.delete(item.id);
              update(item.id, { status: 'queued' });
            }, seconds * 1000),
          );
        } else {
          update(item.id, { status: 'refused', message: err instanceof ApiError ? err.message : `“${item.name}” could not be sent. Try again.` });
        }
      } finally {
        controllers.current.delete(item.id);
      }
    },
    [update],
  );

  // Start queued photos while fewer than CONCURRENT are on their way.
  const started = useRef(new Set<string>());
  useEffect(() => {
    let running = items.filter((i) => isRunning(i.status)).length;
    for (const item of items) {
      if (running >= CONCURRENT) break;
      if (item.status !== 'queued') continue;
      // One start per try, even if React runs this effect twice before the first start's state lands.
      const token = `${item.id}:${item.tries}`;
      if (started.current.has(token)) continue;
      started.current.add(token);
      running += 1;
      void run(item);
    }
  }, [items, run]);

  const enqueue = useCallback((entryId: number, files: File[]) => {
    const added = files.map((file): UploadItem => {
      const refusal = refuseLocally(file);
      seq += 1;
      return {
        id: `u${seq}`,
        entryId,
        file,
        name: file.name || 'photo',
        preview: refusal ? null : preview(file),
        status: refusal ? 'refused' : 'queued',
        progress: 0,
        message: refusal ?? undefined,
        tries: 0,
      };
    });
    dispatch({ type: 'add', items: added });
  }, []);

  const cancel = useCallback(
    (id: string) => {
      const timer = timers.current.get(id);
      if (timer) {
        clearTimeout(timer);
        timers.current.delete(id);
      }
      const c = controllers.current.get(id);
      if (c) c.abort();
      else update(id, { status: 'cancelled', message: undefined });
    },
    [update],
  );

  const itemsRef = useRef(items);
  useEffect(() => {
    itemsRef.current = items;
  }, [items]);

  const clearFinished = useCallback(() => {
    const done = itemsRef.current.filter((i) => isFinished(i.status));
    done.forEach((i) => revoke(i.preview));
    dispatch({ type: 'remove', ids: done.map((i) => i.id) });
  }, []);

  // When every photo went in, the list has said so; it tidies itself away. Refusals stay until cleared.
  const allAdded = items.length > 0 && items.every((i) => i.status === 'done');
  useEffect(() => {
    if (!allAdded) return;
    const t = setTimeout(clearFinished, AUTO_CLEAR_MS);
    return () => clearTimeout(t);
  }, [allAdded, clearFinished]);

  useEffect(() => {
    const ctl = controllers.current;
    const tms = timers.current;
    return () => {
      ctl.forEach((c) => c.abort());
      tms.forEach((t) => clearTimeout(t));
      itemsRef.current.forEach((i) => revoke(i.preview));
    };
  }, []);

  return { items, enqueue, cancel, clearFinished, busy: items.some((i) => !isFinished(i.status)) };
}
