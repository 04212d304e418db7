import {
  advance,
  clampPosition,
  finishRound,
  normalize,
  stepBack,
  targetProblem,
  type PieceShape,
  type Position,
} from '@/schemas/progress-position';
import type { ProgressOp } from '@/schemas/progress';

// What the screen shows: the server's last known position with the taps it has not answered yet laid on top,
// moved by the same arithmetic the server uses. When the server answers, its position (which includes those
// taps) replaces the guess, so the count on screen only ever moves the way the taps did.

export interface Folded {
  position: Position;
  /** Whether an undo has something to go back to. */
  canUndo: boolean;
}

/**
 * @param undoStack the server's undo stack when it matches the confirmed version, else null (then an undo of a
 *   tap the server already has is shown as one step back until the server answers).
 */
export function foldPending(
  shape: PieceShape,
  confirmed: Position,
  undoStack: Position[] | null,
  pending: ProgressOp[],
  confirmedHasEvents = true,
): Folded {
  let position = clampPosition(shape, confirmed);
  const server = undoStack ? [...undoStack] : null;
  const local: Position[] = [];
  for (const op of pending) {
    let next: Position | null = null;
    switch (op.action) {
      case 'step':
        next = advance(shape, position);
        break;
      case 'round':
        next = finishRound(shape, position);
        break;
      case 'set':
        next = op.to && !targetProblem(shape, op.to) ? normalize(shape, op.to) : null;
        break;
      case 'undo': {
        const back = local.pop() ?? (server ? server.pop() : stepBack(shape, position));
        if (back) position = clampPosition(shape, back);
        continue;
      }
    }
    if (next) {
      local.push(position);
      position = next;
    }
  }
  const canUndo =
    local.length > 0 ||
    (server ? server.length > 0 : confirmedHasEvents && stepBack(shape, position) !== null);
  return { position, canUndo };
}
