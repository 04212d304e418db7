import { memo } from 'react';
import { CircleCheck, MapPin, Repeat } from 'lucide-react';
import type { DueNote, RoundView } from '../lib/piece-view';
import { InstructionLine } from './instruction-line';
import type { ShownPlacement } from './marks-sheet';
import { NoteCard } from './note-card';

/**
 * What the tap zone shows: the round and where the maker is in it, a note to confirm, or the end of the piece.
 * Memoised on a position that only changes when the count does, so answers from the server redraw nothing here.
 */
export const ZoneContent = memo(function ZoneContent({
  view,
  unread,
  moreNotes,
  finished,
  mode,
  highContrast,
  earlier,
  cautions,
  pieceName,
  copies,
  rounds,
}: {
  view: RoundView;
  unread: DueNote | null;
  moreNotes: number;
  finished: boolean;
  mode: 'stitch' | 'round';
  highContrast: boolean;
  earlier: ShownPlacement[];
  cautions: string[];
  pieceName: string;
  copies: number;
  rounds: number;
}) {
  const next = view.next;
  return (
    <>
      {unread ? (
        <NoteCard
          due={unread}
          roundName={view.name}
          more={moreNotes}
          cautions={unread.note.kind === 'placement' ? cautions : []}
        />
      ) : finished ? (
        <span className="flex h-full flex-col items-center justify-center gap-3 text-center">
          <CircleCheck aria-hidden className="h-16 w-16 text-moss dark:text-[#9cc3a8]" />
          <span className="block text-3xl font-bold">{pieceName} is counted to the end</span>
          <span className="block text-lg">
            All {rounds} rounds
            {copies > 1 ? ` of all ${copies} copies` : ''}. Undo if that was one tap too many.
          </span>
        </span>
      ) : (
        <>
          <span className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
            <span className="tabular text-4xl font-bold sm:text-5xl md:text-6xl">
              {view.word} {view.round.number}
              <span className="text-2xl font-semibold opacity-70 sm:text-3xl"> of {view.of}</span>
            </span>
            {view.round.loops.map((l) => (
              <span key={l} className="rounded-full border-2 border-current px-3 py-0.5 text-base font-bold">
                {l === 'blo' ? 'BLO · back loop only' : 'FLO · front loop only'}
              </span>
            ))}
            <span className="tabular text-lg font-semibold opacity-80">ends with {view.expected} sts</span>
          </span>
          <InstructionLine
            segments={view.segments}
            highContrast={highContrast}
            className="mt-2 line-clamp-4 md:text-3xl"
          />
          {earlier.length ? (
            <span className="mt-2 block rounded-soft bg-[#f3dccf] px-3 py-1.5 text-base font-semibold text-ink">
              <MapPin aria-hidden className="mr-1 inline h-4 w-4" />
              On copy {earlier[0].copy}:{' '}
              {earlier.map((p) => `${p.label}${p.step !== null ? ` at stitch ${p.step}` : ''}`).join(', ')}
            </span>
          ) : null}
          <span className="flex flex-1 flex-col items-center justify-center py-2 text-center">
            {mode === 'round' ? (
              <>
                <span className="block text-3xl font-bold">Tap when {view.name} is done</span>
                <span className="tabular mt-2 block text-xl">{view.expected} stitches at the end</span>
              </>
            ) : (
              <>
                <span
                  className="tabular block text-8xl leading-none font-bold sm:text-9xl md:text-[11rem]"
                  aria-hidden
                >
                  {view.round.worked > 0 ? view.worked : view.made}
                </span>
                <span className="tabular mt-1 block text-xl font-semibold sm:text-2xl">
                  {view.round.worked > 0
                    ? `of ${view.round.worked} worked — ${view.made} made`
                    : `of ${view.round.stitches} made`}
                </span>
                {view.stepsInRound !== (view.round.worked || view.round.stitches) ? (
                  <span className="tabular mt-1 block text-base opacity-75">
                    step {Math.min(view.stepsDone + 1, view.stepsInRound)} of {view.stepsInRound}
                  </span>
                ) : null}
                {next ? (
                  <span className="mt-4 block text-2xl leading-snug font-bold sm:text-3xl">
                    <span className="font-semibold opacity-75">Next: </span>
                    {next.text}
                  </span>
                ) : (
                  <span className="mt-4 block text-2xl font-bold">Work {view.name} as written, then tap</span>
                )}
                {next?.repeat ? (
                  <span className="tabular mt-2 flex items-center gap-1 text-lg font-semibold">
                    <Repeat aria-hidden className="h-5 w-5" /> repeat {next.repeat.index} of {next.repeat.of}
                  </span>
                ) : null}
              </>
            )}
          </span>
          <span className="block text-center text-sm opacity-60">
            {mode === 'round'
              ? 'Tap anywhere here when the round is done'
              : 'Tap anywhere here for each stitch'}
          </span>
        </>
      )}
    </>
  );
});
