import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';

export function ErrorFallback({ error }: { error?: unknown }) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <div role="alert" className="mx-auto max-w-lg p-8 text-center">
      <h1 className="text-2xl font-bold">That did not work</h1>
      <p className="mt-2">{message}</p>
      <p className="mt-1 text-sm opacity-70">Your counts are saved. Reload the page to carry on.</p>
      <a href="/" className={buttonClasses('primary', 'md', 'mt-6')}>
        Back to On the hook
      </a>
    </div>
  );
}

/** Used as the router's errorElement: shows a sentence, never a stack trace. */
export function RouteErrorFallback() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <ErrorFallback error={new Error('There is no page at this address.')} />;
  return <ErrorFallback error={error} />;
}
