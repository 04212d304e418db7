import { useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/page';
import { useMe } from '@/features/auth/api/get-me';
import { useVerifyEmail } from '@/features/auth/api/verify-email';
import { VerifyEmailSchema } from '@/schemas/auth';
import { paths } from '@/config/paths';

export default function VerifyEmailRoute() {
  const [search] = useSearchParams();
  const parsed = VerifyEmailSchema.safeParse({ token: search.get('token') ?? '' });
  const token = parsed.success ? parsed.data.token : null;
  const verify = useVerifyEmail();
  const me = useMe();
  const sent = useRef(false);

  // Opening the link is the confirmation; it is sent once (the ref survives StrictMode's second effect run).
  // Being a POST from the page, a mail scanner that only fetches the link does not use it up.
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      verify.mutate({ token });
    }
  }, [token, verify]);

  const onward = me.data ? (
    <ButtonLink to={paths.home} size="lg">
      Go to On the hook
    </ButtonLink>
  ) : (
    <ButtonLink to={paths.signIn} size="lg">
      Sign in
    </ButtonLink>
  );

  return (
    <Card>
      <h1 className="mb-4 text-2xl font-bold">Confirm your e-mail</h1>
      <div className="flex flex-col gap-4">
        {!token ? (
          <Banner tone="warning" title="This link is not complete">
            {parsed.error?.issues[0]?.message ?? 'Open the whole link from the e-mail we sent.'} Signed-in members can ask for a new link from the banner at the top of Whorlbook.
          </Banner>
        ) : verify.isSuccess ? (
          <Banner tone="success" title="E-mail confirmed">
            Thank you. <span className="font-semibold">{verify.data.email}</span> is confirmed.
          </Banner>
        ) : verify.isError ? (
          <Banner tone="warning" title="Not confirmed">
            {verify.error.message}
          </Banner>
        ) : (
          <Loading label="Confirming your e-mail…" />
        )}
        {token && verify.isPending ? null : onward}
      </div>
    </Card>
  );
}
