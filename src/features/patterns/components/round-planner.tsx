import { useId, useMemo, useState } from 'react';
import { AlertTriangle, CheckCircle2, CornerDownLeft } from 'lucide-react';
import { checkPiece, planRound } from '@/engine';
import type { Terms } from '@/engine/types';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/field';

interface Preview {
  line: string;
  makes: number;
  ok: boolean;
  message?: string;
}

function preview(
  from: number,
  to: number,
  staggered: boolean,
  label: string,
  terms: Terms,
): Preview | { error: string } {
  if (!Number.isInteger(from) || from < 1)
    return { error: 'Give the stitches of the round before (1 or more).' };
  if (!Number.isInteger(to) || to < 1)
    return { error: 'Give the stitches you want this round to have (1 or more).' };
  if (to > from * 2)
    return { error: `From ${from} stitches a round of increases makes at most ${from * 2}.` };
  if (to * 2 < from)
    return { error: `From ${from} stitches a round of decreases leaves at least ${Math.ceil(from / 2)}.` };
  let instruction: string;
  try {
    // Written in the pattern's own terms, so the inserted line reads like the rest.
    instruction = planRound(from, to, { staggered, terms }).instruction;
  } catch (e) {
    return { error: e instanceof Error ? e.message : 'That round cannot be planned.' };
  }
  const line = `${label}: ${instruction} (${to})`;
  // Check the planned round the same way the round table will, starting from the round before.
  const round = checkPiece(line, { terms, start: from }).rounds[0];
  const makes = round?.stitches ?? 0;
  return { line, makes, ok: makes === to && !round?.problems.length, message: round?.problems[0]?.message };
}

/**
 * The round planner: from the round before and the count wanted, writes the most even increase or decrease
 * round (staggered moves the increases so they do not stack into corners) and inserts it after the caret's line.
 */
export function RoundPlanner({
  defaultFrom,
  nextNumber,
  kind,
  terms,
  onInsert,
}: {
  defaultFrom: number | null;
  nextNumber: number;
  kind: 'round' | 'row';
  terms: Terms;
  onInsert: (line: string) => void;
}) {
  const id = useId();
  const [from, setFrom] = useState(defaultFrom ? String(defaultFrom) : '');
  const [seenDefault, setSeenDefault] = useState(defaultFrom);
  const [to, setTo] = useState('');
  const [staggered, setStaggered] = useState(true);
  // Follow the caret: when the round above it changes, start from that round's count again.
  if (defaultFrom !== seenDefault) {
    setSeenDefault(defaultFrom);
    if (defaultFrom) setFrom(String(defaultFrom));
  }

  const label = `${kind === 'row' ? 'Row' : 'Rnd'} ${nextNumber}`;
  const result = useMemo(
    () => (to === '' ? null : preview(Number(from), Number(to), staggered, label, terms)),
    [from, to, staggered, label, terms],
  );

  return (
    <div
      className="flex flex-col gap-3 rounded-soft bg-wool/60 p-4 dark:bg-white/5"
      role="group"
      aria-labelledby={`${id}-h`}
    >
      <p id={`${id}-h`} className="font-bold">
        Round planner
      </p>
      <p className="text-sm text-ink/80 dark:text-oat/80">
        Writes the most even round from one count to another and puts it on a new line after the caret.
      </p>
      <div className="grid grid-cols-2 gap-3">
        <label className="flex flex-col gap-1 text-sm font-semibold" htmlFor={`${id}-from`}>
          Stitches before
          <input
            id={`${id}-from`}
            type="number"
            inputMode="numeric"
            min={1}
            value={from}
            onChange={(e) => setFrom(e.target.value)}
            className="tabular min-h-tap rounded-soft border-2 border-wool bg-white px-3 text-base text-ink dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat"
          />
        </label>
        <label className="flex flex-col gap-1 text-sm font-semibold" htmlFor={`${id}-to`}>
          Stitches wanted
          <input
            id={`${id}-to`}
            type="number"
            inputMode="numeric"
            min={1}
            value={to}
            onChange={(e) => setTo(e.target.value)}
            className="tabular min-h-tap rounded-soft border-2 border-wool bg-white px-3 text-base text-ink dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat"
          />
        </label>
      </div>
      <CheckboxField
        label="Stagger the increases or decreases"
        checked={staggered}
        onChange={(e) => setStaggered(e.target.checked)}
      />
      {result && 'error' in result ? (
        <p className="flex items-start gap-2 text-sm font-semibold text-clay" role="alert">
          <AlertTriangle aria-hidden className="mt-0.5 h-4 w-4 shrink-0" /> {result.error}
        </p>
      ) : result ? (
        <div className="flex flex-col gap-2">
          <p className="text-sm font-semibold">Preview</p>
          <output
            aria-label="Planned round"
            className="block rounded-soft bg-white px-3 py-2 font-semibold break-words text-ink dark:bg-[#332e2a] dark:text-oat"
          >
            {result.line}
          </output>
          <p className="flex items-center gap-1 text-sm">
            {result.ok ? (
              <>
                <CheckCircle2 aria-hidden className="h-4 w-4 text-moss" /> Makes{' '}
                <span className="tabular font-semibold">{result.makes}</span> stitches from{' '}
                <span className="tabular">{from}</span>.
              </>
            ) : (
              <>
                <AlertTriangle aria-hidden className="h-4 w-4 text-clay" /> Check: makes{' '}
                <span className="tabular font-semibold">{result.makes}</span>. {result.message}
              </>
            )}
          </p>
          <Button variant="secondary" onClick={() => onInsert(result.line)}>
            <CornerDownLeft aria-hidden className="h-5 w-5" /> Insert as {label}
          </Button>
          <p className="text-xs text-ink/70 dark:text-oat/70">
            Rounds after it keep their numbers; renumber them if you need to.
          </p>
        </div>
      ) : null}
    </div>
  );
}
