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
      .filter((r) => r.problems.some((p) => /could not read|too long|past what|not in this piece|repeats itself|no instructions|'rep from|nothing before/.test(p.message)))
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
