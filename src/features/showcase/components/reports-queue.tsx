import { useState } from 'react';
import { EyeOff, Flag, MessageSquare, FileText, Check } from 'lucide-react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { EmptyState, Loading } from '@/components/ui/page';
import { cn } from '@/utils/cn';
import { useReports, type ReportFilter } from '../api/get-reports';
import { useResolveReport } from '../api/resolve-report';
import type { Report } from '@/types/showcase';
import { formatWhen, plural } from '../format';

const statusWords: Record<Report['status'], string> = { open: 'Open', hidden: 'Hidden', dismissed: 'Dismissed' };

/** The admins' queue of reported comments and pages. Reported text is shown as text, never as markup. */
export function ReportsQueue() {
  const [filter, setFilter] = useState<ReportFilter>('open');
  const reports = useReports(filter);
  const resolve = useResolveReport();
  const [hiding, setHiding] = useState<Report | null>(null);

  const act = (r: Report, action: 'hide' | 'dismiss') =>
    resolve.mutate(
      { id: r.id, action },
      {
        onSuccess: () => {
          setHiding(null);
          toast.success(action === 'hide' ? `${r.target === 'comment' ? 'Comment' : 'Page'} hidden.` : 'Report dismissed.');
        },
      },
    );

  return (
    <>
      <div role="tablist" aria-label="Which reports" className="mb-4 flex gap-2">
        {(['open', 'handled', 'all'] as const).map((f) => (
          <button
            key={f}
            role="tab"
            type="button"
            aria-selected={filter === f}
            onClick={() => setFilter(f)}
            className={cn(
              'min-h-tap rounded-soft px-4 font-semibold',
              filter === f ? 'bg-moss text-oat' : 'bg-wool text-ink hover:bg-[#d9ccb4] dark:bg-[#3a3430] dark:text-oat',
            )}
          >
            {filter === f ? <Check aria-hidden className="mr-1 inline h-4 w-4" /> : null}
            {f === 'open' ? 'Open' : f === 'handled' ? 'Handled' : 'All'}
          </button>
        ))}
      </div>
      {reports.isPending ? (
        <Loading label="Loading reports…" />
      ) : !reports.data?.length ? (
        <EmptyState title={filter === 'open' ? 'No open reports' : 'No reports here'}>{filter === 'open' ? 'Nothing is waiting for an admin.' : null}</EmptyState>
      ) : (
        <ul className="space-y-4">
          {reports.data.map((r) => (
            <li key={r.id}>
              <Card>
                <div className="flex flex-wrap items-center gap-2 text-sm">
                  <span className="inline-flex items-center gap-1 rounded-full bg-wool px-3 py-1 font-bold dark:bg-[#3a3430]">
                    {r.target === 'comment' ? <MessageSquare aria-hidden className="h-4 w-4" /> : <FileText aria-hidden className="h-4 w-4" />}
                    {r.target === 'comment' ? 'Comment' : 'Page'}
                  </span>
                  <span className={cn('inline-flex items-center gap-1 rounded-full px-3 py-1 font-bold', r.status === 'open' ? 'bg-[#f3dccf] text-ink' : 'bg-[#dce8df] text-ink')}>
                    {r.status === 'open' ? <Flag aria-hidden className="h-4 w-4 text-clay" /> : <Check aria-hidden className="h-4 w-4 text-moss" />}
                    {statusWords[r.status]}
                  </span>
                  {r.openReportsOnTarget > 1 && r.status === 'open' ? <span className="font-semibold text-clay">{plural(r.openReportsOnTarget, 'open report')} on this</span> : null}
                  <span className="ml-auto text-ink/60 dark:text-oat/60">{formatWhen(r.createdAt)}</span>
                </div>

                {r.comment ? (
                  <blockquote className="mt-3 rounded-soft bg-oat p-3 dark:bg-ink/60">
                    <p className="text-sm font-bold">{r.comment.authorDisplayName} wrote:</p>
                    <p className="mt-1 whitespace-pre-wrap break-words" data-testid="reported-comment">
                      {r.comment.body}
                    </p>
                  </blockquote>
                ) : null}
                {r.page ? (
                  <p className="mt-3">
                    {r.target === 'comment' ? 'On ' : 'Page '}
                    {r.page.path ? (
                      <a href={r.page.path} target="_blank" rel="noopener" className="font-semibold text-moss underline dark:text-[#9cc3a8]">
                        {r.page.title}
                      </a>
                    ) : (
                      <span className="font-semibold">{r.page.title}</span>
                    )}{' '}
                    by {r.page.ownerDisplayName}
                    {r.page.hidden ? <span className="ml-1 font-semibold text-clay">(page hidden)</span> : null}
                  </p>
                ) : null}
                <p className="mt-2">
                  <span className="font-semibold">Reason from {r.reporter.displayName}:</span> <span className="whitespace-pre-wrap break-words">{r.reason}</span>
                </p>
                {r.handledBy ? (
                  <p className="mt-1 text-sm text-ink/70 dark:text-oat/70">
                    {statusWords[r.status]} by {r.handledBy.displayName}
                    {r.handledAt ? `, ${formatWhen(r.handledAt)}` : ''}
                  </p>
                ) : null}
                {r.status === 'open' ? (
                  <div className="mt-4 flex flex-wrap gap-2">
                    <Button variant="danger" onClick={() => setHiding(r)}>
                      <EyeOff aria-hidden className="h-4 w-4" /> Hide {r.target === 'comment' ? 'comment' : 'page'}
                    </Button>
                    <Button variant="secondary" pending={resolve.isPending && resolve.variables?.id === r.id && resolve.variables.action === 'dismiss'} onClick={() => act(r, 'dismiss')}>
                      Dismiss
                    </Button>
                  </div>
                ) : null}
              </Card>
            </li>
          ))}
        </ul>
      )}
      <ConfirmDialog
        open={hiding !== null}
        title={hiding?.target === 'project' ? 'Hide this page?' : 'Hide this comment?'}
        confirmLabel={hiding?.target === 'project' ? 'Hide page' : 'Hide comment'}
        pending={resolve.isPending}
        onCancel={() => setHiding(null)}
        onConfirm={() => hiding && act(hiding, 'hide')}
      >
        <p>
          {hiding?.target === 'project'
            ? 'The link stops working for everyone and the maker cannot share it again. Every open report on this page is closed.'
            : 'Nobody but the page owner will see it, and the owner cannot show it again. Every open report on it is closed.'}
        </p>
      </ConfirmDialog>
    </>
  );
}
