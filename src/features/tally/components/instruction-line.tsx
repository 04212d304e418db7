import type { Segment } from '../lib/piece-view';
import { cn } from '@/utils/cn';

/** The round as written, with the step being worked marked by weight and an underline as well as colour. */
export function InstructionLine({
  segments,
  highContrast,
  className,
}: {
  segments: Segment[];
  highContrast: boolean;
  className?: string;
}) {
  return (
    <span className={cn('block text-xl leading-snug sm:text-2xl', className)}>
      {segments.map((s, i) =>
        s.current ? (
          <mark
            key={i}
            data-current-step
            className={cn(
              'rounded-md px-1 font-bold underline decoration-4 underline-offset-4',
              highContrast
                ? 'bg-ink text-oat dark:bg-oat dark:text-ink'
                : 'bg-[#f3dccf] text-ink decoration-clay dark:bg-[#5a3a2c] dark:text-oat',
            )}
          >
            <span className="sr-only">Now: </span>
            {s.text}
          </mark>
        ) : (
          <span key={i} className={highContrast ? '' : 'text-ink/75 dark:text-oat/75'}>
            {s.text}
          </span>
        ),
      )}
    </span>
  );
}
