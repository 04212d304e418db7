import { Pencil, Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { formatHook } from '@/reference/hooks';
import { hookMaterialLabels } from '@/schemas/hooks';
import type { RollHook } from '@/types/hooks';
import { bySize, hookCount } from '../lib/in-roll';

/** A ring drawn at a size that grows with the hook, like the holes of a hook gauge: bigger hook, bigger hole. */
function GaugeHole({ mm }: { mm: number }) {
  // Square root so 0.75 mm steel and 19 mm jumbo hooks both stay visible in a 44 px slot.
  const px = Math.round(Math.min(44, Math.max(8, Math.sqrt(mm) * 10)));
  return (
    <span aria-hidden className="flex h-12 w-12 shrink-0 items-center justify-center rounded-full bg-wool/70 dark:bg-white/10">
      <span className="block rounded-full border-[3px] border-moss bg-oat dark:border-[#9cc3a8] dark:bg-ink" style={{ width: px, height: px }} />
    </span>
  );
}

export const hookName = (h: RollHook) => formatHook(h.mm);

/** The roll, smallest hook first: one row per hook with its size, US size and what it is made of. */
export function HookList({ hooks, onEdit, onDelete }: { hooks: RollHook[]; onEdit: (h: RollHook) => void; onDelete: (h: RollHook) => void }) {
  const sorted = bySize(hooks);
  const total = hookCount(hooks);
  const range = sorted.length > 1 && sorted[0].mm !== sorted[sorted.length - 1].mm ? `, ${sorted[0].mm}–${sorted[sorted.length - 1].mm} mm` : '';
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink/70 dark:text-oat/70 tabular">
        {total} {total === 1 ? 'hook' : 'hooks'} in the roll{range}
      </p>
      <ul aria-label="Hooks" className="flex flex-col gap-2">
        {sorted.map((h) => {
          const details = [h.material ? hookMaterialLabels[h.material] : null, h.brand].filter(Boolean).join(' · ');
          return (
            <li key={h.id} className="flex items-center gap-3 rounded-blob bg-white/80 py-2 pl-2 pr-1 shadow-sm ring-1 ring-wool dark:bg-[#332e2a] dark:ring-[#4a423c]">
              <GaugeHole mm={h.mm} />
              <div className="min-w-0 flex-1 py-1">
                <p className="text-lg font-bold leading-snug tabular">{hookName(h)}</p>
                <p className="text-sm text-ink/70 dark:text-oat/70">
                  {h.quantity > 1 ? <span className="mr-1 inline-block whitespace-nowrap rounded-full bg-wool px-2 font-semibold text-ink dark:bg-white/10 dark:text-oat">{h.quantity} of these</span> : null}
                  {[h.us ? null : 'No US size', details].filter(Boolean).join(' · ') || 'No details yet'}
                </p>
                {h.note ? <p className="text-sm text-ink/70 dark:text-oat/70">{h.note}</p> : null}
              </div>
              <div className="flex shrink-0">
                <Button variant="quiet" className="px-3" aria-label={`Edit ${hookName(h)}`} onClick={() => onEdit(h)}>
                  <Pencil aria-hidden className="h-5 w-5" />
                </Button>
                <Button variant="quiet" className="px-3 text-clay! dark:text-[#e59b7c]!" aria-label={`Delete ${hookName(h)}`} onClick={() => onDelete(h)}>
                  <Trash2 aria-hidden className="h-5 w-5" />
                </Button>
              </div>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
