import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import type { ProjectPiece } from '@/types/api';
import { progressLine } from './piece-card';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * Asks before a piece goes, naming what goes with it: its Tally count, its placements, and the link from journal
 * entries (the entries themselves and their photos stay in the journal).
 */
export function RemovePieceDialog({
  piece,
  journalEntries,
  fromPattern = false,
  pending,
  onConfirm,
  onCancel,
}: {
  piece: ProjectPiece | null;
  fromPattern?: boolean;
  /** Journal entries written about this piece, or null while the journal is still loading. */
  journalEntries: number | null;
  pending: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const p = piece;
  const started = p ? p.progress.version > 0 || p.progress.done > 0 || p.totals.copiesDone > 0 : false;
  const labels = p ? [...new Set(p.placements.map((pl) => pl.label))] : [];
  return (
    <ConfirmDialog open={p != null} title={p ? `Remove ${p.name}?` : 'Remove the piece?'} confirmLabel="Remove the piece" pending={pending} onConfirm={onConfirm} onCancel={onCancel}>
      {p ? (
        <div className="flex flex-col gap-2">
          <p>“{p.name}” goes from this project for good, with:</p>
          <ul className="flex list-disc flex-col gap-1 pl-5">
            <li>{started ? `its Tally count (${progressLine(p)})` : 'its Tally count (not started yet)'}</li>
            <li>
              {p.placements.length
                ? `${plural(p.placements.length, 'placement', 'placements')} (${labels.join(', ')})`
                : 'no placements (none recorded)'}
            </li>
            <li>
              {journalEntries == null
                ? 'the link from any journal entries about it; the entries and their photos stay in the journal'
                : journalEntries === 0
                  ? 'no journal entries (none are about it)'
                  : `the link from ${plural(journalEntries, 'journal entry', 'journal entries')}; the entries and their photos stay in the journal`}
            </li>
          </ul>
          {fromPattern ? <p className="text-sm text-ink/70 dark:text-oat/70">The pattern the project came from keeps its own copy of the piece.</p> : null}
        </div>
      ) : null}
    </ConfirmDialog>
  );
}
