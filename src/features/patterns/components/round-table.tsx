import type { ReactNode } from 'react';
import {
  AlertTriangle,
  CheckCircle2,
  Cloud,
  Info,
  Link2,
  MapPin,
  Palette,
  RefreshCw,
  Scissors,
  StickyNote,
} from 'lucide-react';
import type { Note, NoteKind, PieceCheck, Problem, Round } from '@/engine/types';
import { cn } from '@/utils/cn';

const noteLook: Record<NoteKind, { word: string; icon: ReactNode }> = {
  colour: { word: 'Colour', icon: <Palette aria-hidden className="h-4 w-4 shrink-0" /> },
  hook: { word: 'Hook', icon: <RefreshCw aria-hidden className="h-4 w-4 shrink-0" /> },
  stuffing: { word: 'Stuffing', icon: <Cloud aria-hidden className="h-4 w-4 shrink-0" /> },
  placement: { word: 'Placement', icon: <MapPin aria-hidden className="h-4 w-4 shrink-0" /> },
  'fasten-off': { word: 'Fasten off', icon: <Scissors aria-hidden className="h-4 w-4 shrink-0" /> },
  join: { word: 'Join', icon: <Link2 aria-hidden className="h-4 w-4 shrink-0" /> },
  other: { word: 'Note', icon: <StickyNote aria-hidden className="h-4 w-4 shrink-0" /> },
};

export interface TableRow {
  kind: 'round';
  line: number;
  label: string;
  /** Rounds this line stands for ("Rnds 8-12" is 5). */
  count: number;
  first: Round;
  stitches: number;
  worked: number;
  /** Stitches the round before left to work into (0 before the first round). */
  previous: number;
  stated: number | null;
  problems: Problem[];
}

export type TableItem = TableRow | { kind: 'note'; line: number; note: Note };

/** One row per written round line (a range is one row), with the notes between them in text order. */
export function tableItems(check: PieceCheck, start = 0): TableItem[] {
  const rows: TableRow[] = [];
  let previous = start;
  for (const r of check.rounds) {
    const last = rows[rows.length - 1];
    if (last && last.line === r.line) {
      last.count += 1;
      last.stitches = r.stitches;
      for (const p of r.problems)
        if (!last.problems.some((q) => q.message === p.message)) last.problems.push(p);
    } else {
      rows.push({
        kind: 'round',
        line: r.line,
        label: r.label,
        count: 1,
        first: r,
        stitches: r.stitches,
        worked: r.worked,
        previous,
        stated: r.stated,
        problems: [...r.problems],
      });
    }
    previous = r.stitches;
  }
  const notes: TableItem[] = check.notes.map((note) => ({ kind: 'note', line: note.line, note }));
  return [...rows, ...notes].sort((a, b) => a.line - b.line || (a.kind === 'note' ? -1 : 1));
}

/**
 * The round table: what every round makes, what it works into, what the pattern says, and each problem in
 * plain words at its line. Clicking a round or a problem takes the caret there in the instructions.
 */
export function RoundTable({
  check,
  start = 0,
  onJump,
  className,
}: {
  check: PieceCheck;
  start?: number;
  onJump?: (line: number, column: number | null) => void;
  className?: string;
}) {
  const items = tableItems(check, start);
  const roundRows = items.filter((i): i is TableRow => i.kind === 'round');
  const problemCount = roundRows.reduce((n, r) => n + r.problems.length, 0);

  return (
    <section aria-label="Round table" className={cn('flex flex-col gap-3', className)}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h4 className="text-lg font-bold">Round table</h4>
        <p className="text-sm font-semibold" aria-live="polite">
          {roundRows.length === 0 ? (
            'No rounds yet'
          ) : problemCount ? (
            <span className="inline-flex items-center gap-1 text-clay">
              <AlertTriangle aria-hidden className="h-4 w-4" /> {problemCount} to check
            </span>
          ) : (
            <span className="inline-flex items-center gap-1 text-moss dark:text-[#9cc3a8]">
              <CheckCircle2 aria-hidden className="h-4 w-4" /> Every count adds up
            </span>
          )}
        </p>
      </div>

      {check.hints.length ? (
        <ul
          className="flex flex-col gap-1 rounded-soft bg-wool px-4 py-2 text-sm text-ink"
          aria-label="Hints"
        >
          {check.hints.map((h) => (
            <li key={h} className="flex items-start gap-2">
              <Info aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
              <span>
                <span className="font-semibold">Hint: </span>
                {h}
              </span>
            </li>
          ))}
        </ul>
      ) : null}

      {items.length === 0 ? (
        <p className="rounded-soft border-2 border-dashed border-wool px-4 py-6 text-center text-sm text-ink/70 dark:border-[#4a423c] dark:text-oat/70">
          Type a round, e.g. <code className="font-semibold">Rnd 1: 6 sc in MR (6)</code>, and its count
          appears here.
        </p>
      ) : (
        <table className="w-full border-separate border-spacing-0 text-sm">
          <thead>
            <tr className="text-left text-xs uppercase tracking-wide text-ink/70 dark:text-oat/70">
              <th scope="col" className="py-1 pr-2 font-semibold">
                Round
              </th>
              <th scope="col" className="px-1 py-1 text-right font-semibold">
                Makes
              </th>
              <th scope="col" className="px-1 py-1 text-right font-semibold">
                Works
              </th>
              <th scope="col" className="px-1 py-1 text-right font-semibold">
                Stated
              </th>
              <th scope="col" className="py-1 pl-2 font-semibold">
                <span className="sr-only">Status</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {items.map((item) =>
              item.kind === 'note' ? (
                <NoteRow key={`n${item.line}`} note={item.note} onJump={onJump} />
              ) : (
                <RoundRows key={`r${item.line}`} row={item} onJump={onJump} />
              ),
            )}
          </tbody>
        </table>
      )}
    </section>
  );
}

function NoteRow({ note, onJump }: { note: Note; onJump?: (line: number, column: number | null) => void }) {
  const look = noteLook[note.kind] ?? noteLook.other;
  const body = (
    <span className="flex items-start gap-2">
      {look.icon}
      <span>
        <span className="font-semibold">{look.word}: </span>
        {note.text}
      </span>
    </span>
  );
  return (
    <tr data-line={note.line}>
      <td
        colSpan={5}
        className="border-t border-wool py-1.5 text-ink/80 italic dark:border-[#4a423c] dark:text-oat/80"
      >
        {onJump ? (
          <button
            type="button"
            onClick={() => onJump(note.line, null)}
            className="w-full text-left hover:underline"
          >
            {body}
          </button>
        ) : (
          body
        )}
      </td>
    </tr>
  );
}

function RoundRows({
  row,
  onJump,
}: {
  row: TableRow;
  onJump?: (line: number, column: number | null) => void;
}) {
  const flagged = row.problems.length > 0;
  const cell = cn(
    'border-t border-wool py-2 align-middle dark:border-[#4a423c]',
    flagged && 'bg-[#f3dccf]/60 dark:bg-clay/15',
  );
  const label = (
    <>
      <span className="font-semibold">{row.label}</span>
      {row.count > 1 ? (
        <span className="ml-1 text-xs text-ink/70 dark:text-oat/70">({row.count} rounds)</span>
      ) : null}
    </>
  );
  return (
    <>
      <tr
        data-line={row.line}
        data-problems={row.problems.length}
        aria-label={`${row.label}${flagged ? ', check' : ''}`}
      >
        <td className={cn(cell, 'pr-2')}>
          {onJump ? (
            <button
              type="button"
              className="min-h-8 text-left hover:underline"
              onClick={() => onJump(row.line, null)}
              title={`Go to line ${row.line + 1}`}
            >
              {label}
            </button>
          ) : (
            label
          )}
        </td>
        <td className={cn(cell, 'tabular px-1 text-right font-semibold')}>{row.stitches}</td>
        <td className={cn(cell, 'tabular px-1 text-right')}>
          {row.previous === 0 && row.worked === 0 ? (
            <span aria-label="nothing before it">—</span>
          ) : (
            `${row.worked} of ${row.previous}`
          )}
        </td>
        <td className={cn(cell, 'tabular px-1 text-right')}>
          {row.stated ?? <span aria-label="not stated">—</span>}
        </td>
        <td className={cn(cell, 'pl-2')}>
          {flagged ? (
            <span className="inline-flex items-center gap-1 font-bold text-clay">
              <AlertTriangle aria-hidden className="h-4 w-4" /> check
            </span>
          ) : (
            <span className="inline-flex items-center gap-1 text-moss dark:text-[#9cc3a8]">
              <CheckCircle2 aria-hidden className="h-4 w-4" /> <span className="sr-only">ok</span>
            </span>
          )}
        </td>
      </tr>
      {flagged ? (
        <tr data-problems-for={row.line}>
          <td colSpan={5} className="bg-[#f3dccf]/60 pb-2 dark:bg-clay/15">
            <ul className="flex flex-col gap-1">
              {row.problems.map((p, i) => (
                <li key={i}>
                  {onJump ? (
                    <button
                      type="button"
                      onClick={() => onJump(row.line, p.column)}
                      className="flex w-full items-start gap-2 rounded-soft px-2 py-1 text-left hover:bg-white/60 dark:hover:bg-white/10"
                    >
                      <ProblemText problem={p} line={row.line} />
                    </button>
                  ) : (
                    <span className="flex items-start gap-2 px-2 py-1">
                      <ProblemText problem={p} line={row.line} />
                    </span>
                  )}
                </li>
              ))}
            </ul>
          </td>
        </tr>
      ) : null}
    </>
  );
}

function ProblemText({ problem, line }: { problem: Problem; line: number }) {
  return (
    <>
      <AlertTriangle aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-clay" />
      <span>
        <span className="font-semibold">{problem.severity === 'error' ? 'Check' : 'Worth a look'}</span>
        <span className="text-ink/70 dark:text-oat/70">
          {' '}
          (line {line + 1}
          {problem.column != null ? `, column ${problem.column + 1}` : ''})
        </span>
        : {problem.message}
      </span>
    </>
  );
}
