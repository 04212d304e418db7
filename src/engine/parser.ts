// Recursive-descent reader for one round's instructions, as designers write them.
// Pipeline: lex → normalise words → brackets into a tree → split into clauses at , ; . : then and →
// read each clause → nest the *…; rep from * repeats → settle what each chain is for.

import { STITCH_BY_ID, SYNONYMS, stitchFor, TERMS_TELLTALES, vocabulary, type StitchEntry } from './abbreviations';
import type {
  ChainRole,
  GroupNode,
  Into,
  MarkNode,
  Node,
  Parsed,
  ParsedNote,
  RepRound,
  StNode,
  Times,
  Units,
} from './ast';
import { lex, normalize, type Tok } from './lexer';
import { classifyNote } from './notes';
import { isPlainWord, suggest } from './suggest';
import type { Loop, Problem, Terms } from './types';

interface Br {
  k: 'br';
  open: Tok;
  close: Tok | null;
  els: El[];
  col: number;
  end: number;
}
type El = Tok | Br;

interface Clause {
  els: El[];
  /** The separator before this clause ('and' lets "… and in each ch across" inherit the stitch). */
  sep: string | null;
}

type Item =
  | Node
  | { t: '*open'; col: number }
  | { t: '*close'; col: number; times: Times | null }
  /** `from`/`to`: star levels of "rep from ** …" / "rep from * to ** …" (absent: a plain "rep from *"). */
  | { t: 'repfrom'; col: number; times: Times; from?: number; to?: number; text: string }
  | { t: 'reptimes'; col: number; times: Times }
  | EndingItem;

/**
 * "ending last rep at **" (`at`: the last time through stops at that mark), "ending last rep with X"
 * (`with`: X takes the place of the repeat's last instruction), "ending with X" (`after`: X comes after the
 * repeats, which leave room for it).
 */
type EndingItem =
  | { t: 'ending'; how: 'at'; level: number; col: number; text: string }
  | { t: 'ending'; how: 'with' | 'after'; nodes: Node[]; col: number; text: string };

const CLOSER: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
const SEP_PUNCT = new Set([',', ';', '.', ':', '+', '/', '=', '-']);
const LOOP_WORDS = new Set(['blo', 'flo', 'in', 'on', 'working', 'work', 'only', 'throughout', 'rnd', 'row', 'for', 'st', 'each', 'around', 'across', 'loops', 'loop', 'whole', 'entire', 'all', 'both', 'here', 'now']);
const COMMENT_BRACKET = /^(rs|ws|right side|wrong side|optional|see (note|photo|picture)s?.*|\d+ (rnds?|rounds?|rows?|rds?))$/;

const error = (message: string, column: number | null): Problem => ({ message, column, severity: 'error' });
const warning = (message: string, column: number | null): Problem => ({ message, column, severity: 'warning' });

function isTok(e: El | undefined): e is Tok {
  return e !== undefined && e.k !== 'br';
}
function isWord(e: El | undefined, ...vs: string[]): boolean {
  return isTok(e) && e.k === 'word' && (vs.length === 0 || vs.includes(e.v));
}
function isNum(e: El | undefined): boolean {
  return isTok(e) && e.k === 'num';
}
const tok = (e: El | undefined): Tok => e as Tok;

// Predicates at module level: the engine runs on every keystroke, and closures made per call cost
// (tsx and dev builds wrap each one to keep its name).
function isRoundWord(e: El): boolean {
  return isWord(e, 'rnd', 'row');
}
function isBracket(e: El): boolean {
  return e.k === 'br';
}
function isStar(e: El): boolean {
  return isP(e, '*');
}
function notStar(e: El): boolean {
  return !isP(e, '*');
}
function notPunct(e: El): boolean {
  return !(isTok(e) && e.k === 'p');
}
function notStatedPunct(e: El): boolean {
  return !(isTok(e) && e.k === 'p' && (e.v === ':' || e.v === '=' || e.v === '.'));
}
function isStatedWord(e: El): boolean {
  return isWord(e, 'st', 'total', 'in', 'all', 'made', 'around', 'each', 'now', 'remaining');
}
function isWordTok(t: Tok): boolean {
  return t.k === 'word';
}
function tokV(t: Tok): string {
  return t.v;
}
function isNumTok(t: Tok): boolean {
  return t.k === 'num';
}
function isEqualsTok(t: Tok): boolean {
  return t.k === 'p' && t.v === '=';
}
function isLoopWord(w: string): boolean {
  return LOOP_WORDS.has(w);
}
function isFloBlo(w: string): boolean {
  return w === 'flo' || w === 'blo';
}
const LEFT_WORDS = new Set(['left', 'leftover', 'unused', 'free', 'remaining', 'unworked', 'from']);
function isLeftWord(w: string): boolean {
  return LEFT_WORDS.has(w);
}
const ACTION_WORDS = new Set(['sk', 'rep', 'join', 'turn', 'mr', 'ring', 'leave', 'blo', 'flo', 'otherside', 'evenly', 'inc', 'dec']);
function isActionWord(w: string): boolean {
  return ACTION_WORDS.has(w);
}
const STITCHY_WORDS = new Set(['sk', 'rep', 'join', 'turn', 'mr', 'blo', 'flo']);
function isWorkNode(n: Node): boolean {
  return n.t === 'st' || n.t === 'group' || n.t === 'skip' || n.t === 'evenly';
}
/** Work that belongs to the round (not the slip stitches that move into place before it starts). */
function isCountedWork(n: Node): boolean {
  return isWorkNode(n) && !(n.t === 'st' && n.moving);
}
function notLoopNode(n: Node): boolean {
  return n.t !== 'loop' && n.t !== 'mark';
}
function isDoingNode(n: Node): boolean {
  return n.t !== 'loop' && n.t !== 'turn' && n.t !== 'mark';
}
function isP(e: El | undefined, v: string): boolean {
  return isTok(e) && e.k === 'p' && e.v === v;
}
function firstCol(els: El[]): number {
  const e = els[0];
  return e ? e.col : 0;
}
function lastEnd(els: El[]): number {
  const e = els[els.length - 1];
  return e ? e.end : 0;
}
function flatToks(els: El[], out: Tok[] = []): Tok[] {
  for (const e of els) {
    if (e.k === 'br') {
      out.push(e.open);
      flatToks(e.els, out);
      if (e.close) out.push(e.close);
    } else out.push(e);
  }
  return out;
}

const KNOWN: Record<Terms, Set<string>> = { us: knownWords('us'), uk: knownWords('uk') };
function knownWords(terms: Terms): Set<string> {
  const s = new Set<string>(vocabulary(terms));
  for (const v of SYNONYMS.values()) s.add(v);
  for (const w of ['st', 'ch', 'in', 'on', 'and', 'then', 'with', 'as', 'not', 'form', 'fromhook', 'otherside', 'chsp',
    'yo', 'yrh', 'pm', 'marker', 'loops', 'loop', 'top', 'beg', 'both', 'spiral', 'join', 'bor', 'continuous',
    'do', 'to', 'until', 'spaced', 'only', 'throughout', 'all', 'left', 'leftover', 'unused', 'free', 'unworked',
    'tog', 'x', 'times', 'more', 'once', 'work', 'working', 'each', 'ring', 'mr', 'mc', 'hook', 'side', 'here',
    'of', 'at', 'it', 'is', 'again', 'around', 'across', 'end', 'total', 'made', 'rows', 'row', 'rnd', 'slst', 'sc']) s.add(w);
  // Stitch spellings of the other terms are read too (with a hint).
  for (const other of ['us', 'uk'] as const) for (const w of vocabulary(other)) s.add(w);
  return s;
}

const STARTS_COUNTS_AS: Record<number, string> = { 1: 'sc', 2: 'hdc', 3: 'dc', 4: 'tr', 5: 'dtr' };

class Reader {
  problems: Problem[] = [];
  notes: ParsedNote[] = [];
  alts: number[] = [];
  statedOnly: number[] = [];
  /** A star repeat was already complained about: an unused '**' is part of the same slip. */
  starTrouble = false;
  telltales = new Set<string>();
  uncertain = false;
  seenStitch = false;
  lastSt: StNode | null = null;
  /** "(sc, ch 3) in same sp and in each ch-sp around": a group worked into a target, which "and in …" repeats. */
  lastGroup: GroupNode | null = null;
  repRound: RepRound | null = null;
  saidUkSc = false;
  readonly other: Terms;

  constructor(
    readonly terms: Terms,
    readonly line: string,
  ) {
    this.other = terms === 'us' ? 'uk' : 'us';
  }

  slice(from: number, to: number): string {
    const s = this.line.slice(from, to);
    return /\s\s|[\t\n\r]/.test(s) ? s.replace(/\s+/g, ' ').trim() : s.trim();
  }

  alt(options: number): number {
    this.alts.push(options);
    return this.alts.length - 1;
  }

  /** What a word means as a stitch here, reading the other terms' spellings too (they raise a hint). */
  stitch(t: Tok): StitchEntry | undefined {
    const e = stitchFor(t.v, this.terms);
    if (e) return e;
    if (this.terms === 'uk' && t.v === 'sc') {
      if (this.saidUkSc) return STITCH_BY_ID.get('sl st');
      this.saidUkSc = true;
      this.problems.push(
        warning(
          "'sc' is ambiguous in UK terms: older UK patterns use it for a slip stitch (ss), US patterns for UK dc. " +
            "Write 'ss' or 'dc'; it is counted as one stitch here",
          t.col,
        ),
      );
      return STITCH_BY_ID.get('sl st');
    }
    const o = stitchFor(t.v, this.other);
    if (o) {
      this.telltales.add(t.v);
      return o;
    }
    return undefined;
  }

  /** Whether any of these words is a stitch (other than the noun "st"). */
  anyStitchWord(words: string[]): boolean {
    for (const v of words) {
      if (v === 'st') continue;
      if (stitchFor(v, this.terms) || stitchFor(v, this.other) || (this.terms === 'uk' && v === 'sc')) return true;
    }
    return false;
  }

  isStitchWord(e: El | undefined): boolean {
    if (!isTok(e) || e.k !== 'word') return false;
    return (
      stitchFor(e.v, this.terms) !== undefined || stitchFor(e.v, this.other) !== undefined || (this.terms === 'uk' && e.v === 'sc')
    );
  }
}

// ───────────────────────── structure ─────────────────────────

function structure(toks: Tok[], r: Reader): El[] {
  const root: El[] = [];
  const stack: Array<{ br: Br; parent: El[] }> = [];
  let cur = root;
  for (const t of toks) {
    if (t.k === 'p' && (t.v === '(' || t.v === '[' || t.v === '{')) {
      const br: Br = { k: 'br', open: t, close: null, els: [], col: t.col, end: t.end };
      cur.push(br);
      stack.push({ br, parent: cur });
      cur = br.els;
      continue;
    }
    if (t.k === 'p' && (t.v === ')' || t.v === ']' || t.v === '}')) {
      const top = stack.pop();
      if (!top) {
        r.problems.push(error(`This '${t.v}' has no opening bracket before it`, t.col));
        continue;
      }
      top.br.close = t;
      top.br.end = t.end;
      if (CLOSER[top.br.open.v] !== t.v) {
        r.problems.push(warning(`'${top.br.open.v}' is closed by '${t.v}'`, t.col));
      }
      cur = top.parent;
      continue;
    }
    cur.push(t);
  }
  while (stack.length) {
    const top = stack.pop()!;
    r.problems.push(error(`'${top.br.open.v}' is never closed — add '${CLOSER[top.br.open.v]}' where the group ends`, top.br.col));
    hoistUnclosed(top.br, top.parent, r);
    top.br.end = Math.max(top.br.end, lastEnd(top.br.els));
  }
  return root;
}

/**
 * Recovery for an unclosed bracket: "(sc, inc x6 (18)" most likely meant "(sc, inc) x6 (18)", so a
 * trailing stated count and repeat count move out of the group.
 */
function hoistUnclosed(br: Br, parent: El[], r: Reader): void {
  const moved: El[] = [];
  const els = br.els;
  const last = els[els.length - 1];
  if (last && last.k === 'br' && statedOf(last, r) !== null) moved.unshift(els.pop()!);
  const n = els.length;
  if (n >= 2 && isWord(els[n - 2], 'x') && isNum(els[n - 1])) moved.unshift(...els.splice(n - 2, 2));
  else if (n >= 2 && isNum(els[n - 2]) && isWord(els[n - 1], 'times', 'x')) moved.unshift(...els.splice(n - 2, 2));
  if (moved.length) {
    const at = parent.indexOf(br);
    parent.splice(at + 1, 0, ...moved);
  }
}

function splitClauses(els: El[]): Clause[] {
  const out: Clause[] = [];
  let cur: El[] = [];
  let sep: string | null = null;
  for (let i = 0; i < els.length; i++) {
    const e = els[i];
    // "rep Rnds 4 and 5", "Rnds 4, 5": a list of round numbers is one clause.
    const inRoundList = isTok(e) && (e.v === 'and' || e.v === ',' || e.v === '-') && isNum(els[i + 1]) && isNum(cur[cur.length - 1]) &&
      cur.some(isRoundWord);
    if (inRoundList) {
      cur.push(e);
      continue;
    }
    if (isTok(e) && ((e.k === 'p' && SEP_PUNCT.has(e.v)) || (e.k === 'word' && (e.v === 'then' || e.v === 'and')))) {
      if (cur.length) out.push({ els: cur, sep });
      cur = [];
      sep = e.v;
      continue;
    }
    cur.push(e);
  }
  if (cur.length) out.push({ els: cur, sep });
  return out;
}

// ───────────────────────── small readers ─────────────────────────

/** A bracket holding only a count: (30), [30], (30 sts), (30 sts total), (total: 30), (30 sc). */
function statedOf(br: Br, r: Reader): number | null {
  const els = br.els.filter(notStatedPunct);
  if (!els.length || els.some(isBracket)) return null;
  let i = 0;
  if (isWord(els[0], 'total')) i = 1;
  if (!isNum(els[i])) return null;
  const n = (els[i] as Tok).n;
  const rest = els.slice(i + 1);
  if (rest.length === 1 && r.isStitchWord(rest[0])) return n;
  if (rest.length >= 1 && isWord(rest[0], 'st') && isP(rest[1], ',')) return n;
  const ok = rest.every(isStatedWord);
  return ok ? n : null;
}

type BracketKind =
  | { k: 'times'; n: number; more: boolean; ambiguous: boolean; fill: number | null }
  /** `plusCh`: "(counts as dc + ch 2)" — the chain also makes a chain space of that many. */
  | { k: 'counts'; as: StitchEntry | null; plusCh?: number }
  | { k: 'notcounts' }
  | { k: 'loop'; loop: Loop | null }
  | { k: 'comment' }
  | { k: 'group' };

function bracketKind(br: Br, r: Reader): BracketKind {
  const toks = flatToks(br.els);
  const wordToks = toks.filter(isWordTok);
  const words = wordToks.map(tokV);
  if (words.includes('counts') || (toks.some(isEqualsTok) && r.anyStitchWord(words))) {
    if (words.includes('not')) return { k: 'notcounts' };
    const asIdx = words.indexOf('as');
    const after = wordToks.slice(asIdx >= 0 ? asIdx + 1 : 0);
    for (const t of after) {
      if (t.v === 'st') return { k: 'counts', as: null };
      const e = r.stitch(t);
      if (e && e.id !== 'ch') {
        // "(counts as dc + ch 2)", "(counts as dc and ch-2 sp)": the rest of the chain is a chain space.
        const at = toks.indexOf(t);
        let plusCh = 0;
        for (let k = at + 1; k < toks.length && !plusCh; k++) {
          const u = toks[k];
          if (u.k === 'word' && u.v === 'chsp' && u.n > 0) plusCh = u.n;
          else if (u.k === 'word' && u.v === 'ch' && toks[k + 1]?.k === 'num') plusCh = toks[k + 1].n;
        }
        return plusCh ? { k: 'counts', as: e, plusCh } : { k: 'counts', as: e };
      }
    }
    return { k: 'counts', as: null };
  }
  if (words.length && !toks.some(isNumTok) && words.every(isLoopWord)) {
    if (words.includes('blo')) return { k: 'loop', loop: 'blo' };
    if (words.includes('flo')) return { k: 'loop', loop: 'flo' };
    if (words.includes('both')) return { k: 'loop', loop: null };
  }
  const text = r.slice(br.col + 1, br.close ? br.close.col : br.end);
  if (COMMENT_BRACKET.test(text.toLowerCase())) return { k: 'comment' };
  // "(repeat 6 times)", "(rep 5 more times)", "(x6)": a repeat count for what comes before.
  const tm = readTimes(br.els, 0);
  if (tm && tm.next === br.els.length) return { k: 'times', n: tm.n, more: tm.more, ambiguous: isWord(br.els[0], 'rep'), fill: null };
  if (isWord(br.els[0], 'rep') && br.els.length > 1) {
    const fill = readFill(br.els, 0);
    if (fill && fill.next === br.els.length) return { k: 'times', n: 0, more: false, ambiguous: false, fill: fill.leave };
  }
  let stitchy = false;
  for (const t of toks) {
    if (t.k === 'num' || (t.k === 'p' && t.v === '*') || STITCHY_WORDS.has(t.v) || r.isStitchWord(t)) {
      stitchy = true;
      break;
    }
  }
  if (!stitchy) return { k: 'comment' };
  return { k: 'group' };
}

function timesOf(kind: Extract<BracketKind, { k: 'times' }>, r: Reader): Times {
  if (kind.fill !== null) return { k: 'fill', leave: kind.fill };
  if (kind.more) return { k: 'n', n: kind.n + 1 };
  // "(repeat 6 times)" after a sequence: 6 in all or 6 more, whichever fits.
  return kind.ambiguous ? { k: 'alt', id: r.alt(2), options: [kind.n, kind.n + 1] } : { k: 'n', n: kind.n };
}

/** "x6", "6 times", "6x", "5 more times", "twice" → how many times, and whether "more" was said. */
function readTimes(els: El[], i: number): { n: number; more: boolean; next: number } | null {
  let j = i;
  if (isWord(els[j], 'rep')) j++;
  if (isWord(els[j], 'x') && isNum(els[j + 1])) {
    const n = (els[j + 1] as Tok).n;
    j += 2;
    let more = false;
    if (isWord(els[j], 'more')) {
      more = true;
      j++;
    }
    if (isWord(els[j], 'times')) j++;
    return { n, more, next: j };
  }
  if (isNum(els[j])) {
    const n = (els[j] as Tok).n;
    const k = j + 1;
    if (isWord(els[k], 'x') || isWord(els[k], 'times')) {
      let m = k + 1;
      let more = false;
      if (isWord(els[m], 'more')) {
        more = true;
        m++;
      }
      return { n, more, next: m };
    }
    if (isWord(els[k], 'more')) {
      let m = k + 1;
      if (isWord(els[m], 'times')) m++;
      return { n, more: true, next: m };
    }
  }
  if (isWord(els[j], 'more') && isNum(els[j + 1])) {
    let m = j + 2;
    if (isWord(els[m], 'times')) m++;
    return { n: (els[j + 1] as Tok).n, more: true, next: m };
  }
  return null;
}

/** "around", "across", "to end", "to last 3 sts", "rep around". */
function readFill(els: El[], i: number): { leave: number; next: number } | null {
  let j = i;
  if (isWord(els[j], 'rep')) j++;
  if (isWord(els[j], 'around', 'across', 'remaining')) {
    j++;
    // "remaining ch", "across the chain": the noun names what is worked into, it is not a stitch made.
    // ("sc across ch 1 turn": that ch is a chain.)
    if (isWord(els[j], 'st') || (isWord(els[j], 'ch') && !isNum(els[j + 1]))) j++;
    return { leave: 0, next: j };
  }
  if (isWord(els[j], 'to')) {
    if (isWord(els[j + 1], 'end')) return { leave: 0, next: j + 2 };
    if (isWord(els[j + 1], 'last')) {
      let k = j + 2;
      let n = 1;
      if (isNum(els[k])) {
        n = (els[k] as Tok).n;
        k++;
      }
      while (isWord(els[k], 'st', 'ch')) k++;
      return { leave: n, next: k };
    }
  }
  if (isWord(els[j], 'each') && isWord(els[j + 1], 'around', 'across')) return { leave: 0, next: j + 2 };
  return null;
}

/** "across", "around", "remaining", "to end", "to last 2 sts" — but not "rep around". */
function startsFill(els: El[], i: number): boolean {
  return !isWord(els[i], 'rep') && readFill(els, i) !== null;
}

const NOUNS = new Set(['st', 'ch', 'sp', 'loops', 'loop']);

// ───────────────────────── clause reading ─────────────────────────

interface Target {
  into: Into;
  units: Units;
  /** Set by "in next N sts" / "in each of next N": the count names stitches worked into. */
  explicitCount: boolean;
  /** "in each st around": a per-stitch count stays per stitch. */
  each: boolean;
  tog: boolean;
  otherSide: boolean;
  loop: Loop | null;
  /** Only a loop or "the other side" was named ("sc around in BLO"): no target. */
  bare: boolean;
}

class Cursor {
  i = 0;
  constructor(readonly els: El[]) {}
  get el(): El | undefined {
    return this.els[this.i];
  }
  at(o: number): El | undefined {
    return this.els[this.i + o];
  }
  done(): boolean {
    return this.i >= this.els.length;
  }
}

function readNoun(c: Cursor, r: Reader): Tok | null {
  const e = c.el;
  if (isTok(e) && e.k === 'word' && (NOUNS.has(e.v) || e.v === 'chsp' || r.isStitchWord(e))) {
    c.i++;
    // "in next ch-2 sp", "in next sc st"
    if (isWord(c.el, 'st', 'sp')) c.i++;
    return e;
  }
  return null;
}

/** "next ch-3 sp" → a space of 3 chains; "next sp" → a space of unknown size (one). */
function spaceFrom(noun: Tok | null): Into | null {
  if (noun && noun.v === 'chsp') return { t: 'space', size: noun.n || 1 };
  if (noun && noun.v === 'sp') return { t: 'space', size: 1 };
  return null;
}

function readTarget(c: Cursor, r: Reader): Target | null {
  const start = c.i;
  const tg: Target = { into: { t: 'next' }, units: { u: 'n', n: 1 }, explicitCount: false, each: false, tog: false, otherSide: false, loop: null, bare: false };
  while (isWord(c.el, 'blo', 'flo', 'only', 'both', 'loops', 'loop')) {
    const v = (c.el as Tok).v;
    if (v === 'blo' || v === 'flo') tg.loop = v;
    c.i++;
  }
  if (isWord(c.el, 'otherside')) {
    tg.otherSide = true;
    c.i++;
    if (isWord(c.el, 'ch', 'st')) c.i++;
    if (isWord(c.el, 'in', 'on')) c.i++;
  }
  const e = c.el;
  if (isWord(e, 'next', 'first', 'last')) {
    c.i++;
    let n = 1;
    if (isNum(c.el)) {
      n = (c.el as Tok).n;
      tg.explicitCount = true;
      c.i++;
    }
    const noun = readNoun(c, r);
    const sp = spaceFrom(noun);
    if (sp) {
      tg.into = sp;
      tg.units = { u: 'n', n };
    } else tg.units = { u: 'n', n };
    if (isWord(c.el, 'tog')) {
      tg.tog = true;
      c.i++;
    }
  } else if (isWord(e, 'each')) {
    c.i++;
    if (isWord(c.el, 'next') && isNum(c.at(1))) {
      tg.units = { u: 'n', n: (c.at(1) as Tok).n };
      tg.explicitCount = true;
      c.i += 2;
      readNoun(c, r);
    } else if (isNum(c.el)) {
      tg.units = { u: 'n', n: (c.el as Tok).n };
      tg.explicitCount = true;
      c.i++;
      readNoun(c, r);
    } else {
      const noun = readNoun(c, r);
      const sp = spaceFrom(noun);
      if (sp) tg.into = sp;
      tg.each = true;
      tg.units = { u: 'fill' };
      const f = readFill(c.els, c.i);
      if (f) {
        if (f.leave) tg.units = { u: 'fillTo', leave: f.leave };
        c.i = f.next;
      }
    }
  } else if (isWord(e, 'same')) {
    c.i++;
    readNoun(c, r);
    if (isWord(c.el, 'as')) {
      c.i++;
      while (c.el && isTok(c.el) && (c.el.k === 'word' || c.el.k === 'num') && !isWord(c.el, 'in', 'on')) c.i++;
    }
    tg.into = { t: 'same' };
  } else if (isTok(e) && e.k === 'ord') {
    c.i++;
    const noun = readNoun(c, r);
    if (isWord(c.el, 'fromhook') || (noun && noun.v === 'ch')) {
      if (isWord(c.el, 'fromhook')) c.i++;
      tg.into = { t: 'fromHook', nth: Math.max(1, e.n) };
    }
  } else if (isWord(e, 'mr', 'ring')) {
    c.i++;
    tg.into = { t: 'ring' };
  } else if (isWord(e, 'chsp', 'sp')) {
    c.i++;
    tg.into = { t: 'space', size: (e as Tok).v === 'chsp' ? (e as Tok).n || 1 : 1 };
  } else if (isWord(e, 'remaining')) {
    c.i++;
    readNoun(c, r);
    tg.units = { u: 'fill' };
    tg.each = true;
  } else if (isWord(e, 'top', 'beg')) {
    c.i++;
    while (c.el && isTok(c.el) && (c.el.k === 'word' || c.el.k === 'num') && !isWord(c.el, 'in', 'on', 'to')) c.i++;
    tg.into = { t: 'same' };
  } else if (isNum(e)) {
    c.i++;
    readNoun(c, r);
    tg.units = { u: 'n', n: tok(e).n };
    tg.explicitCount = true;
  } else if (isTok(e) && e.k === 'word' && (NOUNS.has(e.v) || r.isStitchWord(e))) {
    c.i++;
    if (isWord(c.el, 'remaining')) {
      c.i++;
      tg.units = { u: 'fill' };
      tg.each = true;
    }
  } else if (tg.loop === null && !tg.otherSide) {
    c.i = start;
    return null;
  } else tg.bare = true;
  // "in next 3 sts around" is just "next 3"; "in each st around" was read above.
  return tg;
}

/** Reads one stitch instruction from the cursor; false when the cursor does not start one. */
function readStitch(c: Cursor, r: Reader, out: Item[], inherit: StNode | null, clauseLoop: Loop | null): boolean {
  const start = c.i;
  const startEl = c.el;
  if (!startEl) return false;
  let pre: number | null = null;
  let loop: Loop | null = clauseLoop;
  let entry: StitchEntry | undefined;
  let word: string;
  let incOf: StitchEntry | undefined;
  if (isNum(c.el) && !inherit) {
    pre = (c.el as Tok).n;
    c.i++;
  }
  while (isWord(c.el, 'blo', 'flo')) {
    loop = (c.el as Tok).v as Loop;
    c.i++;
  }
  if (inherit && (isWord(c.el, 'in', 'on', 'next', 'each') || (isTok(c.el) && c.el.k === 'ord') || startsFill(c.els, c.i))) {
    entry = inherit.entry;
    word = inherit.word;
    incOf = inherit.incOf;
    // "2 sc in next st and in each st across", "2 sc in same sp and in each ch-sp around": 2 each time.
    if (inherit.per > 1 && (inherit.into.t === 'next' || inherit.into.t === 'same' || inherit.into.t === 'space')) pre = inherit.per;
    if (loop === null) loop = inherit.loop;
  } else {
    const t = c.el;
    if (!isTok(t) || t.k !== 'word') {
      c.i = start;
      return false;
    }
    entry = r.stitch(t);
    if (!entry) {
      c.i = start;
      return false;
    }
    word = t.raw;
    c.i++;
    if (entry.kind === 'stitch' && isWord(c.el, 'inc')) {
      incOf = entry;
      entry = STITCH_BY_ID.get('inc')!;
      word = `${t.raw} inc`;
      c.i++;
    } else if (entry.kind === 'stitch' && isWord(c.el, 'dec') && entry.decOf) {
      entry = STITCH_BY_ID.get(entry.decOf)!;
      word = entry.abbr[r.terms];
      c.i++;
    } else if (entry.kind === 'stitch' && isNum(c.el) && isWord(c.at(1), 'tog')) {
      const tog = STITCH_BY_ID.get(`${entry.id}${(c.el as Tok).n}tog`);
      if (tog) {
        entry = tog;
        word = tog.abbr[r.terms];
        c.i += 2;
      }
    }
  }
  let post: number | null = null;
  if (isWord(c.el, 'x') && isNum(c.at(1))) {
    post = (c.at(1) as Tok).n;
    c.i += 2;
    if (isWord(c.el, 'times')) c.i++;
  } else if (isNum(c.el) && !inherit) {
    post = (c.el as Tok).n;
    c.i++;
    if (isWord(c.el, 'times', 'x')) c.i++;
    else if (isWord(c.el, 'st')) c.i++;
  }
  let target: Target | null = null;
  let bareFill: { leave: number } | null = null;
  let times = 1;
  let evenly = false;
  let otherSide = false;
  let turnAfter: number | null = null;
  let role: ChainRole | undefined;
  let countsAs: StitchEntry | undefined;
  let plusCh = 0;
  let annotated = false;
  for (let guard = 0; guard < 64 && !c.done(); guard++) {
    const e = c.el!;
    if (e.k === 'br') {
      const kind = bracketKind(e, r);
      if (kind.k === 'counts' && entry.id === 'ch') {
        role = 'counts';
        countsAs = kind.as ?? undefined;
        if (kind.plusCh) plusCh = kind.plusCh;
        annotated = true;
      } else if (kind.k === 'notcounts' && entry.id === 'ch') {
        role = 'turning';
        annotated = true;
      } else if (kind.k === 'loop') loop = kind.loop;
      else if (kind.k !== 'comment') break;
      c.i++;
      continue;
    }
    if (isWord(e, 'blo', 'flo')) {
      loop = e.v as Loop;
      c.i++;
      continue;
    }
    if (isWord(e, 'only', 'st', 'work', 'working')) {
      c.i++;
      continue;
    }
    if (isWord(e, 'in', 'on', 'over') && !target) {
      c.i++;
      const tg = readTarget(c, r);
      if (!tg) {
        c.i--;
        break;
      }
      if (tg.loop) loop = tg.loop;
      if (tg.otherSide) otherSide = true;
      if (!tg.bare) target = tg;
      continue;
    }
    if (isWord(e, 'next', 'each', 'remaining') && !target) {
      const tg = readTarget(c, r);
      if (!tg) break;
      target = tg;
      if (tg.loop) loop = tg.loop;
      continue;
    }
    if (isWord(e, 'otherside')) {
      otherSide = true;
      c.i++;
      continue;
    }
    if (isWord(e, 'evenly', 'spaced')) {
      evenly = true;
      c.i++;
      if (isWord(c.el, 'around', 'across')) c.i++;
      continue;
    }
    const fill = readFill(c.els, c.i);
    if (fill && !target && !bareFill) {
      bareFill = { leave: fill.leave };
      c.i = fill.next;
      continue;
    }
    const tm = readTimes(c.els, c.i);
    if (tm) {
      times *= tm.more ? tm.n + 1 : tm.n;
      c.i = tm.next;
      continue;
    }
    if (isWord(e, 'turn')) {
      turnAfter = e.col;
      c.i++;
      continue;
    }
    break;
  }

  const col = startEl.col;
  const end = c.i > start ? (c.els[c.i - 1] as El).end : col;
  if (evenly && (entry.kind === 'inc' || entry.kind === 'dec')) {
    const n = pre ?? post ?? (target && target.units.u === 'n' ? target.units.n : 1);
    out.push({ t: 'evenly', kind: entry.kind, n, col, loop });
    r.seenStitch = true;
    return true;
  }

  let per = 1;
  let units: Units;
  let into: Into = target ? target.into : { t: 'next' };
  if (entry.id === 'ch') {
    units = { u: 'n', n: (pre ?? 1) * (post ?? 1) };
    into = { t: 'air' };
  } else if (into.t === 'ring') {
    units = { u: 'n', n: (pre ?? 1) * (post ?? 1) };
  } else if (into.t === 'same' || into.t === 'fromHook' || into.t === 'space') {
    per = pre ?? post ?? 1;
    if (pre !== null && post !== null) times *= post;
    // "in each ch-sp around" keeps its fill: one unit per chain space left.
    units = (target!.units.u === 'n' && target!.explicitCount) || (into.t === 'space' && target!.units.u !== 'n') ? target!.units : { u: 'n', n: 1 };
  } else if (target && target.units.u === 'n') {
    const m = target.units.n;
    per = pre ?? (m === 1 && !target.explicitCount ? post : null) ?? 1;
    if (post !== null && !(m === 1 && pre === null && !target.explicitCount)) times *= post;
    units = { u: 'n', n: m };
    if (entry.kind === 'dec' && (target.explicitCount || target.tog)) {
      // "dec over next 2 sts" is one decrease; "sc2tog over next 3" is an sc3tog.
      if (m % entry.works === 0) units = { u: 'n', n: m / entry.works };
      else if (m === 3 && entry.works === 2) {
        const three = STITCH_BY_ID.get(entry.id.replace('2tog', '3tog')) ?? STITCH_BY_ID.get('sc3tog')!;
        entry = three;
        word = three.abbr[r.terms];
        units = { u: 'n', n: 1 };
      } else {
        r.problems.push(error(`${m} stitches cannot be split into ${entry.abbr[r.terms]} decreases of ${entry.works}`, col));
        units = { u: 'n', n: Math.floor(m / entry.works) };
      }
    } else if (target.tog && entry.kind === 'stitch' && entry.decOf) {
      // "sc next 2 sts tog"
      const dec = STITCH_BY_ID.get(m === 3 ? entry.decOf.replace('2tog', '3tog') : entry.decOf);
      if (dec) {
        entry = dec;
        word = dec.abbr[r.terms];
        units = { u: 'n', n: 1 };
        per = 1;
      }
    }
  } else if (target && target.units.u !== 'n') {
    per = pre ?? 1;
    units = target.units;
    if (post !== null) times *= post;
  } else if (bareFill) {
    if (pre !== null) units = { u: 'n', n: pre };
    else units = bareFill.leave ? { u: 'fillTo', leave: bareFill.leave } : { u: 'fill' };
  } else {
    units = { u: 'n', n: (pre ?? 1) * (post ?? 1) };
  }
  if (entry.kind === 'inc' || entry.kind === 'dec') per = 1;
  per = Math.max(0, per);

  const node: StNode = { t: 'st', entry, word, per, units, into, loop, col, end };
  if (incOf) node.incOf = incOf;
  if (role) node.role = role;
  if (countsAs) node.countsAs = countsAs;
  if (plusCh) node.plusCh = plusCh;
  if (annotated) node.annotated = true;
  if (inherit) node.inherited = true;
  if (bareFill && pre === null && times === 1 && !inherit && into.t === 'next' && units.u !== 'n') node.bareFill = true;
  if (otherSide) out.push({ t: 'otherside', col });
  if (times !== 1) {
    const g: GroupNode = {
      t: 'group',
      body: [node],
      into: null,
      units: { u: 'n', n: 1 },
      times: { k: 'n', n: Math.max(0, times) },
      col,
      end,
      display: r.slice(col, end),
      loop: null,
    };
    out.push(g);
  } else out.push(node);
  if (turnAfter !== null) out.push({ t: 'turn', col: turnAfter });
  r.lastSt = node;
  r.lastGroup = null;
  r.seenStitch = true;
  return true;
}

function readGroup(c: Cursor, r: Reader, out: Item[], clauseLoop: Loop | null): void {
  const br = c.el as Br;
  c.i++;
  const body = readSeq(br.els, r, false);
  const g: GroupNode = {
    t: 'group',
    body,
    into: null,
    units: { u: 'n', n: 1 },
    times: { k: 'n', n: 1 },
    col: br.col,
    end: br.end,
    display: r.slice(br.col, br.end),
    loop: clauseLoop,
  };
  for (let guard = 0; guard < 16 && !c.done(); guard++) {
    const e = c.el!;
    if (e.k === 'br') {
      const kind = bracketKind(e, r);
      if (kind.k === 'loop') g.loop = kind.loop;
      else if (kind.k !== 'comment') break;
      c.i++;
      continue;
    }
    if (isWord(e, 'blo', 'flo')) {
      g.loop = e.v as Loop;
      c.i++;
      continue;
    }
    if (isWord(e, 'in', 'on') && !g.into) {
      c.i++;
      const tg = readTarget(c, r);
      if (!tg) {
        c.i--;
        break;
      }
      if (tg.loop) g.loop = tg.loop;
      if (!tg.bare) {
        g.into = tg.into;
        g.units = tg.units;
      }
      continue;
    }
    if (isWord(e, 'each') && !g.into) {
      const tg = readTarget(c, r);
      if (!tg) break;
      g.into = tg.into;
      g.units = tg.units;
      continue;
    }
    const fill = readFill(c.els, c.i);
    if (fill) {
      if (g.into) g.units = fill.leave ? { u: 'fillTo', leave: fill.leave } : { u: 'fill' };
      else g.times = { k: 'fill', leave: fill.leave };
      c.i = fill.next;
      continue;
    }
    const tm = readTimes(c.els, c.i);
    if (tm) {
      const n = tm.more ? tm.n + 1 : tm.n;
      g.times = g.times.k === 'n' ? { k: 'n', n: g.times.n * n } : g.times;
      c.i = tm.next;
      continue;
    }
    if (isWord(e, 'st', 'only')) {
      c.i++;
      continue;
    }
    break;
  }
  g.end = c.i > 0 ? Math.max(g.end, (c.els[c.i - 1] as El).end) : g.end;
  out.push(g);
  r.seenStitch = true;
  // What "… and in each …" carries over is the group, not the last stitch inside it.
  r.lastSt = null;
  r.lastGroup = g.into && g.times.k === 'n' && g.times.n === 1 ? g : null;
}

/** Words of a clause, for the whole-clause recognisers. */
function clauseWords(els: El[]): string[] {
  const out: string[] = [];
  for (const e of els) if (isTok(e) && e.k === 'word') out.push(e.v);
  return out;
}

/** Stars written together ("**") are one marker of that many stars; "* *" are two single stars. */
function starRun(els: El[], i: number): number {
  let n = 0;
  while (isP(els[i + n], '*') && (n === 0 || (els[i + n] as Tok).col === (els[i + n - 1] as Tok).end)) n++;
  return n;
}

function markOf(level: number, col: number): MarkNode {
  return { t: 'mark', level, col };
}

/** "ending last rep at **", "ending last rep with …", "ending with …", "end last rep at **". */
function isEnding(els: El[]): boolean {
  return isWord(els[0], 'end') && isWord(els[1], 'last', 'with', 'at', 'rep');
}

function readClause(cl: Clause, r: Reader, out: Item[], top: boolean): void {
  let els = cl.els;
  while (isP(els[0], '*')) {
    const run = starRun(els, 0);
    const col = (els[0] as Tok).col;
    out.push(run === 1 ? { t: '*open', col } : markOf(run, col));
    els = els.slice(run);
  }
  let closeStar: { col: number; times: Times | null } | null = null;
  // In "rep from * …" (and "…, then from * to ** once") the star names the repeat's start; it closes nothing.
  const startsRep = isWord(els[0], 'rep', 'work', 'as') || (isWord(els[0], 'from') && isP(els[1], '*'));
  let starAt = startsRep ? -1 : els.findIndex(isStar);
  if (starAt >= 0 && starRun(els, starAt) >= 2) {
    // "sc 3**, …": a marker after the instructions; what follows it in the clause is read on.
    const run = starRun(els, starAt);
    if (starAt > 0) readClauseBody(els.slice(0, starAt), cl.sep, r, out, top);
    out.push(markOf(run, (els[starAt] as Tok).col));
    const rest = els.slice(starAt + run);
    if (rest.length) readClause({ els: rest, sep: null }, r, out, top);
    return;
  }
  if (starAt > 0 && els[starAt - 1].k === 'br' && isNum(els[starAt + 1])) {
    // "(2 sc, inc)*6": the star is a times sign.
    els = [...els.slice(0, starAt), { ...(els[starAt] as Tok), k: 'word', v: 'x' }, ...els.slice(starAt + 1)];
    starAt = els.findIndex(isStar);
  }
  if (starAt >= 0) {
    const after = els.slice(starAt + 1).filter(notStar);
    const tm = readTimes(after, 0);
    const fill = tm ? null : readFill(after, 0);
    closeStar = {
      col: (els[starAt] as Tok).col,
      times: tm ? { k: 'n', n: tm.more ? tm.n + 1 : tm.n } : fill ? { k: 'fill', leave: fill.leave } : null,
    };
    els = els.slice(0, starAt);
  }
  if (els.length) readClauseBody(els, cl.sep, r, out, top);
  if (closeStar) out.push({ t: '*close', col: closeStar.col, times: closeStar.times });
}

/** Replaces likely typos by the word they resemble (with a problem), so the count can carry on. */
function correctTypos(els: El[], r: Reader): El[] {
  const known = KNOWN[r.terms];
  let outEls: El[] | null = null;
  for (let i = 0; i < els.length; i++) {
    const e = els[i];
    if (!isTok(e) || e.k !== 'word' || known.has(e.v)) continue;
    const s = suggest(e.v, r.terms);
    if (!s) continue;
    const shown = s === 'slst' ? 'sl st' : s === 'chsp' ? 'ch-sp' : s;
    r.problems.push(error(`'${e.raw}' — did you mean '${shown}'?`, e.col));
    outEls ??= [...els];
    outEls[i] = { ...e, v: s };
  }
  return outEls ?? els;
}

function readClauseBody(rawEls: El[], sep: string | null, r: Reader, out: Item[], top: boolean): void {
  const col = firstCol(rawEls);
  const end = lastEnd(rawEls);
  const first = rawEls[0];
  // Notes inside a round: "with color B, sc around", "…, stuff as you go", "fasten off".
  if (top && isTok(first) && first.k === 'word' && !r.isStitchWord(first) && !isWord(first, 'inc', 'dec', 'ch', 'sk', 'rep', 'mr')) {
    const raw = r.slice(col, end);
    const reading = classifyNote(raw);
    const actionFirst = isWord(first, 'join', 'leave');
    if ((reading.kind !== 'other' && (!actionFirst || reading.kind === 'colour' || reading.kind === 'fasten-off')) ||
      /^(pm|place\s+(a\s+)?(st(itch)?\s+)?marker|mark\b)/i.test(raw)) {
      if (reading.kind !== 'other') r.notes.push({ text: raw, col, position: r.seenStitch ? 'after' : 'before' });
      return;
    }
  }
  const els = correctTypos(rawEls, r);
  const words = clauseWords(els);

  const nums = els.filter(isNum).map(tok);
  const w0 = isTok(els[0]) && els[0].k === 'word' ? els[0].v : null;

  // Leftover loops: "working in the front loops left from Rnd 6", "in the unused back loops of Rnd 9".
  const loopWord = words.find(isFloBlo) as Loop | undefined;
  let rndAt = -1;
  for (let i = 0; i < els.length - 1; i++) {
    if (isWord(els[i], 'rnd', 'row') && isNum(els[i + 1])) {
      rndAt = i;
      break;
    }
  }
  if (loopWord && rndAt >= 0 && !r.anyStitchWord(words)) {
    const left = words.some(isLeftWord);
    out.push({
      t: 'leftover',
      loop: loopWord,
      round: (els[rndAt + 1] as Tok).n,
      kind: (els[rndAt] as Tok).v === 'row' ? 'row' : 'round',
      wording: left ? 'left' : 'of',
      col,
    });
    return;
  }
  // A loop marker on its own: "BLO", "working in back loops only", "(in BLO)".
  if (words.length && !nums.length && words.every(isLoopWord) && (loopWord || words.includes('both'))) {
    out.push({ t: 'loop', loop: loopWord ?? null, col });
    return;
  }
  if (els.length === 1 && els[0].k === 'br') {
    const kind = bracketKind(els[0], r);
    if (kind.k === 'loop') {
      out.push({ t: 'loop', loop: kind.loop, col });
      return;
    }
    if (kind.k === 'comment') return;
    if (kind.k === 'counts' || kind.k === 'notcounts') {
      annotateLastChain(r, kind);
      return;
    }
    if (kind.k === 'times') {
      out.push({ t: 'reptimes', col, times: timesOf(kind, r) });
      return;
    }
  }
  if (words.includes('join') && words.includes('not')) return; // "do not join": spiral rounds
  if (words.includes('join')) {
    if (words.includes('ring') || words.includes('form')) out.push({ t: 'ring', col, formed: true });
    else out.push({ t: 'join', col });
    return;
  }
  // The slip stitch by any spelling ("sl st", UK "ss").
  const slipFirst = w0 !== null && (stitchFor(w0, r.terms)?.id === 'sl st' || stitchFor(w0, r.other)?.id === 'sl st');
  if (slipFirst && (words.includes('form') && words.includes('ring'))) {
    out.push({ t: 'ring', col, formed: true });
    return;
  }
  // "sl st in first sc" joins; "sl st in first ch-sp" moves into that space.
  if (slipFirst && !nums.length && (words.includes('first') || words.includes('top') || words.includes('beg')) && !words.includes('chsp') && !words.includes('sp')) {
    out.push({ t: 'join', col });
    return;
  }
  if (w0 === 'turn') {
    out.push({ t: 'turn', col });
    return;
  }
  if (words.includes('tail')) return;
  if (words.includes('leave') || (words.includes('not') && words.includes('work') && words.includes('remaining'))) {
    out.push({ t: 'leave', n: nums.length ? nums[0].n : null, col });
    return;
  }
  if (w0 === 'not' && (words.includes('join') || words.includes('turn'))) return;
  if (
    w0 === 'rep' ||
    (w0 === 'from' && isP(els[1], '*')) ||
    (w0 === 'work' && (words.includes('as') || words.includes('rep'))) ||
    (w0 === 'as' && (words.includes('rnd') || words.includes('row')))
  ) {
    readRep(els, r, out, top, col);
    return;
  }
  if (words.includes('counts') && !(w0 && r.isStitchWord(els[0]))) {
    annotateLastChain(r, words.includes('not') ? { k: 'notcounts' } : { k: 'counts', as: null });
    return;
  }
  if (words.includes('otherside') && !(isNum(els[0]) || r.isStitchWord(els[0]) || w0 === 'inc' || w0 === 'dec')) {
    out.push({ t: 'otherside', col });
    return;
  }
  const lastGroup = r.lastGroup;
  if (lastGroup && (sep === 'and' || sep === ',') && isWord(els[0], 'in', 'on', 'each', 'next')) {
    const c = new Cursor(els);
    if (isWord(c.el, 'in', 'on')) c.i++;
    const tg = readTarget(c, r);
    if (tg && !tg.bare && c.done()) {
      out.push({ ...lastGroup, into: tg.into, units: tg.units, col, end, loop: tg.loop ?? lastGroup.loop });
      r.seenStitch = true;
      return;
    }
  }
  // Comment: no number, no bracket, no stitch and no action word ("pulling tight", "stuff as you go").
  const actiony = words.some(isActionWord);
  // "… and in each ch across": the stitch carries over from the clause before.
  // "sc in 2nd ch from hook and across" / "… and to end" likewise, after "and" only ("…, around" is prose).
  let inherit =
    r.lastSt && ((sep === 'and' || sep === ',') && isWord(els[0], 'in', 'on', 'next', 'each') || (sep === 'and' && startsFill(els, 0)))
      ? r.lastSt
      : null;
  let stitchy = false;
  for (const e of els) {
    if (e.k === 'br' || isNum(e) || r.isStitchWord(e)) {
      stitchy = true;
      break;
    }
  }
  if (!actiony && !stitchy && !inherit) {
    // One unknown word between stitches ("sc in next 5, xyzzy, sc in next 36") is most likely a stitch
    // Whorlbook does not know: counted as one, said once. Longer prose is a comment.
    const only = els.length === 1 && isTok(els[0]) && els[0].k === 'word' ? (els[0] as Tok) : null;
    if (!only || KNOWN[r.terms].has(only.v) || isPlainWord(only.v) || !r.seenStitch) return;
  }

  const c = new Cursor(els);
  let clauseLoop: Loop | null = null;
  while (!c.done()) {
    const e = c.el!;
    if (isWord(e, 'work', 'working', 'with', 'then', 'only', 'st', 'pm', 'bor', 'again', 'continue')) {
      c.i++;
      continue;
    }
    if (isWord(e, 'in', 'on') && isWord(c.at(1), 'blo', 'flo')) {
      // "in back loops only sc around": the loop comes first.
      c.i++;
      continue;
    }
    if (isWord(e, 'blo', 'flo')) {
      // "BLO sc around", "blo: …" — a loop before the stitch applies to it.
      if (c.i + 1 >= els.length) {
        out.push({ t: 'loop', loop: tok(e).v as Loop, col: e.col });
        c.i++;
        continue;
      }
      clauseLoop = tok(e).v as Loop;
      c.i++;
      continue;
    }
    if (e.k === 'br') {
      const kind = bracketKind(e, r);
      if (kind.k === 'loop') {
        clauseLoop = kind.loop;
        c.i++;
        continue;
      }
      if (kind.k === 'comment') {
        c.i++;
        continue;
      }
      if (kind.k === 'counts' || kind.k === 'notcounts') {
        annotateLastChain(r, kind);
        c.i++;
        continue;
      }
      if (kind.k === 'times') {
        out.push({ t: 'reptimes', col: e.col, times: timesOf(kind, r) });
        c.i++;
        continue;
      }
      readGroup(c, r, out, clauseLoop);
      continue;
    }
    if (isWord(e, 'in', 'on') && isWord(c.at(1), 'mr', 'ring') && !c.at(2)) {
      // "In a magic ring, work 6 sc"
      out.push({ t: 'ring', col: e.col, formed: false });
      c.i += 2;
      continue;
    }
    if (isWord(e, 'mr', 'ring')) {
      out.push({ t: 'ring', col: e.col, formed: false });
      c.i++;
      continue;
    }
    if (isWord(e, 'sk')) {
      c.i++;
      let n = 1;
      let noun: 'st' | 'ch' | 'sp' = 'st';
      if (isWord(c.el, 'next')) c.i++;
      if (isNum(c.el)) {
        n = (c.el as Tok).n;
        c.i++;
      }
      if (isWord(c.el, 'chsp')) {
        n = (c.el as Tok).n || 1;
        noun = 'sp';
        c.i++;
      } else if (isWord(c.el, 'ch')) {
        noun = 'ch';
        c.i++;
      } else if (isWord(c.el, 'st', 'sp') || r.isStitchWord(c.el)) c.i++;
      if (isWord(c.el, 'remaining')) {
        out.push({ t: 'skip', n: 'fill', col: e.col, noun });
        c.i++;
        continue;
      }
      out.push({ t: 'skip', n, col: e.col, noun });
      continue;
    }
    if (isWord(e, 'turn')) {
      out.push({ t: 'turn', col: e.col });
      c.i++;
      continue;
    }
    if (isWord(e, 'otherside')) {
      out.push({ t: 'otherside', col: e.col });
      c.i++;
      continue;
    }
    if (readStitch(c, r, out, inherit, clauseLoop)) {
      inherit = null;
      continue;
    }
    // An unknown word where a stitch goes ("xyz in next 3"): counted as one stitch each, said once.
    if (isTok(e) && e.k === 'word' && !KNOWN[r.terms].has(e.v) && !isPlainWord(e.v) && (c.i === 0 || isNum(c.at(-1)))) {
      const generic: StitchEntry = { ...STITCH_BY_ID.get('sc')!, id: e.raw, us: [e.raw], uk: [e.raw], abbr: { us: e.raw, uk: e.raw },
        name: { us: e.raw, uk: e.raw }, madeAs: e.raw, decOf: undefined };
      r.problems.push(error(`'${e.raw}' is not a stitch Whorlbook knows; it is counted as one stitch`, e.col));
      const fake: Tok = { ...e, v: '\u0000generic' };
      const sub = [...els];
      sub[c.i] = fake;
      const c2 = new Cursor(sub);
      c2.i = c.i;
      const saved = r.stitch.bind(r);
      r.stitch = (t: Tok) => (t.v === '\u0000generic' ? generic : saved(t));
      const ok = readStitch(c2, r, out, null, clauseLoop);
      r.stitch = saved;
      if (ok) {
        c.i = c2.i;
        continue;
      }
    }
    // What is left is prose ("in color B", "pulling tight") or something the engine cannot read.
    const rest = c.els.slice(c.i);
    const restToks = flatToks(rest);
    const restStitchy = restToks.some((t) => t.k === 'num' || r.isStitchWord(t));
    const restRaw = r.slice(firstCol(rest), lastEnd(rest));
    if (!restStitchy) {
      const reading = classifyNote(restRaw);
      if (top && reading.kind !== 'other') r.notes.push({ text: restRaw, col: firstCol(rest), position: r.seenStitch ? 'after' : 'before' });
    } else {
      r.problems.push(error(`Whorlbook could not read '${restRaw}'`, firstCol(rest)));
      r.uncertain = true;
    }
    break;
  }
}

function annotateLastChain(r: Reader, kind: BracketKind): void {
  const last = r.lastSt;
  if (!last || last.entry.id !== 'ch') return;
  last.annotated = true;
  if (kind.k === 'notcounts') last.role = 'turning';
  else if (kind.k === 'counts') {
    last.role = 'counts';
    if (kind.as) last.countsAs = kind.as;
    if (kind.plusCh) last.plusCh = kind.plusCh;
  }
}

/** "rep from * around", "rep from * 5 more times", "rep Rnd 7", "rep Rnds 4-5 twice", "rep (…) 6 times". */
function readRep(els: El[], r: Reader, out: Item[], top: boolean, col: number): void {
  let i = 1;
  if (isWord(els[0], 'work', 'as')) {
    i = 0;
    while (isWord(els[i], 'work', 'as', 'same', 'rep')) i++;
  }
  if (isWord(els[0], 'from')) i = 0;
  if (isWord(els[i], 'from') || isP(els[i], '*')) {
    if (isWord(els[i], 'from')) i++;
    const from = starRun(els, i);
    i += from;
    // "rep from * to * …" closes the * repeat; "rep from * to ** …" repeats only the part up to the "**".
    let to = 0;
    if (isWord(els[i], 'to') && isP(els[i + 1], '*')) {
      to = starRun(els, i + 1);
      i += 1 + to;
    }
    const text = r.slice(col, lastEnd(els));
    const tm = readTimes(els, i);
    const fill = tm ? null : readFill(els, i);
    let times: Times;
    if (to >= 2) {
      // The part up to "**" was already worked once in the first pass: "once" / "N (more) times" are
      // the times it is worked again (common practice); "N times" may also mean N in all.
      const n = tm ? tm.n : isNum(els[i]) ? (els[i] as Tok).n : null;
      if (fill) times = { k: 'fill', leave: fill.leave };
      else if (n === null) times = { k: 'n', n: 1 };
      else if (tm?.more || n <= 1) times = { k: 'n', n };
      else times = { k: 'alt', id: r.alt(2), options: [n, n - 1] };
      out.push({ t: 'repfrom', col, times, to, from, text });
      return;
    }
    if (tm) times = tm.more ? { k: 'n', n: tm.n + 1 } : { k: 'alt', id: r.alt(2), options: [tm.n, tm.n + 1] };
    else if (fill) times = { k: 'fill', leave: fill.leave };
    else if (isNum(els[i])) times = { k: 'alt', id: r.alt(2), options: [(els[i] as Tok).n, (els[i] as Tok).n + 1] };
    else times = { k: 'fill', leave: 0 };
    out.push(from >= 2 ? { t: 'repfrom', col, times, from, text } : { t: 'repfrom', col, times, text });
    return;
  }
  if (isWord(els[i], 'rnd', 'row')) {
    const kind = (els[i] as Tok).v === 'row' ? 'row' : 'round';
    i++;
    const refs: number[] = [];
    let prevNum: number | null = null;
    let range = false;
    for (; i < els.length; i++) {
      const e = els[i];
      if (isNum(e)) {
        if (isWord(els[i + 1], 'times', 'x', 'more')) break;
        const n = tok(e).n;
        if (range && prevNum !== null) for (let k = prevNum + 1; k <= Math.min(n, prevNum + 200); k++) refs.push(k);
        else refs.push(n);
        prevNum = n;
        range = false;
      } else if (isP(e, '-') || isWord(e, 'to')) range = true;
      else if (isWord(e, 'and', 'rnd', 'row') || isP(e, ',')) continue;
      else break;
    }
    const tm = readTimes(els, i);
    if (!top || !refs.length) {
      r.problems.push(error(`Whorlbook could not read '${r.slice(col, lastEnd(els))}'`, col));
      r.uncertain = true;
      return;
    }
    r.repRound = { kind, refs, times: tm ? (tm.more ? tm.n : tm.n) : null, col };
    return;
  }
  if (els[i] && els[i].k === 'br') {
    const c = new Cursor(els);
    c.i = i;
    readGroup(c, r, out, null);
    return;
  }
  const tm = readTimes(els, i);
  if (tm) {
    out.push({ t: 'reptimes', col, times: tm.more ? { k: 'n', n: tm.n + 1 } : { k: 'alt', id: r.alt(2), options: [tm.n, tm.n + 1] } });
    return;
  }
  const fill = readFill(els, i);
  if (fill) {
    out.push({ t: 'reptimes', col, times: { k: 'fill', leave: fill.leave } });
    return;
  }
  r.problems.push(error(`Whorlbook could not read '${r.slice(col, lastEnd(els))}'`, col));
  r.uncertain = true;
}

/** Nodes that start a round rather than belong to a repeat: a first chain, the ring, a loop marker. */
function isSetup(n: Node, at: number): boolean {
  if (n.t === 'ring' || n.t === 'loop' || n.t === 'leftover' || n.t === 'join') return true;
  return at === 0 && n.t === 'st' && n.entry.id === 'ch';
}

function starGroupOf(body: Node[], col: number, times: Times): GroupNode {
  return { t: 'group', body, into: null, units: { u: 'n', n: 1 }, times, col, end: col, display: '*', loop: null, star: true };
}

const stars = (level: number): string => '*'.repeat(level);

function markIndex(list: Node[], level: number, lastOne = false): number {
  let at = -1;
  for (let i = 0; i < list.length; i++) {
    const n = list[i];
    if (n.t === 'mark' && n.level === level) {
      at = i;
      if (!lastOne) break;
    }
  }
  return at;
}

function markCount(list: Node[], level: number): number {
  let n = 0;
  for (const x of list) if (x.t === 'mark' && x.level === level) n++;
  return n;
}

function isRepeatGroup(n: Node | undefined): n is GroupNode {
  return n !== undefined && n.t === 'group' && !n.into && !(n.times.k === 'n' && n.times.n === 1 && !n.star);
}

function isWorkingNode(n: Node): boolean {
  return n.t === 'st' || n.t === 'group' || n.t === 'skip' || n.t === 'evenly';
}

/** Stitches these nodes work into, when that does not depend on the round (else null). */
export function staticWorks(nodes: Node[]): number | null {
  let w = 0;
  for (const n of nodes) {
    switch (n.t) {
      case 'st':
        if (n.entry.id === 'ch') break;
        if (n.units.u !== 'n') return null;
        if (n.into.t === 'next') w += n.units.n * n.entry.works;
        else if (n.into.t !== 'same' && n.into.t !== 'ring') return null;
        break;
      case 'group': {
        if (n.times.k !== 'n') return null;
        if (n.into) {
          if (n.units.u !== 'n' || (n.into.t !== 'next' && n.into.t !== 'same')) return null;
          if (n.into.t === 'next') w += n.units.n * n.times.n;
          break;
        }
        const b = staticWorks(n.body);
        if (b === null) return null;
        w += b * n.times.n;
        break;
      }
      case 'skip':
        if (n.n === 'fill' || n.noun === 'sp') return null;
        w += n.n;
        break;
      case 'join':
      case 'turn':
      case 'loop':
      case 'mark':
        break;
      default:
        return null;
    }
  }
  return w;
}

function sameStitch(a: Node, b: Node): boolean {
  return a.t === 'st' && b.t === 'st' && a.entry.id === b.entry.id && (a.incOf?.id ?? null) === (b.incOf?.id ?? null);
}

/** Turns the flat list with star markers into nested repeat groups. */
function nestStars(items: Item[], r: Reader): Node[] {
  const frames: Array<{ list: Node[]; col: number }> = [{ list: [], col: -1 }];
  // A closed *…* waiting for its "rep" clause.
  let waiting: GroupNode | null = null;
  const used = new Set<number>();
  const fail = (message: string, col: number) => {
    r.problems.push(error(message, col));
    r.uncertain = true;
    r.starTrouble = true;
  };
  for (let idx = 0; idx < items.length; idx++) {
    const it = items[idx];
    switch (it.t) {
      case '*open':
        frames.push({ list: [], col: it.col });
        waiting = null;
        break;
      case '*close': {
        if (frames.length < 2) {
          r.problems.push(warning("This '*' closes a repeat that was never opened", it.col));
          break;
        }
        const f = frames.pop()!;
        const g = starGroupOf(f.list, f.col, it.times ?? { k: 'n', n: 1 });
        frames[frames.length - 1].list.push(g);
        waiting = it.times ? null : g;
        break;
      }
      case 'repfrom':
      case 'reptimes': {
        if (it.t === 'repfrom' && it.to !== undefined) {
          repeatToMark(it, idx);
          waiting = null;
          break;
        }
        if (it.t === 'repfrom' && it.from !== undefined) {
          // "**sc, *inc, sc; rep from * twice; rep from ** 5 more times": everything since the "**".
          const list = frames[frames.length - 1].list;
          const at = markIndex(list, it.from, true);
          if (at < 0) fail(`'rep from ${stars(it.from)}' has no '${stars(it.from)}' before it to repeat from`, it.col);
          else {
            used.add(it.from);
            const body = list.splice(at);
            list.push(starGroupOf(body, body[0].col, it.times));
          }
          waiting = null;
          break;
        }
        if (it.t === 'repfrom' && frames.length >= 2) {
          const f = frames.pop()!;
          frames[frames.length - 1].list.push(starGroupOf(f.list, f.col, it.times));
        } else if (waiting) {
          waiting.times = it.times;
          waiting = null;
        } else {
          const list = frames[frames.length - 1].list;
          const last = list[list.length - 1];
          if (it.t === 'reptimes' && last && last.t === 'group' && !last.into && last.times.k === 'n' && last.times.n === 1) {
            last.times = it.times;
          } else if (it.t === 'reptimes' && list.length) {
            // "(dc, htr) in next st, dc in next st, rep 5 more times": everything so far in the round,
            // after its starting chain, ring or loop marker.
            let from = 0;
            while (from < list.length && isSetup(list[from], from)) from++;
            if (from < list.length) {
              const body = list.splice(from);
              list.push({ ...starGroupOf(body, body[0].t === 'st' || body[0].t === 'group' ? body[0].col : it.col, it.times), star: false });
            } else {
              r.problems.push(error('There is nothing before this repeat to repeat', it.col));
              r.uncertain = true;
            }
          } else {
            r.problems.push(error(it.t === 'repfrom' ? "'rep from *' has no '*' before it to repeat from" : 'There is nothing before this repeat to repeat', it.col));
            r.uncertain = true;
          }
        }
        break;
      }
      case 'ending':
        ending(it);
        waiting = null;
        break;
      default:
        frames[frames.length - 1].list.push(it);
        if (it.t !== 'loop' && it.t !== 'turn' && it.t !== 'join' && it.t !== 'mark') waiting = null;
    }
  }
  while (frames.length > 1) {
    const f = frames.pop()!;
    r.problems.push(warning("The repeat that starts at this '*' is never repeated", f.col));
    frames[frames.length - 1].list.push(...f.list);
  }
  for (const it of items) {
    if (it.t === 'mark' && !used.has(it.level) && !r.starTrouble) {
      const m = stars(it.level);
      r.problems.push(
        warning(`Nothing refers to this '${m}' (as in 'rep from * to ${m}' or 'ending last rep at ${m}'), so it changes nothing`, it.col),
      );
      used.add(it.level);
    }
  }
  return frames[0].list;

  /** "*A**, B; rep from * to ** once": A and B are worked, then A again (common practice). */
  function repeatToMark(it: Extract<Item, { t: 'repfrom' }>, idx: number): void {
    const level = it.to!;
    const m = stars(level);
    const parent = () => frames[frames.length - 1].list;
    let body: Node[] | null = null;
    let col = it.col;
    let marks = 0;
    if (frames.length >= 2) {
      // The * repeat is still open: its first pass is worked as written, then the part up to the mark.
      const f = frames.pop()!;
      const at = markIndex(f.list, level);
      marks = markCount(f.list, level);
      parent().push(...f.list);
      if (at >= 0) {
        body = f.list.slice(0, at);
        col = f.col;
      }
    } else {
      // "rep from * twice more, then from * to ** once": the * repeat was closed by the "rep" before.
      const list = parent();
      for (let i = list.length - 1; i >= 0 && !body; i--) {
        const n = list[i];
        if (n.t === 'group' && n.star) {
          const at = markIndex(n.body, level);
          if (at >= 0) {
            body = n.body.slice(0, at);
            col = n.col;
            marks = markCount(n.body, level);
          }
        }
      }
    }
    if (marks > 1) {
      fail(`The repeat holds ${marks} '${m}' marks, so Whorlbook cannot tell which one '${it.text}' means: keep one`, it.col);
      return;
    }
    if (!body) {
      const later = items.slice(idx + 1).some((x) => x.t === 'mark' && x.level === level);
      fail(
        later
          ? `'${it.text}' comes before its '${m}', so the repeat would hold itself: put the '${m}' where the repeated part ends, before the 'rep'`
          : `'${it.text}' has no '${m}' before it: put '${m}' where the repeated part ends`,
        it.col,
      );
      return;
    }
    used.add(level);
    parent().push(starGroupOf(body, col, it.times));
  }

  function ending(it: EndingItem): void {
    const list = frames[frames.length - 1].list;
    const g = list[list.length - 1];
    if (!isRepeatGroup(g)) {
      fail(`'${it.text}' follows no repeat: put it right after the 'rep from *' it changes`, it.col);
      if (it.how !== 'at') list.push(...it.nodes);
      return;
    }
    if (it.how === 'at') {
      const at = markIndex(g.body, it.level);
      const m = stars(it.level);
      const marks = markCount(g.body, it.level);
      if (marks > 1) {
        fail(`The repeat holds ${marks} '${m}' marks, so Whorlbook cannot tell which one '${it.text}' means: keep one`, it.col);
        return;
      }
      if (at < 0) {
        fail(`'${it.text}' needs a '${m}' inside the repeat to say where the last repeat stops`, it.col);
        return;
      }
      used.add(it.level);
      g.last = g.body.slice(0, at);
      return;
    }
    if (it.how === 'with') {
      let li = g.body.length - 1;
      while (li >= 0 && !isWorkingNode(g.body[li])) li--;
      const x = it.nodes.find(isWorkingNode);
      if (li < 0 || !x || !sameStitch(g.body[li], x)) {
        fail(
          `Whorlbook cannot tell which part of the last repeat '${it.text}' takes the place of: put '**' where the last repeat stops and write 'ending last rep at **', or write the last repeat out`,
          it.col,
        );
        return;
      }
      g.last = [...g.body.slice(0, li), ...it.nodes, ...g.body.slice(li + 1)];
      return;
    }
    // "rep from * across, ending with sc in last st": the repeats leave room for what ends the row.
    if (g.times.k === 'fill') {
      const w = staticWorks(it.nodes);
      if (w === null) {
        fail(`Whorlbook cannot tell how many stitches '${it.text}' needs at the end: write 'rep from * to last N sts, …' instead`, it.col);
      } else g.times = { k: 'fill', leave: g.times.leave + w };
    }
    list.push(...it.nodes);
  }
}

/**
 * "ending last rep at **", "ending last rep with sc in next st", "ending with sc in last st, turn": reads
 * the clause and the ones after it that belong to it (up to a ';' or '.'); returns the last clause used.
 */
function readEnding(clauses: Clause[], ci: number, r: Reader, out: Item[], top: boolean): number {
  const els = clauses[ci].els;
  const col = firstCol(els);
  let i = 1;
  let lastRep = false;
  if (isWord(els[i], 'last')) {
    lastRep = true;
    i++;
  }
  if (isWord(els[i], 'rep')) {
    lastRep = true;
    i++;
  }
  if (isWord(els[i], 'at')) {
    const run = starRun(els, i + 1);
    const text = r.slice(col, lastEnd(els));
    if (run >= 2 && i + 1 + run === els.length) out.push({ t: 'ending', how: 'at', level: run, col, text });
    else {
      const why = run === 1 ? "a single '*' starts the repeat, so it cannot say where the last one stops; " : '';
      r.problems.push(error(`Whorlbook could not read '${text}': ${why}mark where the last repeat stops with '**' and write 'ending last rep at **'`, col));
      r.uncertain = true;
      r.starTrouble = true;
    }
    return ci;
  }
  if (isWord(els[i], 'with')) i++;
  let last = ci;
  const parts: Clause[] = [{ els: els.slice(i), sep: null }];
  while (last + 1 < clauses.length) {
    const next = clauses[last + 1];
    if (!(next.sep === ',' || next.sep === 'and' || next.sep === 'then') || isEnding(next.els) || isWord(next.els[0], 'rep')) break;
    parts.push(next);
    last++;
  }
  const sub: Item[] = [];
  for (const p of parts) if (p.els.length) readClause(p, r, sub, top);
  const nodes = nestStars(sub, r);
  const text = r.slice(col, lastEnd(clauses[last].els));
  if (!nodes.some(isWorkingNode)) {
    r.problems.push(error(`Whorlbook could not read '${text}': say what the last repeat ends with, e.g. 'ending last rep with sc in next st'`, col));
    r.uncertain = true;
    out.push(...nodes);
    return last;
  }
  out.push({ t: 'ending', how: lastRep ? 'with' : 'after', nodes, col, text });
  return last;
}

/** Most instructions a sequence closed by "… around" may hold and still be read as a repeat. */
const MAX_AROUND_SEQ = 4;

function isSetupItem(n: Item): boolean {
  return n.t === 'ring' || n.t === 'loop' || n.t === 'leftover' || n.t === 'join' || n.t === 'turn';
}

/** What may come before a round's starting chain: setup, or slip stitches that move into place. */
function isLeadItem(n: Item): boolean {
  return isSetupItem(n) || (n.t === 'st' && n.entry.id === 'sl st');
}

/** What may sit in a short sequence repeated around: fixed stitches, chains, skips and groups. */
function inSequence(n: Item): boolean {
  if (n.t === 'st') {
    return n.entry.id !== 'sl st' && n.units.u === 'n' && !n.bareFill && (n.into.t === 'next' || n.into.t === 'same' || n.into.t === 'air');
  }
  if (n.t === 'group') return n.times.k === 'n' && (!n.into || n.units.u === 'n') && !n.around && !n.last;
  return n.t === 'skip' && n.n !== 'fill' && n.noun !== 'sp';
}

function sameUnit(a: Node, b: StNode): boolean {
  return a.t === 'st' && a.entry.id === b.entry.id && a.per === b.per && a.into.t === b.into.t && (a.incOf?.id ?? null) === (b.incOf?.id ?? null);
}

/**
 * "sc, dec around", "sc 2, inc around": the short sequence before "around" is repeated around (common
 * practice). Read either way and settled by the count (see AroundInfo). Returns whether it rewrote items.
 */
function aroundSequence(items: Item[], from: number, before: number, r: Reader): boolean {
  const fill = items[before];
  if (!fill || fill.t !== 'st' || !fill.bareFill) return false;
  for (let k = before + 1; k < items.length; k++) if (items[k].t !== 'turn') return false;
  let s = from;
  let chain = false;
  for (; s < before; s++) {
    const n = items[s];
    if (isSetupItem(n)) continue;
    // A first chain is the round's starting chain, not part of the sequence.
    if (!chain && n.t === 'st' && n.entry.id === 'ch' && items.slice(0, s).every(isLeadItem)) {
      chain = true;
      continue;
    }
    break;
  }
  const seq = items.slice(s, before) as Node[];
  if (!seq.length || seq.length > MAX_AROUND_SEQ || !seq.every(inSequence)) return false;
  if (seq.every((n) => sameUnit(n, fill))) return false;
  const shaping = fill.entry.works !== fill.entry.makes || fill.entry.kind === 'inc' || fill.entry.kind === 'dec';
  const id = r.alt(2);
  // An inc or dec closing the sequence is read as the repeat unless the stated count says otherwise; a
  // plain stitch ("2 sc in first st, sc around") as the rest of the round unless the count says otherwise.
  if (shaping) r.statedOnly.push(id);
  const seqCol = (seq[0] as { col: number }).col;
  const text = r.slice(seqCol, fill.end);
  const seqText = text.replace(/[\s,]*(rep\w*\s+)?(each\s+)?(around|across|remaining(\s+\w+)?|to\s+(the\s+)?end|to\s+last\b.*)$/i, '');
  const unit: StNode = { ...fill, units: { u: 'n', n: 1 } };
  delete unit.bareFill;
  const g: GroupNode = {
    t: 'group',
    body: [...seq, unit],
    into: null,
    units: { u: 'n', n: 1 },
    times: { k: 'fill', leave: fill.units.u === 'fillTo' ? fill.units.leave : 0 },
    col: seqCol,
    end: fill.end,
    display: text,
    loop: null,
    around: { id, repeatFirst: shaping, literal: [...seq, fill], text, seq: seqText },
  };
  items.splice(s, before + 1 - s, g);
  return true;
}

function readSeq(els: El[], r: Reader, top: boolean): Node[] {
  const clauses = splitClauses(els);
  const items: Item[] = [];
  // Where the sequence a closing "… around" may repeat starts: after a ';' or '.', or anything else.
  let seqFrom = 0;
  for (let ci = 0; ci < clauses.length; ci++) {
    const cl = clauses[ci];
    if (cl.sep === ';' || cl.sep === '.' || cl.sep === ':') seqFrom = items.length;
    if (isEnding(cl.els)) {
      ci = readEnding(clauses, ci, r, items, top);
      seqFrom = items.length;
      continue;
    }
    const before = items.length;
    readClause(cl, r, items, top);
    if (!top || items.length === before) continue;
    if (aroundSequence(items, seqFrom, before, r)) {
      seqFrom = items.length;
      continue;
    }
    for (let k = before; k < items.length; k++) if (!inSequence(items[k]) && !isSetupItem(items[k])) seqFrom = k + 1;
  }
  const nodes = nestStars(items, r);
  settleChains(nodes, r, top);
  return nodes;
}

/** Every node list a group may work: its body, its last time through, its literal reading. */
function groupLists(g: GroupNode): Node[][] {
  const lists = [g.body];
  if (g.last) lists.push(g.last);
  if (g.around) lists.push(g.around.literal);
  return lists;
}

function hasFromHook(nodes: Node[]): boolean {
  for (const n of nodes) {
    if (n.t === 'st' && n.into.t === 'fromHook') return true;
    if (n.t === 'group' && groupLists(n).some(hasFromHook)) return true;
  }
  return false;
}

/** Chains inside repeats are chain stitches unless they say otherwise. */
function defaultChains(nodes: Node[]): void {
  for (const n of nodes) {
    if (n.t === 'st' && n.entry.id === 'ch' && !n.role && !n.roleAlt) n.role = 'chains';
    if (n.t === 'st' && n.role === 'counts' && !n.countsAs) n.countsAs = STITCH_BY_ID.get('dc');
    if (n.t === 'group') for (const list of groupLists(n)) defaultChains(list);
  }
}

/** "dc in 4th ch from hook": do the skipped chains count as a stitch? Settled by the count. */
function markSkippedChains(nodes: Node[], r: Reader): void {
  for (const n of nodes) {
    // A node may sit in a repeat's body and its last time through: one ambiguity, not two.
    if (n.t === 'st' && n.into.t === 'fromHook' && n.into.nth >= 3 && !n.skippedCountAlt) {
      n.skippedCountAlt = { id: r.alt(2), defaultCounts: n.into.nth >= 4 };
    }
    if (n.t === 'group') for (const list of groupLists(n)) markSkippedChains(list, r);
  }
}

/**
 * "sl st in next 2 dc and in next ch-2 sp, ch 3 (counts as dc), …": slip stitches that open a round and
 * are followed by its starting chain only move the yarn into place; they are not stitches of the round
 * (common practice).
 */
function markMovingSlips(nodes: Node[]): void {
  let i = 0;
  while (i < nodes.length && (nodes[i].t === 'loop' || nodes[i].t === 'mark')) i++;
  const from = i;
  for (; i < nodes.length; i++) {
    const n = nodes[i];
    if (n.t !== 'st' || n.entry.id !== 'sl st' || n.units.u !== 'n' || (n.into.t !== 'next' && n.into.t !== 'space')) break;
  }
  const next = nodes[i];
  if (i === from || !next || next.t !== 'st' || next.entry.id !== 'ch') return;
  for (let k = from; k < i; k++) (nodes[k] as StNode).moving = true;
}

/** Decides what each chain is for: turning, counting as a stitch, chain stitches, foundation or ring. */
function settleChains(nodes: Node[], r: Reader, top: boolean): void {
  if (top) markMovingSlips(nodes);
  const fromHook = hasFromHook(nodes);
  const firstIdx = nodes.findIndex(isCountedWork);
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i];
    if (n.t !== 'st' || n.entry.id !== 'ch') continue;
    let next: Node | undefined;
    let laterWork = false;
    for (let j = i + 1; j < nodes.length; j++) {
      if (!next && notLoopNode(nodes[j])) next = nodes[j];
      if (isWorkNode(nodes[j])) {
        laterWork = true;
        break;
      }
    }
    if (next && next.t === 'ring' && next.formed) {
      n.role = 'ring';
      continue;
    }
    if (n.role) {
      if (n.role === 'counts' && !n.countsAs) n.countsAs = STITCH_BY_ID.get(STARTS_COUNTS_AS[n.units.u === 'n' ? n.units.n : 3] ?? 'dc');
      continue;
    }
    const count = n.units.u === 'n' ? n.units.n : 1;
    if (top && i === firstIdx) {
      if (fromHook) n.role = 'foundation';
      else if (!laterWork) n.role = 'chains';
      else if (count === 1) n.role = 'turning';
      else if (next && next.t === 'skip') {
        // "ch 4, sk 4, …" makes a gap of 4 chains; read as a turning chain when the count says so.
        n.roleAlt = { id: r.alt(2), options: ['chains', 'turning'] };
      } else {
        const options: ChainRole[] = count >= 3 ? ['counts', 'turning'] : ['turning', 'counts'];
        n.roleAlt = { id: r.alt(2), options };
        n.countsAs = STITCH_BY_ID.get(STARTS_COUNTS_AS[count] ?? 'dc');
      }
    } else if (top && !laterWork && next && next.t === 'turn') n.role = 'turning';
    else n.role = 'chains';
  }
  defaultChains(nodes);
  if (top) markSkippedChains(nodes, r);
}

// ───────────────────────── entry point ─────────────────────────

/** Trailing stated count: "(30)", "[30]", "(30 sts)", "— 30 sts", "= 30", ", 30 sts." */
function takeStated(els: El[], r: Reader): { stated: number | null; col: number | null; cut: number; trailingFrom: number | null } {
  for (let i = els.length - 1; i >= 0; i--) {
    const e = els[i];
    if (e.k === 'br') {
      const n = statedOf(e, r);
      // "(2 sc) in next st": a group with a target, not a count; "(2 sc) x6": a group repeated.
      if (n !== null && !(isWord(els[i + 1], 'in', 'on') && !isWord(els[i + 2], 'all', 'total')) && !readTimes(els, i + 1)) {
        let tail = 0;
        for (const x of els.slice(i + 1)) if (notPunct(x) && !(x.k === 'br' && bracketKind(x, r).k === 'comment')) tail++;
        return { stated: n, col: e.col, cut: i, trailingFrom: tail ? i + 1 : null };
      }
      // Only the last bracket can be the count; an earlier one would leave instructions after it.
      const after = els.slice(i + 1);
      let instructions = false;
      for (const x of after) if (x.k === 'br' || isNum(x) || r.isStitchWord(x)) instructions = true;
      if (instructions) break;
    }
  }
  // Dash or equals form at the very end.
  let j = els.length - 1;
  while (j >= 0 && isTok(els[j]) && (els[j] as Tok).k === 'p' && ['.', ',', ';'].includes((els[j] as Tok).v)) j--;
  let k = j;
  if (isWord(els[k], 'total')) k--;
  if (isWord(els[k], 'st')) k--;
  if (isNum(els[k])) {
    const before = els[k - 1];
    const hadSt = k < j;
    if ((isP(before, '-') || isP(before, '=')) || (hadSt && (isP(before, ',') || isP(before, '.') || isP(before, ';') || isP(before, ':') || before === undefined))) {
      return { stated: (els[k] as Tok).n, col: before && isTok(before) ? before.col : (els[k] as Tok).col, cut: before ? k - 1 : k, trailingFrom: null };
    }
  }
  return { stated: null, col: null, cut: els.length, trailingFrom: null };
}

const parseCache = new Map<string, Parsed>();

/**
 * Reads the instruction text of one round. `text` is the whole source line; the instructions start at
 * `from` (after the label). Never throws.
 */
export function parseInstruction(text: string, from: number, terms: Terms): Parsed {
  const key = `${terms}\u0000${from}\u0000${text}`;
  const hit = parseCache.get(key);
  if (hit) return hit;
  const parsed = parseUncached(text, from, terms);
  if (parseCache.size > 2000) parseCache.clear();
  parseCache.set(key, parsed);
  return parsed;
}

function parseUncached(text: string, from: number, terms: Terms): Parsed {
  const r = new Reader(terms, text);
  const raw = lex(text.slice(from), from);
  const tell = TERMS_TELLTALES[terms === 'us' ? 'uk' : 'us'];
  for (const t of raw) if (t.k === 'word' && tell.has(t.v)) r.telltales.add(t.v);
  const toks = normalize(raw, terms);
  const tree = structure(toks, r);
  const st = takeStated(tree, r);
  const body = tree.slice(0, st.cut);
  if (st.trailingFrom !== null) {
    const tail = tree.slice(st.trailingFrom);
    const tailText = r.slice(firstCol(tail), text.length).replace(/^[.,;:\s]+/, '');
    const firstTail = tail.find(notPunct);
    const instructiony = firstTail && (isWord(firstTail, 'turn', 'join', 'ch', 'slst') || (isTok(firstTail) && firstTail.v === 'not'));
    if (instructiony && classifyNote(tailText).kind === 'other') body.push({ k: 'p', v: ',', n: 0, col: firstCol(tail), end: firstCol(tail), raw: ',' }, ...tail);
    else if (tailText) r.notes.push({ text: tailText, col: firstCol(tail), position: 'after' });
  }
  let nodes: Node[] = [];
  try {
    nodes = readSeq(body, r, true);
  } catch {
    // A reader bug must not take the editor down: say so on the line instead.
    r.problems.push(error('Whorlbook could not read this line', from));
    r.uncertain = true;
  }
  const hasWork = nodes.some(isDoingNode);
  const startCol = body.length ? firstCol(body) : from;
  return {
    nodes,
    stated: st.stated,
    statedCol: st.col,
    problems: r.problems,
    notes: r.notes,
    alts: r.alts,
    statedOnly: r.statedOnly,
    repRound: r.repRound,
    empty: !hasWork && !r.repRound,
    uncertain: r.uncertain,
    telltales: [...r.telltales],
    endCol: body.length ? lastEnd(body) : from,
    startCol,
  };
}

/** Whether an unlabelled line reads as instructions (starts with a stitch, a count, a bracket or a star). */
export function startsLikeInstruction(text: string, from: number, terms: Terms): boolean {
  const toks = normalize(lex(text.slice(from, from + 200), from), terms).slice(0, 3);
  const r = new Reader(terms, text);
  const t0 = toks[0];
  if (!t0) return false;
  if (t0.k === 'p') return t0.v === '(' || t0.v === '[' || t0.v === '{' || t0.v === '*';
  if (t0.k === 'num') {
    const t1 = toks[1];
    return !!t1 && (r.isStitchWord(t1) || isWord(t1, 'mr', 'blo', 'flo'));
  }
  if (t0.k === 'word') return r.isStitchWord(t0) || isWord(t0, 'mr', 'sk', 'blo', 'flo');
  return false;
}
