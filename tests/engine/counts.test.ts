// Count helpers the app uses: totals, steps per round, where notes sit.
import { describe, expect, it } from 'vitest';
import { checkPiece, notesAfter, notesBefore, pieceTotals, placements, roundAt, stepsPerRound } from '@/engine';

const check = checkPiece(
  [
    'Body',
    'Rnd 1: 6 sc in MR (6)',
    'Rnd 2: inc x6 (12)',
    'Rnds 3-4: sc around (12)',
    'Change to color B',
    'Rnd 5: (sc, inc) x6 (19)',
    'Place safety eyes between Rnds 4 and 5, 4 sts apart',
    'Stuff firmly',
    'Rnd 6: (sc, dec) x6 (12)',
  ].join('\n'),
);

describe('count helpers', () => {
  it('pieceTotals sums stitches and steps and counts problems', () => {
    expect(pieceTotals(check)).toEqual({
      rounds: 6,
      stitches: 6 + 12 + 12 + 12 + 18 + 12,
      steps: 6 + 6 + 12 + 12 + 12 + 12,
      finalCount: 12,
      errors: 1,
      warnings: 0,
    });
    expect(check.totalStitches).toBe(72);
    expect(check.totalSteps).toBe(60);
  });

  it('stepsPerRound lists what the Tally walks per round', () => {
    expect(stepsPerRound(check)).toEqual([
      { number: 1, label: 'Rnd 1', steps: 6 },
      { number: 2, label: 'Rnd 2', steps: 6 },
      { number: 3, label: 'Rnds 3-4', steps: 12 },
      { number: 4, label: 'Rnds 3-4', steps: 12 },
      { number: 5, label: 'Rnd 5', steps: 12 },
      { number: 6, label: 'Rnd 6', steps: 12 },
    ]);
  });

  it('notesBefore / notesAfter find the notes at a round', () => {
    expect(notesBefore(check, 1).map((n) => n.text)).toEqual(['Body']);
    expect(notesBefore(check, 5).map((n) => n.text)).toEqual(['Change to color B']);
    expect(notesAfter(check, 4).map((n) => n.text)).toEqual(['Change to color B']);
    expect(notesAfter(check, 5).map((n) => n.kind)).toEqual(['placement', 'stuffing']);
    expect(notesBefore(check, 6).map((n) => n.kind)).toEqual(['placement', 'stuffing']);
    // A range shares one line: its notes come before the first of its rounds only.
    expect(notesBefore(check, 4)).toEqual([]);
    expect(notesBefore(check, 99)).toEqual([]);
    expect(roundAt(check, 5)?.stitches).toBe(18);
    expect(notesBefore(check, roundAt(check, 5)!).map((n) => n.text)).toEqual(['Change to color B']);
    expect(placements(check).map((n) => n.placement?.betweenRounds)).toEqual([[4, 5]]);
  });
});
