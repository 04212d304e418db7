// Property tests (fast-check): the engine never throws, its steps always add up, the planner always
// reads back, and US → UK → US gives back the same text.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkPiece, convertTerms, planRound, type PieceCheck } from '@/engine';

// Pieces of real instructions, joined at random: the engine meets every construct in odd company.
const REAL = [
  'sc', 'hdc', 'dc', 'tr', 'dtr', 'inc', 'dec', 'invdec', 'sc2tog', 'sc3tog', 'ch', 'sl st', 'MR', 'magic ring', 'ring',
  '(', ')', '[', ']', '{', '}', '*', 'x6', '6', '2', '0', '12', 'times', 'twice', 'more', 'rep from *', 'around', 'across',
  'in next', 'in each st', 'st', 'sts', ',', ';', '.', ':', '—', '-', '×', 'Rnd 5:', 'Rnds 2-4:', 'Row 1:', 'R3:', '(30)',
  '— 30 sts', '[18]', 'sk 2', 'skip', 'leave remaining 4 sts unworked', 'ch 3 (counts as dc)', '(does not count)',
  'in 2nd ch from hook', 'working on the other side of the chain', 'BLO', 'FLO', 'in back loops only', 'join', 'turn',
  '5 more times', 'to last 3 sts', 'evenly', 'rep Rnd 2', 'rep Rnds 2 and 3 twice', 'Working in the front loops left from Rnd 2:',
  '\n', 'htr', 'ss', 'yrh', 'miss', 'scc', 'xyzzy', '(sc, hdc) in next st', '3 sc in next st', 'ch-2 sp', 'same st',
  'first st', 'last st', 'tog', 'Stuff firmly', 'Change to color B', 'Fasten off', 'Place safety eyes between Rnds 2 and 3',
  '**', '***', 'rep from * to **', 'rep from ** 2 times', 'then from * to ** once', 'ending last rep at **', 'ending last rep with',
  'ending with', 'ending at *', 'in each ch-sp around', 'in next ch-sp', 'sk next ch-sp', 'ch 2', '(counts as dc + ch 2)',
  'sc, dec around', 'sc 2, inc around', 'in same sp and in each ch-sp around', 'sl st in next ch-sp,',
];
// Pasted nonsense that would flood the counter: rare in the mix, since each costs the whole piece budget.
const HEAVY = ['99999999999', 'Rnds 1-100000:', 'sc 9999', '(sc, inc) x9999'];
const TOKEN = fc.oneof({ arbitrary: fc.constantFrom(...REAL), weight: 60 }, { arbitrary: fc.constantFrom(...HEAVY), weight: 1 });

// Plain checks gathered into one expect: a round can have 20,000 steps, and an expect per step is slow.
function invariants(c: PieceCheck, terms: 'us' | 'uk'): void {
  const bad: string[] = [];
  if (c.terms !== terms) bad.push('terms');
  if (c.hints.some((h) => h.includes('could not check'))) bad.push('crashed');
  if (c.totalStitches !== c.rounds.reduce((s, r) => s + r.stitches, 0)) bad.push('totalStitches');
  if (c.totalSteps !== c.rounds.reduce((s, r) => s + r.steps.length, 0)) bad.push('totalSteps');
  const unsettled = new Set(
    c.rounds
      .filter((r) =>
        r.problems.some((p) =>
          /could not read|too long|past what|not in this piece|repeats itself|no instructions|'rep from|nothing before|by hand|cannot tell|comes before its|has no '\*|needs a '\*|follows no repeat|holds \d+ '\*/.test(p.message),
        ),
      )
      .map((r) => r.line),
  );
  for (const r of c.rounds) {
    if (!Number.isInteger(r.stitches) || r.stitches < 0) bad.push(`${r.label}: stitches ${r.stitches}`);
    let worked = 0;
    let makes = 0;
    r.steps.forEach((s, i) => {
      worked += s.worksInto;
      makes += s.makes;
      if (s.index !== i) bad.push(`${r.label}: step index`);
    });
    if (worked !== r.worked) bad.push(`${r.label}: worked ${r.worked} but steps work ${worked}`);
    // A line read in full leaves exactly what its steps make (a line read in part carries its stated count).
    if (!unsettled.has(r.line) && makes !== r.stitches) bad.push(`${r.label}: ${r.stitches} but steps make ${makes}`);
    for (const p of r.problems) if (!p.message || /could not read this line|undefined|NaN/.test(p.message)) bad.push(`${r.label}: ${p.message}`);
  }
  expect(bad).toEqual([]);
}

describe('checkPiece never throws', () => {
  it('on random text', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 400 }), fc.constantFrom<'us' | 'uk'>('us', 'uk'), (text, terms) => {
        invariants(checkPiece(text, { terms }), terms);
      }),
      { numRuns: 600 },
    );
  });

  it('on random code points, including surrogates and control characters', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 300 }), (text) => {
        invariants(checkPiece(text), 'us');
      }),
      { numRuns: 400 },
    );
  });

  it('on random mixes of real tokens, with any start count', () => {
    fc.assert(
      fc.property(
        fc.array(TOKEN, { maxLength: 60 }),
        fc.constantFrom<'us' | 'uk'>('us', 'uk'),
        fc.integer({ min: -10, max: 200 }),
        (parts, terms, start) => {
          invariants(checkPiece(parts.join(' '), { terms, start }), terms);
        },
      ),
      { numRuns: 1500 },
    );
  }, 60_000);

  it('on things that are not strings at all', () => {
    for (const bad of [undefined, null, 42, {}, [], { toString: () => 'Rnd 1: 6 sc in MR' }]) {
      expect(() => checkPiece(bad as unknown as string)).not.toThrow();
    }
    expect(checkPiece(null as unknown as string).rounds).toEqual([]);
  });
});

describe('planner read-back', () => {
  it('whatever it writes, plain or staggered, US or UK, reads back FROM worked and TO made with no problem', () => {
    const pair = fc.integer({ min: 1, max: 150 }).chain((from) => fc.tuple(fc.constant(from), fc.integer({ min: Math.ceil(from / 2), max: 2 * from })));
    fc.assert(
      fc.property(pair, fc.boolean(), fc.constantFrom<'us' | 'uk'>('us', 'uk'), ([from, to], staggered, terms) => {
        const { instruction } = planRound(from, to, { staggered, terms });
        const r = checkPiece(`Rnd 9: ${instruction}`, { start: from, terms }).rounds[0];
        expect({ worked: r.worked, stitches: r.stitches, problems: r.problems }).toEqual({ worked: from, stitches: to, problems: [] });
      }),
      { numRuns: 1000 },
    );
  }, 60_000);

  it('refuses, with a RangeError, every TO outside ceil(FROM/2)..2·FROM', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 300 }), fc.integer({ min: -5, max: 700 }), (from, to) => {
        fc.pre(to < Math.ceil(from / 2) || to > 2 * from);
        expect(() => planRound(from, to)).toThrow(RangeError);
      }),
    );
  });
});

// US text: stitches, long names and plain words, without words that only UK terms use (htr, yrh, miss …):
// such a word could not be told apart from a converted one afterwards (see src/engine/terms.ts).
const US_PARTS = [
  'sc', 'hdc', 'dc', 'tr', 'dtr', 'sc2tog', 'sc3tog', 'hdc2tog', 'dc2tog', 'dc3tog', 'tr2tog', 'fpdc', 'bpdc', 'fpsc', 'fphdc',
  'yo', 'skip', 'skipped', 'skipping', 'sk', 'sl st', 'ch', 'inc', 'dec', 'Sc', 'SC', 'Dc', 'HDC', 'Yo', 'Skip',
  'single crochet', 'half double crochet', 'double crochet', 'treble crochet', 'double treble crochet', 'yarn over',
  'Single crochet', 'Yarn Over', 'yarn over hook', 'double crochets', 'half double', 'treble crochets',
  'in', 'next', 'st', 'around', 'Rnd 3:', '(', ')', '*', 'x6', '6', '2sc', '12', ',', ';', '.', '—', 'rep from *', 'hook',
  'crochet', 'treble', 'yarn', 'over', 'the', 'loop', '\n', 'Stuff', 'colour B', 'sC', 'sTr',
];

describe('US → UK → US round trip', () => {
  it('gives back the same text', () => {
    const sep = fc.constantFrom(' ', ', ', '  ', '\n', '-', '; ', '\t');
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.constantFrom(...US_PARTS), sep), { maxLength: 40 }), (parts) => {
        const text = parts.map(([w, s]) => w + s).join('');
        expect(convertTerms(convertTerms(text, 'us', 'uk'), 'uk', 'us')).toBe(text);
      }),
      { numRuns: 2000 },
    );
  });

  it('and the UK text checks to the same counts', () => {
    const round = fc.constantFrom('sc around', '(sc, inc) x6', '*2 sc, dec; rep from * around', 'hdc in each st around', 'dc in next 6 sts, sc2tog x3', '3 sc in next st, sk 2, tr in next 3');
    fc.assert(
      fc.property(fc.array(round, { minLength: 1, maxLength: 8 }), (rounds) => {
        const us = rounds.map((r, i) => `Rnd ${i + 2}: ${r}`).join('\n');
        const a = checkPiece(us, { start: 12 });
        const b = checkPiece(convertTerms(us, 'us', 'uk'), { start: 12, terms: 'uk' });
        expect(b.rounds.map((r) => [r.stitches, r.worked, r.made])).toEqual(a.rounds.map((r) => [r.stitches, r.worked, r.made]));
      }),
      { numRuns: 300 },
    );
  });
});

// Stitches of the round before each instruction works (counting rules as in constructs.test.ts).
const PLAIN = [['sc', 1], ['2 sc', 2], ['sc 2', 2], ['hdc', 1], ['dc 3', 3], ['sc in next 2 sts', 2]] as const;
const SHAPING = [['inc', 1], ['dec', 2], ['sc2tog', 2], ['hdc inc', 1], ['invdec', 2]] as const;
const works = (parts: ReadonlyArray<readonly [string, number]>) => parts.reduce((s, [, w]) => s + w, 0);
const text = (parts: ReadonlyArray<readonly [string, number]>) => parts.map(([t]) => t).join(', ');
const reading = (c: PieceCheck) => c.rounds.map((r) => ({ stitches: r.stitches, worked: r.worked, made: r.made, problems: r.problems }));

describe('"… around" after a short sequence', () => {
  const sequence = fc.tuple(fc.array(fc.constantFrom(...PLAIN), { minLength: 1, maxLength: 3 }), fc.constantFrom(...SHAPING));

  it('reads like the same sequence in brackets, repeated as often as the round before allows', () => {
    fc.assert(
      fc.property(sequence, fc.integer({ min: 1, max: 12 }), ([seq, last], k) => {
        const all = [...seq, last];
        const start = k * works(all);
        const around = checkPiece(`Rnd 5: ${text(seq)}, ${last[0]} around`, { start });
        const written = checkPiece(`Rnd 5: (${text(all)}) x${k}`, { start });
        expect(reading(around)).toEqual(reading(written));
        expect(around.rounds[0].problems).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });

  it('says what is left over when the count is not a multiple of the sequence', () => {
    fc.assert(
      fc.property(sequence, fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 20 }), ([seq, last], k, extra) => {
        const w = works([...seq, last]);
        fc.pre(extra % w !== 0);
        const r = checkPiece(`Rnd 5: ${text(seq)}, ${last[0]} around`, { start: k * w + (extra % w) }).rounds[0];
        expect(r.problems.map((p) => p.message)).toEqual([
          `'${text(seq)}, ${last[0]} around' repeats '${text(seq)}, ${last[0]}', which works ${w} stitches each time, but ${k * w + (extra % w)} are left for it: it cannot fit the round (${k} ${k === 1 ? 'repeat leaves' : 'repeats leave'} ${extra % w} over)`,
        ]);
      }),
      { numRuns: 300 },
    );
  });
});

describe('star markers', () => {
  const part = fc.array(fc.constantFrom(...PLAIN, ...SHAPING), { minLength: 1, maxLength: 3 });

  it('"*A**, B; rep from * to ** N more times" is A, B, then A N more times', () => {
    fc.assert(
      fc.property(part, part, fc.integer({ min: 1, max: 6 }), (a, b, n) => {
        const start = works(a) * (n + 1) + works(b);
        const stars = checkPiece(`Rnd 5: *${text(a)}**, ${text(b)}; rep from * to ** ${n} more times`, { start });
        const written = checkPiece(`Rnd 5: ${text(a)}, ${text(b)}, (${text(a)}) x${n}`, { start });
        expect(reading(stars)).toEqual(reading(written));
        expect(stars.rounds[0].problems).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });

  it('"*A**, B; rep from * around, ending last rep at **" is (A, B) k−1 times, then A', () => {
    fc.assert(
      fc.property(part, part, fc.integer({ min: 1, max: 8 }), (a, b, k) => {
        const start = (k - 1) * (works(a) + works(b)) + works(a);
        const stars = checkPiece(`Rnd 5: *${text(a)}**, ${text(b)}; rep from * around, ending last rep at **`, { start });
        const written = checkPiece(`Rnd 5: ${k > 1 ? `(${text([...a, ...b])}) x${k - 1}, ` : ''}${text(a)}`, { start });
        expect(reading(stars)).toEqual(reading(written));
        expect(stars.rounds[0].problems).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });
});

describe('chain spaces', () => {
  it('"M sc in each ch-sp around" after "(sc, ch N) in each st around" works every space', () => {
    fc.assert(
      // From 2 spaces up: with one, the slip stitch takes it and "in each ch-sp around" has none left (said).
      fc.property(fc.integer({ min: 2, max: 20 }), fc.integer({ min: 1, max: 5 }), fc.integer({ min: 1, max: 4 }), fc.boolean(), (k, n, m, slip) => {
        const rnd3 = slip ? `sl st in next ch-sp, ch 1, ${m} sc in same sp and in each ch-sp around, join` : `${m} sc in each ch-sp around`;
        const c = checkPiece(`Rnd 1: ${k} sc in MR (${k})\nRnd 2: (sc, ch ${n}) in each st around\nRnd 3: ${rnd3}`);
        const r = c.rounds[2];
        expect({ stitches: r.stitches, worked: r.worked, problems: r.problems }).toEqual({ stitches: m * k, worked: k * (n + 1), problems: [] });
        expect(c.rounds[1].stitches).toBe(k * (n + 1));
      }),
      { numRuns: 300 },
    );
  });
});
