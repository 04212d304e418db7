// Foundation rows worked "and across", counts stated in the label, and join / yarn lines as notes.
// Counting rules are common practice: "sc in 2nd ch from hook" skips one chain for the turn, so a chain of
// 11 gives 10 sc; for "dc in 4th ch from hook" the 3 skipped chains count as the first dc. All examples are
// our own.
import { describe, expect, it } from 'vitest';
import { checkPiece, classifyNote, type Round } from '@/engine';

function only(text: string, start = 0): Round {
  const rounds = checkPiece(text, { start }).rounds;
  expect(rounds, text).toHaveLength(1);
  return rounds[0];
}

const messages = (r: Round) => r.problems.map((p) => p.message);

describe('"… from hook and across" works the rest of the chain', () => {
  it.each([
    'Row 1: ch 11, sc in 2nd ch from hook and across (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and in each ch across (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and in each remaining ch (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and in each rem ch (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and in each ch to end (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and each ch across (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and to end, turn (10)',
    'Row 1: ch 11, sc in 2nd ch from hook and in each remaining ch across, turn (10)',
  ])('%s', (text) => {
    const r = only(text);
    expect(messages(r)).toEqual([]);
    expect([r.stitches, r.worked, r.made]).toEqual([10, 10, { sc: 10 }]);
    expect(r.steps.filter((s) => s.action === 'sc')).toHaveLength(10);
  });

  it('taller stitches too, with the skipped chains as the first stitch', () => {
    const dc = only('Row 1: ch 12, dc in 4th ch from hook and across (10)');
    expect([messages(dc), dc.stitches, dc.worked, dc.made]).toEqual([[], 10, 9, { dc: 10 }]);
    const hdc = only('Row 1: ch 12, hdc in 3rd ch from hook and in each ch across (10)');
    expect([messages(hdc), hdc.stitches, hdc.made]).toEqual([[], 10, { hdc: 10 }]);
  });

  it('"and across" after a stitch into the first stitch of a row works the rest of the row', () => {
    const r = only('Row 2: ch 1, turn, sc in first st and across (10)', 10);
    expect([r.stitches, r.worked, messages(r)]).toEqual([10, 10, []]);
  });

  it('"remaining ch" is what is worked into, not one more chain made', () => {
    // Before: "each remaining ch" read the ch as a chain stitch, 11 instead of 10.
    expect(only('Row 1: ch 11, sc in 2nd ch from hook and in each remaining ch (10)').made).toEqual({ sc: 10 });
    // …but a chain with a count after "across" is still a chain.
    expect(only('Row 2: sc across ch 2', 10).made).toEqual({ sc: 10, ch: 2 });
  });
});

describe('a count stated in the label', () => {
  it.each([
    ['Round 5 (36 sts): (4 sc, inc) x6', 36],
    ['Rnd 5 [36]: (4 sc, inc) x6', 36],
    ['Rnd 5 (36 stitches): (4 sc, inc) x6', 36],
    ['Rnd 5 (36 sts) (4 sc, inc) x6', 36],
    ['Rnd 5: (4 sc, inc) x6 (36)', 36],
  ])('%s', (text, stated) => {
    const r = only(text, 30);
    expect([r.stated, r.stitches, messages(r)]).toEqual([stated, 36, []]);
  });

  it('is checked like a count at the end, pointing at the label', () => {
    const text = 'Round 5 (35 sts): (4 sc, inc) x6';
    const r = only(text, 30);
    expect(messages(r)).toEqual(['Round 5 makes 36 stitches, not 35']);
    expect(r.problems[0].column).toBe(text.indexOf('(35'));
  });

  it('two counts that differ are said once; the one the round makes is the stated one', () => {
    const text = 'Rnd 5 (35): (4 sc, inc) x6 (36)';
    const r = only(text, 30);
    expect(r.stated).toBe(36);
    expect(r.problems).toEqual([
      { message: 'Round 5 gives two counts: 35 in the label and 36 at the end of the line', column: text.indexOf('(35)'), severity: 'warning' },
    ]);
    // The label's count is the one made: the end of the line is the one off.
    const l = only('Rnd 5 (36): (4 sc, inc) x6 (35)', 30);
    expect([l.stated, messages(l)]).toEqual([36, ['Round 5 gives two counts: 36 in the label and 35 at the end of the line']]);
    // Neither: the two counts, and what the round makes against the one at the end.
    const n = only('Rnd 5 (40): (4 sc, inc) x6 (42)', 30);
    expect([n.stated, messages(n)]).toEqual([
      42,
      ['Round 5 gives two counts: 40 in the label and 42 at the end of the line', 'Round 5 makes 36 stitches, not 42'],
    ]);
  });

  it('a range with a count in its label states it for every round', () => {
    const rounds = checkPiece('Rnds 6-8 (36 sts): sc around', { start: 36 }).rounds;
    expect(rounds.map((r) => [r.number, r.stated, r.problems.length])).toEqual([
      [6, 36, 0],
      [7, 36, 0],
      [8, 36, 0],
    ]);
  });

  it('a bracket that is not a count or an aside, with no colon, is the first group of the round', () => {
    // Before: "(sc, inc)" was taken as part of the label and the round read "x6" alone.
    const r = only('Rnd 3 (sc, inc) x6 (18)', 12);
    expect([r.label, r.stitches, r.stated, messages(r)]).toEqual(['Rnd 3', 18, 18, []]);
    const aside = only('Row 2 (RS) sc across (10)', 10);
    expect([aside.label, aside.stitches, messages(aside)]).toEqual(['Row 2', 10, []]);
    const loop = only('Rnd 7 (BLO) sc around (36)', 36);
    expect([loop.loops, messages(loop)]).toEqual([['blo'], []]);
  });

  it('"(2 sc) in next st" at the start of a round is a group, not a count', () => {
    const r = only('Rnd 9: (2 sc) in next st, sc in next 11 sts', 12);
    expect([r.stitches, r.stated, messages(r)]).toEqual([13, null, []]);
  });
});

describe('join and yarn lines', () => {
  it.each([
    ['Join with sl st to first sc.', 'join'],
    ['Join with a slip stitch in the first st', 'join'],
    ['Join.', 'join'],
    ['Join to first sc', 'join'],
    ['Join the round with a sl st', 'join'],
    ['Sl st in first sc to join.', 'join'],
    ['Sl st to join', 'join'],
    ['ss in first dc to join', 'join'],
    ['Join the ears to the head', 'other'],
    ['Join new yarn', 'colour'],
    ['Join B with sl st to first sc', 'colour'],
    ['With plum yarn:', 'colour'],
    ['Using the green yarn:', 'colour'],
  ])('%s → %s', (text, kind) => {
    expect(classifyNote(text).kind).toBe(kind);
  });

  it('a join on its own line after a round is a join note at the end of that round, not a round', () => {
    const check = checkPiece(
      [
        'Rnd 1: 6 sc in MR (6)',
        'Join with sl st to first sc.',
        'Rnd 2: ch 1, 2 sc in each st around (12)',
        'Sl st in first sc to join.',
        'Using the green yarn:',
        'Rnd 3: (sc, inc) x6 (18)',
        'With plum yarn:',
        'Rnd 4: (2 sc, inc) x6 (24)',
      ].join('\n'),
    );
    expect(check.rounds.map((r) => [r.label, r.stitches, r.problems.length])).toEqual([
      ['Rnd 1', 6, 0],
      ['Rnd 2', 12, 0],
      ['Rnd 3', 18, 0],
      ['Rnd 4', 24, 0],
    ]);
    expect(check.notes.map((n) => [n.text, n.kind, n.afterRound, n.beforeRound])).toEqual([
      ['Join with sl st to first sc.', 'join', 1, 2],
      ['Sl st in first sc to join.', 'join', 2, 3],
      ['Using the green yarn:', 'colour', 2, 3],
      ['With plum yarn:', 'colour', 3, 4],
    ]);
  });

  it('a join with no round before it is only words', () => {
    const check = checkPiece('Join with sl st to first sc.\nRnd 1: 6 sc in MR (6)');
    expect(check.notes.map((n) => n.kind)).toEqual(['other']);
  });
});
