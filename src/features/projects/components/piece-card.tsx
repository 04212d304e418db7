import { useMemo, type ReactNode } from 'react';
import { ChevronDown, Diamond, Hash } from 'lucide-react';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Silhouette } from '@/components/silhouette/silhouette';
import { stitchSize } from '@/components/silhouette/geometry';
import type { SilhouetteMark } from '@/components/silhouette/geometry';
import { paths } from '@/config/paths';
import { checkPiece } from '@/engine';
import { formatHook } from '@/reference/hooks';
import type { Note, Round, Terms } from '@/engine/types';
import type { ProjectPiece } from '@/types/api';

/** "Rnd 7 of 17 · copy 1 of 2", or where the piece stands when it is not started or all done. */
export function progressLine(piece: ProjectPiece) {
  const { rounds, copiesDone, roundsDone } = piece.totals;
  const copies = piece.copies;
  if (rounds === 0) return 'No rounds to count yet';
  if (copiesDone >= copies) return copies > 1 ? `All ${copies} copies done` : 'Done';
  const started = piece.progress.version > 0 || piece.progress.done > 0 || copiesDone > 0;
  const copy = copies > 1 ? ` · copy ${Math.min(copies, copiesDone + 1)} of ${copies}` : '';
  if (!started) return `Not started · ${rounds} ${rounds === 1 ? 'round' : 'rounds'}${copies > 1 ? ` · make ${copies}` : ''}`;
  return `Rnd ${Math.min(rounds, roundsDone + 1)} of ${rounds}${copy}`;
}

/** Share of the whole piece (all copies) that is done, 0–1. */
export function pieceFraction(piece: ProjectPiece) {
  const { rounds, copiesDone, roundsDone } = piece.totals;
  if (!rounds) return 0;
  const total = rounds * piece.copies;
  return Math.min(1, (copiesDone >= piece.copies ? total : copiesDone * rounds + roundsDone) / total);
}

export function PieceCard({
  projectId,
  piece,
  terms,
  yarnWeight,
  showShape = false,
  actions,
  compact = false,
}: {
  projectId: number;
  piece: ProjectPiece;
  terms: Terms;
  yarnWeight?: number | null;
  /** Open the silhouette from the start (the piece being worked); the others stay folded to keep the page short. */
  showShape?: boolean;
  /** Buttons beside the name (edit, move), from the screen. */
  actions?: ReactNode;
  /** Name and progress only, e.g. while the pieces are being put in order. */
  compact?: boolean;
}) {
  const check = useMemo(() => checkPiece(piece.instructions, { terms }), [piece.instructions, terms]);
  const marks = useMemo<SilhouetteMark[]>(() => {
    // One mark per round, naming everything placed there, so two eyes on Rnd 9 do not print over each other.
    const byRound = (list: SilhouetteMark[]) => {
      const grouped = new Map<number, string[]>();
      for (const m of list) {
        const labels = grouped.get(m.round) ?? [];
        if (!labels.includes(m.label)) labels.push(m.label);
        grouped.set(m.round, labels);
      }
      return [...grouped].map(([round, labels]) => ({ round, label: labels.join(', ') }));
    };
    if (piece.placements.length) return byRound(piece.placements.map((p) => ({ round: p.round, label: p.label })));
    // Nothing recorded yet: show where the pattern says parts go.
    return byRound(
      check.notes.flatMap((n: Note) => {
        const p = n.placement;
        if (!p) return [];
        const round = p.betweenRounds ? (p.betweenRounds[0] + p.betweenRounds[1]) / 2 : p.atRound;
        return round == null ? [] : [{ round, label: p.label }];
      }),
    );
  }, [check.notes, piece.placements]);
  const fraction = pieceFraction(piece);
  const line = progressLine(piece);
  const silRounds = check.rounds.map((r: Round) => ({ number: r.number, stitches: r.stitches, kind: r.kind }));

  return (
    <Card className="flex flex-col gap-4 p-4 sm:p-5">
      <div className="flex flex-wrap items-start justify-between gap-x-4 gap-y-1">
        <div>
          <h3 className="text-xl font-bold">{piece.name}</h3>
          <p className="text-sm text-ink/70 dark:text-oat/70">
            {piece.copies > 1 ? `Make ${piece.copies}` : 'Make 1'}
            {piece.hookMm ? ` · ${formatHook(piece.hookMm)} hook` : ''}
            {piece.yarns.length ? ` · ${piece.yarns.join(', ')}` : ''}
          </p>
        </div>
        {actions ? <div className="-mr-2 -mt-1 flex flex-wrap gap-1">{actions}</div> : null}
      </div>

      <div>
        <p className="flex items-center gap-2 font-semibold tabular">
          <Hash aria-hidden className="h-4 w-4 text-moss dark:text-[#9cc3a8]" />
          {line}
        </p>
        <div
          role="progressbar"
          aria-label={`${piece.name} progress`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={Math.round(fraction * 100)}
          aria-valuetext={line}
          className="mt-2 h-3 overflow-hidden rounded-full bg-wool dark:bg-[#4a423c]"
        >
          <div className="h-full rounded-full bg-moss" style={{ width: `${fraction * 100}%` }} />
        </div>
      </div>

      {compact ? null : piece.totals.rounds > 0 ? (
        <ButtonLink to={paths.tally(projectId, piece.id)} size="lg" className="w-full" aria-label={`Count ${piece.name}`}>
          Count
        </ButtonLink>
      ) : null}

      {!compact && piece.placements.length ? (
        <div>
          <h4 className="mb-1 font-semibold">Placements</h4>
          <ul className="flex flex-col gap-1 text-sm">
            {piece.placements.map((p) => (
              <li key={p.id} className="flex items-start gap-2">
                <Diamond aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-clay" />
                <span>
                  <span className="font-semibold">{p.label}</span>
                  <span className="tabular">
                    {' '}
                    · Rnd {p.round}
                    {p.step != null ? `, st ${p.step}` : ''}
                    {piece.copies > 1 ? ` · copy ${p.copy}` : ''}
                  </span>
                  {p.note ? <span className="block text-ink/70 dark:text-oat/70">{p.note}</span> : null}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {!compact && check.rounds.length ? (
        <details open={showShape} className="group rounded-soft bg-wool/40 px-4 py-2 dark:bg-white/5">
          <summary className="flex min-h-tap cursor-pointer list-none items-center gap-2 font-semibold [&::-webkit-details-marker]:hidden">
            <span className="flex-1">
              Silhouette
              {marks.length ? (
                <span className="text-sm font-normal">
                  {' '}
                  · {marks.length} {marks.length === 1 ? 'mark' : 'marks'}
                </span>
              ) : null}
            </span>
            <ChevronDown aria-hidden className="h-5 w-5 transition-transform group-open:rotate-180" />
          </summary>
          <div className="max-w-xs pb-2">
            <Silhouette title={`${piece.name} silhouette`} rounds={silRounds} size={stitchSize(null, yarnWeight)} marks={marks} />
          </div>
        </details>
      ) : null}

      {!compact && piece.instructions.trim() ? (
        <details className="group rounded-soft bg-wool/40 px-4 py-2 dark:bg-white/5">
          <summary className="flex min-h-tap cursor-pointer list-none items-center gap-2 font-semibold [&::-webkit-details-marker]:hidden">
            <span className="flex-1">Instructions</span>
            <ChevronDown aria-hidden className="h-5 w-5 transition-transform group-open:rotate-180" />
          </summary>
          <pre className="whitespace-pre-wrap pb-2 font-sans text-sm leading-relaxed">{piece.instructions}</pre>
        </details>
      ) : null}
    </Card>
  );
}
