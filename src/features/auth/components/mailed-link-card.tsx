import { useEffect, useRef, type ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { UseMutationResult } from '@tanstack/react-query';
import { Card } from '@/components/ui/card';
import { Banner } from '@/components/ui/banner';
import { ButtonLink } from '@/components/ui/button';
import { Loading } from '@/components/ui/page';
import { TokenSchema } from '@/schemas/auth';
import { paths } from '@/config/paths';
import { useMe } from '../api/get-me';

/**
 * A page opened from a link in an e-mail whose opening is the confirmation (a new address, a new e-mail): it
 * sends the link's token once, says how it went, and offers the way on. The token is sent as a POST from the
 * page, so a mail scanner that only fetches the link does not use it up.
 */
export function MailedLinkCard<T>({
  title,
  mutation,
  working,
  done,
  failed,
  incompleteHint,
  signedInOnward,
}: {
  title: string;
  mutation: UseMutationResult<T, Error, { token: string }>;
  working: string;
  done: (data: T) => { title: string; body: ReactNode };
  failed: string;
  incompleteHint?: string;
  signedInOnward: { to: string; label: string };
}) {
  const [search] = useSearchParams();
  const parsed = TokenSchema.safeParse(search.get('token') ?? '');
  const token = parsed.success ? parsed.data : null;
  const me = useMe();
  const sent = useRef(false);
  const { mutate } = mutation;

  // Sent once: the ref survives StrictMode's second effect run.
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      mutate({ token });
    }
  }, [token, mutate]);

  const success = mutation.isSuccess ? done(mutation.data) : null;
  return (
    <Card>
      <h1 className="mb-4 text-2xl font-bold">{title}</h1>
      <div className="flex flex-col gap-4">
        {!token ? (
          <Banner tone="warning" title="This link is not complete">
            {parsed.error?.issues[0]?.message ?? 'Open the whole link from the e-mail we sent.'}
            {incompleteHint ? ` ${incompleteHint}` : null}
          </Banner>
        ) : success ? (
          <Banner tone="success" title={success.title}>
            {success.body}
          </Banner>
        ) : mutation.isError ? (
          <Banner tone="warning" title={failed}>
            {mutation.error.message}
          </Banner>
        ) : (
          <Loading label={working} />
        )}
        {token && mutation.isPending ? null : me.data ? (
          <ButtonLink to={signedInOnward.to} size="lg">
            {signedInOnward.label}
          </ButtonLink>
        ) : (
          <ButtonLink to={paths.signIn} size="lg">
            Sign in
          </ButtonLink>
        )}
      </div>
    </Card>
  );
}
