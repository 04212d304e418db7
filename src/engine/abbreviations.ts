// Every abbreviation the engine reads, as data. The reference is the Craft Yarn Council's "Crochet Master
// List" of abbreviations (CYC booklet "Standards & Guidelines for Crochet and Knitting", standards.md §4).
// Its entries could not be read at the source, so each entry says where it comes from:
//   'cyc-memory'  — recalled from the CYC master list, not verified (standards.md §4);
//   'cyc-uk'      — US/UK pairing read in the reprints listed in standards.md §5 (S11, S20, S21, S22);
//   'common'      — common practice, not on the CYC list (magic ring, invisible decrease, bobble …);
//   'whorlbook'   — our own reading of plain words (e.g. "around", "next").

import type { Terms } from './types';

export type Source = 'cyc-memory' | 'cyc-uk' | 'common' | 'whorlbook';

export type StitchKind = 'chain' | 'slip' | 'stitch' | 'inc' | 'dec' | 'special';

export interface StitchEntry {
  /** Canonical US abbreviation; also the key used in Round.made (except inc, which makes its base stitch). */
  id: string;
  /** Spellings read in US terms (lower case; multi-word phrases are joined by the phrase table below). */
  us: string[];
  /** Spellings read in UK terms. */
  uk: string[];
  /** Abbreviation written back to the maker in each terms. */
  abbr: { us: string; uk: string };
  /** Words for the maker. */
  name: { us: string; uk: string };
  kind: StitchKind;
  /** Stitches of the previous round one of these works into. */
  works: number;
  /** Stitches one of these leaves for the next round. */
  makes: number;
  /** Key counted in Round.made (inc counts as 2 of its base stitch). */
  madeAs: string;
  /** For a basic stitch: its "2 together" decrease (so "hdc dec" reads as hdc2tog). */
  decOf?: string;
  source: Source;
}

const e = (x: StitchEntry): StitchEntry => x;

export const STITCHES: StitchEntry[] = [
  e({ id: 'ch', us: ['ch', 'chain', 'chs'], uk: ['ch', 'chain', 'chs'], abbr: { us: 'ch', uk: 'ch' },
    name: { us: 'chain', uk: 'chain' }, kind: 'chain', works: 0, makes: 1, madeAs: 'ch', source: 'cyc-memory' }),
  // US sl st = UK slip stitch (ss). [standards.md §5, S11]
  e({ id: 'sl st', us: ['slst', 'sl'], uk: ['ss', 'slst', 'sl'], abbr: { us: 'sl st', uk: 'ss' },
    name: { us: 'slip stitch', uk: 'slip stitch' }, kind: 'slip', works: 1, makes: 1, madeAs: 'sl st', source: 'cyc-uk' }),
  // US sc = UK dc. [standards.md §5, S11, S20, S21, S22]
  e({ id: 'sc', us: ['sc'], uk: ['dc'], abbr: { us: 'sc', uk: 'dc' },
    name: { us: 'single crochet', uk: 'double crochet' }, kind: 'stitch', works: 1, makes: 1, madeAs: 'sc', decOf: 'sc2tog', source: 'cyc-uk' }),
  // US hdc = UK htr. [standards.md §5, S11, S20, S21]
  e({ id: 'hdc', us: ['hdc'], uk: ['htr'], abbr: { us: 'hdc', uk: 'htr' },
    name: { us: 'half double crochet', uk: 'half treble' }, kind: 'stitch', works: 1, makes: 1, madeAs: 'hdc', decOf: 'hdc2tog', source: 'cyc-uk' }),
  // US dc = UK tr. [standards.md §5, S11, S20, S21]
  e({ id: 'dc', us: ['dc'], uk: ['tr'], abbr: { us: 'dc', uk: 'tr' },
    name: { us: 'double crochet', uk: 'treble' }, kind: 'stitch', works: 1, makes: 1, madeAs: 'dc', decOf: 'dc2tog', source: 'cyc-uk' }),
  // US tr = UK dtr. [standards.md §5, S11, S20]
  e({ id: 'tr', us: ['tr', 'trc'], uk: ['dtr'], abbr: { us: 'tr', uk: 'dtr' },
    name: { us: 'treble crochet', uk: 'double treble' }, kind: 'stitch', works: 1, makes: 1, madeAs: 'tr', decOf: 'tr2tog', source: 'cyc-uk' }),
  // US dtr = UK triple treble (ttr / trtr). [standards.md §5, S11]
  e({ id: 'dtr', us: ['dtr'], uk: ['ttr', 'trtr'], abbr: { us: 'dtr', uk: 'ttr' },
    name: { us: 'double treble crochet', uk: 'triple treble' }, kind: 'stitch', works: 1, makes: 1, madeAs: 'dtr', source: 'cyc-uk' }),
  e({ id: 'trtr', us: ['trtr'], uk: ['qtr'], abbr: { us: 'trtr', uk: 'qtr' },
    name: { us: 'triple treble crochet', uk: 'quadruple treble' }, kind: 'stitch', works: 1, makes: 1, madeAs: 'trtr', source: 'cyc-memory' }),

  // Increase: 2 sc in one stitch (common practice; "inc" is on the CYC list as increase(s)/increasing, from memory).
  e({ id: 'inc', us: ['inc', 'incr', 'increase'], uk: ['inc', 'incr', 'increase'], abbr: { us: 'inc', uk: 'inc' },
    name: { us: 'increase', uk: 'increase' }, kind: 'inc', works: 1, makes: 2, madeAs: 'sc', source: 'cyc-memory' }),

  // Decreases: two (or three) stitches worked together into one.
  e({ id: 'sc2tog', us: ['sc2tog', 'dec', 'decr', 'decrease', 'scdec'], uk: ['dc2tog', 'dec', 'decr', 'decrease', 'dcdec'],
    abbr: { us: 'sc2tog', uk: 'dc2tog' }, name: { us: 'single crochet 2 together', uk: 'double crochet 2 together' },
    kind: 'dec', works: 2, makes: 1, madeAs: 'sc2tog', source: 'cyc-memory' }),
  // The invisible decrease (front loops only of the next 2 stitches) is not on the CYC list. [standards.md §4]
  e({ id: 'invdec', us: ['invdec'], uk: ['invdec'], abbr: { us: 'invdec', uk: 'invdec' },
    name: { us: 'invisible decrease', uk: 'invisible decrease' }, kind: 'dec', works: 2, makes: 1, madeAs: 'sc2tog', source: 'common' }),
  e({ id: 'sc3tog', us: ['sc3tog'], uk: ['dc3tog'], abbr: { us: 'sc3tog', uk: 'dc3tog' },
    name: { us: 'single crochet 3 together', uk: 'double crochet 3 together' }, kind: 'dec', works: 3, makes: 1, madeAs: 'sc3tog', source: 'cyc-memory' }),
  e({ id: 'hdc2tog', us: ['hdc2tog', 'hdcdec'], uk: ['htr2tog', 'htrdec'], abbr: { us: 'hdc2tog', uk: 'htr2tog' },
    name: { us: 'half double crochet 2 together', uk: 'half treble 2 together' }, kind: 'dec', works: 2, makes: 1, madeAs: 'hdc2tog', source: 'cyc-memory' }),
  e({ id: 'hdc3tog', us: ['hdc3tog'], uk: ['htr3tog'], abbr: { us: 'hdc3tog', uk: 'htr3tog' },
    name: { us: 'half double crochet 3 together', uk: 'half treble 3 together' }, kind: 'dec', works: 3, makes: 1, madeAs: 'hdc3tog', source: 'cyc-memory' }),
  e({ id: 'dc2tog', us: ['dc2tog', 'dcdec'], uk: ['tr2tog', 'trdec'], abbr: { us: 'dc2tog', uk: 'tr2tog' },
    name: { us: 'double crochet 2 together', uk: 'treble 2 together' }, kind: 'dec', works: 2, makes: 1, madeAs: 'dc2tog', source: 'cyc-memory' }),
  e({ id: 'dc3tog', us: ['dc3tog'], uk: ['tr3tog'], abbr: { us: 'dc3tog', uk: 'tr3tog' },
    name: { us: 'double crochet 3 together', uk: 'treble 3 together' }, kind: 'dec', works: 3, makes: 1, madeAs: 'dc3tog', source: 'cyc-memory' }),
  e({ id: 'tr2tog', us: ['tr2tog', 'trdec'], uk: ['dtr2tog', 'dtrdec'], abbr: { us: 'tr2tog', uk: 'dtr2tog' },
    name: { us: 'treble crochet 2 together', uk: 'double treble 2 together' }, kind: 'dec', works: 2, makes: 1, madeAs: 'tr2tog', source: 'cyc-memory' }),

  // Post stitches: FP/BP + stitch (CYC lists BP/FP, from memory); the base stitch follows the terms.
  ...(['sc', 'hdc', 'dc', 'tr'] as const).flatMap((base) => {
    const ukBase = { sc: 'dc', hdc: 'htr', dc: 'tr', tr: 'dtr' }[base];
    return (['fp', 'bp'] as const).map((side) =>
      e({ id: side + base, us: [side + base], uk: [side + ukBase], abbr: { us: side + base, uk: side + ukBase },
        name: { us: `${side === 'fp' ? 'front' : 'back'} post ${base}`, uk: `${side === 'fp' ? 'front' : 'back'} post ${ukBase}` },
        kind: 'stitch', works: 1, makes: 1, madeAs: side + base, source: 'cyc-memory' }),
    );
  }),

  // Textured stitches that sit in one stitch and count as one: CL and pc are on the CYC list (from memory);
  // bobble and puff are common practice.
  e({ id: 'cl', us: ['cl', 'cluster'], uk: ['cl', 'cluster'], abbr: { us: 'cl', uk: 'cl' }, name: { us: 'cluster', uk: 'cluster' },
    kind: 'special', works: 1, makes: 1, madeAs: 'cl', source: 'cyc-memory' }),
  e({ id: 'pc', us: ['pc', 'popcorn'], uk: ['pc', 'popcorn'], abbr: { us: 'pc', uk: 'pc' }, name: { us: 'popcorn', uk: 'popcorn' },
    kind: 'special', works: 1, makes: 1, madeAs: 'pc', source: 'cyc-memory' }),
  e({ id: 'bobble', us: ['bobble', 'bob'], uk: ['bobble', 'bob'], abbr: { us: 'bobble', uk: 'bobble' },
    name: { us: 'bobble', uk: 'bobble' }, kind: 'special', works: 1, makes: 1, madeAs: 'bobble', source: 'common' }),
  e({ id: 'puff', us: ['puff'], uk: ['puff'], abbr: { us: 'puff', uk: 'puff' }, name: { us: 'puff stitch', uk: 'puff stitch' },
    kind: 'special', works: 1, makes: 1, madeAs: 'puff', source: 'common' }),
  // A picot sits on top of a stitch and is not counted as a stitch (common practice).
  e({ id: 'picot', us: ['picot'], uk: ['picot'], abbr: { us: 'picot', uk: 'picot' }, name: { us: 'picot', uk: 'picot' },
    kind: 'special', works: 0, makes: 0, madeAs: 'picot', source: 'cyc-memory' }),
];

export const STITCH_BY_ID: ReadonlyMap<string, StitchEntry> = new Map(STITCHES.map((s) => [s.id, s]));

function spellingTable(terms: Terms): Map<string, StitchEntry> {
  const m = new Map<string, StitchEntry>();
  for (const s of STITCHES) for (const w of s[terms]) if (!m.has(w)) m.set(w, s);
  return m;
}

const SPELLINGS: Record<Terms, Map<string, StitchEntry>> = { us: spellingTable('us'), uk: spellingTable('uk') };

/** The stitch a (normalised, lower-case) word means in the given terms, if any. */
export function stitchFor(word: string, terms: Terms): StitchEntry | undefined {
  return SPELLINGS[terms].get(word);
}

/**
 * Multi-word phrases joined into one word before parsing, per terms, longest first.
 * "double crochet" means US dc but UK dc (= US sc), so the table is per terms.
 */
export const PHRASES: Record<Terms, Array<[string[], string]>> = {
  us: [
    [['half', 'double', 'crochet'], 'hdc'],
    [['double', 'treble', 'crochet'], 'dtr'],
    [['triple', 'treble', 'crochet'], 'trtr'],
    [['single', 'crochet'], 'sc'],
    [['double', 'crochet'], 'dc'],
    [['treble', 'crochet'], 'tr'],
    [['triple', 'crochet'], 'tr'],
  ],
  uk: [
    [['half', 'treble', 'crochet'], 'htr'],
    [['double', 'treble', 'crochet'], 'dtr'],
    [['triple', 'treble', 'crochet'], 'ttr'],
    [['half', 'treble'], 'htr'],
    [['double', 'treble'], 'dtr'],
    [['triple', 'treble'], 'ttr'],
    [['double', 'crochet'], 'dc'],
    [['treble', 'crochet'], 'tr'],
    [['treble'], 'tr'],
  ],
};

/** Phrases that mean the same in both terms. */
export const COMMON_PHRASES: Array<[string[], string]> = [
  [['slip', 'stitch'], 'slst'],
  [['sl', 'st'], 'slst'],
  [['sl', 'sts'], 'slst'],
  [['slip', 'st'], 'slst'],
  [['magic', 'ring'], 'mr'],
  [['magic', 'circle'], 'mr'],
  [['magic', 'loop'], 'mr'],
  [['adjustable', 'ring'], 'mr'],
  [['adjustable', 'loop'], 'mr'],
  [['inv', 'dec'], 'invdec'],
  [['invisible', 'dec'], 'invdec'],
  [['invisible', 'decrease'], 'invdec'],
  [['back', 'loops', 'only'], 'blo'],
  [['back', 'loop', 'only'], 'blo'],
  [['front', 'loops', 'only'], 'flo'],
  [['front', 'loop', 'only'], 'flo'],
  [['back', 'loops'], 'blo'],
  [['back', 'loop'], 'blo'],
  [['front', 'loops'], 'flo'],
  [['front', 'loop'], 'flo'],
  [['bl', 'only'], 'blo'],
  [['fl', 'only'], 'flo'],
  [['blo', 'only'], 'blo'],
  [['flo', 'only'], 'flo'],
  [['yarn', 'over'], 'yo'],
  [['yarn', 'round', 'hook'], 'yrh'],
  [['chain', 'space'], 'chsp'],
  [['ch', 'sp'], 'chsp'],
  [['ch', 'space'], 'chsp'],
  [['from', 'hook'], 'fromhook'],
  [['other', 'side'], 'otherside'],
  [['opposite', 'side'], 'otherside'],
  [['place', 'marker'], 'pm'],
  [['st', 'marker'], 'pm'],
  [['each', 'st'], 'each'],
];

/** Single words rewritten to one spelling before parsing (both terms). */
export const SYNONYMS: ReadonlyMap<string, string> = new Map([
  ['stitch', 'st'], ['stitches', 'st'], ['sts', 'st'], ['stich', 'st'], ['stiches', 'st'],
  ['chains', 'ch'], ['chs', 'ch'], ['chain', 'ch'],
  ['into', 'in'], ['inside', 'in'], ['through', 'in'], ['thru', 'in'],
  ['every', 'each'], ['foll', 'next'], ['following', 'next'], ['nxt', 'next'],
  ['rem', 'remaining'], ['rest', 'remaining'],
  ['repeat', 'rep'], ['repeated', 'rep'], ['repeating', 'rep'], ['reps', 'rep'],
  ['skip', 'sk'], ['skipping', 'sk'], ['skipped', 'sk'], ['miss', 'sk'], ['missing', 'sk'],
  ['together', 'tog'],
  ['bl', 'blo'], ['fl', 'flo'], ['tbl', 'blo'], ['tfl', 'flo'], ['bls', 'blo'], ['fls', 'flo'],
  ['lp', 'loop'], ['lps', 'loops'],
  ['rnd', 'rnd'], ['rnds', 'rnd'], ['round', 'rnd'], ['rounds', 'rnd'], ['rd', 'rnd'], ['rds', 'rnd'], ['rows', 'row'],
  ['beginning', 'beg'], ['begin', 'beg'], ['starting', 'beg'],
  ['stitche', 'st'], ['circle', 'ring'],
  ['increases', 'inc'], ['incs', 'inc'], ['decreases', 'dec'], ['decs', 'dec'], ['invdecs', 'invdec'],
  ['space', 'sp'], ['spaces', 'sp'], ['sps', 'sp'],
  ['×', 'x'], ['times', 'times'], ['time', 'times'],
  ['doesnt', 'not'], ["doesn't", 'not'], ['dont', 'not'], ['no', 'not'],
  ['counting', 'counts'], ['count', 'counts'], ['leaving', 'leave'], ['until', 'to'], ['till', 'to'], ['ending', 'end'],
  ['tch', 'ch'], ['beg', 'beg'],
  ['scs', 'sc'], ['hdcs', 'hdc'], ['dcs', 'dc'], ['trs', 'tr'], ['dtrs', 'dtr'], ['htrs', 'htr'],
]);

/** Number words read in counts ("twice", "three times"). */
export const NUMBER_WORDS: ReadonlyMap<string, number> = new Map([
  ['once', 1], ['one', 1], ['twice', 2], ['two', 2], ['thrice', 3], ['three', 3], ['four', 4], ['five', 5],
  ['six', 6], ['seven', 7], ['eight', 8], ['nine', 9], ['ten', 10], ['eleven', 11], ['twelve', 12],
]);

/**
 * Structural words: not stitches, but words the engine reads. With their source. Kept here so the
 * "did you mean" suggestions and the documentation use one list.
 */
export const STRUCTURE_WORDS: ReadonlyArray<{ word: string; meaning: string; source: Source }> = [
  { word: 'st', meaning: 'stitch(es)', source: 'cyc-memory' },
  { word: 'sk', meaning: 'skip (UK: miss)', source: 'cyc-memory' },
  { word: 'rep', meaning: 'repeat(s)', source: 'cyc-memory' },
  { word: 'rnd', meaning: 'round(s)', source: 'cyc-memory' },
  { word: 'row', meaning: 'row', source: 'whorlbook' },
  { word: 'tog', meaning: 'together', source: 'cyc-memory' },
  { word: 'blo', meaning: 'back loop only (BL/BLO, tbl)', source: 'cyc-memory' },
  { word: 'flo', meaning: 'front loop only (FL/FLO)', source: 'cyc-memory' },
  { word: 'yo', meaning: 'yarn over (UK: yrh, yarn round hook)', source: 'cyc-uk' },
  { word: 'yrh', meaning: 'yarn round hook (UK)', source: 'cyc-uk' },
  { word: 'beg', meaning: 'beginning', source: 'cyc-memory' },
  { word: 'remaining', meaning: 'remaining (rem)', source: 'cyc-memory' },
  { word: 'sp', meaning: 'space(s)', source: 'cyc-memory' },
  { word: 'chsp', meaning: 'chain space (ch-sp)', source: 'cyc-memory' },
  { word: 'loop', meaning: 'loop (lp)', source: 'cyc-memory' },
  { word: 'loops', meaning: 'loops (lps)', source: 'cyc-memory' },
  { word: 'pm', meaning: 'place marker', source: 'cyc-memory' },
  { word: 'mr', meaning: 'magic ring (not on the CYC list; "MC" can also mean main colour)', source: 'common' },
  { word: 'ring', meaning: 'ring made from a chain, or the magic ring', source: 'common' },
  { word: 'next', meaning: 'next', source: 'whorlbook' },
  { word: 'each', meaning: 'each', source: 'whorlbook' },
  { word: 'around', meaning: 'in each remaining stitch of the round', source: 'whorlbook' },
  { word: 'across', meaning: 'in each remaining stitch of the row', source: 'whorlbook' },
  { word: 'same', meaning: 'the stitch just worked into', source: 'whorlbook' },
  { word: 'first', meaning: 'first', source: 'whorlbook' },
  { word: 'last', meaning: 'last', source: 'whorlbook' },
  { word: 'join', meaning: 'join with a slip stitch (makes no stitch)', source: 'common' },
  { word: 'turn', meaning: 'turn the work (makes no stitch)', source: 'common' },
  { word: 'leave', meaning: 'leave stitches unworked', source: 'whorlbook' },
  { word: 'unworked', meaning: 'not worked into', source: 'whorlbook' },
  { word: 'times', meaning: 'times', source: 'whorlbook' },
  { word: 'more', meaning: 'more', source: 'whorlbook' },
  { word: 'from', meaning: 'from', source: 'whorlbook' },
  { word: 'working', meaning: 'working', source: 'whorlbook' },
  { word: 'counts', meaning: 'counts (as a stitch)', source: 'whorlbook' },
  { word: 'evenly', meaning: 'spread evenly around', source: 'whorlbook' },
  { word: 'over', meaning: 'over', source: 'whorlbook' },
  { word: 'top', meaning: 'top (of a chain)', source: 'whorlbook' },
  { word: 'end', meaning: 'end', source: 'whorlbook' },
  { word: 'then', meaning: 'then', source: 'whorlbook' },
];

/** Words that belong to UK terms only / US terms only: used for the "looks like the other terms" hint. */
export const TERMS_TELLTALES: Record<Terms, ReadonlySet<string>> = {
  // Words that suggest a pattern is written in UK terms. [standards.md §5 heuristic, S21]
  uk: new Set(['htr', 'yrh', 'ttr', 'htr2tog', 'ss', 'miss']),
  // Words that suggest US terms. [standards.md §5 heuristic]
  us: new Set(['sc', 'hdc', 'sc2tog', 'hdc2tog', 'yo', 'skip']),
};

/** Spelling of an entry in the given terms. */
export function abbrIn(id: string, terms: Terms): string {
  return STITCH_BY_ID.get(id)?.abbr[terms] ?? id;
}

/** All words the engine can read: the "did you mean" dictionary. */
export function vocabulary(terms: Terms): string[] {
  const words = new Set<string>();
  for (const s of STITCHES) for (const w of s[terms]) words.add(w);
  for (const s of STRUCTURE_WORDS) words.add(s.word);
  for (const w of ['in', 'on', 'and', 'with', 'as', 'not', 'x', 'hook', 'side', 'ch', 'sl']) words.add(w);
  return [...words];
}

// US hook letters to mm, for hook-change notes written with a letter. [standards.md §2, S9, S10, S13]
export const US_HOOK_MM: ReadonlyMap<string, number> = new Map([
  ['b-1', 2.25], ['b1', 2.25], ['c-2', 2.75], ['c2', 2.75], ['d-3', 3.25], ['d3', 3.25], ['e-4', 3.5], ['e4', 3.5],
  ['f-5', 3.75], ['f5', 3.75], ['g-6', 4], ['g6', 4], ['h-8', 5], ['h8', 5], ['i-9', 5.5], ['i9', 5.5],
  ['j-10', 6], ['j10', 6], ['k-10.5', 6.5], ['k-10½', 6.5], ['l-11', 8], ['l11', 8],
]);
