// Star markers beyond the single '*': "rep from * to **", "rep from **", "ending last rep at **",
// "ending last rep with …" and "ending with …". The readings follow the pattern-reading convention
// (common practice, as pattern-reading handbooks explain it): "rep from * to **" works again only what
// lies between '*' and '**' and then carries on where the pattern was; "ending last rep at **" stops the
// last repeat at the '**'. Counting rules as in constructs.test.ts (each inc uses 1 and makes 2, each
// sc2tog uses 2 and makes 1; common practice). The patterns are our own.
import { describe, expect, it } from 'vitest';
import { checkPiece, type Round } from '@/engine';

function round(text: string, start: number): Round {
  const rounds = checkPiece(text, { start }).rounds;
  expect(rounds, text).toHaveLength(1);
  return rounds[0];
}

function clean(text: string, start: number, stitches: number, worked = start): Round {
  const r = round(text, start);
  expect(r.problems.map((p) => p.message), text).toEqual([]);
  expect(r.stitches, text).toBe(stitches);
  expect(r.worked, text).toBe(worked);
  expect(r.steps.reduce((s, x) => s + x.makes, 0), text).toBe(r.stitches);
  expect(r.steps.reduce((s, x) => s + x.worksInto, 0), text).toBe(r.worked);
  return r;
}

const messages = (r: Round) => r.problems.map((p) => p.message);

describe('rep from * to **', () => {
  it('works the part between * and ** again: "*A**; rep from * to ** 5 more times"', () => {
    const r = clean('Rnd 5: *sc 3, inc**; rep from * to ** 5 more times (30)', 24, 30);
    // The first pass is worked as written, then the five repeats.
    expect(r.steps.slice(0, 4).map((s) => s.repeat)).toEqual([null, null, null, null]);
    expect(r.steps[4].repeat).toEqual({ index: 1, of: 5 });
    expect(r.steps.filter((s) => s.repeat?.of === 5)).toHaveLength(20);
  });

  it('A, B, then A again: "*A**, B; rep from * N more times, then from * to ** once, C"', () => {
    // (sc 3, inc, sc 2) three times = 18 worked, 21 made; sc 3, inc = 4 worked, 5 made; sc 2 = 2 and 2.
    const r = clean(
      'Rnd 6: ch 1, *sc in next 3 sts, inc**, sc in next 2 sts; rep from * 2 more times, then from * to ** once, sc in next 2 sts, join (28)',
      24,
      28,
    );
    expect(r.made).toEqual({ sc: 28 });
  });

  it('"rep from * to ** 3 times" is 3 more unless the count says 3 in all', () => {
    // hdc 2, inc = 3 worked, 4 made; sc = 1 and 1. First pass 4 → 5, then A three more times: 13 → 17.
    clean('Rnd 5: *hdc 2, inc**, sc; rep from * to ** 3 times (17)', 13, 17);
    clean('Rnd 5: *hdc 2, inc**, sc; rep from * to ** 3 times', 13, 17);
    // Three in all (two more): 10 → 13.
    clean('Rnd 5: *hdc 2, inc**, sc; rep from * to ** 3 times (13)', 10, 13);
  });

  it('"rep from ** …" repeats everything since the "**", with a * repeat inside', () => {
    // (sc 2, inc x3) four times: 20 worked, 32 made.
    clean('Rnd 5: **sc 2, *inc; rep from * 2 more times; rep from ** 3 more times (32)', 20, 32);
  });
});

describe('ending last rep …', () => {
  it('"ending last rep at **": the last repeat stops at the marker (with "around", and with a count)', () => {
    const r = clean('Rnd 4: *sc 3, inc**, ch 1; rep from * around, ending last rep at **, join (35)', 24, 35);
    expect(r.made).toEqual({ sc: 30, ch: 5 });
    // The last repeat has no chain; every other one ends with one.
    const last = r.steps.filter((s) => s.repeat?.index === 6);
    expect(last.map((s) => s.action)).toEqual(['sc', 'sc', 'sc', 'inc']);
    expect(last[0].repeat).toEqual({ index: 6, of: 6 });
    clean('Rnd 4: *sc 3, inc**, ch 1; rep from * 5 more times, ending last rep at ** (35)', 24, 35);
  });

  it('"around" with a shorter last repeat works out how many fit', () => {
    // Full repeat works 5, the last one 4: 4 × 5 + 4 = 24.
    const r = clean('Rnd 4: *sc 3, inc**, sc; rep from * around, ending last rep at **', 24, 29);
    expect(r.steps.filter((s) => s.action === 'inc').map((s) => s.repeat)).toEqual([1, 2, 3, 4, 5].map((index) => ({ index, of: 5 })));
  });

  it('says what is left over when the shorter last repeat cannot fit', () => {
    const r = round('Rnd 4: *sc 3, inc**, sc; rep from * around, ending last rep at **', 26);
    expect(messages(r)).toEqual([
      'The repeat works 5 stitches each time and 4 the last time, but 26 are left for it: it cannot fit the round (5 repeats leave 2 over)',
    ]);
  });

  it('"ending last rep with …" takes the place of the repeat\'s last instruction when it is the same stitch', () => {
    // Each repeat works sc, sk 1, sc 2 = 4; the last sc, sk 1, sc 1 = 3: 5 × 4 + 3 = 23.
    const r = clean(
      'Rnd 7: *sc in next st, ch 2, sk next st, sc in next 2 sts; rep from * around, ending last rep with sc in next st, join',
      23,
      29,
    );
    expect(r.made).toEqual({ sc: 17, ch: 12 });
  });

  it('"ending with …" after "across": the repeats leave room for it', () => {
    clean('Row 3: ch 1, *sc in next st, ch 1, sk next st; rep from * across, ending with sc in last st, turn (11)', 11, 11);
  });
});

describe('forms that cannot be read without guessing say so', () => {
  it('a "**" written after the "rep from * to **" that refers to it', () => {
    const r = round('Rnd 7: *sc 3, inc; rep from * to ** 5 more times, sc 3** , sc 2, inc (30)', 30);
    expect(r.problems.map((p) => [p.message, p.severity])).toEqual([
      [
        "'rep from * to ** 5 more times' comes before its '**', so the repeat would hold itself: put the '**' where the repeated part ends, before the 'rep'",
        'error',
      ],
    ]);
    // The round keeps its stated count, so the next round is not thrown off.
    expect(r.stitches).toBe(30);
  });

  it('no "**" at all, or two of them', () => {
    expect(messages(round('Rnd 4: *sc 3, inc; rep from * to ** 5 times', 24))).toEqual([
      "'rep from * to ** 5 times' has no '**' before it: put '**' where the repeated part ends",
    ]);
    expect(messages(round('Rnd 4: *sc 3**, inc**; rep from * to ** 5 times', 24))).toEqual([
      "The repeat holds 2 '**' marks, so Whorlbook cannot tell which one 'rep from * to ** 5 times' means: keep one",
    ]);
    expect(messages(round('Rnd 4: *sc 3**, inc**, ch 1; rep from * around, ending last rep at **', 24))).toEqual([
      "The repeat holds 2 '**' marks, so Whorlbook cannot tell which one 'ending last rep at **' means: keep one",
    ]);
  });

  it('"ending last rep at **" without a "**" in the repeat, at a single "*", or after no repeat', () => {
    expect(messages(round('Rnd 4: *sc 3, inc; rep from * around, ending last rep at **', 24))).toEqual([
      "'ending last rep at **' needs a '**' inside the repeat to say where the last repeat stops",
    ]);
    expect(messages(round('Rnd 4: *sc 3, inc**, ch 1; rep from * around, ending last rep at *', 24))).toEqual([
      "Whorlbook could not read 'ending last rep at *': a single '*' starts the repeat, so it cannot say where the last one stops; mark where the last repeat stops with '**' and write 'ending last rep at **'",
    ]);
    expect(messages(round('Rnd 4: sc 3, ending last rep at **', 24))).toEqual([
      "'ending last rep at **' follows no repeat: put it right after the 'rep from *' it changes",
    ]);
  });

  it('"ending last rep with …" that does not match the end of the repeat', () => {
    // The repeat ends with an inc; "sc in last 3 sts" could replace part of it or follow it.
    const r = round('Rnd 5: *sc in next 3 sts, inc; rep from * around, ending last rep with sc in last 3 sts (30)', 24);
    expect(messages(r)).toEqual([
      "Whorlbook cannot tell which part of the last repeat 'ending last rep with sc in last 3 sts' takes the place of: put '**' where the last repeat stops and write 'ending last rep at **', or write the last repeat out",
    ]);
    expect(r.stitches).toBe(30);
  });

  it('"ending with …" whose length depends on the row', () => {
    const r = round('Row 3: ch 1, *sc in next st, ch 1, sk next st; rep from * across, ending with sc in each remaining st, turn', 11);
    expect(messages(r)).toEqual([
      "Whorlbook cannot tell how many stitches 'ending with sc in each remaining st, turn' needs at the end: write 'rep from * to last N sts, …' instead",
    ]);
  });

  it('a "**" nothing refers to is a warning, and the round is counted as written', () => {
    const r = round('Rnd 4: *sc 3, inc**, sc 2; rep from * around (28)', 24);
    expect(r.problems.map((p) => [p.message, p.severity])).toEqual([
      ["Nothing refers to this '**' (as in 'rep from * to **' or 'ending last rep at **'), so it changes nothing", 'warning'],
    ]);
    expect([r.stitches, r.worked]).toEqual([28, 24]);
  });
});
