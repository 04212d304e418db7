import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { checkPiece } from '@/engine';
import type { Terms } from '@/engine/types';
import {
  doneAt,
  isFinished,
  samePosition,
  shapeOf,
  stepsPerCopy,
  type Position,
} from '@/schemas/progress-position';
import type { ProgressAction } from '@/schemas/progress';
import { useProgress } from '../api/get-progress';
import { useHistory } from '../api/get-history';
import { foldPending } from '../lib/fold';
import { notesDue, roundView } from '../lib/piece-view';
import { outbox } from '../lib/outbox';
import { newOpId } from '../lib/op-id';
import { readAcknowledged, writeAcknowledged } from '../lib/acknowledged';
import { SessionClock } from '../lib/session-clock';
import { useOutbox } from './use-outbox';

/**
 * The same position object for as long as the count stays put, so an answer from the server that only confirms
 * what the screen already shows redraws nothing.
 */
function useSamePosition(p: Position | null): Position | null {
  const kept = useRef(p);
  if (p === null || kept.current === null || !samePosition(kept.current, p)) kept.current = p;
  return kept.current;
}

export interface TallyPiece {
  id: number;
  name: string;
  copies: number;
  instructions: string;
}

/**
 * The Tally's state for one piece: the engine's reading of it, the position on screen (the server's, with this
 * device's unanswered taps on top) and the actions. Every action is queued in the outbox first.
 */
export function useTally(piece: TallyPiece, terms: Terms, memberId: string) {
  const check = useMemo(() => checkPiece(piece.instructions, { terms }), [piece.instructions, terms]);
  const lines = useMemo(() => piece.instructions.split(/\r?\n/), [piece.instructions]);
  const shape = useMemo(() => shapeOf(check.rounds, piece.copies), [check, piece.copies]);
  const progress = useProgress(piece.id);
  const history = useHistory(piece.id);
  const box = useOutbox();

  const pending = useMemo(
    () =>
      box.items.flatMap((i) =>
        i.kind === 'progress' && i.pieceId === piece.id && i.memberId === memberId ? [i.op] : [],
      ),
    [box.items, piece.id, memberId],
  );
  const waiting = useMemo(
    () => box.items.filter((i) => i.memberId === memberId).length,
    [box.items, memberId],
  );

  const confirmed = progress.data;
  const stack =
    history.data && confirmed && history.data.version === confirmed.version ? history.data.undo : null;
  const folded = useMemo(
    () => (confirmed ? foldPending(shape, confirmed, stack, pending, confirmed.version > 0) : null),
    [shape, confirmed, stack, pending],
  );
  const position = useSamePosition(folded?.position ?? null);
  const finished = position ? isFinished(shape, position) : false;
  const view = useMemo(
    () => (position ? roundView(check, lines, shape, position) : null),
    [check, lines, shape, position],
  );

  const [acknowledged, setAcknowledged] = useState(() => readAcknowledged(piece.id));
  const due = useMemo(
    () => (position ? notesDue(check, position, finished, shape.copies) : []),
    [check, position, finished, shape.copies],
  );
  const unread = useMemo(() => due.filter((d) => !acknowledged.has(d.key)), [due, acknowledged]);

  const [clock] = useState(() => new SessionClock());
  useEffect(() => () => clock.save(), [clock]);

  const send = useCallback(
    (action: ProgressAction, to?: Position) => {
      outbox.enqueue(
        {
          kind: 'progress',
          pieceId: piece.id,
          op: { opId: newOpId(), action, at: new Date().toISOString(), ...(to ? { to } : {}) },
        },
        memberId,
      );
    },
    [piece.id, memberId],
  );

  const acknowledge = useCallback(
    (key: string) => {
      setAcknowledged((old) => {
        const next = new Set(old).add(key);
        writeAcknowledged(piece.id, next);
        return next;
      });
    },
    [piece.id],
  );

  /** One stitch, unless a note is waiting (then the tap confirms the note) or the piece is done. */
  const step = useCallback((): 'step' | 'note' | 'end' | 'round' => {
    if (!position || !view) return 'end';
    if (unread.length) {
      acknowledge(unread[0].key);
      return 'note';
    }
    if (finished) return 'end';
    const made = view.next?.makes ?? view.round.stitches;
    const roundEnds = view.stepsDone + 1 >= view.stepsInRound;
    send('step');
    clock.tap(Date.now(), 1, made);
    return roundEnds ? 'round' : 'step';
  }, [position, view, unread, finished, acknowledge, send, clock]);

  /** The rest of the round at once ("round done"). */
  const round = useCallback((): 'round' | 'note' | 'end' => {
    if (!position || !view) return 'end';
    if (unread.length) {
      acknowledge(unread[0].key);
      return 'note';
    }
    if (finished) return 'end';
    const rest = view.round.steps.slice(view.stepsDone);
    const made = rest.length ? rest.reduce((a, s) => a + s.makes, 0) : view.round.stitches;
    send('round');
    clock.tap(Date.now(), view.stepsInRound - view.stepsDone, made);
    return 'round';
  }, [position, view, unread, finished, acknowledge, send, clock]);

  const undo = useCallback(() => {
    if (!folded?.canUndo) return false;
    send('undo');
    clock.undo(Date.now());
    return true;
  }, [folded, send, clock]);

  const jump = useCallback((to: Position) => send('set', to), [send]);

  const done = position ? doneAt(shape, position) : 0;
  const totalSteps = stepsPerCopy(shape) * shape.copies;

  return {
    check,
    shape,
    lines,
    progress,
    position,
    view,
    finished,
    canUndo: folded?.canUndo ?? false,
    due,
    unread,
    acknowledge,
    waiting,
    outboxLoaded: box.loaded,
    done,
    totalSteps,
    remainingSteps: Math.max(0, totalSteps - done),
    clock,
    step,
    round,
    undo,
    jump,
  };
}

export type Tally = ReturnType<typeof useTally>;
