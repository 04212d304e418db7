// What an edit to a started piece does to its Tally count. The project page shows these sentences before the
// maker saves, and the server moves the stored count with the very same rules when it saves, so what was said
// is what happens. Like progress-position.ts it lives beside the schemas because the server may import it, and
// it imports nothing but that file (the caller hands in the engine's rounds).

import { clampPosition, doneAt, normalize, samePosition, startPosition, type PieceShape, type Position } from './progress-position';

/** A round as the engine reads it, reduced to what the comparison needs. */
export interface ReworkRound {
  number: number;
  kind: 'round' | 'row';
  /** The instruction after the label: renumbering a round leaves it alone. */
  text: string;
  steps: number;
}

export const reworkRounds = (
  rounds: ReadonlyArray<{ number: number; kind: 'round' | 'row'; text: string; steps: ReadonlyArray<unknown> }>,
): ReworkRound[] => rounds.map((r) => ({ number: r.number, kind: r.kind, text: r.text, steps: r.steps.length }));

// Same as the Tally's shapeOf: a round it cannot split into steps is still one step to work.
const shapeFor = (rounds: ReworkRound[], copies: number): PieceShape => ({
  copies: Math.max(1, copies),
  stepsPerRound: rounds.map((r) => Math.max(1, r.steps)),
});

const sameText = (r: ReworkRound) => r.text.replace(/\s+/g, ' ').trim().toLowerCase();

// Past this many cells the middle of a long edit is treated as rewritten rather than aligned round by round.
const ALIGN_LIMIT = 250_000;

/**
 * For each old round, the new round with the same instruction (a longest common subsequence), or null when it
 * was changed or removed. Common starts and ends are matched first, so the usual edit costs next to nothing.
 */
export function alignRounds(before: ReworkRound[], after: ReworkRound[]): Array<number | null> {
  const a = before.map(sameText);
  const b = after.map(sameText);
  const out: Array<number | null> = a.map(() => null);
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) out[head] = head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) {
    out[a.length - 1 - tail] = b.length - 1 - tail;
    tail += 1;
  }
  const n = a.length - head - tail;
  const m = b.length - head - tail;
  if (n === 0 || m === 0 || n * m > ALIGN_LIMIT) return out;
  // lcs[i][j]: longest common run of a[head+i..] and b[head+j..].
  const lcs = Array.from({ length: n + 1 }, () => new Int32Array(m + 1));
  for (let i = n - 1; i >= 0; i -= 1)
    for (let j = m - 1; j >= 0; j -= 1)
      lcs[i][j] = a[head + i] === b[head + j] ? lcs[i + 1][j + 1] + 1 : Math.max(lcs[i + 1][j], lcs[i][j + 1]);
  for (let i = 0, j = 0; i < n && j < m; ) {
    if (a[head + i] === b[head + j]) {
      out[head + i] = head + j;
      i += 1;
      j += 1;
    } else if (lcs[i + 1][j] >= lcs[i][j + 1]) i += 1;
    else j += 1;
  }
  return out;
}

export interface ReworkInput {
  before: { rounds: ReworkRound[]; copies: number };
  after: { rounds: ReworkRound[]; copies: number };
  /** The stored Tally position. */
  position: Position;
}

export interface Rework {
  /** Where the count was, brought inside the old instructions. */
  from: Position;
  /** Where the Tally stands after the change. */
  to: Position;
  /** Steps done on the piece at `to`, as the Tally stores it. */
  done: number;
  /** The maker should read `messages` before saving. */
  notable: boolean;
  /** Plain sentences, in the order a maker would want them. */
  messages: string[];
  /** Moves any position of the old instructions (the undo history) the same way. */
  map: (p: Position) => Position;
}

const roundName = (r: ReworkRound | undefined, index: number) => (r ? `${r.kind === 'row' ? 'Row' : 'Rnd'} ${r.number}` : `round ${index + 1}`);

function names(list: string[]) {
  const shown = list.length > 4 ? [...list.slice(0, 3), `${list.length - 3} more`] : list;
  return shown.length > 1 ? `${shown.slice(0, -1).join(', ')} and ${shown[shown.length - 1]}` : (shown[0] ?? '');
}

/**
 * Moves the Tally's count through an edit of the piece: the count stays on the same written round even when
 * rounds before it are added or removed; a count past the new last round finishes that copy; a finished piece
 * with new rounds after its end goes back to the first of them. Copies must not drop below the copy being
 * worked (see copiesProblem); `to` is kept inside the new copies regardless.
 */
export function reworkPiece({ before, after, position }: ReworkInput): Rework {
  const oldShape = shapeFor(before.rounds, before.copies);
  const newShape = shapeFor(after.rounds, after.copies);
  const n = before.rounds.length;
  const m = after.rounds.length;
  const match = alignRounds(before.rounds, after.rounds);
  // The first new round after the last old round (before index r) that is still there.
  const reopenAt = (r: number) => {
    for (let k = Math.min(r, n) - 1; k >= 0; k -= 1) if (match[k] != null) return match[k]! + 1;
    return 0;
  };
  const newCopies = Math.max(1, after.copies);

  const map = (p: Position): Position => {
    if (m === 0) return { ...startPosition };
    const at = clampPosition(oldShape, p);
    const copy = Math.min(at.copy, newCopies);
    let round: number;
    let step = 0;
    if (at.round >= n) round = reopenAt(n);
    else if (match[at.round] != null) {
      round = match[at.round]!;
      step = Math.min(at.step, newShape.stepsPerRound[round]);
    } else {
      round = reopenAt(at.round);
      if (round < m) step = Math.min(at.step, newShape.stepsPerRound[round]);
    }
    if (round >= m) return copy < newCopies ? { copy: copy + 1, round: 0, step: 0 } : { copy, round: m, step: 0 };
    return normalize(newShape, { copy, round, step });
  };

  const from = n === 0 ? { ...startPosition } : clampPosition(oldShape, position);
  const to = map(from);
  const done = m === 0 ? 0 : doneAt(newShape, to);
  const messages: string[] = [];
  const started = !samePosition(from, startPosition);
  if (!started) return { from, to, done, notable: false, messages, map };

  const oldName = (i: number) => roundName(before.rounds[i], i);
  const newName = (i: number) => roundName(after.rounds[i], i);
  const word = (after.rounds[m - 1] ?? before.rounds[n - 1])?.kind === 'row' ? 'row' : 'round';
  const where = (p: Position, shape: PieceShape, name: (i: number) => string) => {
    const rounds = shape.stepsPerRound.length;
    const copy = shape.copies > 1 ? `, copy ${p.copy} of ${shape.copies}` : '';
    if (rounds === 0) return 'the start';
    if (p.round >= rounds) return `the end of the piece (done)`;
    const steps = shape.stepsPerRound[p.round];
    return (p.step > 0 ? `${name(p.round)}, step ${p.step} of ${steps}` : `the start of ${name(p.round)}`) + copy;
  };
  const finishedBefore = from.round >= n;
  const current = finishedBefore ? n : from.round;

  const matchedNew = new Set(match.filter((j): j is number => j != null));
  if (m === 0) {
    messages.push('The new instructions have no rounds to count, so the Tally count for this piece starts again from nothing.');
  } else {
    const mapped = finishedBefore ? reopenAt(n) : (match[current] ?? reopenAt(current));
    const reopened = finishedBefore && mapped < m;
    if (!finishedBefore && mapped >= m) {
      messages.push(
        `The Tally is at ${oldName(current)}, past the new last ${word} (${newName(m - 1)}). ` +
          (to.copy > from.copy
            ? `Saving counts copy ${from.copy} as done and starts copy ${to.copy} at ${newName(0)}.`
            : `Saving counts ${newCopies > 1 ? 'every copy of the piece' : 'the piece'} as done.`),
      );
    }
    if (reopened) {
      const fresh: number[] = [];
      for (let j = mapped; j < m; j += 1) if (!matchedNew.has(j)) fresh.push(j);
      const it = fresh.length === 1 ? 'it' : 'them';
      messages.push(
        `This piece was counted as done, and ${names(fresh.map(newName))} ${fresh.length === 1 ? 'is' : 'are'} new after its old last ${word}: ` +
          `the Tally goes back to ${newName(mapped)} so you can count ${it}.`,
      );
    } else if (finishedBefore && to.copy > from.copy) {
      messages.push(`Copy ${to.copy} is new: the Tally starts it at ${newName(0)}.`);
    }

    // Rounds already worked on this copy: old ones before the count with no match were changed or removed;
    // new ones before the count with no match were changed (paired with those) or added.
    const lostOld: number[] = [];
    for (let i = 0; i < Math.min(current, n); i += 1) if (match[i] == null) lostOld.push(i);
    const freshNew: number[] = [];
    const limitNew = reopened ? mapped : to.copy === from.copy ? Math.min(to.round, m) : m;
    for (let j = 0; j < limitNew; j += 1) if (!matchedNew.has(j)) freshNew.push(j);
    const changed = Math.min(lostOld.length, freshNew.length);
    if (changed) {
      const list = freshNew.slice(0, changed).map(newName);
      messages.push(
        `You have already worked ${names(list)}, and ${changed === 1 ? 'this change alters it' : 'these changes alter them'}. ` +
          'What you made stays as it is; check it against the new instructions.',
      );
    }
    if (lostOld.length > changed) {
      const list = lostOld.slice(changed).map(oldName);
      messages.push(`You have already worked ${names(list)} as the instructions were, and ${list.length === 1 ? 'it is' : 'they are'} no longer in them.`);
    }
    if (freshNew.length > changed) {
      const list = freshNew.slice(changed).map(newName);
      const it = list.length === 1 ? 'it' : 'them';
      messages.push(
        `${names(list)} ${list.length === 1 ? 'is' : 'are'} new and ${list.length === 1 ? 'comes' : 'come'} before your place, so the Tally counts ${it} as worked. ` +
          `If you have not worked ${it} yet, use “Jump to a round” in the Tally to go back.`,
      );
    }
    if (!finishedBefore && from.step > 0 && match[current] == null && mapped < m) {
      messages.push(
        `You are partway through ${oldName(current)} (step ${from.step} of ${oldShape.stepsPerRound[current]}) and its instructions change. ` +
          `The Tally keeps the steps counted; check them against the new ${newName(mapped)}.`,
      );
    }
  }
  const rewritten = match.some((j) => j == null) || matchedNew.size < m;
  if (to.copy > 1 && rewritten) {
    messages.push(`${to.copy === 2 ? 'Copy 1 was' : `Copies 1 to ${to.copy - 1} were`} made from the instructions as they were.`);
  }

  const renamed = !finishedBefore && current < n && to.round < m && oldName(current) !== newName(to.round);
  const notable = messages.length > 0 || renamed;
  if (notable) {
    const was = where(from, oldShape, oldName);
    const will = where(to, newShape, newName);
    messages.push(was === will ? `The Tally stays at ${will}.` : `The Tally was at ${was}; after saving it stands at ${will}.`);
  }
  return { from, to, done, notable, messages, map };
}

/**
 * Why a piece cannot have this few copies, in a sentence the maker can act on, or null. The copy being worked
 * (and any copy with a placement recorded on it) must stay.
 */
export function copiesProblem(name: string, position: Position, copies: number, placementCopies: readonly number[] = []): string | null {
  if (copies < position.copy)
    return `${name} is counted up to copy ${position.copy} in the Tally, so it needs at least ${position.copy} copies. To make fewer, first go back to an earlier copy with “Jump to a round” in the Tally.`;
  const marked = Math.max(0, ...placementCopies);
  if (copies < marked)
    return `${name} has a placement recorded on copy ${marked}, so it needs at least ${marked} copies. To make fewer, remove that placement in the Tally first.`;
  return null;
}
