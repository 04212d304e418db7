// Tokenizer for one line of instructions. Hand-written and single-pass: it keeps every token's column in
// the source line (problems point at them) and runs on every keystroke in the editor.

import { COMMON_PHRASES, NUMBER_WORDS, PHRASES, SYNONYMS, stitchFor } from './abbreviations';
import type { Terms } from './types';

export type TokKind = 'num' | 'ord' | 'word' | 'p';

export interface Tok {
  k: TokKind;
  /** word: lower-case normalised spelling; p: the punctuation ('(' ')' '[' ']' '{' '}' '*' ',' ';' '.' ':' '-' '=' '+' '/'). */
  v: string;
  /** Value of a number or ordinal; size of a "ch-3" space. */
  n: number;
  col: number;
  end: number;
  /** As written (lower-cased for words before normalising). */
  raw: string;
}

const ORDINAL = /^(st|nd|rd|th)$/;

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

function isLetter(ch: string, c: number): boolean {
  if ((c >= 97 && c <= 122) || (c >= 65 && c <= 90)) return true;
  return c > 127 && /\p{L}/u.test(ch);
}

/** Splits a line into tokens. Never throws. */
export function lex(text: string, offset = 0): Tok[] {
  const out: Tok[] = [];
  const len = text.length;
  let i = 0;
  while (i < len) {
    const ch = text[i];
    const c = text.charCodeAt(i);
    if (c <= 32 || c === 160 || c === 0x2009 || c === 0x202f) {
      i++;
      continue;
    }
    if (isDigit(c)) {
      let j = i;
      while (j < len && isDigit(text.charCodeAt(j))) j++;
      const digits = text.slice(i, j);
      // An ordinal suffix sits right after the digits and ends the word ("2nd ch", but "6sc" is 6 + sc).
      let k = j;
      while (k < len && isLetter(text[k], text.charCodeAt(k))) k++;
      const suffix = text.slice(j, k).toLowerCase();
      const n = digits.length > 9 ? Number.MAX_SAFE_INTEGER : Number(digits);
      if (ORDINAL.test(suffix) && ordinalFits(n, suffix)) {
        out.push({ k: 'ord', v: digits + suffix, n, col: i + offset, end: k + offset, raw: text.slice(i, k) });
        i = k;
      } else {
        out.push({ k: 'num', v: digits, n, col: i + offset, end: j + offset, raw: digits });
        i = j;
      }
      continue;
    }
    if (isLetter(ch, c)) {
      let j = i;
      for (;;) {
        while (j < len && (isLetter(text[j], text.charCodeAt(j)) || text[j] === "'" || text[j] === '’')) j++;
        // Letters, digits, letters again: one word ("sc2tog", "dc3tog"); "x6" stays "x" + 6.
        let d = j;
        while (d < len && isDigit(text.charCodeAt(d))) d++;
        if (d > j && d < len && isLetter(text[d], text.charCodeAt(d))) {
          j = d;
          continue;
        }
        break;
      }
      let raw = text.slice(i, j);
      let lowerRaw = raw.toLowerCase();
      let lower = lowerRaw;
      if (raw.includes("'") || raw.includes('’')) {
        while (raw.endsWith("'") || raw.endsWith('’')) raw = raw.slice(0, -1);
        lowerRaw = raw.toLowerCase();
        lower = lowerRaw.replace(/['’]/g, '');
      }
      out.push({ k: 'word', v: lower, n: 0, col: i + offset, end: i + raw.length + offset, raw: lowerRaw });
      i = j;
      continue;
    }
    switch (ch) {
      case '×':
        out.push({ k: 'word', v: 'x', n: 0, col: i + offset, end: i + 1 + offset, raw: 'x' });
        break;
      case '&':
        out.push({ k: 'word', v: 'and', n: 0, col: i + offset, end: i + 1 + offset, raw: '&' });
        break;
      case '-':
      case '–':
      case '—':
      case '‑':
      case '−':
        out.push({ k: 'p', v: '-', n: 0, col: i + offset, end: i + 1 + offset, raw: ch });
        break;
      case '(':
      case ')':
      case '[':
      case ']':
      case '{':
      case '}':
      case '*':
      case ',':
      case ';':
      case '.':
      case ':':
      case '=':
      case '+':
      case '/':
        out.push({ k: 'p', v: ch, n: 0, col: i + offset, end: i + 1 + offset, raw: ch });
        break;
      case '!':
      case '?':
        out.push({ k: 'p', v: '.', n: 0, col: i + offset, end: i + 1 + offset, raw: ch });
        break;
      default:
        // Quotes, hashes and other marks carry no instruction.
        break;
    }
    i++;
  }
  return out;
}

function ordinalFits(n: number, suffix: string): boolean {
  const last = n % 10;
  const teen = n % 100 >= 11 && n % 100 <= 13;
  if (suffix === 'st') return last === 1 && !teen;
  if (suffix === 'nd') return last === 2 && !teen;
  if (suffix === 'rd') return last === 3 && !teen;
  return true;
}

const FILLERS = new Set(['the', 'a', 'an', 'of', 'your', 'this', 'that', 'its', 'them']);

function knownJoined(word: string, terms: Terms): boolean {
  return stitchFor(word, terms) !== undefined || SYNONYMS.has(word) || word === 'chsp' || word === 'slst';
}

interface PhraseIndex {
  byFirst: Map<string, Array<[string[], string]>>;
}

function indexPhrases(list: Array<[string[], string]>): PhraseIndex {
  const byFirst = new Map<string, Array<[string[], string]>>();
  for (const p of [...list].sort((a, b) => b[0].length - a[0].length)) {
    const arr = byFirst.get(p[0][0]) ?? [];
    arr.push(p);
    byFirst.set(p[0][0], arr);
  }
  return { byFirst };
}

const PHRASE_INDEX: Record<Terms, PhraseIndex> = {
  us: indexPhrases([...PHRASES.us, ...COMMON_PHRASES, [['treble'], 'tr']]),
  uk: indexPhrases([...PHRASES.uk, ...COMMON_PHRASES]),
};

/**
 * Rewrites words to the spellings the parser reads: synonyms ("stitches" → "st"), multi-word phrases
 * ("half double crochet" → "hdc", per terms), "ch-3 sp" → one space token, number words → numbers, and
 * drops filler words. Columns stay those of the source.
 */
export function normalize(toks: Tok[], terms: Terms): Tok[] {
  // 1. Hyphenated words: "ch-3" (a chain space), "sc-dec", "sl-st".
  const a: Tok[] = [];
  for (let i = 0; i < toks.length; i++) {
    const t = toks[i];
    const d = toks[i + 1];
    const b = toks[i + 2];
    if (t.k === 'word' && d && d.k === 'p' && d.v === '-' && d.col === t.end && b && b.col === d.end) {
      const tv = SYNONYMS.get(t.v) ?? t.v;
      if (tv === 'ch' && b.k === 'num') {
        let end = b.end;
        let skip = 2;
        const after = toks[i + 3];
        if (after && after.k === 'word' && /^(sp|sps|space|spaces|loop|lp|lps|loops)$/.test(after.v)) {
          end = after.end;
          skip = 3;
        }
        a.push({ k: 'word', v: 'chsp', n: b.n, col: t.col, end, raw: 'ch-' + b.raw });
        i += skip;
        continue;
      }
      if (b.k === 'word') {
        const joined = t.v + b.v;
        if (knownJoined(joined, terms) || (tv === 'ch' && /^(sp|space)$/.test(b.v))) {
          a.push({ k: 'word', v: tv === 'ch' ? 'chsp' : joined, n: 0, col: t.col, end: b.end, raw: t.raw + '-' + b.raw });
          i += 2;
          continue;
        }
        // "back-loop", "half-double": read as separate words.
        a.push(t);
        i += 1;
        continue;
      }
    }
    a.push(t);
  }
  // 2. Synonyms and number words.
  const s: Tok[] = [];
  for (const t of a) {
    if (t.k !== 'word') {
      s.push(t);
      continue;
    }
    const numberWord = NUMBER_WORDS.get(t.v);
    if (numberWord !== undefined) {
      s.push({ ...t, k: 'num', n: numberWord, v: String(numberWord) });
      if (t.v === 'once' || t.v === 'twice' || t.v === 'thrice') s.push({ ...t, k: 'word', v: 'times', n: 0 });
      continue;
    }
    const syn = SYNONYMS.get(t.v);
    s.push(syn && syn !== t.v ? { ...t, v: syn } : t);
  }
  // 3. Phrases, longest first.
  const idx = PHRASE_INDEX[terms];
  const p: Tok[] = [];
  for (let i = 0; i < s.length; i++) {
    const t = s[i];
    if (t.k === 'word') {
      const cands = idx.byFirst.get(t.v);
      let matched = false;
      if (cands) {
        for (const [words, canon] of cands) {
          let ok = true;
          for (let w = 1; w < words.length; w++) {
            const u = s[i + w];
            if (!u || u.k !== 'word' || u.v !== words[w]) {
              ok = false;
              break;
            }
          }
          if (ok) {
            const last = s[i + words.length - 1];
            p.push({ k: 'word', v: canon, n: 0, col: t.col, end: last.end, raw: words.join(' ') });
            i += words.length - 1;
            matched = true;
            break;
          }
        }
      }
      if (matched) continue;
      if (FILLERS.has(t.v)) continue;
    }
    p.push(t);
  }
  return p;
}
