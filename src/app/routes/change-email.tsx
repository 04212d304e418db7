import { useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/page';
import { useMe } from '@/features/auth/api/get-me';
import { useConfirmEmailChange } from '@/features/auth/api/change-email';
import { ConfirmEmailChangeSchema } from '@/schemas/auth';
import { paths } from '@/config/paths';

/** Opened from the link sent to a new address; opening it is the confirmation. */
export default function ChangeEmailRoute() {
  const [search] = useSearchParams();
  const parsed = ConfirmEmailChangeSchema.safeParse({ token: search.get('token') ?? '' });
  const token = parsed.success ? parsed.data.token : null;
  const confirm = useConfirmEmailChange();
  const me = useMe();
  const sent = useRef(false);

  // Sent once (the ref survives StrictMode's second effect run); a POST, so a mail scanner fetching the link does
  // not use it up.
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      confirm.mutate({ token });
    }
  }, [token, confirm]);

  const onward = me.data ? (
    <ButtonLink to={paths.account} size="lg">
      Go to Me
    </ButtonLink>
  ) : (
    <ButtonLink to={paths.signIn} size="lg">
      Sign in
    </ButtonLink>
  );

  return (
    <Card>
      <h1 className="mb-4 text-2xl font-bold">Your new e-mail</h1>
      <div className="flex flex-col gap-4">
        {!token ? (
          <Banner tone="warning" title="This link is not complete">
            {parsed.error?.issues[0]?.message ?? 'Open the whole link from the e-mail we sent.'}
          </Banner>
        ) : confirm.isSuccess ? (
          <Banner tone="success" title="E-mail changed">
            {confirm.data.message}
          </Banner>
        ) : confirm.isError ? (
          <Banner tone="warning" title="Not changed">
            {confirm.error.message}
          </Banner>
        ) : (
          <Loading label="Changing your e-mail…" />
        )}
        {token && confirm.isPending ? null : onward}
      </div>
    </Card>
  );
}
