// How a tap moves the Tally through a piece. The server applies events with these functions and the client
// folds its not-yet-acknowledged taps over the server's position with the very same ones, so the screen
// shows what the server will answer. It lives beside the schemas because that is the one shared folder the
// server may import besides the engine; like them it imports nothing.

export interface Position {
  /** 1-based copy ("Ear 2 of 2"). */
  copy: number;
  /** 0-based index into the stitch engine's rounds for the piece (not the round's label number); equal to the
   * number of rounds once the last copy is finished. */
  round: number;
  /** Steps done in this round (0 … steps in the round). */
  step: number;
}

export interface PieceShape {
  copies: number;
  /** Steps per round, in the engine's round order. Always at least 1 per round. */
  stepsPerRound: number[];
}

export const startPosition: Position = { copy: 1, round: 0, step: 0 };

/**
 * A round the engine could not split into steps (an unusual stitch, a line it only partly read) still has to be
 * worked: it counts as one step, finished with one tap or "round done".
 */
export function shapeOf(
  rounds: ReadonlyArray<{ steps: ReadonlyArray<unknown> }>,
  copies: number,
): PieceShape {
  return { copies: Math.max(1, copies), stepsPerRound: rounds.map((r) => Math.max(1, r.steps.length)) };
}

export const stepsPerCopy = (shape: PieceShape) => shape.stepsPerRound.reduce((a, b) => a + b, 0);
export const totalSteps = (shape: PieceShape) => stepsPerCopy(shape) * shape.copies;

/**
 * Every round of every copy counted. The finished position is just past the last round of the last copy
 * (round = the number of rounds, step 0), so "rounds done" and "copies done" read straight off it.
 */
export function isFinished(shape: PieceShape, p: Position): boolean {
  const rounds = shape.stepsPerRound.length;
  if (rounds === 0) return true;
  if (p.copy < shape.copies) return false;
  return p.round >= rounds || (p.round === rounds - 1 && p.step >= shape.stepsPerRound[rounds - 1]);
}

/** A completed round moves on to the next round (or the next copy); after the very last one, past the end. */
export function normalize(shape: PieceShape, p: Position): Position {
  const rounds = shape.stepsPerRound.length;
  if (rounds === 0) return { ...startPosition };
  let { copy, round, step } = p;
  while (round < rounds && step >= shape.stepsPerRound[round]) {
    if (round < rounds - 1) {
      round += 1;
      step = 0;
    } else if (copy < shape.copies) {
      copy += 1;
      round = 0;
      step = 0;
    } else {
      round = rounds;
      step = 0;
    }
  }
  return { copy, round, step };
}

/** Brings a stored position back inside the piece, e.g. after its instructions were shortened. */
export function clampPosition(shape: PieceShape, p: Position): Position {
  const rounds = shape.stepsPerRound.length;
  if (rounds === 0) return { ...startPosition };
  const copy = Math.min(Math.max(1, p.copy), shape.copies);
  if (p.round >= rounds)
    return copy === shape.copies ? { copy, round: rounds, step: 0 } : { copy: copy + 1, round: 0, step: 0 };
  const round = Math.max(0, p.round);
  const step = Math.min(Math.max(0, p.step), shape.stepsPerRound[round]);
  return normalize(shape, { copy, round, step });
}

/** Total steps completed on the piece across all copies at this position. */
export function doneAt(shape: PieceShape, p: Position): number {
  let done = (p.copy - 1) * stepsPerCopy(shape);
  for (let r = 0; r < p.round && r < shape.stepsPerRound.length; r += 1) done += shape.stepsPerRound[r];
  return done + p.step;
}

/** One stitch (step) forward, or null at the end of the piece. */
export function advance(shape: PieceShape, p: Position): Position | null {
  if (isFinished(shape, p)) return null;
  return normalize(shape, { ...p, step: p.step + 1 });
}

/** The rest of the current round at once ("round done"), or null at the end of the piece. */
export function finishRound(shape: PieceShape, p: Position): Position | null {
  if (isFinished(shape, p)) return null;
  return normalize(shape, { ...p, step: shape.stepsPerRound[p.round] });
}

/** One step back, across a round or copy boundary (or from the end); null at the very start. */
export function stepBack(shape: PieceShape, p: Position): Position | null {
  const rounds = shape.stepsPerRound.length;
  if (rounds === 0) return null;
  if (p.round >= rounds)
    return { copy: p.copy, round: rounds - 1, step: shape.stepsPerRound[rounds - 1] - 1 };
  if (p.step > 0) return { ...p, step: p.step - 1 };
  if (p.round > 0) return { copy: p.copy, round: p.round - 1, step: shape.stepsPerRound[p.round - 1] - 1 };
  if (p.copy > 1) return { copy: p.copy - 1, round: rounds - 1, step: shape.stepsPerRound[rounds - 1] - 1 };
  return null;
}

/** Why a jump target is outside the piece, in a sentence, or null when it is fine. */
export function targetProblem(
  shape: PieceShape,
  to: Position,
  roundLabel: (index: number) => string = (i) => `round ${i + 1}`,
): string | null {
  const rounds = shape.stepsPerRound.length;
  if (rounds === 0) return 'This piece has no rounds to jump to yet.';
  if (to.copy > shape.copies)
    return `This piece is made ${shape.copies === 1 ? 'once' : `${shape.copies} times`}, so there is no copy ${to.copy}.`;
  if (to.round >= rounds)
    return `This piece has ${rounds} round${rounds === 1 ? '' : 's'} (round index 0 to ${rounds - 1}), so there is no round index ${to.round}.`;
  const steps = shape.stepsPerRound[to.round];
  if (to.step > steps)
    return `${roundLabel(to.round)} has ${steps} step${steps === 1 ? '' : 's'}, so step ${to.step} is past its end.`;
  return null;
}

export const samePosition = (a: Position, b: Position) =>
  a.copy === b.copy && a.round === b.round && a.step === b.step;
