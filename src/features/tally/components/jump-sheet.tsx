import { useState } from 'react';
import type { PieceCheck } from '@/engine/types';
import type { Position } from '@/schemas/progress-position';
import { cn } from '@/utils/cn';
import { roundWord } from '../lib/piece-view';
import { Sheet } from './sheet';

/** Jump to the start of any round of any copy (restarting a round that was frogged, or catching up). */
export function JumpSheet({
  open,
  onClose,
  check,
  copies,
  pieceName,
  position,
  onJump,
}: {
  open: boolean;
  onClose: () => void;
  check: PieceCheck;
  copies: number;
  pieceName: string;
  position: Position;
  onJump: (to: Position) => void;
}) {
  // Mounted each time it opens, so it starts at the copy being worked.
  const [copy, setCopy] = useState(position.copy);
  return (
    <Sheet open={open} onClose={onClose} title="Jump to a round">
      {copies > 1 ? (
        <fieldset className="mb-5">
          <legend className="mb-2 text-lg font-bold">Which {pieceName.toLowerCase()}</legend>
          <div className="flex flex-wrap gap-2">
            {Array.from({ length: copies }, (_, i) => i + 1).map((c) => (
              <button
                key={c}
                type="button"
                aria-pressed={copy === c}
                onClick={() => setCopy(c)}
                className={cn(
                  'min-h-14 min-w-24 rounded-soft border-2 px-4 text-lg font-bold',
                  copy === c
                    ? 'border-moss bg-moss text-oat'
                    : 'border-wool bg-white text-ink dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat',
                )}
              >
                {copy === c ? '✓ ' : ''}
                {c} of {copies}
              </button>
            ))}
          </div>
        </fieldset>
      ) : null}
      <p className="mb-3 text-base text-ink/75 dark:text-oat/75">
        Pick a round to start it from its first stitch.
      </p>
      <ol className="grid grid-cols-3 gap-2 sm:grid-cols-4">
        {check.rounds.map((r, index) => {
          const here = copy === position.copy && index === position.round;
          return (
            <li key={`${r.line}-${r.number}-${index}`}>
              <button
                type="button"
                onClick={() => {
                  onJump({ copy, round: index, step: 0 });
                  onClose();
                }}
                aria-current={here ? 'step' : undefined}
                className={cn(
                  'flex min-h-16 w-full flex-col items-center justify-center rounded-soft border-2 px-2 py-1 text-center',
                  here
                    ? 'border-clay bg-[#f3dccf] text-ink'
                    : 'border-wool bg-white text-ink hover:border-moss dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat',
                )}
              >
                <span className="text-lg font-bold">
                  {roundWord(r)} {r.number}
                </span>
                <span className="tabular text-sm">
                  {here ? 'you are here' : `${r.stated ?? r.stitches} sts`}
                </span>
              </button>
            </li>
          );
        })}
      </ol>
    </Sheet>
  );
}
