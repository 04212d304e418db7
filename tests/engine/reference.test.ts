// Worked examples checked against published references. Each check names its source (keys from
// /work/shared/reference/standards.md). Where the reference entry itself is recalled rather than read,
// the test says "from memory".
import { describe, expect, it } from 'vitest';
import { checkPiece, convertTerms, STITCHES } from '@/engine';

const one = (text: string, start: number, terms: 'us' | 'uk' = 'us') => {
  const r = checkPiece(text, { start, terms }).rounds;
  expect(r).toHaveLength(1);
  return r[0];
};

describe('Craft Yarn Council abbreviation list (standards.md §4; entries from memory, not verified)', () => {
  // Source: Craft Yarn Council, "Crochet Master List" of abbreviations (booklet "Standards & Guidelines
  // for Crochet and Knitting", S5) — the entries below are from memory, as standards.md §4 says.
  const basics: Array<[string, string]> = [
    ['ch', 'chain'],
    ['sl st', 'slip stitch'],
    ['sc', 'single crochet'],
    ['hdc', 'half double crochet'],
    ['dc', 'double crochet'],
    ['tr', 'treble crochet'],
    ['dtr', 'double treble crochet'],
  ];
  it.each(basics)('%s is the abbreviation of %s, and each stitch counts as one (from memory)', (abbr, name) => {
    const entry = STITCHES.find((s) => s.id === abbr);
    expect(entry?.name.us).toBe(name);
    if (abbr === 'ch') return;
    // Written short and written out, one stitch in each of 6 stitches makes 6.
    for (const spelled of [abbr, name]) {
      const r = one(`Rnd 2: ${spelled} in each st around (6)`, 6);
      expect(r.stitches).toBe(6);
      expect(r.worked).toBe(6);
      expect(r.problems).toEqual([]);
      expect(r.made).toEqual({ [abbr]: 6 });
    }
  });

  it('ch makes stitches without working into any (from memory)', () => {
    const r = one('Rnd 2: sc in next 3 sts, ch 4, sk 4, sc in next 3 sts (10)', 10);
    expect(r.made).toEqual({ sc: 6, ch: 4 });
    expect(r.stitches).toBe(10);
    expect(r.worked).toBe(10);
  });

  it('sc2tog works 2 stitches together into 1; inc/dec are increase/decrease (from memory)', () => {
    const dec = one('Rnd 2: sc2tog x6 (6)', 12);
    expect(dec.worked).toBe(12);
    expect(dec.stitches).toBe(6);
    const inc = one('Rnd 2: inc x6 (12)', 6);
    expect(inc.worked).toBe(6);
    expect(inc.stitches).toBe(12);
  });

  it('BLO / FLO are back / front loop only: worked as usual, the loop is recorded (from memory)', () => {
    for (const [written, loop] of [
      ['BLO', 'blo'],
      ['BL', 'blo'],
      ['in back loops only', 'blo'],
      ['FLO', 'flo'],
      ['in front loops only', 'flo'],
    ] as const) {
      const r = one(`Rnd 5: ${written} sc in each st around (24)`, 24);
      expect(r.stitches, written).toBe(24);
      expect(r.loops, written).toEqual([loop]);
      expect(r.steps.every((s) => s.loop === loop), written).toBe(true);
    }
  });

  it('each entry says where it comes from', () => {
    for (const s of STITCHES) expect(['cyc-memory', 'cyc-uk', 'common', 'whorlbook']).toContain(s.source);
    // Not on the CYC list (standards.md §4): the invisible decrease is common practice.
    expect(STITCHES.find((s) => s.id === 'invdec')?.source).toBe('common');
  });
});

describe('CYC US/UK terminology chart, as reprinted (standards.md §5: S11, S20, S21, S22)', () => {
  // Source: S11 "Crochet hook, yarn & stitch conversions" (UK/US/Aus); S20 (US/UK terms); S21 (UK-terms
  // book: dc, htr, tr, dtr, yrh); S22 (US/UK dataset). Pairs: US sc = UK dc, US hdc = UK htr,
  // US dc = UK tr, US tr = UK dtr, US dtr = UK ttr (S11), US sl st = UK ss (S11).
  const pairs: Array<[string, string]> = [
    ['sc', 'dc'],
    ['hdc', 'htr'],
    ['dc', 'tr'],
    ['tr', 'dtr'],
    ['dtr', 'ttr'],
  ];
  it.each(pairs)('UK %2$s is read as US %1$s (S11)', (us, uk) => {
    const r = one(`Rnd 2: ${uk} in each st around (12)`, 12, 'uk');
    expect(r.made).toEqual({ [us]: 12 });
    expect(r.problems).toEqual([]);
  });

  it.each(pairs)('US %s is written UK %s, and back', (us, uk) => {
    expect(convertTerms(`6 ${us} in next st`, 'us', 'uk')).toBe(`6 ${uk} in next st`);
    expect(convertTerms(`6 ${uk} in next st`, 'uk', 'us')).toBe(`6 ${us} in next st`);
  });

  it('UK ss and sl st are the slip stitch (S11)', () => {
    for (const w of ['ss', 'sl st']) {
      const r = one(`Rnd 2: ${w} in each st around (6)`, 6, 'uk');
      expect(r.made).toEqual({ 'sl st': 6 });
    }
  });

  it('a lone sc in a UK pattern is a problem, never read as US sc (standards.md §5 caution, S22)', () => {
    const r = one('Rnd 2: sc in each st around (6)', 6, 'uk');
    expect(r.stitches).toBe(6);
    expect(r.made.sc).toBeUndefined();
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0].message).toMatch(/^'sc' is ambiguous in UK terms/);
  });

  it('yarn over = yarn round hook (S21) and skip = miss (§5, an inference noted there)', () => {
    expect(convertTerms('yo, pull up a loop; skip 2 sts', 'us', 'uk')).toBe('yrh, pull up a loop; miss 2 sts');
    expect(convertTerms('Yarn over twice', 'us', 'uk')).toBe('Yarn round hook twice');
    expect(convertTerms('yrh, miss next st', 'uk', 'us')).toBe('yo, skip next st');
  });

  it('htr or yrh in a US pattern, sc or hdc in a UK one, gives one hint (standards.md §5 heuristic)', () => {
    const us = checkPiece('Rnd 1: 6 sc in MR (6)\nRnd 2: htr in each st around (6)\nRnd 3: yrh, htr around (6)');
    expect(us.hints).toHaveLength(1);
    expect(us.hints[0]).toMatch(/looks like UK terms \(htr, yrh\)/);
    expect(us.rounds.flatMap((r) => r.problems)).toEqual([]);
    const uk = checkPiece('Rnd 1: 6 dc in MR (6)\nRnd 2: hdc in each st around (6)', { terms: 'uk' });
    expect(uk.hints).toHaveLength(1);
    expect(uk.hints[0]).toMatch(/looks like US terms \(hdc\)/);
  });
});

describe('flat circle in single crochet: 6, 12, 18, 24, 30, 36 (common practice; S38, S20, S41)', () => {
  // Round r has 6r stitches; round r ≥ 3 is (r−2 sc, inc) x6. [standards.md §8]
  const circle = [
    'Rnd 1: 6 sc in MR (6)',
    'Rnd 2: inc x6 (12)',
    'Rnd 3: (sc, inc) x6 (18)',
    'Rnd 4: (2 sc, inc) x6 (24)',
    'Rnd 5: (3 sc, inc) x6 (30)',
    'Rnd 6: (4 sc, inc) x6 (36)',
  ].join('\n');
  it('counts 6r stitches in round r with no problem', () => {
    const c = checkPiece(circle);
    expect(c.rounds.map((r) => r.stitches)).toEqual([6, 12, 18, 24, 30, 36]);
    expect(c.rounds.map((r) => r.worked)).toEqual([0, 6, 12, 18, 24, 30]);
    expect(c.rounds.flatMap((r) => r.problems)).toEqual([]);
    expect(c.totalStitches).toBe(6 + 12 + 18 + 24 + 30 + 36);
  });
  it('the same circle written with stars and words reads the same (common practice)', () => {
    const c = checkPiece(
      [
        'Round 1: 6 single crochet in a magic ring',
        'Round 2: 2 sc in each st around — 12 sts',
        'Round 3: *sc in next st, 2 sc in next st; rep from * around [18]',
        'Round 4: *sc in next 2 sts, inc; rep from * 5 more times (24 sts)',
      ].join('\n'),
    );
    expect(c.rounds.map((r) => r.stitches)).toEqual([6, 12, 18, 24]);
    expect(c.rounds.flatMap((r) => r.problems)).toEqual([]);
  });
});

describe('sphere heuristic: +6 a round to N, about N/6 even rounds, then −6 a round (S41; common practice)', () => {
  it('a 36-stitch ball closes back to 6 with every count right', () => {
    const lines = ['Rnd 1: 6 sc in MR (6)', 'Rnd 2: inc x6 (12)'];
    for (let r = 3; r <= 6; r++) lines.push(`Rnd ${r}: (${r - 2} sc, inc) x6 (${6 * r})`);
    // 36 ÷ 6 = 6 even rounds. [S41]
    lines.push('Rnds 7-12: sc around (36)');
    for (let k = 4; k >= 1; k--) lines.push(`Rnd ${17 - k}: (${k} sc, dec) x6 (${6 * (k + 1)})`);
    lines.push('Rnd 17: dec x6 (6)');
    const c = checkPiece(lines.join('\n'));
    expect(c.rounds.map((r) => r.stitches)).toEqual([6, 12, 18, 24, 30, 36, 36, 36, 36, 36, 36, 36, 30, 24, 18, 12, 6]);
    expect(c.rounds.flatMap((r) => r.problems)).toEqual([]);
  });
});
