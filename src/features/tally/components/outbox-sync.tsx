import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { Placement } from '@/types/api';
import { acceptProgress } from '../api/get-progress';
import { tallyKeys } from '../api/keys';
import { outbox } from '../lib/outbox';

/**
 * Mounted once for the whole app (src/app/provider.tsx): sends the Tally's queued taps whatever screen is open,
 * and feeds the server's answers into the query cache.
 */
export function TallyOutboxSync({ memberId }: { memberId: string | null }) {
  const qc = useQueryClient();
  useEffect(() => {
    let historyTimer: ReturnType<typeof setTimeout> | null = null;
    let waitingHistory: number[] = [];
    outbox.setHandlers({
      progress: (item, progress) => acceptProgress(qc, item.pieceId, progress),
      placement: (item, placement) => {
        qc.setQueryData<Placement[]>(tallyKeys.placements(item.pieceId), (old) => [
          ...(old ?? []).filter((p) => p.id !== placement.id),
          placement,
        ]);
      },
      rejected: (item) => {
        void qc.invalidateQueries({ queryKey: tallyKeys.piece(item.pieceId) });
      },
      drained: (pieceIds) => {
        // The undo stack only matters for undoing offline; ask for it once the taps have paused a moment.
        if (historyTimer) clearTimeout(historyTimer);
        const ids = [...new Set([...waitingHistory, ...pieceIds])];
        waitingHistory = ids;
        historyTimer = setTimeout(() => {
          waitingHistory = [];
          for (const id of ids) void qc.invalidateQueries({ queryKey: tallyKeys.history(id) });
        }, 1_500);
      },
    });
    void outbox.load();
    const wake = () => outbox.wake();
    const onVisible = () => document.visibilityState === 'visible' && outbox.wake();
    window.addEventListener('online', wake);
    document.addEventListener('visibilitychange', onVisible);
    return () => {
      if (historyTimer) clearTimeout(historyTimer);
      window.removeEventListener('online', wake);
      document.removeEventListener('visibilitychange', onVisible);
    };
  }, [qc]);
  useEffect(() => {
    outbox.setMember(memberId);
  }, [memberId]);
  return null;
}
