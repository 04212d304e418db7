import { AlertTriangle, Ban, CheckCircle2, Clock, Loader2, X } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { cn } from '@/utils/cn';
import { isFinished, type UploadItem, type UploadStatus } from '../hooks/use-photo-uploads';

const statusWords: Record<UploadStatus, string> = {
  queued: 'Waiting its turn',
  shrinking: 'Making it smaller',
  sending: 'Sending',
  preparing: 'Preparing on the server',
  waiting: 'Server busy',
  done: 'Added',
  refused: 'Not added',
  cancelled: 'Cancelled',
};

function StatusIcon({ status }: { status: UploadStatus }) {
  const c = 'h-5 w-5 shrink-0';
  if (status === 'done') return <CheckCircle2 aria-hidden className={cn(c, 'text-moss')} />;
  if (status === 'refused') return <AlertTriangle aria-hidden className={cn(c, 'text-clay')} />;
  if (status === 'cancelled') return <Ban aria-hidden className={c} />;
  if (status === 'queued' || status === 'waiting') return <Clock aria-hidden className={c} />;
  return <Loader2 aria-hidden className={cn(c, 'animate-spin')} />;
}

/** One row per photo on its way: its own bar, its own cancel, and its own sentence if it was refused. */
export function UploadList({ items, onCancel, onClear }: { items: UploadItem[]; onCancel: (id: string) => void; onClear: () => void }) {
  if (!items.length) return null;
  const allDone = items.every((i) => isFinished(i.status));
  return (
    <section aria-label="Photos on their way" className="flex flex-col gap-2 rounded-blob bg-white/80 p-4 ring-1 ring-wool dark:bg-[#332e2a] dark:ring-[#4a423c]">
      <ul className="flex flex-col gap-3">
        {items.map((item) => {
          const pct = Math.round(item.progress * 100);
          const showBar = item.status === 'shrinking' || item.status === 'sending' || item.status === 'preparing';
          return (
            <li key={item.id} className="flex gap-3">
              {item.preview ? (
                <img src={item.preview} alt="" className="h-14 w-14 shrink-0 rounded-soft bg-wool object-cover" onError={(e) => (e.currentTarget.style.visibility = 'hidden')} />
              ) : (
                <div aria-hidden className="h-14 w-14 shrink-0 rounded-soft bg-wool dark:bg-[#3a3430]" />
              )}
              <div className="flex min-w-0 flex-1 flex-col gap-1">
                <div className="flex items-center gap-2">
                  <StatusIcon status={item.status} />
                  <p className="min-w-0 flex-1 truncate font-semibold">{item.name}</p>
                </div>
                <p className="text-sm" aria-live="polite">
                  {statusWords[item.status]}
                  {item.status === 'sending' || item.status === 'shrinking' ? <span className="tabular">{` · ${pct}%`}</span> : null}
                </p>
                {showBar ? (
                  <div
                    role="progressbar"
                    aria-label={`${statusWords[item.status]}: ${item.name}`}
                    aria-valuemin={0}
                    aria-valuemax={100}
                    aria-valuenow={item.status === 'preparing' ? undefined : pct}
                    className="h-2.5 overflow-hidden rounded-full bg-wool dark:bg-[#4a423c]"
                  >
                    <div
                      className={cn('h-full rounded-full transition-[width]', item.status === 'shrinking' ? 'bg-clay' : 'bg-moss', item.status === 'preparing' && 'animate-pulse')}
                      style={{ width: `${item.status === 'preparing' ? 100 : Math.max(3, pct)}%` }}
                    />
                  </div>
                ) : null}
                {item.message ? (
                  <p role={item.status === 'refused' ? 'alert' : undefined} className={cn('text-sm', item.status === 'refused' && 'font-semibold text-clay dark:text-[#e59b7c]')}>
                    {item.message}
                  </p>
                ) : null}
              </div>
              {!isFinished(item.status) ? (
                <button
                  type="button"
                  onClick={() => onCancel(item.id)}
                  aria-label={`Cancel ${item.name}`}
                  className="flex min-h-tap min-w-tap shrink-0 items-center justify-center self-start rounded-soft hover:bg-wool dark:hover:bg-white/10"
                >
                  <X aria-hidden className="h-5 w-5" />
                </button>
              ) : null}
            </li>
          );
        })}
      </ul>
      {allDone ? (
        <Button variant="quiet" className="self-end" onClick={onClear}>
          Clear this list
        </Button>
      ) : null}
    </section>
  );
}
