// One slip, one complaint (issue 4): after a round whose instructions miss its stated count, the next
// round may be written for the stated count (the designer's count) or for what the instructions make.
// The engine carries on from the computed count and complains about a later round only when it is wrong
// from both. Counting rules are common practice (standards.md §8: an inc uses 1 and makes 2, an sc2tog
// uses 2 and makes 1; "ch 1" at the start of a row is not a stitch, "ch 3 (counts as dc)" is one).
// All pieces are our own scenarios.
import { describe, expect, it } from 'vitest';
import { checkPiece, type PieceCheck } from '@/engine';

const said = (check: PieceCheck) => check.rounds.map((r) => [r.label, r.stitches, r.problems.map((p) => p.message)]);

describe('a slip in the instructions: later rounds follow the stated count', () => {
  it('a foundation row that stops short is the only complaint', () => {
    const check = checkPiece(
      [
        'Row 1: ch 11, sc in 2nd ch from hook (10)',
        'Row 2: ch 1, turn, sc across (10)',
        'Row 3: ch 3 (counts as dc), dc in each st across, turn (10)',
      ].join('\n'),
    );
    expect(said(check)).toEqual([
      ['Row 1', 1, ["Row 1 works 1 of 10 chains; 9 are left unworked — say 'leave the remaining 9 ch unworked' if that is meant (it makes 1, not the 10 stated)"]],
      // Right from the stated 10: no complaint, but the count carries on from what was really made.
      ['Row 2', 1, []],
      ['Row 3', 1, []],
    ]);
  });

  it('a round that works too few, then increases written for the stated count', () => {
    const check = checkPiece(
      [
        'Rnd 1: 6 sc in MR (6)',
        'Rnd 2: inc x6 (12)',
        'Rnd 3: (sc, inc) x5 (18)',
        'Rnd 4: (2 sc, inc) x6 (24)',
        'Rnd 5: (3 sc, inc) x6 (30)',
      ].join('\n'),
    );
    expect(said(check)).toEqual([
      ['Rnd 1', 6, []],
      ['Rnd 2', 12, []],
      ['Rnd 3', 15, ["Round 3 works 10 of 12 stitches; 2 are left unworked — say 'leave the remaining 2 sts unworked' if that is meant (it makes 15, not the 18 stated)"]],
      // From the computed 15, (2 sc, inc) x6 would work 18: but it is right from the stated 18.
      ['Rnd 4', 24, []],
      ['Rnd 5', 30, []],
    ]);
    expect(check.rounds[3].worked).toBe(18);
  });

  it('a round with no stated count passes the stated count on', () => {
    const check = checkPiece(
      [
        'Row 1: ch 11, sc in 2nd ch from hook (10)',
        'Row 2: ch 1, turn, sc across',
        'Row 3: ch 1, turn, sc in next 10 sts (10)',
      ].join('\n'),
    );
    expect(said(check).map(([, , p]) => p)).toEqual([[expect.stringContaining('Row 1 works 1 of 10 chains')], [], []]);
  });

  it('a later round wrong from both starts is still a slip of its own', () => {
    const check = checkPiece(
      [
        'Rnd 1: 6 sc in MR (6)',
        'Rnd 2: inc x6 (12)',
        'Rnd 3: sc in next 10 sts (12)',
        'Rnd 4: sc around (12)',
        // From 12 this works 12 and makes 18, not 24; from the computed 10 it works 12 of 10.
        'Rnd 5: (sc, inc) x6 (24)',
      ].join('\n'),
    );
    const problems = check.rounds.map((r) => r.problems.map((p) => p.message));
    expect(problems[2]).toEqual([expect.stringContaining('Round 3 works 10 of 12 stitches')]);
    expect(problems[3]).toEqual([]);
    expect(problems[4]).toEqual(['Round 5 works 12 stitches, but Round 4 has only 10 (it makes 18, not the 24 stated)']);
  });

  it('once a stated count matches again, the next round is checked from that count only', () => {
    const check = checkPiece(
      [
        'Rnd 1: 6 sc in MR (6)',
        'Rnd 2: inc x6 (13)',
        'Rnd 3: sc around (12)',
        // Would be right from Rnd 2's stated 13, but Rnd 3 states 12 and makes 12.
        'Rnd 4: sc in next 13 sts (13)',
      ].join('\n'),
    );
    expect(check.rounds.map((r) => r.problems.map((p) => p.message))).toEqual([
      [],
      ['Round 2 makes 12 stitches, not 13'],
      [],
      ['Round 4 works 13 stitches, but Round 3 has only 12'],
    ]);
  });
});

describe('a slip in the stated count: later rounds follow the instructions', () => {
  it('Rnd 6 states 31 but makes 30; Rnd 7 is right from 30 and says nothing', () => {
    const check = checkPiece(
      [
        'Rnd 1: 6 sc in MR (6)',
        'Rnd 2: inc x6 (12)',
        'Rnd 3: (sc, inc) x6 (18)',
        'Rnd 4: (2 sc, inc) x6 (24)',
        'Rnd 5: (3 sc, inc) x6 (30)',
        'Rnd 6: sc around (31)',
        // From the stated 31 it would leave 1 over; from the computed 30 it works 30 and makes 36.
        'Rnd 7: (4 sc, inc) x6 (36)',
        'Rnd 8: sc around (36)',
      ].join('\n'),
    );
    expect(said(check).slice(5)).toEqual([
      ['Rnd 6', 30, ['Round 6 makes 30 stitches, not 31']],
      ['Rnd 7', 36, []],
      ['Rnd 8', 36, []],
    ]);
    expect(check.rounds[6].worked).toBe(30);
  });

  it('a range after the slip is checked round by round the same way', () => {
    const check = checkPiece(['Rnd 1: 6 sc in MR (6)', 'Rnd 2: inc x6 (11)', 'Rnds 3-5: sc around (12)'].join('\n'));
    expect(said(check)).toEqual([
      ['Rnd 1', 6, []],
      ['Rnd 2', 12, ['Round 2 makes 12 stitches, not 11']],
      ['Rnds 3-5', 12, []],
      ['Rnds 3-5', 12, []],
      ['Rnds 3-5', 12, []],
    ]);
  });
});
