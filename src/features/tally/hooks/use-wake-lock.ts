import { useEffect, useState } from 'react';

export type WakeLockState = 'off' | 'on' | 'unsupported' | 'refused';

/** Keeps the screen awake while counting (Screen Wake Lock API); says so when the browser will not. */
export function useWakeLock(enabled: boolean): WakeLockState {
  const [state, setState] = useState<WakeLockState>('off');
  useEffect(() => {
    if (!enabled) {
      setState('off');
      return;
    }
    const wl = (
      navigator as Navigator & { wakeLock?: { request: (type: 'screen') => Promise<WakeLockSentinel> } }
    ).wakeLock;
    if (!wl) {
      setState('unsupported');
      return;
    }
    let sentinel: WakeLockSentinel | null = null;
    let stopped = false;
    const acquire = async () => {
      if (document.visibilityState !== 'visible' || stopped) return;
      try {
        sentinel = await wl.request('screen');
        if (stopped) {
          void sentinel.release();
          return;
        }
        setState('on');
        sentinel.addEventListener('release', () => {
          if (!stopped && document.visibilityState === 'visible') setState('refused');
        });
      } catch {
        setState('refused');
      }
    };
    // The lock is dropped whenever the page is hidden; take it again on return.
    const onVisible = () => {
      if (document.visibilityState === 'visible') void acquire();
    };
    void acquire();
    document.addEventListener('visibilitychange', onVisible);
    return () => {
      stopped = true;
      document.removeEventListener('visibilitychange', onVisible);
      if (sentinel && !sentinel.released) void sentinel.release();
    };
  }, [enabled]);
  return state;
}
