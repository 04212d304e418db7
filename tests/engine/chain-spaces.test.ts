// Chain spaces: "ch N" inside a round makes a chain space, and the next round's "in each ch-sp around",
// "in next ch-sp" and "sk next ch-sp" are counted against the spaces the round before made.
// Source: Craft Yarn Council abbreviation list — "ch-sp" chain space; "ch-" refers to a chain or space
// made earlier, e.g. ch-1 space (standards.md §4, from memory, not verified); S23 (standards.md §4): "ch-5"
// is a loop made of 5 chains, "ch 5" means make 5 chain stitches.
// Counting rules (common practice): a chain makes one stitch for the next round; working into a ch-N
// space works its N chains and passes the stitches before it; the stitches after the last space are
// passed on the way to the join; a row meets the row before from its last stitch. The patterns are our own.
import { describe, expect, it } from 'vitest';
import { checkPiece, type PieceCheck, type Round } from '@/engine';

const messages = (r: Round) => r.problems.map((p) => p.message);
const summary = (c: PieceCheck) => c.rounds.map((r) => [r.label, r.stitches, r.worked, messages(r)]);

describe('in each ch-sp around', () => {
  it('counts the spaces of a mesh round, and the stitches between them are passed', () => {
    const c = checkPiece(
      [
        'Rnd 1: 6 sc in MR (6)',
        'Rnd 2: (sc, ch 1) in each st around (12)',
        'Rnd 3: (sc, ch 1) in each ch-sp around (12)',
        'Rnd 4: sc in each ch-sp around (6)',
        'Rnd 5: (sc, ch 2) in each st around (18)',
        'Rnd 6: sl st in first ch-sp, ch 1, 3 sc in same sp and in each ch-sp around, join (18)',
      ].join('\n'),
    );
    expect(summary(c)).toEqual([
      ['Rnd 1', 6, 0, []],
      ['Rnd 2', 12, 6, []],
      ['Rnd 3', 12, 12, []],
      ['Rnd 4', 6, 12, []],
      ['Rnd 5', 18, 6, []],
      ['Rnd 6', 18, 18, []],
    ]);
    // One step per space; each works the sc before the space and its chain.
    expect(c.rounds[2].steps.map((s) => [s.worksInto, s.makes])).toEqual(Array.from({ length: 6 }, () => [2, 2]));
    // The slip stitch moving into the first space makes no stitch; the ch 1 after it is the starting chain.
    expect(c.rounds[5].steps.slice(0, 2).map((s) => [s.action, s.worksInto, s.makes])).toEqual([
      ['sl st', 3, 0],
      ['ch 1', 0, 0],
    ]);
    expect(c.rounds[5].steps[0].text).toBe('sl st in the next space (moves the yarn into place; not a stitch)');
  });

  it('a square with corner spaces, rep from * over the spaces of the round before', () => {
    const c = checkPiece(
      [
        'Rnd 1: ch 4, join to form a ring, ch 3 (counts as dc), 2 dc in ring, ch 2, (3 dc in ring, ch 2) x3, join (20)',
        'Rnd 2: sl st in next 2 dc and in next ch-2 sp, ch 3 (counts as dc), (2 dc, ch 2, 3 dc) in same sp, ch 1, *(3 dc, ch 2, 3 dc) in next ch-2 sp, ch 1; rep from * twice, join (36)',
        'Rnd 3: sl st in next 2 dc and in next ch-2 sp, ch 3 (counts as dc), (2 dc, ch 2, 3 dc) in same sp, ch 1, 3 dc in next ch-1 sp, ch 1, *(3 dc, ch 2, 3 dc) in next ch-2 sp, ch 1, 3 dc in next ch-1 sp, ch 1; rep from * around, join (52)',
      ].join('\n'),
    );
    expect(summary(c)).toEqual([
      ['Rnd 1', 20, 0, []],
      ['Rnd 2', 36, 20, []],
      ['Rnd 3', 52, 36, []],
    ]);
    expect(c.rounds[2].made).toEqual({ dc: 36, ch: 16 });
    // Rnd 3 works into 8 spaces: 2 before the repeat, then 2 each time for 3 repeats.
    expect(c.rounds[2].steps.filter((s) => s.action === '3 dc' || s.action.startsWith('(3 dc')).map((s) => s.repeat?.of ?? null)).toEqual([
      null, 3, 3, 3, 3, 3, 3,
    ]);
  });

  it('"ch 5 (counts as dc + ch 2)" makes a chain space too', () => {
    const c = checkPiece(
      [
        'Rnd 1: ch 5 (counts as dc + ch 2), (dc in ring, ch 2) x7, join to 3rd ch of beg ch-5 (24)',
        'Rnd 2: sl st in next ch-2 sp, ch 1, (sc, ch 3) in same sp and in each ch-2 sp around, join (32)',
        'Rnd 3: sl st in next ch-3 sp, ch 3 (counts as dc), 3 dc in same sp, 4 dc in each ch-3 sp around, join (32)',
      ].join('\n'),
    );
    expect(summary(c)).toEqual([
      ['Rnd 1', 24, 0, []],
      ['Rnd 2', 32, 24, []],
      ['Rnd 3', 32, 32, []],
    ]);
    expect(c.rounds[0].steps[0]).toMatchObject({ action: 'ch 5', makes: 3, text: 'ch 5 (counts as the first dc and a ch-2 space)' });
    expect(c.rounds[0].made).toEqual({ dc: 8, ch: 16 });
  });

  it('a slip into the first space is not a space worked "in each ch-sp around"', () => {
    // 6 spaces; the slip stitch takes the first, so "in each ch-sp around" works the other 5.
    const c = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: (sc, ch 1) in each st around (12)\nRnd 3: sl st in next ch-sp, ch 1, (sc, ch 1) in each ch-sp around, join (12)');
    expect(messages(c.rounds[2])).toEqual(['Round 3 makes 10 stitches, not 12']);
  });

  it('rows meet the row before from its far end', () => {
    const c = checkPiece(
      [
        'Row 1: ch 12, sc in 2nd ch from hook and in each ch across, turn (11)',
        // The gap sits after 3 stitches from this end, so after 6 from the other end.
        'Row 2: ch 1, sc in first 3 sts, ch 2, sk 2, sc in next 6 sts, turn (11)',
        'Row 3: ch 1, sc in next 6 sts, 2 sc in next ch-2 sp, sc in next 3 sts, turn (11)',
        'Row 4: ch 1, sc in first st, *ch 1, sk next st, sc in next st; rep from * across, turn (11)',
        'Row 5: ch 1, sc in first st, *sc in next ch-sp, sc in next st; rep from * across, turn (11)',
        'Row 6: ch 1, sc in first st, *ch 1, sk next st, sc in next st; rep from * across, turn (11)',
        'Row 7: ch 1, (sc, ch 1) in each ch-sp across, sc in last st, turn (11)',
      ].join('\n'),
    );
    expect(c.rounds.map((r) => [r.label, r.stitches, r.worked, messages(r)])).toEqual(
      [1, 2, 3, 4, 5, 6, 7].map((n) => [`Row ${n}`, 11, 11, []]),
    );
  });

  it('sk next ch-sp skips a whole space', () => {
    const c = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: (sc, ch 2) in each st around (18)\nRnd 3: *sc in next ch-sp, ch 3, sk next ch-sp; rep from * around, join (12)');
    expect(summary(c)[2]).toEqual(['Rnd 3', 12, 18, []]);
  });
});

describe('what cannot be counted is said', () => {
  it('a repeat over spaces that does not fit says what is left over', () => {
    const c = checkPiece('Rnd 1: 5 sc in MR (5)\nRnd 2: (sc, ch 2) in each st around (15)\nRnd 3: *3 dc in next ch-sp, ch 1, 3 dc in next ch-sp; rep from * around');
    expect(messages(c.rounds[2])).toEqual([
      'The repeat works into 2 chain spaces each time, but Round 2 has 5 left: it cannot fit the round (2 repeats leave 1 over)',
    ]);
  });

  it('working into a space that is not there', () => {
    const c = checkPiece(
      'Rnd 1: 6 sc in MR (6)\nRnd 2: (sc, ch 1) in each st around (12)\nRnd 3: ' + Array.from({ length: 7 }, () => 'sc in next ch-sp').join(', ') + ' (7)',
    );
    expect(messages(c.rounds[2])).toEqual(['Round 2 has no chain space left to work into here']);
  });

  it('a round before without chains, one that could not be read, or no round before: a hand check, keeping the stated count', () => {
    const noChains = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: sc in each ch-sp around (6)').rounds[1];
    expect(noChains.problems.map((p) => [p.message, p.severity])).toEqual([
      [
        "Whorlbook counts 'in each ch-sp' from the chain spaces of the round before, but Round 1 makes no chains between its stitches; check this round by hand",
        'warning',
      ],
    ]);
    const unread = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: (sc, ch 1) in each st around, 3 to 4 in next (12)\nRnd 3: sc in each ch-sp around (6)').rounds[2];
    expect([unread.stitches, messages(unread)]).toEqual([
      6,
      [
        "Whorlbook counts 'in each ch-sp' from the chain spaces of the round before, but Round 2 could not be followed stitch by stitch; check this round by hand",
      ],
    ]);
    const start = checkPiece('Rnd 4: (sc, ch 2, sc) in each ch-2 sp around (48)', { start: 36 }).rounds[0];
    expect([start.stitches, messages(start)]).toEqual([
      48,
      [
        "Whorlbook counts 'in each ch-sp' from the chain spaces of the round before, but there is no round before this line to count them from; check this round by hand",
      ],
    ]);
  });

  it('a repeated round counts the spaces of the copy before it', () => {
    const c = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: (sc, ch 1) in each st around (12)\nRnds 3-5: (sc, ch 1) in each ch-sp around (12)');
    expect(summary(c).slice(2)).toEqual([
      ['Rnds 3-5', 12, 12, []],
      ['Rnds 3-5', 12, 12, []],
      ['Rnds 3-5', 12, 12, []],
    ]);
  });
});
