import type { ReactNode } from 'react';
import { AlertTriangle, Info, CheckCircle2, ShieldAlert } from 'lucide-react';
import { cn } from '@/utils/cn';
import { ApiError } from '@/lib/api-client';

type Tone = 'info' | 'success' | 'warning' | 'caution';

const tones: Record<Tone, { cls: string; icon: ReactNode; word: string }> = {
  info: { cls: 'bg-wool text-ink', icon: <Info aria-hidden className="h-5 w-5 shrink-0" />, word: 'Note' },
  success: { cls: 'bg-[#dce8df] text-ink', icon: <CheckCircle2 aria-hidden className="h-5 w-5 shrink-0 text-moss" />, word: 'Done' },
  warning: { cls: 'bg-[#f3dccf] text-ink', icon: <AlertTriangle aria-hidden className="h-5 w-5 shrink-0 text-clay" />, word: 'Check' },
  caution: { cls: 'bg-[#f3dccf] text-ink ring-2 ring-clay', icon: <ShieldAlert aria-hidden className="h-5 w-5 shrink-0 text-clay" />, word: 'Safety' },
};

/** A message strip. State is always carried by a word and an icon as well as colour. */
export function Banner({ tone = 'info', title, children, action, className }: { tone?: Tone; title?: ReactNode; children?: ReactNode; action?: ReactNode; className?: string }) {
  const t = tones[tone];
  return (
    <div role={tone === 'warning' || tone === 'caution' ? 'alert' : 'status'} className={cn('flex items-start gap-3 rounded-soft px-4 py-3', t.cls, className)}>
      {t.icon}
      <div className="flex-1">
        <p className="font-bold">
          <span className="sr-only">{t.word}: </span>
          {title ?? t.word}
        </p>
        {children ? <div className="mt-0.5 text-sm leading-relaxed">{children}</div> : null}
      </div>
      {action}
    </div>
  );
}

/** A form's "Not saved" strip: the server's sentence, and how many fields it named when there were several. */
export function NotSavedBanner({ error }: { error: Error | null }) {
  if (!error) return null;
  const fields = error instanceof ApiError ? error.issues.length : 0;
  return (
    <Banner tone="warning" title="Not saved">
      {error.message}
      {fields > 1 ? ` (${fields} fields)` : ''}
    </Banner>
  );
}
