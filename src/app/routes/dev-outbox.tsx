import { RefreshCw } from 'lucide-react';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { EmptyState, Loading, PageHeader } from '@/components/ui/page';
import { Banner } from '@/components/ui/banner';
import { useOutbox } from '@/features/dev/api/get-outbox';
import { OutboxList } from '@/features/dev/components/outbox-list';

/** Public on purpose: someone trying Whorlbook locally reads its e-mail here, signed in or not. */
export default function DevOutboxRoute() {
  const outbox = useOutbox();
  return (
    <>
      <PageHeader
        title="Outbox"
        subtitle="E-mail this Whorlbook sent while it runs without a mail server. Newest first; it refreshes by itself."
        action={
          outbox.data ? (
            <Button variant="secondary" onClick={() => void outbox.refetch()}>
              <RefreshCw aria-hidden className="h-5 w-5" /> Refresh
            </Button>
          ) : null
        }
      />
      {outbox.isPending ? (
        <Loading label="Opening the outbox…" />
      ) : outbox.isError ? (
        <Banner tone="warning" title="The outbox could not be read">
          {outbox.error.message}
        </Banner>
      ) : outbox.data === null ? (
        <Card>
          <p>This Whorlbook sends real e-mail through its mail server, so there is no outbox to show here. Look in your own inbox.</p>
        </Card>
      ) : outbox.data.length === 0 ? (
        <EmptyState title="No e-mail yet">Sign up or ask for a password reset, and the message appears here.</EmptyState>
      ) : (
        <OutboxList messages={outbox.data} />
      )}
    </>
  );
}
