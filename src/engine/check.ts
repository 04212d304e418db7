// checkPiece: reads a whole piece line by line, counts every round against the one before, and keeps
// every other line as a note at its place.

import type { LeftoverNode, Node, Parsed } from './ast';
import { evaluate, type EvalEnv, type EvalResult, type Layout } from './evaluate';
import { readLabel, type Label } from './labels';
import { classifyNote } from './notes';
import { parseInstruction, startsLikeInstruction } from './parser';
import type { CheckOptions, Note, PieceCheck, Problem, Round, Terms } from './types';

/** A piece longer than this is not a piece; the rest is not read (the editor stays responsive). */
export const MAX_ROUNDS = 5000;
/** Steps over the whole piece: keeps memory bounded for pasted nonsense ("Rnds 1-1000: sc 9999"). */
export const MAX_PIECE_STEPS = 400000;
const MAX_LINE = 4000;

const error = (message: string, column: number | null): Problem => ({ message, column, severity: 'error' });
const warning = (message: string, column: number | null): Problem => ({ message, column, severity: 'warning' });

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

interface Record_ {
  round: Round;
  nodes: Node[];
  parsed: Parsed;
}

class PieceReader {
  rounds: Round[] = [];
  records: Record_[] = [];
  notes: Note[] = [];
  waiting: Note[] = [];
  prev: number;
  prevName: string | null;
  /**
   * The count the pattern says the maker has, when it differs from `prev`: after a round whose stated
   * count its instructions miss, the next round may be written for either, and is only a slip if it is
   * wrong from both (one slip, one complaint).
   */
  prevStated: number | null = null;
  lastNumber = 0;
  lastKind: 'round' | 'row' = 'round';
  pendingLeftover: LeftoverNode | null = null;
  /** What the last round made, in its working order (chain spaces for "in each ch-sp"); see EvalEnv. */
  prevLayout: Layout | null | undefined = undefined;
  /** The last round ended with "turn": the next one meets its stitches the other way round. */
  prevTurned = false;
  telltales = new Set<string>();
  truncated = false;
  steps = 0;
  /** The line being read was cut at MAX_LINE characters. */
  cut = false;

  /** Bound once: a round asks for it only when it starts in leftover loops. */
  readonly leftoverOf: EvalEnv['leftover'];

  constructor(
    readonly terms: Terms,
    start: number,
  ) {
    this.leftoverOf = this.leftover.bind(this);
    this.prev = start;
    this.prevName = start > 0 ? 'the start' : null;
  }

  find(n: number): Record_ | undefined {
    for (let i = this.records.length - 1; i >= 0; i--) if (this.records[i].round.number === n) return this.records[i];
    return undefined;
  }

  leftover(node: LeftoverNode): { count: number; problem: string | null } {
    const noun = node.kind === 'row' ? 'Row' : 'Round';
    const target = this.find(node.round);
    if (!target) return { count: this.prev, problem: `${noun} ${node.round} is not in this piece before this line` };
    // Front loops are left free by a round worked in back loops only, and the other way round.
    const opposite = node.loop === 'flo' ? 'blo' : 'flo';
    const freed = (r: Round | undefined) => (r ? r.steps.filter((s) => s.loop === opposite).reduce((a, s) => a + s.worksInto, 0) : 0);
    const own = freed(target.round);
    const nextRec = this.records[this.records.indexOf(target) + 1];
    const after = freed(nextRec?.round);
    const order = node.wording === 'left' ? [own, after] : [after, own];
    const count = order.find((x) => x > 0);
    if (count !== undefined) return { count, problem: null };
    const loopName = node.loop === 'flo' ? 'front' : 'back';
    const workedName = opposite === 'blo' ? 'back' : 'front';
    return {
      count: target.round.stitches,
      problem: `${noun} ${node.round} was not worked in ${workedName} loops only, so it left no ${loopName} loops free; counting its ${target.round.stitches} stitches`,
    };
  }

  addNote(line: number, text: string, kind?: Note['kind']): Note {
    const reading = classifyNote(text);
    const last = this.rounds[this.rounds.length - 1];
    let k = kind ?? reading.kind;
    // A join ends the round before it; with no round before, it is only words.
    if (k === 'join' && !last) k = 'other';
    const note: Note = { line, text, kind: k, afterRound: last ? last.number : null, beforeRound: null };
    if (reading.hookMm !== undefined) note.hookMm = reading.hookMm;
    if (reading.placement) note.placement = reading.placement;
    if (reading.smallParts) note.smallParts = true;
    this.notes.push(note);
    this.waiting.push(note);
    return note;
  }

  addRounds(idx: number, line: string, label: Label | null, parsed: Parsed, foundation: boolean): void {
    for (const t of parsed.telltales) this.telltales.add(t);
    const kind = label ? label.kind : foundation ? 'row' : this.lastKind;
    const noun = kind === 'row' ? 'Row' : 'Round';
    const textStart = label ? label.textStart : line.length - line.trimStart().length;
    const text = line.slice(textStart).trim();
    const rep = parsed.repRound;
    let numbers: number[];
    if (label) numbers = label.numbers;
    else if (rep) {
      const count = Math.min(1000, rep.refs.length * (rep.times ?? 1));
      numbers = Array.from({ length: count }, (_, i) => this.lastNumber + 1 + i);
    } else if (foundation) numbers = [this.lastNumber];
    else numbers = [this.lastNumber + 1];
    const shownLabel = label ? label.label : foundation ? 'Foundation chain' : `${noun === 'Row' ? 'Row' : 'Rnd'} ${numbers[0]}`;

    const lineProblems: Problem[] = [...(label?.problems ?? []), ...parsed.problems];
    if (this.cut) lineProblems.unshift(warning(`This line is longer than ${MAX_LINE} characters; only the first ${MAX_LINE} are read`, MAX_LINE));
    // Numbering: a new part starts again at 1; anything else should follow on.
    if (label && this.rounds.length) {
      const n0 = numbers[0];
      const last = this.lastNumber;
      if (n0 !== 1 && n0 > last + 1) {
        const missing = n0 - last === 2 ? `is ${noun} ${last + 1}` : `are ${noun}s ${last + 1}–${n0 - 1}`;
        lineProblems.push(warning(`${noun} ${n0} follows ${noun} ${last}: ${missing} missing?`, 0));
      } else if (n0 !== 1 && n0 <= last) {
        lineProblems.push(warning(`${noun} ${n0} comes after ${noun} ${last}`, 0));
      }
    }
    if (rep && label && rep.times !== null && rep.refs.length * rep.times !== numbers.length) {
      lineProblems.push(
        warning(`'${label.label}' names ${plural(numbers.length, 'round', 'rounds')}, but the repeat covers ${rep.refs.length * rep.times}`, rep.col),
      );
    }
    for (const n of parsed.notes) if (n.position === 'before') this.addNote(idx, n.text);
    // The count may be stated in the label ("Round 5 (36 sts):") as well as at the end of the line.
    const endStated = parsed.stated;
    const labelStated = label?.stated ?? null;
    const twoCounts = endStated !== null && labelStated !== null && endStated !== labelStated;
    if (twoCounts) {
      lineProblems.push(
        warning(
          `${numbers.length === 1 ? `${noun} ${numbers[0]}` : `'${label!.label}'`} gives two counts: ${labelStated} in the label and ${endStated} at the end of the line`,
          label!.statedCol,
        ),
      );
    }

    for (let j = 0; j < numbers.length; j++) {
      if (this.rounds.length >= MAX_ROUNDS) {
        this.truncated = true;
        return;
      }
      const number = numbers[j];
      const name = `${noun} ${number}`;
      const env: EvalEnv = {
        terms: this.terms,
        prev: this.prev,
        prevName: this.prevName,
        name,
        leftover: this.leftoverOf,
        maxSteps: MAX_PIECE_STEPS - this.steps,
      };
      // Rows turn, so a row meets the row before from its last stitch (common practice); so does a round
      // after a "turn".
      const turned = kind === 'row' || this.prevTurned || turnsFirst(parsed.nodes);
      env.prevLayout = this.prevLayout && turned ? [...this.prevLayout].reverse() : this.prevLayout;
      const problems: Problem[] = j === 0 ? [...lineProblems] : [];
      let nodes = parsed.nodes;
      let source = parsed;
      let res: EvalResult | null = null;
      if (rep) {
        const ref = rep.refs[j % rep.refs.length];
        const src = this.find(ref);
        const refNoun = rep.kind === 'row' ? 'Row' : 'Round';
        if (!src) problems.push(error(`${refNoun} ${ref} is not in this piece before this line`, rep.col));
        else if (src.round.line === idx) problems.push(error(`${name} repeats itself`, rep.col));
        else {
          // A leftover-loops start belongs to the round that was repeated, not to its copies.
          nodes = src.nodes.filter((n) => n.t !== 'leftover');
          source = src.parsed;
        }
      }
      const own = nodes;
      if (this.pendingLeftover && j === 0) {
        nodes = [this.pendingLeftover, ...nodes];
        this.pendingLeftover = null;
      }
      let stated = endStated ?? labelStated;
      let statedCol = endStated !== null ? parsed.statedCol : (label?.statedCol ?? null);
      const nothing = (parsed.empty && !rep) || (rep && source === parsed);
      if (parsed.empty && !rep) problems.push(error(`${name} has no instructions`, textStart));
      const evalOpts = { nodes, initialLoop: label?.loop ?? null, stated };
      if (!nothing) res = evaluate(source, env, evalOpts);
      let stitches: number;
      /** What the round makes when worked from the stated count of the round before (see prevStated). */
      let fromStated: number | null = null;
      const uncertain = parsed.uncertain || (res?.uncertain ?? false);
      if (!res) stitches = stated ?? this.prev;
      else if (uncertain) {
        stitches = stated ?? res.stitches;
        // A hand check asked for while counting (not while reading) is said by the count itself.
        if (!parsed.uncertain) problems.push(...(source === parsed ? res.problems : res.problems.map((p) => ({ ...p, column: rep!.col }))));
      }
      else {
        stitches = res.stitches;
        // Of two counts, the one the round makes is the one meant; the other was already said.
        if (twoCounts && stitches === labelStated) {
          stated = labelStated;
          statedCol = label!.statedCol;
        }
        const complains = res.problems.length > 0 || (stated !== null && stated !== stitches);
        let excused = false;
        if (this.prevStated !== null && (complains || stated === null)) {
          const alt = evaluate(source, { ...env, prev: this.prevStated }, evalOpts);
          fromStated = alt.stitches;
          // Written for the count the round before states: that round has already said what slipped.
          excused = complains && alt.problems.length === 0 && (stated === null || stated === alt.stitches);
        }
        // A repeated round's sentences point at this line's "rep", not at the line repeated.
        if (!excused) problems.push(...(source === parsed ? res.problems : res.problems.map((p) => ({ ...p, column: rep!.col }))));
        if (!excused && stated !== null && stated !== stitches) {
          // One slip, one sentence: a round that leaves stitches unworked (or works too many) usually
          // misses its stated count for the same reason, so the count goes into that sentence.
          const cover = problems.findIndex((p) => / works \d+ (of \d+ |stitches, but )|cannot fit the round|stitch(es)? over$/.test(p.message));
          if (cover >= 0) {
            problems[cover] = { ...problems[cover], message: `${problems[cover].message} (it makes ${stitches}, not the ${stated} stated)` };
          } else {
            problems.push(error(`${name} makes ${plural(stitches, 'stitch', 'stitches')}, not ${stated}`, statedCol));
          }
        }
      }
      const round: Round = {
        number,
        label: label || foundation ? shownLabel : `${noun === 'Row' ? 'Row' : 'Rnd'} ${number}`,
        kind,
        line: idx,
        text,
        stitches,
        worked: res ? res.worked : 0,
        stated,
        made: res ? res.made : {},
        loops: res ? res.loops : [],
        steps: res ? res.steps : [],
        problems,
      };
      this.rounds.push(round);
      this.steps += round.steps.length;
      this.records.push({ round, nodes: own, parsed: source });
      for (const n of this.waiting) n.beforeRound = number;
      this.waiting = [];
      // The count the pattern means from here: its stated count, else what the round makes from the
      // count meant before it (an unreadable or empty round keeps what was meant).
      const meant = stated ?? (!res ? (this.prevStated ?? stitches) : uncertain ? stitches : (fromStated ?? stitches));
      this.prevStated = meant !== stitches ? meant : null;
      // The chain spaces the next round may work into: known only when this round was counted in full.
      this.prevLayout = res && !uncertain && res.stitches === stitches ? res.layout : null;
      this.prevTurned = turnsLast(source === parsed ? parsed.nodes : nodes);
      this.prev = stitches;
      this.prevName = name;
      this.lastNumber = number;
      this.lastKind = kind;
    }
    for (const n of parsed.notes) if (n.position === 'after') this.addNote(idx, n.text);
  }

  line(idx: number, raw: string): void {
    let line = raw;
    this.cut = line.length > MAX_LINE;
    if (this.cut) line = line.slice(0, MAX_LINE);
    if (!/[\p{L}\p{N}]/u.test(line)) return;
    const label = readLabel(line);
    if (label) {
      this.addRounds(idx, line, label, parseInstruction(line, label.textStart, this.terms), false);
      return;
    }
    const from = line.length - line.trimStart().length;
    const looksLike = startsLikeInstruction(line, from, this.terms) || /^\s*(rep(eat)?|work|working)\b/i.test(line);
    if (looksLike) {
      const parsed = parseInstruction(line, from, this.terms);
      const reading = classifyNote(line);
      const onlyLeftover = parsed.nodes.length > 0 && parsed.nodes.every((n) => n.t === 'leftover' || n.t === 'loop') && parsed.nodes.some((n) => n.t === 'leftover');
      if (onlyLeftover) {
        // "Working in the front loops left from Rnd 6:" on its own line: the next round starts there.
        this.pendingLeftover = parsed.nodes.find((n): n is LeftoverNode => n.t === 'leftover') ?? null;
        this.addNote(idx, line.trim());
        return;
      }
      // "Sl st in first sc to join." alone on its line: the end of the round before, not a round.
      const onlyJoin =
        parsed.stated === null && parsed.nodes.some((n) => n.t === 'join') && parsed.nodes.every((n) => n.t === 'join' || n.t === 'turn');
      if (onlyJoin) {
        this.addNote(idx, line.trim(), 'join');
        return;
      }
      const isRep = parsed.repRound !== null;
      const noteLike = reading.kind !== 'other' && parsed.stated === null;
      const readable = !parsed.empty && !parsed.problems.some((p) => p.message.startsWith('Whorlbook could not read') && p.column === from);
      if (isRep || (!noteLike && readable && !/^\s*(rep(eat)?|work)\b/i.test(line))) {
        const foundation =
          !isRep &&
          parsed.nodes.length > 0 &&
          parsed.nodes.every((n) => (n.t === 'st' && n.entry.id === 'ch') || n.t === 'turn') &&
          parsed.nodes.some((n) => n.t === 'st');
        this.addRounds(idx, line, null, parsed, foundation);
        return;
      }
    }
    this.addNote(idx, line.trim());
  }

  result(): PieceCheck {
    const hints: string[] = [];
    if (this.telltales.size) {
      const words = [...this.telltales].slice(0, 4).join(', ');
      hints.push(
        this.terms === 'us'
          ? `This looks like UK terms (${words}): if the pattern is written in UK terms, check it with UK terms`
          : `This looks like US terms (${words}): if the pattern is written in US terms, check it with US terms`,
      );
    }
    if (this.truncated) hints.push(`Only the first ${MAX_ROUNDS} rounds were checked`);
    return {
      terms: this.terms,
      rounds: this.rounds,
      notes: this.notes,
      hints,
      totalStitches: this.rounds.reduce((s, r) => s + r.stitches, 0),
      totalSteps: this.rounds.reduce((s, r) => s + r.steps.length, 0),
    };
  }
}

function isWork(n: Node): boolean {
  return n.t === 'st' || n.t === 'group' || n.t === 'skip' || n.t === 'evenly';
}

/** "ch 1, turn, …": the round turns before it starts. */
function turnsFirst(nodes: Node[]): boolean {
  for (const n of nodes) {
    if (n.t === 'turn') return true;
    if (isWork(n) && !(n.t === 'st' && n.entry.id === 'ch')) return false;
  }
  return false;
}

/** "…, ch 1, turn": the round ends by turning. */
function turnsLast(nodes: Node[]): boolean {
  for (let i = nodes.length - 1; i >= 0; i--) {
    const n = nodes[i];
    if (n.t === 'turn') return true;
    if (isWork(n) && !(n.t === 'st' && n.entry.id === 'ch')) return false;
  }
  return false;
}

function startOf(opts: CheckOptions | undefined): number {
  const s = opts?.start;
  return typeof s === 'number' && Number.isFinite(s) && s > 0 ? Math.floor(s) : 0;
}

/** Checks a whole piece. Never throws, whatever the input. */
export function checkPiece(text: string, opts?: CheckOptions): PieceCheck {
  const terms: Terms = opts?.terms === 'uk' ? 'uk' : 'us';
  try {
    const src = typeof text === 'string' ? text : text == null ? '' : String(text);
    const reader = new PieceReader(terms, startOf(opts));
    const lines = src.split(/\r\n|\n|\r/);
    for (let i = 0; i < lines.length; i++) {
      if (reader.rounds.length >= MAX_ROUNDS) {
        reader.truncated = true;
        break;
      }
      reader.line(i, lines[i]);
    }
    return reader.result();
  } catch {
    return {
      terms,
      rounds: [],
      notes: [],
      hints: ['Whorlbook could not check this piece'],
      totalStitches: 0,
      totalSteps: 0,
    };
  }
}
