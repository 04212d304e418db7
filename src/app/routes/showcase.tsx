import { useCallback } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ApiError } from '@/lib/api-client';
import { EmptyState, Loading } from '@/components/ui/page';
import { ButtonLink } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { useShowcase } from '@/features/showcase/api/get-showcase';
import { ShowcaseView } from '@/features/showcase/components/showcase-view';
import { PublicShell } from '@/features/showcase/components/public-shell';

/** /p/:token — the showcase, open to anyone with the link, signed in or not. */
export default function ShowcaseRoute() {
  const { token = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const showcase = useShowcase(token);
  const print = search.get('print');
  const autoPrint = print === 'card' || print === 'page' ? print : null;
  const clearPrint = useCallback(() => setSearch({}, { replace: true }), [setSearch]);
  const signedIn = showcase.data?.viewer.signedIn;
  const next = encodeURIComponent(paths.showcase(token));

  return (
    <PublicShell
      action={
        signedIn === false ? (
          <Link to={`${paths.signIn}?next=${next}`} className="flex min-h-tap items-center rounded-soft px-3 font-semibold text-moss hover:bg-wool dark:text-[#9cc3a8] dark:hover:bg-white/10">
            Sign in
          </Link>
        ) : signedIn ? (
          <Link to={paths.home} className="flex min-h-tap items-center rounded-soft px-3 font-semibold text-moss hover:bg-wool dark:text-[#9cc3a8] dark:hover:bg-white/10">
            On the hook
          </Link>
        ) : null
      }
    >
      {showcase.isPending ? (
        <div className="mx-auto max-w-3xl px-4">
          <Loading label="Opening the page…" />
        </div>
      ) : showcase.error ? (
        <div className="mx-auto max-w-xl px-4 py-10">
          {showcase.error instanceof ApiError && showcase.error.status === 404 ? (
            <EmptyState title="This page is not shared" action={<ButtonLink to={paths.home}>Go to Whorlbook</ButtonLink>}>
              The maker may have stopped sharing it, or sent a newer link. Ask them for the link again.
            </EmptyState>
          ) : (
            <EmptyState title="The page did not load" action={<ButtonLink to={paths.showcase(token)} reloadDocument>Try again</ButtonLink>}>
              {showcase.error.message}
            </EmptyState>
          )}
        </div>
      ) : (
        <ShowcaseView showcase={showcase.data} autoPrint={autoPrint} onAutoPrinted={clearPrint} />
      )}
    </PublicShell>
  );
}
