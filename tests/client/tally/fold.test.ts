import { describe, expect, it } from 'vitest';
import { foldPending } from '@/features/tally/lib/fold';
import { highlight, notesDue } from '@/features/tally/lib/piece-view';
import { checkPiece } from '@/engine';

// Rounds of 3, 2 and 4 steps, made twice.
const shape = { copies: 2, stepsPerRound: [3, 2, 4] };
const at = (copy: number, round: number, step: number) => ({ copy, round, step });
const tap = (action: 'step' | 'round' | 'undo') => ({ opId: `op-${Math.random()}`, action });

describe('what the Tally shows before the server answers', () => {
  it('lays unanswered taps over the server position, across round and copy boundaries', () => {
    expect(foldPending(shape, at(1, 0, 2), [], [tap('step')]).position).toEqual(at(1, 1, 0));
    expect(foldPending(shape, at(1, 2, 3), [], [tap('step')]).position).toEqual(at(2, 0, 0));
    expect(foldPending(shape, at(1, 1, 0), [], [tap('round'), tap('round')]).position).toEqual(at(2, 0, 0));
  });

  it('stops at the end of the last copy', () => {
    expect(foldPending(shape, at(2, 2, 3), [], [tap('step'), tap('step'), tap('step')]).position).toEqual(
      at(2, 3, 0),
    );
  });

  it('undoes its own taps exactly, then the server’s from its undo stack', () => {
    const r = foldPending(shape, at(1, 1, 1), [at(1, 0, 1)], [tap('round'), tap('undo'), tap('undo')]);
    expect(r.position).toEqual(at(1, 0, 1));
    expect(r.canUndo).toBe(false);
  });

  it('shows an undo of a tap the server already has as one step back when its stack is not known yet', () => {
    expect(foldPending(shape, at(1, 1, 0), null, [tap('undo')]).position).toEqual(at(1, 0, 2));
    expect(foldPending(shape, at(2, 0, 0), null, [tap('undo')]).position).toEqual(at(1, 2, 3));
  });

  it('has nothing to undo on a fresh piece', () => {
    expect(foldPending(shape, at(1, 0, 0), [], []).canUndo).toBe(false);
    expect(foldPending(shape, at(1, 0, 0), null, [], false).canUndo).toBe(false);
  });
});

describe('the round as the Tally shows it', () => {
  const text = [
    'With plum yarn:',
    'Rnd 1: 6 sc in MR (6)',
    'Rnd 2: inc x6 (12)',
    'Change to pink yarn.',
    'Rnds 3-4: (sc, inc) x6 (18)',
    'Place safety eyes between Rnds 3 and 4.',
    'Rnd 5: sc around (18)',
    'Fasten off.',
  ].join('\n');
  const check = checkPiece(text);

  it('marks the step being worked in the line as written, leaving the stated count out', () => {
    const r = check.rounds[2];
    const line = text.split('\n')[r.line];
    const parts = highlight(line, r, r.steps[1]);
    expect(parts.find((p) => p.current)?.text).toBe('inc');
    const last = highlight(line, r, r.steps[r.steps.length - 1]);
    expect(last.map((p) => p.text).join('')).toBe(line);
    expect(last.find((p) => p.current)?.text).not.toMatch(/\(18\)/);
    const around = check.rounds[4];
    const aroundLine = text.split('\n')[around.line];
    expect(highlight(aroundLine, around, around.steps[0]).find((p) => p.current)?.text).toBe('sc around');
    const ring = check.rounds[0];
    expect(highlight(text.split('\n')[ring.line], ring, ring.steps[0]).find((p) => p.current)?.text).toBe(
      '6 sc in MR',
    );
  });

  it('brings up the notes before a round, a placement where it goes, and the end notes', () => {
    const keys = (copy: number, round: number, step = 0, finished = false) =>
      notesDue(check, { copy, round, step }, finished, 2).map((d) => `${d.reason}:${d.note.text}`);
    expect(keys(1, 0)).toEqual(['before:With plum yarn:']);
    expect(keys(1, 0, 1)).toEqual([]);
    expect(keys(1, 2)).toEqual(['before:Change to pink yarn.']);
    // The range's second round is not "before" anything, but it is where the eyes go.
    expect(keys(1, 3)).toEqual(['mark:Place safety eyes between Rnds 3 and 4.']);
    expect(keys(1, 4)).toEqual(['before:Place safety eyes between Rnds 3 and 4.']);
    expect(keys(2, 0)).toEqual([
      'end:Fasten off.',
      'copy:Copy 1 is done. Start copy 2 of 2 from the first round.',
      'before:With plum yarn:',
    ]);
    expect(keys(2, 4, 18, true)).toEqual(['end:Fasten off.']);
  });
});
