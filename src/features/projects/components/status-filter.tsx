import { Layers } from 'lucide-react';
import { projectStatusLabels, type ProjectStatus } from '@/schemas/common';
import { cn } from '@/utils/cn';
import { projectStatuses, statusIcons } from './status';

/** Filter chips: every chip carries its word and icon; the chosen one is also marked pressed for screen readers. */
export function StatusFilter({ value, onChange }: { value: ProjectStatus | undefined; onChange: (s: ProjectStatus | undefined) => void }) {
  const chip = (key: string, label: string, Icon: typeof Layers, active: boolean, onClick: () => void) => (
    <button
      key={key}
      type="button"
      aria-pressed={active}
      onClick={onClick}
      className={cn(
        'inline-flex min-h-tap shrink-0 items-center gap-1.5 rounded-full border-2 px-4 text-sm font-semibold transition-colors',
        active ? 'border-moss bg-moss text-oat' : 'border-wool bg-white/70 text-ink hover:border-moss dark:border-[#4a423c] dark:bg-white/5 dark:text-oat',
      )}
    >
      <Icon aria-hidden className="h-4 w-4" />
      {label}
    </button>
  );
  return (
    <div role="group" aria-label="Show projects that are" className="-mx-4 flex gap-2 overflow-x-auto px-4 pb-1 sm:mx-0 sm:flex-wrap sm:overflow-visible sm:px-0">
      {chip('all', 'All', Layers, value === undefined, () => onChange(undefined))}
      {projectStatuses.map((s) => chip(s, projectStatusLabels[s], statusIcons[s], value === s, () => onChange(s)))}
    </div>
  );
}
