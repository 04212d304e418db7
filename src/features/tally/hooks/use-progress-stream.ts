import { useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { PieceProgress } from '@/types/api';
import { acceptProgress } from '../api/get-progress';
import { tallyKeys } from '../api/keys';
import { outbox } from '../lib/outbox';

export type StreamState = 'connecting' | 'live' | 'polling';

// How often to ask for the position while the stream is down (a proxy that buffers, a flaky connection).
const POLL_MS = 4_000;

/**
 * Hears taps from the maker's other devices as the server commits them (server-sent events), and falls back to
 * asking every few seconds while the stream is down.
 */
export function useProgressStream(pieceId: number, onPieceChanged?: () => void): StreamState {
  const qc = useQueryClient();
  const [state, setState] = useState<StreamState>('connecting');
  // Kept in a ref so a new callback each render does not reopen the stream.
  const changed = useRef(onPieceChanged);
  changed.current = onPieceChanged;
  useEffect(() => {
    let poll: ReturnType<typeof setInterval> | null = null;
    let refetchHistory: ReturnType<typeof setTimeout> | null = null;
    const startPolling = () => {
      setState('polling');
      poll ??= setInterval(() => {
        if (navigator.onLine !== false) void qc.invalidateQueries({ queryKey: tallyKeys.progress(pieceId) });
      }, POLL_MS);
    };
    const stopPolling = () => {
      if (poll) clearInterval(poll);
      poll = null;
    };
    if (typeof EventSource === 'undefined') {
      startPolling();
      return stopPolling;
    }
    const source = new EventSource(`/api/pieces/${pieceId}/stream`);
    source.addEventListener('open', () => {
      stopPolling();
      setState('live');
      // Taps another device made before this stream opened (or while it was down) were never sent to it.
      void qc.invalidateQueries({ queryKey: tallyKeys.progress(pieceId) });
      // Whatever queued up while the line was down can go now.
      outbox.wake();
    });
    source.addEventListener('error', () => {
      // EventSource retries by itself; meanwhile ask now and then.
      startPolling();
    });
    source.addEventListener('progress', (e) => {
      const msg = JSON.parse((e as MessageEvent<string>).data) as {
        progress: PieceProgress;
        opId: string | null;
      };
      const ours = msg.opId !== null && outbox.getSnapshot().items.some((i) => i.opId === msg.opId);
      if (msg.opId) outbox.acknowledge(msg.opId);
      acceptProgress(qc, pieceId, msg.progress);
      // No tap behind it: the server moved the count because the piece itself was edited (its rounds or copies),
      // so the instructions on this screen are out of date too.
      if (msg.opId === null) changed.current?.();
      if (!ours) {
        // Another device moved the count: its undo stack changed too.
        if (refetchHistory) clearTimeout(refetchHistory);
        refetchHistory = setTimeout(
          () => void qc.invalidateQueries({ queryKey: tallyKeys.history(pieceId) }),
          250,
        );
      }
    });
    source.addEventListener('placements', () => {
      void qc.invalidateQueries({ queryKey: tallyKeys.placements(pieceId) });
    });
    return () => {
      source.close();
      stopPolling();
      if (refetchHistory) clearTimeout(refetchHistory);
    };
  }, [pieceId, qc]);
  return state;
}
