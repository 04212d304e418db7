import { useEffect, useState } from 'react';
import { CloudOff, RefreshCw, X } from 'lucide-react';
import { outbox, type OutboxState } from '../lib/outbox';

// A tap usually reaches the server within a few milliseconds; only say "waiting" once it has waited a while,
// so the banner does not flicker with every tap on a good connection.
const QUIET_MS = 1_500;

const taps = (n: number) => `${n} ${n === 1 ? 'tap' : 'taps'}`;

/**
 * How many of the member's taps wait, and whether that is worth saying: only once they have waited a while or
 * a send has failed, so nothing on screen blinks with every tap on a good connection.
 */
export function useWaiting(state: OutboxState, memberId: string | null) {
  const mine = state.items.filter((i) => i.memberId === memberId);
  const oldest = mine[0]?.queuedAt ?? null;
  const [, setTick] = useState(0);
  useEffect(() => {
    if (oldest === null) return;
    const t = setInterval(() => setTick((n) => n + 1), 500);
    return () => clearInterval(t);
  }, [oldest]);
  const stuck = state.status === 'offline' || state.status === 'retrying' || state.status === 'signed-out';
  const show =
    mine.length > 0 && (stuck || state.failing || (oldest !== null && Date.now() - oldest > QUIET_MS));
  return { count: mine.length, show };
}

/** "3 taps waiting to sync", from the outbox kept on this device, so it is there again after a reload. */
export function SyncBanner({
  state,
  memberId,
  pieceId,
}: {
  state: OutboxState;
  memberId: string | null;
  pieceId: number;
}) {
  const { count, show } = useWaiting(state, memberId);
  const rejected = state.rejected.filter((r) => r.pieceId === pieceId);

  return (
    <>
      {show ? (
        <div role="status" className="flex items-center gap-3 rounded-soft bg-wool px-4 py-2 text-ink">
          {state.status === 'offline' ? (
            <CloudOff aria-hidden className="h-6 w-6 shrink-0" />
          ) : (
            <RefreshCw aria-hidden className="h-6 w-6 shrink-0" />
          )}
          <p className="flex-1 text-base leading-snug">
            <span className="font-bold">{taps(count)} waiting to sync.</span>{' '}
            {state.status === 'signed-out'
              ? 'Sign in again to send them; they are kept on this device.'
              : state.status === 'offline'
                ? 'They are kept on this device and sent when you are back online.'
                : 'Sending…'}
            {!state.durable
              ? ' This browser cannot keep them through a reload: stay on this page until they are sent.'
              : ''}
          </p>
          {state.status !== 'idle' ? (
            <button
              type="button"
              onClick={() => outbox.wake()}
              className="min-h-tap rounded-soft px-3 font-bold underline"
            >
              Try now
            </button>
          ) : null}
        </div>
      ) : null}
      {rejected.length ? (
        <div
          role="alert"
          className="flex items-start gap-3 rounded-soft bg-[#f3dccf] px-4 py-2 text-ink ring-2 ring-clay"
        >
          <p className="flex-1 text-base leading-snug">
            <span className="font-bold">
              {rejected.length === 1 ? 'One' : rejected.length}{' '}
              {rejected[0].kind === 'placement' ? 'mark' : 'tap'}
              {rejected.length === 1 ? ' was' : 's were'} not kept:
            </span>{' '}
            {rejected[rejected.length - 1].message} The count shows what the server has.
          </p>
          <button
            type="button"
            onClick={() => rejected.forEach((r) => outbox.dismissRejected(r.opId))}
            className="flex min-h-tap min-w-tap items-center justify-center rounded-soft"
            aria-label="Dismiss"
          >
            <X aria-hidden className="h-6 w-6" />
          </button>
        </div>
      ) : null}
    </>
  );
}
