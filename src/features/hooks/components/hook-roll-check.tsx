import { Link } from 'react-router-dom';
import { CircleCheck, CircleDashed, Plus } from 'lucide-react';
import { paths } from '@/config/paths';
import { formatHook } from '@/reference/hooks';
import { cn } from '@/utils/cn';
import { useHookRoll } from '../api/get-hooks';
import { hooksOfSize } from '../lib/in-roll';

/**
 * Whether the maker already owns the hook a piece needs, said in words and with an icon (never colour alone).
 * Says nothing until the roll has loaded, rather than guessing "not in your hook roll".
 */
export function HookRollCheck({ mm, className }: { mm: number; className?: string }) {
  const roll = useHookRoll();
  if (!roll.data) return null;
  const have = hooksOfSize(roll.data, mm).length > 0;
  const size = formatHook(mm);
  // Keep "2.5 mm" on one line when the sentence wraps on a phone.
  const shown = size.replace(' mm', '\u00a0mm');
  return (
    <p
      data-testid="hook-roll-check"
      className={cn(
        // Hangs under the piece's card like a tag, inset past the card's rounded corners so it reads as part of it.
        'mx-6 flex min-h-tap items-center gap-2 rounded-b-soft py-1 pl-3 pr-1 text-sm font-semibold',
        have ? 'bg-[#dce8df] text-ink dark:bg-moss/35 dark:text-oat' : 'bg-wool/70 text-ink dark:bg-white/5 dark:text-oat',
        className,
      )}
    >
      {have ? <CircleCheck aria-hidden className="h-5 w-5 shrink-0 text-moss dark:text-[#9cc3a8]" /> : <CircleDashed aria-hidden className="h-5 w-5 shrink-0 text-clay dark:text-[#e59b7c]" />}
      <span className="flex-1 tabular">{have ? `In your hook roll · ${shown}` : `Not in your hook roll — ${shown}`}</span>
      {have ? null : (
        <Link
          to={`${paths.hookRoll}?size=${mm}`}
          aria-label={`Add a ${size} hook to your hook roll`}
          className="inline-flex min-h-tap items-center gap-1 rounded-soft px-3 text-moss hover:bg-wool dark:text-[#9cc3a8] dark:hover:bg-white/10"
        >
          <Plus aria-hidden className="h-4 w-4" /> Add
        </Link>
      )}
    </p>
  );
}
