import { notesAfter, notesBefore } from '@/engine';
import type { Note, PieceCheck, Round, Step } from '@/engine/types';
import { isFinished, type PieceShape, type Position } from '@/schemas/progress-position';

// Everything the Tally says about a position, worked out from the engine's reading of the piece.

export interface Segment {
  text: string;
  current: boolean;
}

export interface RoundView {
  index: number;
  round: Round;
  /** "Rnd" or "Row". */
  word: string;
  /** "Rnd 7". */
  name: string;
  /** Last round's number, for "Rnd 7 of 17". */
  of: number;
  /** The round's line as written, split so the current step stands out. */
  segments: Segment[];
  /** The next step to work, or null when the round (or piece) is complete. */
  next: Step | null;
  stepsInRound: number;
  stepsDone: number;
  /** Stitches of the previous round worked into so far, and stitches made so far in this round. */
  worked: number;
  made: number;
  /** What the round should end with: the stated count, else the engine's count. */
  expected: number;
  finished: boolean;
}

export function roundWord(round: Pick<Round, 'kind'>) {
  return round.kind === 'row' ? 'Row' : 'Rnd';
}

/** "Rnd 7" for the round at an index. */
export function roundName(check: PieceCheck, index: number) {
  const r = check.rounds[index];
  return r ? `${roundWord(r)} ${r.number}` : `Round ${index + 1}`;
}

/** The round's source line with the current step's words marked (steps carry their column in that line). */
export function highlight(line: string, round: Round, step: Step | null): Segment[] {
  if (!step) return [{ text: line, current: false }];
  const start = Math.min(Math.max(0, step.column), line.length);
  // The stated count "(36)" at the end of the line is never part of a step.
  const count = /\s*[([]\s*\d+\s*(?:sts?|stitches)?\s*[)\]]\s*\.?\s*$/i.exec(line);
  const lineEnd = count && count.index > start ? count.index : line.length;
  const later = round.steps.map((s) => s.column).filter((c) => c > start && c < lineEnd);
  let end = later.length ? Math.min(...later) : lineEnd;
  // Inside a repeat "(sc, inc) x6" every pass shares the same columns: stop at the end of this stitch's words.
  const delimiter = /[,;)\]]/.exec(line.slice(start + 1, end));
  if (delimiter) end = start + 1 + delimiter.index;
  const raw = line.slice(start, end);
  // Trim the separators between steps so only the instruction itself is marked.
  const text = raw.replace(/[\s,;(]+$/, '');
  const parts: Segment[] = [];
  if (start > 0) parts.push({ text: line.slice(0, start), current: false });
  if (text) parts.push({ text, current: true });
  const rest = raw.slice(text.length) + line.slice(end);
  if (rest) parts.push({ text: rest, current: false });
  return parts.length ? parts : [{ text: line, current: false }];
}

export function roundView(
  check: PieceCheck,
  lines: string[],
  shape: PieceShape,
  position: Position,
): RoundView | null {
  const finished = isFinished(shape, position);
  // Past the end of the piece the last round is shown, complete.
  const index = Math.min(position.round, check.rounds.length - 1);
  const round = check.rounds[index];
  if (!round) return null;
  const stepsInRound = shape.stepsPerRound[index] ?? Math.max(1, round.steps.length);
  const stepsDone = finished ? stepsInRound : Math.min(position.step, stepsInRound);
  const next = !finished && stepsDone < round.steps.length ? round.steps[stepsDone] : null;
  let worked = 0;
  let made = 0;
  if (round.steps.length) {
    for (let i = 0; i < Math.min(stepsDone, round.steps.length); i += 1) {
      worked += round.steps[i].worksInto;
      made += round.steps[i].makes;
    }
  } else if (stepsDone > 0) {
    worked = round.worked;
    made = round.stitches;
  }
  const line = lines[round.line] ?? `${round.label}: ${round.text}`;
  const last = check.rounds[check.rounds.length - 1];
  return {
    index,
    round,
    word: roundWord(round),
    name: `${roundWord(round)} ${round.number}`,
    of: last.number,
    segments: highlight(line.trimEnd(), round, next),
    next,
    stepsInRound,
    stepsDone,
    worked,
    made,
    expected: round.stated ?? round.stitches,
    finished,
  };
}

export interface DueNote {
  /** Stable per copy, so an acknowledged note stays acknowledged. */
  key: string;
  note: Note;
  /** 'before': the pattern says it here; 'mark': where a placement goes; 'end': after the last round; 'copy': a new copy starts. */
  reason: 'before' | 'mark' | 'end' | 'copy';
}

/** Notes the maker must see at this position: before the round about to start, or at the end of a copy. */
export function notesDue(check: PieceCheck, position: Position, finished: boolean, copies = 1): DueNote[] {
  const due: DueNote[] = [];
  const lastRound = check.rounds[check.rounds.length - 1];
  const ends = lastRound ? notesAfter(check, lastRound) : [];
  if (finished) {
    for (const note of ends) due.push({ key: `${position.copy}:end:${note.line}`, note, reason: 'end' });
    return due;
  }
  if (position.step !== 0) return due;
  const round = check.rounds[position.round];
  if (!round) return due;
  if (position.round === 0 && position.copy > 1) {
    for (const note of ends) due.push({ key: `${position.copy - 1}:end:${note.line}`, note, reason: 'end' });
    due.push({
      key: `${position.copy}:start`,
      note: {
        line: -1,
        text: `Copy ${position.copy - 1} is done. Start copy ${position.copy} of ${copies} from the first round.`,
        kind: 'other',
        afterRound: null,
        beforeRound: round.number,
      },
      reason: 'copy',
    });
  }
  // The engine's notesBefore already keeps a note before a range ("Rnds 7-12") to the range's first round.
  const before = notesBefore(check, round);
  for (const note of before)
    due.push({ key: `${position.copy}:${note.line}:before`, note, reason: 'before' });
  // A placement is also shown where it goes ("eyes between Rnds 9 and 10" at Rnd 10), so the spot can be marked.
  for (const note of check.notes) {
    const p = note.placement;
    if (note.kind !== 'placement' || !p || before.includes(note)) continue;
    const at = p.betweenRounds ? p.betweenRounds[1] : p.atRound;
    if (at === round.number) due.push({ key: `${position.copy}:${note.line}:mark`, note, reason: 'mark' });
  }
  return due;
}
