// "sc, dec around", "sc 2, inc around": a short sequence closed by "… around" is repeated as many times
// as the round before allows, like "(sc, dec) around" (common practice in amigurumi patterns). A plain
// stitch closing it ("2 sc in first st, sc around") is the rest of the round unless the stated count says
// otherwise (common practice). Counting rules as in constructs.test.ts. The patterns are our own.
import { describe, expect, it } from 'vitest';
import { checkPiece, type Round } from '@/engine';

function round(text: string, start: number): Round {
  const rounds = checkPiece(text, { start }).rounds;
  expect(rounds, text).toHaveLength(1);
  return rounds[0];
}

const messages = (r: Round) => r.problems.map((p) => p.message);

describe('a short sequence before "around" is a repeat', () => {
  it.each([
    ['Rnd 3: sc, inc around (18)', 12, 18, { sc: 18 }],
    ['Rnd 3: sc, dec around', 18, 12, { sc: 6, sc2tog: 6 }],
    ['Rnd 4: sc 2, inc around (24)', 18, 24, { sc: 24 }],
    ['Rnd 4: 2 sc, inc around (24)', 18, 24, { sc: 24 }],
    ['Rnd 4: sc in next 2 sts, inc around (24)', 18, 24, { sc: 24 }],
    ['Rnd 7: sc 3, dec around (24)', 30, 24, { sc: 18, sc2tog: 6 }],
    ['Rnd 7: ch 1, sc 3, dec around, join (24)', 30, 24, { sc: 18, sc2tog: 6 }],
    ['Rnd 7: BLO sc 3, dec around (24)', 30, 24, { sc: 18, sc2tog: 6 }],
    ['Rnd 6: sc, hdc inc around (18)', 12, 18, { sc: 6, hdc: 12 }],
    ['Rnd 4: sc, invdec around (8)', 12, 8, { sc: 4, sc2tog: 4 }],
    ['Row 4: ch 1, sc, dec across, turn (8)', 12, 8, { sc: 4, sc2tog: 4 }],
    // A slip stitch that moves into place before the starting chain is not part of the sequence (it
    // passes 1 stitch, so 12 are left for the repeats).
    ['Rnd 8: sl st in next st, ch 1, sc, dec around, join (8)', 13, 8, { sc: 4, sc2tog: 4 }],
  ])('%s', (text, start, stitches, made) => {
    const r = round(text, start);
    expect([r.stitches, r.worked, messages(r), r.made]).toEqual([stitches, start, [], made]);
  });

  it('each step carries its repeat, as "(sc, inc) around" does', () => {
    const r = round('Rnd 3: sc, inc around (18)', 12);
    expect(r.steps).toHaveLength(12);
    expect(r.steps[0].repeat).toEqual({ index: 1, of: 6 });
    expect(r.steps[11]).toMatchObject({ action: 'inc', repeat: { index: 6, of: 6 } });
    const bracket = round('Rnd 3: (sc, inc) around (18)', 12);
    expect(r.steps.map((s) => [s.action, s.worksInto, s.makes, s.repeat])).toEqual(
      bracket.steps.map((s) => [s.action, s.worksInto, s.makes, s.repeat]),
    );
  });

  it('says what is left over when the round before is not a multiple of the sequence', () => {
    const c = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: inc around (12)\nRnd 3: sc 4, inc around (14)');
    const r = c.rounds[2];
    // One slip, one sentence: the stated count goes into it.
    expect(r.problems.map((p) => [p.message, p.severity])).toEqual([
      [
        "'sc 4, inc around' repeats 'sc 4, inc', which works 5 stitches each time, but Round 2 has 12: it cannot fit the round (2 repeats leave 2 over) (it makes 12, not the 14 stated)",
        'error',
      ],
    ]);
    expect(messages(round('Rnd 3: sc, dec around', 17))).toEqual([
      "'sc, dec around' repeats 'sc, dec', which works 3 stitches each time, but 17 are left for it: it cannot fit the round (5 repeats leave 2 over)",
    ]);
  });
});

describe('when the rest of the round is meant', () => {
  it('a plain stitch after other stitches is "in each remaining st"', () => {
    expect([round('Rnd 2: ch 1, 2 sc in first st, sc around, join (7)', 6)].map((r) => [r.stitches, messages(r)])).toEqual([[7, []]]);
    const r = round('Rnd 2: hdc in next 3 sts, sc around (12)', 12);
    expect([r.stitches, r.made, messages(r)]).toEqual([12, { hdc: 3, sc: 9 }, []]);
    expect(round('Rnd 2: sc in next 3 sts, sc around', 12).stitches).toBe(12);
  });

  it('"inc, sc around" is read the way the stated count fits, else as the rest of the round', () => {
    expect([round('Rnd 2: inc, sc around (18)', 12)].map((r) => [r.stitches, messages(r)])).toEqual([[18, []]]);
    expect([round('Rnd 2: inc, sc around (13)', 12)].map((r) => [r.stitches, messages(r)])).toEqual([[13, []]]);
    expect(round('Rnd 2: inc, sc around', 12).stitches).toBe(13);
  });

  it('an inc or dec closing the sequence is read literally only when the stated count says so', () => {
    // (2 sc in first st, dec) would work 3 each time and 13 is not a multiple of 3; the count 8 is the
    // literal reading: 2 sc in the first stitch, then dec over the other 12.
    const literal = round('Rnd 3: 2 sc in first st, dec around (8)', 13);
    expect([literal.stitches, literal.worked, messages(literal)]).toEqual([8, 13, []]);
    // Without a count nothing confirms the literal reading: the repeat reading and its problem stand.
    expect(messages(round('Rnd 3: 2 sc in first st, dec around', 13))).toEqual([
      "'2 sc in first st, dec around' repeats '2 sc in first st, dec', which works 3 stitches each time, but 13 are left for it: it cannot fit the round (4 repeats leave 1 over)",
    ]);
  });

  it('a sequence of more than four instructions is not a short sequence', () => {
    const r = round('Rnd 5: sc, hdc, dc, hdc, sc, inc around', 10);
    expect([r.stitches, r.made, messages(r)]).toEqual([15, { sc: 12, hdc: 2, dc: 1 }, []]);
  });

  it('"inc around" alone and "(sc, inc) around" read as before', () => {
    expect(round('Rnd 2: inc around (24)', 12).stitches).toBe(24);
    expect(round('Rnd 3: (sc, inc) around (18)', 12).stitches).toBe(18);
  });
});
