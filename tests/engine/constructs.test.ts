// Every construct the engine reads, one at a time, with the count a careful designer would give.
// Counting rules are common practice (standards.md §8: each inc uses 1 and makes 2; each sc2tog uses 2
// and makes 1) unless a source is named.
import { describe, expect, it } from 'vitest';
import { checkPiece, type Round } from '@/engine';

function round(text: string, start: number, terms: 'us' | 'uk' = 'us'): Round {
  const rounds = checkPiece(text, { start, terms }).rounds;
  expect(rounds, text).toHaveLength(1);
  return rounds[0];
}

function clean(text: string, start: number, stitches: number, worked = start, terms: 'us' | 'uk' = 'us'): Round {
  const r = round(text, start, terms);
  expect(r.problems.map((p) => p.message), text).toEqual([]);
  expect(r.stitches, text).toBe(stitches);
  expect(r.worked, text).toBe(worked);
  // The steps the Tally walks add up to the round.
  expect(r.steps.reduce((s, x) => s + x.makes, 0), text).toBe(r.stitches);
  expect(r.steps.reduce((s, x) => s + x.worksInto, 0), text).toBe(r.worked);
  return r;
}

const messages = (r: Round) => r.problems.map((p) => p.message);

describe('labels', () => {
  it.each([
    ['Rnd 5: sc around', 5, 'Rnd 5', 'round'],
    ['Round 5: sc around', 5, 'Round 5', 'round'],
    ['R5: sc around', 5, 'R5', 'round'],
    ['Row 3: sc across', 3, 'Row 3', 'row'],
    ['rnd 5 sc around', 5, 'rnd 5', 'round'],
    ['Row 2 (RS): sc across', 2, 'Row 2', 'row'],
  ])('%s', (text, number, label, kind) => {
    const r = round(text, 12);
    expect([r.number, r.label, r.kind]).toEqual([number, label, kind]);
    expect(r.stitches).toBe(12);
  });

  it('expands ranges with a hyphen, an en dash, "and" and lists', () => {
    const nums = (t: string) => checkPiece(t, { start: 12 }).rounds.map((r) => r.number);
    expect(nums('Rnds 8-12: sc around (12)')).toEqual([8, 9, 10, 11, 12]);
    expect(nums('Rnds 8–12: sc around (12)')).toEqual([8, 9, 10, 11, 12]);
    expect(nums('Rounds 9 and 10: sc around (12)')).toEqual([9, 10]);
    expect(nums('Rnds 3, 5 and 7: sc around')).toEqual([3, 5, 7]);
    expect(nums('Rnds 8 to 10: sc around')).toEqual([8, 9, 10]);
    // A singular label does not read "1, 6 sc" as a list.
    expect(nums('Rnd 1, 6 sc in MR')).toEqual([1]);
    const r = checkPiece('Rnds 8-12: sc around (12)', { start: 12 }).rounds;
    expect(r.every((x) => x.label === 'Rnds 8-12' && x.stitches === 12 && x.problems.length === 0)).toBe(true);
  });

  it('numbers unlabelled instruction lines on and keeps titles as notes', () => {
    const c = checkPiece('Pebble\n6 sc in MR (6)\ninc x6 (12)\nsc around (12)');
    expect(c.rounds.map((r) => [r.number, r.label, r.stitches])).toEqual([
      [1, 'Rnd 1', 6],
      [2, 'Rnd 2', 12],
      [3, 'Rnd 3', 12],
    ]);
    expect(c.notes.map((n) => n.text)).toEqual(['Pebble']);
  });

  it('warns about a gap or a step back in the numbering, but not about a new part starting at 1', () => {
    const c = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 4: sc around (12)\nEar\nRnd 1: 6 sc in MR (6)');
    expect(messages(c.rounds[2])).toEqual(['Round 4 follows Round 2: is Round 3 missing?']);
    expect(c.rounds[2].problems[0].severity).toBe('warning');
    expect(messages(c.rounds[3])).toEqual([]);
  });
});

describe('stitches', () => {
  it('counts each basic stitch as one', () => {
    const r = clean('Rnd 3: sc in next 2 sts, hdc in next 2 sts, dc in next 2 sts, tr in next 2 sts, dtr, sl st in next st (10)', 10, 10);
    expect(r.made).toEqual({ sc: 2, hdc: 2, dc: 2, tr: 2, dtr: 1, 'sl st': 1 });
  });

  it('inc is 2 sc in one stitch: one step that makes 2', () => {
    const r = clean('Rnd 2: inc (2)', 1, 2);
    expect(r.steps).toHaveLength(1);
    expect(r.steps[0]).toMatchObject({ action: 'inc', text: 'inc: 2 sc in the next stitch', worksInto: 1, makes: 2 });
    expect(r.made).toEqual({ sc: 2 });
  });

  it.each(['dec', 'invdec', 'inv dec', 'sc2tog', 'sc dec'])('%s works 2 stitches into 1, one step', (d) => {
    const r = clean(`Rnd 9: ${d} (1)`, 2, 1);
    expect(r.steps).toHaveLength(1);
    expect(r.steps[0]).toMatchObject({ worksInto: 2, makes: 1 });
    expect(r.made).toEqual({ sc2tog: 1 });
  });

  it('sc3tog, hdc2tog and dc2tog', () => {
    const r = clean('Rnd 9: sc3tog, hdc2tog, dc2tog, hdc dec, dc dec (5)', 11, 5);
    expect(r.made).toEqual({ sc3tog: 1, hdc2tog: 2, dc2tog: 2 });
    clean('Rnd 9: dec over next 3 sts (1)', 3, 1);
  });

  it('N sc in next st is an N-stitch increase; (sc, hdc) in next st is one step making 2', () => {
    const r = clean('Rnd 4: 3 sc in next st, (sc, hdc) in next st, sc in next 4 sts (9)', 6, 9);
    expect(r.steps[0]).toMatchObject({ action: '3 sc', worksInto: 1, makes: 3 });
    expect(r.steps[1]).toMatchObject({ action: '(sc, hdc)', text: '(sc, hdc) in the next stitch', worksInto: 1, makes: 2 });
    expect(r.made).toEqual({ sc: 8, hdc: 1 });
    clean('Rnd 4: (sc, ch 2, sc) in next st, sc in next 5 (9)', 6, 9);
    clean('Rnd 4: 2 hdc in each st around (12)', 6, 12);
  });

  it('N sc, sc N, sc in next N sts, sc in each st around, sc around and N sc around', () => {
    clean('Rnd 6: 6 sc, sc 6, sc in next 6 sts, sc in next 6 (24)', 24, 24);
    clean('Rnd 6: sc in each st around (24)', 24, 24);
    clean('Rnd 6: sc around (24)', 24, 24);
    clean('Rnd 6: 24 sc around (24)', 24, 24);
    clean('Rnd 6: sc in next 4 sts, sc in each st around (24)', 24, 24);
    clean('Rnd 6: sc in each of next 20 sts, sc in each remaining st (24)', 24, 24);
    const r = round('Rnd 6: 30 sc around (30)', 24);
    expect(messages(r)).toEqual(['Round 6 works 30 stitches, but the start has only 24']);
  });

  it('BLO / FLO are worked as usual, recorded per step and per round', () => {
    const r = clean('Rnd 7: BLO sc in next 12 sts, FLO sc in next 12 sts (24)', 24, 24);
    expect(r.loops).toEqual(['blo', 'flo']);
    expect(r.steps[0].loop).toBe('blo');
    expect(r.steps[0].text).toBe('sc in the next stitch (1 of 12) — back loop only');
    expect(r.steps[23].loop).toBe('flo');
    expect(clean('Rnd 7: working in back loops only, sc around (24)', 24, 24).loops).toEqual(['blo']);
    expect(clean('Rnd 7: sc around in BLO (24)', 24, 24).loops).toEqual(['blo']);
    expect(clean('Rnd 7 (BLO): sc around (24)', 24, 24).loops).toEqual(['blo']);
    expect(clean('Rnd 7: sc in blo of next 24 sts (24)', 24, 24).loops).toEqual(['blo']);
  });

  it('sk N / skip N sts count as worked, make nothing, and raise no problem', () => {
    const r = clean('Rnd 5: sc in next 4, sk 2, sc in next 4, skip 2 sts, sc in next 12 (20)', 24, 20);
    expect(r.steps.filter((s) => s.action === 'sk').map((s) => s.worksInto)).toEqual([2, 2]);
  });

  it('ch N inside a round makes N stitches for the next round and works none', () => {
    const r = clean('Rnd 5: sc in next 10, ch 4, sk 4, sc in next 10 (24)', 24, 24);
    const chains = r.steps.filter((s) => s.action === 'ch');
    expect(chains).toHaveLength(4);
    expect(chains.every((s) => s.worksInto === 0 && s.makes === 1)).toBe(true);
    expect(r.made).toEqual({ sc: 20, ch: 4 });
    // The next round works into those chains as stitches.
    const c = checkPiece('Rnd 5: sc in next 10, ch 4, sk 4, sc in next 10 (24)\nRnd 6: sc around (24)', { start: 24 });
    expect(c.rounds[1].problems).toEqual([]);
  });

  it('leave remaining N sts unworked is not a problem; a wrong N is', () => {
    clean('Row 4: sc in next 20, leave remaining 4 sts unworked (20)', 24, 20, 20);
    clean('Row 4: sc in next 20, leave remaining sts unworked (20)', 24, 20, 20);
    const r = round('Row 4: sc in next 18, leave the remaining 4 sts unworked (18)', 24);
    expect(messages(r)).toEqual(['Row 4 says to leave 4 unworked, but 6 are left']);
  });
});

describe('starts', () => {
  it.each(['6 sc in MR', '6 sc in magic ring', '6 sc in a magic circle', '6 sc in ring', 'MR, 6 sc', 'sc 6 in MR', 'magic ring with 6 sc'])(
    '%s makes 6, works none',
    (start) => {
      const r = clean(`Rnd 1: ${start} (6)`, 0, 6, 0);
      expect(r.steps).toHaveLength(6);
      expect(r.steps.every((s) => s.worksInto === 0 && s.makes === 1)).toBe(true);
    },
  );

  it('a chain ring: ch 4, join to form a ring, then stitches in the ring', () => {
    const r = clean('Rnd 1: ch 4, join with sl st to form a ring, ch 3 (counts as dc), 11 dc in ring, join (12)', 0, 12, 0);
    expect(r.made).toEqual({ dc: 12 });
  });

  it('a foundation chain row: only stitches worked into the chain count', () => {
    // ch 11, sc in 2nd ch from hook and in each ch across → works 10 of the chain, makes 10.
    const r = clean('Row 1: ch 11, sc in 2nd ch from hook and in each ch across, turn (10)', 0, 10, 10);
    expect(r.steps.filter((s) => s.action === 'ch')).toHaveLength(11);
    expect(r.steps.find((s) => s.action === 'sc')?.text).toBe('sc in the 2nd ch from the hook');
    expect(r.made).toEqual({ sc: 10 });
  });

  it('a chain on its own line is the foundation for the next row', () => {
    const c = checkPiece('Ch 11.\nRow 1: sc in 2nd ch from hook and in each ch across, turn (10)');
    expect(c.rounds.map((r) => [r.label, r.stitches, r.worked])).toEqual([
      ['Foundation chain', 11, 0],
      ['Row 1', 10, 10],
    ]);
    expect(c.rounds.flatMap((r) => r.problems)).toEqual([]);
  });

  it('a foundation row that stops short says so', () => {
    const r = round('Row 1: ch 11, sc in 2nd ch from hook, sc in next 7 ch (8)', 0);
    expect(messages(r)).toEqual([
      "Row 1 works 8 of 10 chains; 2 are left unworked — say 'leave the remaining 2 ch unworked' if that is meant",
    ]);
  });

  it('ch 2, 6 sc in 2nd ch from hook', () => {
    clean('Rnd 1: ch 2, 6 sc in 2nd ch from hook (6)', 0, 6, 1);
  });

  it('the oval start around both sides of a chain', () => {
    const r = clean(
      'Rnd 1: ch 6, sc in 2nd ch from hook, sc in next 3 ch, 3 sc in last ch, working on the other side of the chain, sc in next 3 ch, 2 sc in last ch (12)',
      0,
      12,
      9,
    );
    expect(r.made).toEqual({ sc: 12 });
    const next = checkPiece(
      'Rnd 1: ch 6, sc in 2nd ch from hook, sc in next 3 ch, 3 sc in last ch, working on the other side of the chain, sc in next 3 ch, 2 sc in last ch (12)\nRnd 2: inc, sc in next 3, inc x3, sc in next 3, inc x2 (18)',
    ).rounds[1];
    expect(next.problems).toEqual([]);
    expect(next.stitches).toBe(18);
  });
});

describe('turning and starting chains, joins', () => {
  it('ch 1 at the start of a row does not count; turn makes nothing', () => {
    const r = clean('Row 2: ch 1, sc in each st across, turn (10)', 10, 10);
    expect(r.steps[0]).toMatchObject({ action: 'ch 1', worksInto: 0, makes: 0 });
    expect(r.steps).toHaveLength(11);
  });

  it('ch 3 (counts as dc) is one stitch worked into the first stitch (common practice)', () => {
    const r = clean('Row 2: ch 3 (counts as dc), dc in next st and in each st across, turn (10)', 10, 10);
    expect(r.steps[0]).toMatchObject({ action: 'ch 3', worksInto: 1, makes: 1, text: 'ch 3 (counts as the first dc)' });
    expect(r.made).toEqual({ dc: 10 });
  });

  it('ch 2 (does not count as a st) makes nothing', () => {
    clean('Row 2: ch 2 (does not count as a st), hdc in each st across, turn (10)', 10, 10);
  });

  it('a plain ch 3 at the start is read the way that fits the row', () => {
    // ch 3 is read as counting when the count says so …
    clean('Row 2: ch 3, dc in next st and in each st across (10)', 10, 10);
    expect(clean('Row 2: ch 3, dc in same st and in each st across (11)', 10, 11).steps[0].makes).toBe(1);
    // … and a plain ch 2 as a turning chain.
    expect(clean('Row 2: ch 2, hdc in first st and in each st across (10)', 10, 10).steps[0].makes).toBe(0);
  });

  it('dc in same st works into the stitch the starting chain stands in', () => {
    const r = clean('Rnd 2: ch 3 (counts as dc), dc in same st, 2 dc in each st around, join (24)', 12, 24);
    expect(r.steps[1]).toMatchObject({ text: 'dc in the same stitch', worksInto: 0, makes: 1 });
  });

  it('join with sl st to first st makes no stitch', () => {
    const r = clean('Rnd 3: ch 1, sc in same st, sc in next 11 sts, join with sl st to first st (12)', 12, 12);
    expect(r.steps[r.steps.length - 1]).toMatchObject({ action: 'join', worksInto: 0, makes: 0 });
    clean('Rnd 3: sc around, sl st in first sc to join (12)', 12, 12);
    clean('Rnd 3: sc around, sl st to join (12)', 12, 12);
  });

  it('a spiral round and the same round joined give the same count', () => {
    const spiral = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: inc around (12)\nRnd 3: (sc, inc) x6 (18)');
    const joined = checkPiece(
      'Rnd 1: 6 sc in MR, join (6)\nRnd 2: ch 1, inc in same st and in each st around, join (12)\nRnd 3: ch 1, (sc, inc) x6, join with sl st to first sc (18)',
    );
    expect(joined.rounds.map((r) => r.stitches)).toEqual(spiral.rounds.map((r) => r.stitches));
    expect(joined.rounds.flatMap((r) => r.problems)).toEqual([]);
  });
});

describe('repeats', () => {
  it('(…) x6, […] 6 times, (…) twice, *…* x2', () => {
    clean('Rnd 4: (2 sc, inc) x6 (24)', 18, 24);
    clean('Rnd 4: (2 sc, inc) × 6 (24)', 18, 24);
    clean('Rnd 4: [2 sc, inc] 6 times (24)', 18, 24);
    clean('Rnd 4: (2 sc, inc) 6x (24)', 18, 24);
    clean('Rnd 4: (8 sc, inc) twice (20)', 18, 20);
    clean('Rnd 4: *8 sc, inc* x2 (20)', 18, 20);
  });

  it('*…; rep from * around works out the repeat count from what is left', () => {
    const r = clean('Rnd 4: sc, *inc, 2 sc; rep from * 4 more times, inc, sc (24)', 18, 24);
    expect(r.steps.filter((s) => s.repeat?.of === 5)).toHaveLength(15);
    const a = clean('Rnd 5: *3 sc, inc; rep from * around (30)', 24, 30);
    expect(a.steps[0].repeat).toEqual({ index: 1, of: 6 });
    expect(a.steps[23].repeat).toEqual({ index: 6, of: 6 });
    clean('Rnd 5: *3 sc, inc; rep from * to end (30)', 24, 30);
    clean('Rnd 5: sc, *3 sc, inc; rep from * to last 3 sts, sc in last 3 sts (29)', 24, 29);
  });

  it('rep from * 5 more times, and "5 times" read the way that fits', () => {
    clean('Rnd 4: *2 sc, inc; rep from * 5 more times (24)', 18, 24);
    clean('Rnd 4: *2 sc, inc; rep from * 5 times (24)', 18, 24);
    clean('Rnd 4: *sc, inc, sc; rep from * twice more (12)', 9, 12);
  });

  it('nested repeats, with the innermost repeat on each step', () => {
    const r = clean('Rnd 5: [(sc, inc) x2, 2 sc] x4, 2 sc (34)', 26, 34);
    expect(r.steps[0].repeat).toEqual({ index: 1, of: 2 });
    expect(r.steps[4].repeat).toEqual({ index: 1, of: 4 });
  });

  it('a repeat that cannot fit the round says so once', () => {
    const r = round('Rnd 5: *3 sc, inc; rep from * around (31)', 26);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0].message).toMatch(/^The repeat works 4 stitches each time, but 26 are left for it: it cannot fit the round/);
  });

  it('Rows 3-8: rep row 2, and alternating rounds', () => {
    const c = checkPiece('Row 1: ch 11, sc in 2nd ch from hook and in each ch across, turn (10)\nRow 2: ch 1, sc across, turn (10)\nRows 3-8: rep row 2');
    expect(c.rounds.map((r) => r.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(c.rounds.every((r) => r.stitches === 10 && r.problems.length === 0)).toBe(true);
    const alt = checkPiece(
      'Rnd 1: 6 sc in MR (6)\nRnd 2: inc around (12)\nRnd 3: sc around (12)\nRnds 4-7: rep Rnds 2 and 3 twice',
    );
    expect(alt.rounds.map((r) => r.stitches)).toEqual([6, 12, 12, 24, 24, 48, 48]);
    const missing = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: rep Rnd 5 (6)').rounds[1];
    expect(messages(missing)).toEqual(['Round 5 is not in this piece before this line']);
  });
});

describe('stated counts', () => {
  it.each(['(30)', '[30]', '(30 sts)', '— 30 sts', '- 30 sts', '= 30', '(30 st total)', '{30}', '. 30 sts.'])('%s', (stated) => {
    const r = clean(`Rnd 5: (3 sc, inc) x6 ${stated}`, 24, 30);
    expect(r.stated).toBe(30);
  });
  it('no stated count is null', () => {
    expect(clean('Rnd 5: (3 sc, inc) x6', 24, 30).stated).toBeNull();
  });
});

describe('leftover loops', () => {
  it('a round worked into the front loops left by an earlier BLO round works into that round', () => {
    const c = checkPiece(
      [
        'Rnd 6: BLO sc around (30)',
        'Rnd 7: sc around (30)',
        'Rnd 8: dec x15 (15)',
        'Working in the front loops left from Rnd 6: (4 sc, inc) x6 (36)',
      ].join('\n'),
      { start: 30 },
    );
    const r = c.rounds[3];
    expect(r.worked).toBe(30);
    expect(r.stitches).toBe(36);
    expect(r.loops).toEqual(['flo']);
    expect(r.problems).toEqual([]);
  });

  it('the leftover start on its own line, and "front loops of" the round before the BLO one', () => {
    const c = checkPiece(
      'Rnd 5: sc around (24)\nRnd 6: BLO sc around (24)\nRnd 7: dec around (12)\nWorking in the front loops of Rnd 5:\nRnd 8: sc around (24)',
      { start: 24 },
    );
    expect(c.rounds[3]).toMatchObject({ number: 8, worked: 24, stitches: 24, problems: [] });
    expect(c.notes[0]).toMatchObject({ text: 'Working in the front loops of Rnd 5:', beforeRound: 8 });
  });

  it('naming a round that left no loops is a warning, counted from that round', () => {
    const c = checkPiece('Rnd 5: sc around (24)\nRnd 6: sc around (24)\nRnd 7: working in the front loops left from Rnd 6, sc around (24)', { start: 24 });
    expect(messages(c.rounds[2])).toEqual([
      'Round 6 was not worked in back loops only, so it left no front loops free; counting its 24 stitches',
    ]);
  });
});

describe('evenly', () => {
  it('inc 6 evenly around uses the round planner', () => {
    clean('Rnd 5: inc 6 sts evenly around (30)', 24, 30);
    const r = clean('Rnd 5: dec 4 evenly (20)', 24, 20);
    expect(r.made).toEqual({ sc: 16, sc2tog: 4 });
  });
});

describe('UK terms', () => {
  it('reads UK terms and reports US names', () => {
    const r = clean('Rnd 3: (dc, htr) in next st, dc in next st, tr in next st, dtr, ss in next st, miss 1 (6)', 6, 6, 6, 'uk');
    expect(r.made).toEqual({ sc: 2, hdc: 1, dc: 1, tr: 1, 'sl st': 1 });
    expect(r.steps[0].text).toBe('(dc, htr) in the next stitch');
    expect(r.steps[1].text).toBe('dc in the next stitch');
    const dec = clean('Rnd 9: dc2tog x6 (6)', 12, 6, 12, 'uk');
    expect(dec.made).toEqual({ sc2tog: 6 });
    expect(dec.steps[0].text).toBe('dc2tog: dc the next 2 stitches together (1 of 6)');
    const start = clean('Rnd 1: ch 3 (counts as tr), 11 tr in ring, join (12)', 0, 12, 0, 'uk');
    expect(start.made).toEqual({ dc: 12 });
  });
});

describe('ways designers write the same thing', () => {
  it.each([
    ['Rnd 1: In a magic ring, work 6 sc (6)', 0, 6],
    ['Rnd 1: 6 sc in MR, do not join (6)', 0, 6],
    ["Rnd 1: 6 sc in MR; don't join, work in continuous rounds (6)", 0, 6],
    ['Rnd 3: *1 sc, 1 inc* 6 times (18)', 12, 18],
    ['Rnd 4: (2sc, inc)*6 (24)', 18, 24],
    ['Rnd 5: sc 3, inc (repeat 6 times) (30)', 24, 30],
    ['Rnd 4: sc in next 2 sts, 2 sc in next st, repeat 5 times (24)', 18, 24],
    ['Rnd 5: *sc in next 3 sts, inc in next st* repeat 6 times (30)', 24, 30],
    ['Rnd 15: 2 sc in the next stitch, 1 sc in each of the next 2 stitches; repeat 5 more times (24)', 18, 24],
    ['Rnds 7-10: sc in each st around (36 sts) (4 rnds)', 36, 36],
    ['Rnd 2: ch 1, 2 sc in same st as ch 1, 2 sc in each st around, join (12)', 6, 12],
    ['Rnd 9: sc in each st around, pulling tight (18)', 18, 18],
    ['Rnd 11: sc in the back loop of each st around (18)', 18, 18],
    ['Rnd 14: [sc 3, dec] repeat around (24)', 30, 24],
    ['Rnd 16: sc 2, inc, [sc 3, inc] x5, sc (30)', 24, 30],
    ['Row 3: Ch 2 (counts as first hdc), hdc in each st across (10)', 10, 10],
    ['Row 4: ch 3 (counts as dc here and throughout), dc in each remaining st (10)', 10, 10],
    // A last slip stitch into the round just made finishes the edge and is not counted (common practice).
    ['Rnd 18: dec x6, sl st in next st, fasten off (6)', 12, 6],
  ])('%s', (text, start, stitches) => {
    const c = checkPiece(text, { start });
    expect(c.rounds.map((r) => [r.stitches, r.problems.map((p) => p.message)])).toEqual(c.rounds.map(() => [stitches, []]));
    expect(c.rounds.length).toBeGreaterThan(0);
  });

  it('a UK slip-stitch join makes no stitch', () => {
    clean('Rnd 1: 6 dc in MR, ss in first dc (6)', 0, 6, 0, 'uk');
  });

  it('a note inside a round line goes to the notes, not the count', () => {
    const c = checkPiece('Rnd 10: sc in each st around; stuff as you go (18)', { start: 18 });
    expect(c.rounds[0]).toMatchObject({ stitches: 18, problems: [] });
    expect(c.notes.map((n) => [n.text, n.kind])).toEqual([['stuff as you go', 'stuffing']]);
  });
});

describe('chain spaces', () => {
  it('in next ch-N sp works the N chains', () => {
    clean('Rnd 4: sc in next st, 3 sc in next ch-3 sp, sc in next 2 (6)', 6, 6);
  });
  it("with no round before it to count spaces from, 'in each ch-sp around' is flagged for a hand check, not guessed", () => {
    const r = round('Rnd 4: sl st in next ch-2 sp, ch 1, (sc, ch 2, sc) in each ch-2 sp around, join (48)', 36);
    expect(r.stitches).toBe(48);
    expect(r.problems.map((p) => [p.message, p.severity])).toEqual([
      [
        "Whorlbook counts 'in each ch-sp' from the chain spaces of the round before, but there is no round before this line to count them from; check this round by hand",
        'warning',
      ],
    ]);
  });
});

describe('more forms', () => {
  it.each([
    ['Rnd 4: {2 sc, inc} x6 (24)', 18, 24],
    ['Rnd 4: (sc, ch 2, sc) in each st around (24)', 6, 24],
    ['Rnd 4: 2 sc in next 3 sts, sc in next 3 sts (9)', 6, 9],
    ['Rnd 4: sc next 2 sts tog x3 (3)', 6, 3],
    ['Rnd 4: 6sc, 3scs (9)', 9, 9],
    ['Rnd 4: sc in each st to end, 30 sts.', 30, 30],
    ['Rnd 4: FPdc in next 6 sts, BPdc in next 6 sts (12)', 12, 12],
  ])('%s', (text, start, stitches) => {
    const r = checkPiece(text, { start }).rounds[0];
    expect([r.stitches, r.problems.map((p) => p.message)]).toEqual([stitches, []]);
  });

  it('as Rnd 8, and an unlabelled "Repeat Rnds … more times"', () => {
    const c = checkPiece('Rnd 8: sc around (24)\nRnd 9: as Rnd 8\nRnd 10: (3 sc, inc) x6 (30)\nRnd 11: sc around (30)\nRepeat Rnds 11-11 three more times.', { start: 24 });
    expect(c.rounds.map((r) => [r.number, r.label, r.stitches, r.problems.length])).toEqual([
      [8, 'Rnd 8', 24, 0],
      [9, 'Rnd 9', 24, 0],
      [10, 'Rnd 10', 30, 0],
      [11, 'Rnd 11', 30, 0],
      [12, 'Rnd 12', 30, 0],
      [13, 'Rnd 13', 30, 0],
      [14, 'Rnd 14', 30, 0],
    ]);
  });
});

describe('limits', () => {
  it('a line past 4000 characters is read in part, and says so', () => {
    const r = checkPiece('Rnd 2: ' + 'sc, '.repeat(1500), { start: 3000 }).rounds[0];
    expect(r.problems[0]).toMatchObject({ severity: 'warning', message: 'This line is longer than 4000 characters; only the first 4000 are read' });
  });
  it('a range past 1000 rounds is cut, and says so', () => {
    const c = checkPiece('Rnds 1-5000: sc around', { start: 6 });
    expect(c.rounds).toHaveLength(1000);
    expect(c.rounds[0].problems.map((p) => p.message)).toContain("'Rnds 1-5000' spans more than 1000 rounds; only the first 1000 are read");
  });
  it('a repeat too long to count is one problem, not a hang', () => {
    const r = checkPiece('Rnd 2: (sc, inc) x99999', { start: 6 }).rounds[0];
    expect(r.problems.map((p) => p.message)).toEqual(['Round 2 is too long to count (more than 20000 steps); check the repeat counts']);
  });
});
