import { CircleCheck, CirclePause, CirclePlay, NotebookPen, Undo2, type LucideIcon } from 'lucide-react';
import { projectStatusLabels, ProjectStatusSchema, type ProjectStatus } from '@/schemas/common';
import { cn } from '@/utils/cn';

export const projectStatuses = ProjectStatusSchema.options;

export const statusIcons: Record<ProjectStatus, LucideIcon> = {
  planned: NotebookPen,
  on_the_hook: CirclePlay,
  resting: CirclePause,
  finished: CircleCheck,
  frogged: Undo2,
};

const tones: Record<ProjectStatus, string> = {
  planned: 'bg-wool text-ink dark:bg-[#3a3430] dark:text-oat',
  on_the_hook: 'bg-moss text-oat',
  resting: 'bg-[#ece3d3] text-ink dark:bg-[#3a3430] dark:text-oat',
  finished: 'bg-[#dce8df] text-ink dark:bg-[#2f4a39] dark:text-oat',
  frogged: 'bg-[#f3dccf] text-ink dark:bg-[#5a3526] dark:text-oat',
};

/** The status as a word with an icon; the colour only repeats what the word says. */
export function StatusBadge({ status, className }: { status: ProjectStatus; className?: string }) {
  const Icon = statusIcons[status];
  return (
    <span className={cn('inline-flex items-center gap-1.5 whitespace-nowrap rounded-full px-3 py-1 text-sm font-semibold', tones[status], className)}>
      <Icon aria-hidden className="h-4 w-4" />
      {projectStatusLabels[status]}
    </span>
  );
}
