import type { ReactNode } from 'react';
import { AlertTriangle, Check, CheckCircle2, MapPin, Shuffle, TrendingUp } from 'lucide-react';
import { journalTagLabels, journalTags, type JournalTag } from '@/schemas/journal';
import { cn } from '@/utils/cn';

const icon = 'h-4 w-4 shrink-0';
export const tagIcons: Record<JournalTag, ReactNode> = {
  progress: <TrendingUp aria-hidden className={icon} />,
  change: <Shuffle aria-hidden className={icon} />,
  placement: <MapPin aria-hidden className={icon} />,
  problem: <AlertTriangle aria-hidden className={icon} />,
  finished: <CheckCircle2 aria-hidden className={icon} />,
};

/** Toggle chips for the kinds of note: each says its word, and a tick (not only colour) shows it is on. */
export function TagToggles({ value, onChange, labelId }: { value: JournalTag[]; onChange: (tags: JournalTag[]) => void; labelId: string }) {
  return (
    <div role="group" aria-labelledby={labelId} className="flex flex-wrap gap-2">
      {journalTags.map((tag) => {
        const on = value.includes(tag);
        return (
          <button
            key={tag}
            type="button"
            aria-pressed={on}
            onClick={() => onChange(on ? value.filter((t) => t !== tag) : [...value, tag])}
            className={cn(
              'inline-flex min-h-tap items-center gap-1.5 rounded-full border-2 px-4 text-sm font-semibold transition-colors',
              on
                ? 'border-moss bg-moss text-oat'
                : 'border-wool bg-white text-ink hover:border-moss/60 dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat',
            )}
          >
            {on ? <Check aria-hidden className={icon} /> : tagIcons[tag]}
            {journalTagLabels[tag]}
          </button>
        );
      })}
    </div>
  );
}

export function TagBadges({ tags }: { tags: JournalTag[] }) {
  if (!tags.length) return null;
  return (
    <ul className="flex flex-wrap gap-1.5" aria-label="Kind of note">
      {tags.map((tag) => (
        <li
          key={tag}
          className={cn(
            'inline-flex items-center gap-1 rounded-full px-2.5 py-1 text-xs font-semibold',
            tag === 'problem' ? 'bg-[#f3dccf] text-ink' : tag === 'finished' ? 'bg-[#dce8df] text-ink' : 'bg-wool text-ink dark:bg-[#3a3430] dark:text-oat',
          )}
        >
          {tagIcons[tag]}
          {journalTagLabels[tag]}
        </li>
      ))}
    </ul>
  );
}
