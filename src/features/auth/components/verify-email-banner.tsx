import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Banner } from '@/components/ui/banner';
import { useMe } from '../api/get-me';
import { useResendVerification } from '../api/resend-verification';

const dismissKey = (userId: string) => `whorlbook.verify-banner-dismissed.${userId}`;

function readDismissed(userId: string) {
  try {
    return sessionStorage.getItem(dismissKey(userId)) === '1';
  } catch {
    return false;
  }
}

/**
 * Asks an unconfirmed member to confirm their address. Unconfirmed members can use everything; "Not now" hides
 * the banner until this browser tab's session ends (sessionStorage), so it nudges without nagging.
 */
export function VerifyEmailBanner() {
  const me = useMe();
  const resend = useResendVerification();
  const user = me.data;
  const [dismissed, setDismissed] = useState<string | null>(null);
  if (!user || user.emailVerified || dismissed === user.id || readDismissed(user.id)) return null;

  const dismiss = () => {
    try {
      sessionStorage.setItem(dismissKey(user.id), '1');
    } catch {
      /* storage blocked: hiding it for this page view is still something */
    }
    setDismissed(user.id);
  };

  return (
    <Banner tone="info" title="Please confirm your e-mail" className="mb-5">
      <p>
        We sent a link to <span className="font-semibold">{user.email}</span>. Confirming it lets us help you back in if you forget your password.
      </p>
      {resend.isSuccess ? (
        <p role="status" className="mt-1 font-semibold">
          ✓ {resend.data.message}
        </p>
      ) : null}
      {resend.error ? (
        <p role="alert" className="mt-1 font-semibold text-clay-dark">
          <span aria-hidden>⚠ </span>
          {resend.error.message}
        </p>
      ) : null}
      <div className="mt-2 flex flex-wrap gap-2">
        <Button variant="primary" pending={resend.isPending} onClick={() => resend.mutate()}>
          Send the link again
        </Button>
        <Button variant="quiet" onClick={dismiss}>
          Not now
        </Button>
      </div>
    </Banner>
  );
}
