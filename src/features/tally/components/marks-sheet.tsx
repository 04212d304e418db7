import { memo, useMemo } from 'react';
import { CloudOff, MapPin, Trash2 } from 'lucide-react';
import type { PieceCheck } from '@/engine/types';
import type { Placement } from '@/types/api';
import { Silhouette } from '@/components/silhouette/silhouette';
import { placementMarks, type StitchSize } from '@/components/silhouette/geometry';
import { cn } from '@/utils/cn';
import { Sheet } from './sheet';

export interface ShownPlacement extends Omit<Placement, 'id' | 'createdAt'> {
  id: number | null;
  /** Still in the outbox, not on the server yet. */
  waiting: boolean;
  key: string;
}

export function placementWhere(p: Pick<Placement, 'round' | 'step' | 'copy'>, copies: number, word = 'Rnd') {
  const at =
    p.step === null
      ? `${word} ${p.round}`
      : p.step === 0
        ? `${word} ${p.round}, before its first stitch`
        : `${word} ${p.round}, stitch ${p.step}`;
  return `${at}${copies > 1 ? ` (copy ${p.copy})` : ''}`;
}

/** Silhouette marks: recorded placements grouped by round, then the pattern's own placement notes not yet marked. */
export function silhouetteMarks(check: PieceCheck, placements: ShownPlacement[], current?: number) {
  const byRound = new Map<number, string[]>();
  for (const p of placements) {
    const labels = byRound.get(p.round) ?? [];
    if (!labels.includes(p.label)) labels.push(p.label);
    byRound.set(p.round, labels);
  }
  const recorded = [...byRound].map(([round, labels]) => ({ round, label: labels.join(', ') }));
  const fromPattern = placementMarks(check.notes).filter(
    (m) => !recorded.some((r) => Math.abs(r.round - m.round) <= 1),
  );
  const marks = [...recorded, ...fromPattern];
  if (current !== undefined) marks.push({ round: current, label: 'you are here' });
  return marks;
}

/** The piece's silhouette with where things went, and the list of marks. Memoised: taps leave it alone. */
export const PieceMarks = memo(function PieceMarks({
  check,
  size,
  placements,
  copies,
  pieceName,
  current,
  onDelete,
  compact,
}: {
  check: PieceCheck;
  size: StitchSize;
  placements: ShownPlacement[];
  copies: number;
  pieceName: string;
  current?: number;
  onDelete?: (id: number) => void;
  compact?: boolean;
}) {
  const rounds = useMemo(
    () => check.rounds.map((r) => ({ number: r.number, stitches: r.stitches, kind: r.kind })),
    [check],
  );
  const marks = useMemo(() => silhouetteMarks(check, placements, current), [check, placements, current]);
  return (
    <>
      <Silhouette
        rounds={rounds}
        size={size}
        marks={marks}
        title={`${pieceName} silhouette`}
        className="mx-auto w-full max-w-sm"
      />
      <h3 className={compact ? 'mt-4 mb-2 text-base font-bold' : 'mt-6 mb-2 text-lg font-bold'}>
        Placements
      </h3>
      {placements.length === 0 ? (
        <p className="text-base text-ink/75 dark:text-oat/75">
          Nothing marked yet. Use “Mark here” while counting to record where a part went.
        </p>
      ) : (
        <ul className="flex flex-col gap-2">
          {placements.map((p) => (
            <li
              key={p.key}
              className={cn(
                'flex items-center gap-3 rounded-soft bg-white ring-1 ring-wool dark:bg-[#332e2a] dark:ring-[#4a423c]',
                compact ? 'px-3 py-1.5' : 'px-4 py-2',
              )}
            >
              <MapPin aria-hidden className="h-5 w-5 shrink-0 text-clay" />
              <div className="min-w-0 flex-1">
                <p className={compact ? 'text-base font-bold' : 'text-lg font-bold'}>{p.label}</p>
                <p className={compact ? 'text-sm' : 'text-base'}>{placementWhere(p, copies)}</p>
                {p.note && !compact ? <p className="text-base opacity-80">{p.note}</p> : null}
                {p.waiting ? (
                  <p className="flex items-center gap-1 text-sm font-semibold">
                    <CloudOff aria-hidden className="h-4 w-4" /> Waiting to sync
                  </p>
                ) : null}
              </div>
              {onDelete && p.id !== null ? (
                <button
                  type="button"
                  onClick={() => onDelete(p.id!)}
                  className="flex min-h-tap min-w-tap items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
                  aria-label={`Remove the mark “${p.label}”`}
                >
                  <Trash2 aria-hidden className="h-6 w-6" />
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </>
  );
});

export function MarksSheet({
  open,
  onClose,
  ...rest
}: {
  open: boolean;
  onClose: () => void;
  check: PieceCheck;
  size: StitchSize;
  placements: ShownPlacement[];
  copies: number;
  pieceName: string;
  current?: number;
  onDelete: (id: number) => void;
}) {
  return (
    <Sheet open={open} onClose={onClose} title={`Marks on ${rest.pieceName}`}>
      <PieceMarks {...rest} />
    </Sheet>
  );
}
