// US ↔ UK rewrite of a pattern's text: only the terms change, everything else stays byte for byte.
// Pairs [standards.md §5]: sc↔dc, hdc↔htr, dc↔tr, tr↔dtr (S11, S20, S21, S22), dtr↔ttr (S11),
// yarn over↔yarn round hook, yo↔yrh (S21), skip↔miss (inference noted in §5).
//
// Round trip: US → UK → US gives back the same text, because the map is one-to-one on the words it
// rewrites and is done in a single left-to-right pass (sc → dc never goes on to dc → tr). Words that
// already belong to the target terms only (a US text that says "htr") are the exception: no mapping
// can tell them apart afterwards, and the checker's hints flag such text.
//
// Left as written on purpose: "sl st" and "ss" (both read in UK patterns), "sk" (no UK abbreviation),
// "treble"/"double" without "crochet" (too common as plain words), words in mixed case like "sC".

import type { Terms } from './types';

type Pair = [string[], string[]];

// Single words, US → UK. Post stitches follow their base stitch.
const WORDS: Array<[string, string]> = [
  ['sc', 'dc'], ['hdc', 'htr'], ['dc', 'tr'], ['tr', 'dtr'], ['dtr', 'ttr'],
  ['sc2tog', 'dc2tog'], ['sc3tog', 'dc3tog'], ['hdc2tog', 'htr2tog'], ['hdc3tog', 'htr3tog'],
  ['dc2tog', 'tr2tog'], ['dc3tog', 'tr3tog'], ['tr2tog', 'dtr2tog'], ['tr3tog', 'dtr3tog'], ['dtr2tog', 'ttr2tog'],
  ['fpsc', 'fpdc'], ['bpsc', 'bpdc'], ['fphdc', 'fphtr'], ['bphdc', 'bphtr'], ['fpdc', 'fptr'], ['bpdc', 'bptr'],
  ['fptr', 'fpdtr'], ['bptr', 'bpdtr'],
  ['yo', 'yrh'], ['yos', 'yrhs'],
  ['skip', 'miss'], ['skips', 'misses'], ['skipped', 'missed'], ['skipping', 'missing'],
];

// Phrases, US → UK (longest first when matching).
const PHRASES: Pair[] = [
  [['half', 'double', 'crochet'], ['half', 'treble', 'crochet']],
  [['double', 'treble', 'crochet'], ['triple', 'treble', 'crochet']],
  [['single', 'crochet'], ['double', 'crochet']],
  [['double', 'crochet'], ['treble', 'crochet']],
  [['treble', 'crochet'], ['double', 'treble', 'crochet']],
  [['half', 'double'], ['half', 'treble']],
  [['single', 'crochets'], ['double', 'crochets']],
  [['double', 'crochets'], ['treble', 'crochets']],
  [['treble', 'crochets'], ['double', 'treble', 'crochets']],
  [['yarn', 'over'], ['yarn', 'round', 'hook']],
  [['yarn', 'overs'], ['yarn', 'rounds', 'hook']],
];

// "yarn over hook" (and CYC's "yoh", from memory) already names the UK action: it stays as written, and
// must not be read as "yarn over" + "hook".
const KEEP: string[][] = [['yarn', 'over', 'hook']];

interface Table {
  words: Map<string, string>;
  phrases: Array<[string[], string[]]>;
}

function build(dir: 'us-uk' | 'uk-us'): Table {
  const words = new Map<string, string>();
  for (const [us, uk] of WORDS) {
    if (dir === 'us-uk') words.set(us, uk);
    else words.set(uk, us);
  }
  const phrases: Array<[string[], string[]]> = PHRASES.map(([us, uk]) => (dir === 'us-uk' ? [us, uk] : [uk, us]));
  for (const k of KEEP) phrases.push([k, k]);
  phrases.sort((a, b) => b[0].length - a[0].length);
  return { words, phrases };
}

const TABLES = { 'us-uk': build('us-uk'), 'uk-us': build('uk-us') };

type CaseForm = 'lower' | 'upper' | 'title';

function caseOf(w: string): CaseForm | null {
  if (w === w.toLowerCase()) return 'lower';
  if (w === w.toUpperCase()) return 'upper';
  if (w[0] === w[0].toUpperCase() && w.slice(1) === w.slice(1).toLowerCase()) return 'title';
  return null;
}

function applyCase(w: string, c: CaseForm): string {
  if (c === 'upper') return w.toUpperCase();
  if (c === 'title') return w[0].toUpperCase() + w.slice(1);
  return w;
}

interface WordAt {
  word: string;
  start: number;
  end: number;
}

// A word: letters, optionally letters-digits-letters ("sc2tog"); digits before it are not part of it
// ("6sc" → "sc").
const WORD_RE = /[A-Za-z]+(?:[0-9]+[A-Za-z]+)*/g;
const SEP_RE = /^(?:[ \t]+|-)$/;

export function convertTerms(text: string, from: Terms, to: Terms): string {
  const src = String(text ?? '');
  if (from === to) return src;
  const table = TABLES[from === 'us' ? 'us-uk' : 'uk-us'];
  const words: WordAt[] = [];
  WORD_RE.lastIndex = 0;
  for (let m = WORD_RE.exec(src); m; m = WORD_RE.exec(src)) words.push({ word: m[0], start: m.index, end: m.index + m[0].length });
  let out = '';
  let at = 0;
  for (let i = 0; i < words.length; i++) {
    const w = words[i];
    // Phrases first (joined by spaces or one hyphen).
    let done = false;
    for (const [fromWords, toWords] of table.phrases) {
      const n = fromWords.length;
      if (i + n > words.length) continue;
      const seps: string[] = [];
      const cases: CaseForm[] = [];
      let ok = true;
      for (let j = 0; j < n; j++) {
        const u = words[i + j];
        const c = caseOf(u.word);
        if (c === null || u.word.toLowerCase() !== fromWords[j]) {
          ok = false;
          break;
        }
        cases.push(c);
        if (j > 0) {
          const sep = src.slice(words[i + j - 1].end, u.start);
          if (!SEP_RE.test(sep)) {
            ok = false;
            break;
          }
          seps.push(sep);
        }
      }
      if (!ok) continue;
      const first = words[i];
      const last = words[i + n - 1];
      // Same number of words: each keeps its own case and separator; otherwise the first separator and
      // the last word's case serve for the words added.
      const parts: string[] = [];
      for (let j = 0; j < toWords.length; j++) {
        const c = cases[Math.min(j, cases.length - 1)];
        parts.push(applyCase(toWords[j], c));
        if (j < toWords.length - 1) parts.push(toWords.length === n ? seps[j] : seps[0] ?? ' ');
      }
      out += src.slice(at, first.start) + parts.join('');
      at = last.end;
      i += n - 1;
      done = true;
      break;
    }
    if (done) continue;
    const c = caseOf(w.word);
    const mapped = c === null ? undefined : table.words.get(w.word.toLowerCase());
    if (mapped !== undefined && c !== null) {
      out += src.slice(at, w.start) + applyCase(mapped, c);
      at = w.end;
    }
  }
  return out + src.slice(at);
}
