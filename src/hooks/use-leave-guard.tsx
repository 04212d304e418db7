import { useEffect, useRef, type ReactNode } from 'react';
import { useBlocker } from 'react-router-dom';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';

/**
 * Asks before leaving a form with unsaved changes: in-app navigation through the router, closing or reloading
 * the tab through the browser. Set `leaving.current` while a save is on its way, so a navigation the save itself
 * makes is not asked about. Render `dialog` once. The router allows one blocker at a time: one guarded form
 * per screen.
 */
export function useLeaveGuard(dirty: boolean, message: ReactNode) {
  const leaving = useRef(false);
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) => dirty && !leaving.current && currentLocation.pathname !== nextLocation.pathname,
  );
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);
  const dialog = (
    <ConfirmDialog
      open={blocker.state === 'blocked'}
      title="Leave without saving?"
      confirmLabel="Leave and lose changes"
      onConfirm={() => blocker.proceed?.()}
      onCancel={() => blocker.reset?.()}
    >
      <p>{message}</p>
    </ConfirmDialog>
  );
  return { leaving, dialog };
}
