// Walks a parsed round against the stitches available and produces its count, steps and count problems.

import { STITCH_BY_ID, type StitchEntry } from './abbreviations';
import type { GroupNode, Into, LeftoverNode, Node, Parsed, StNode, Units } from './ast';
import { parseInstruction } from './parser';
import { planRound } from './planner';
import type { Loop, Problem, Step, Terms } from './types';

export interface EvalEnv {
  terms: Terms;
  /** Stitches available from the previous round (or the start). */
  prev: number;
  /** Where those come from, for sentences: "Round 4", "the start", or null when there is nothing. */
  prevName: string | null;
  /** "Round 5" / "Row 5". */
  name: string;
  /** Leftover loops of an earlier round (see check.ts). */
  leftover: (node: LeftoverNode) => { count: number; problem: string | null };
  /** Steps this round may still add (the piece as a whole has a budget too). */
  maxSteps?: number;
  /**
   * What the previous round made, in the order this round meets it (see `layout` below): chain spaces
   * are found here. Undefined: there is no round before; null: it could not be followed stitch by stitch.
   */
  prevLayout?: Layout | null;
}

/**
 * The stitches a round makes, in order, as runs: a positive number is that many stitches, a negative one
 * that many chains in a row (a chain space for the next round), e.g. [1, -2, 1, -2] for "(sc, ch 2) x2".
 */
export type Layout = number[];

export interface EvalResult {
  steps: Step[];
  made: Record<string, number>;
  loops: Loop[];
  worked: number;
  stitches: number;
  problems: Problem[];
  /** False when some choice could not be settled (only used to pick between readings). */
  clean: boolean;
  layout: Layout;
  /** Part of the round could not be counted (a hand check was asked for): the stated count stands. */
  uncertain: boolean;
}

/** Per round: beyond this the text is almost surely a slip, and the counter could not walk it anyway. */
export const MAX_STEPS = 20000;
const MAX_OPS = 200000;

class Budget extends Error {}

type Base = 'prev' | 'ring' | 'chain' | 'leftover';

/** What a trial run of a repeat must put back (see Walker.trial). */
interface Snapshot {
  steps: number;
  problems: number;
  pos: number;
  offset: number;
  base: Base;
  ringKind: 'mr' | 'ring';
  side: 1 | 2;
  chainPool: number | null;
  foundationLen: number | null;
  pool: number;
  made: Map<string, number>;
  loops: Set<Loop>;
  loopMode: Loop | null;
  overCol: number | null;
  fitFailed: boolean;
  leave: { n: number | null; col: number } | null;
  repeat: { index: number; of: number } | null;
  anyWorked: boolean;
  clean: boolean;
  uncertain: boolean;
  layout: Layout | null;
  plain: number;
  spaceList: number[] | null | undefined;
  spacePtr: number;
  saidSpaces: boolean;
  absorb: { step: number; pos: number } | null;
}

const error = (message: string, column: number | null): Problem => ({ message, column, severity: 'error' });
const warning = (message: string, column: number | null): Problem => ({ message, column, severity: 'warning' });

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

function ordinal(n: number): string {
  const t = n % 100;
  if (t >= 11 && t <= 13) return `${n}th`;
  return `${n}${['th', 'st', 'nd', 'rd'][n % 10] ?? 'th'}`;
}

const LOOP_WORDS: Record<Loop, string> = { blo: 'back loop only', flo: 'front loop only' };

class Walker {
  pool: number;
  pos = 0;
  /** Stitches worked on the first side of a foundation chain, once the other side is being worked. */
  offset = 0;
  base: Base = 'prev';
  ringKind: 'mr' | 'ring' = 'mr';
  side: 1 | 2 = 1;
  chainPool: number | null = null;
  foundationLen: number | null = null;
  steps: Step[] = [];
  made = new Map<string, number>();
  loops = new Set<Loop>();
  loopMode: Loop | null = null;
  problems: Problem[] = [];
  overCol: number | null = null;
  fitFailed = false;
  leave: { n: number | null; col: number } | null = null;
  repeat: { index: number; of: number } | null = null;
  anyWorked = false;
  ops = 0;
  clean = true;
  uncertain = false;
  /** Null while the round has made no chain yet: then it is `plain` stitches (most rounds never need more). */
  layout: Layout | null = null;
  plain = 0;
  /** Chain spaces of the previous round as [start, end) pairs of positions, once asked for. */
  spaceList: number[] | null | undefined;
  /** First space not yet passed. */
  spacePtr = 0;
  saidSpaces = false;
  /** After "in each ch-sp around": the step that may pass over the stitches after the last space. */
  absorb: { step: number; pos: number } | null = null;
  readonly maxSteps: number;

  constructor(
    readonly env: EvalEnv,
    readonly choices: number[],
  ) {
    this.pool = env.prev;
    this.maxSteps = Math.min(MAX_STEPS, env.maxSteps ?? MAX_STEPS);
  }

  get terms(): Terms {
    return this.env.terms;
  }

  abbr(e: StitchEntry): string {
    return e.abbr[this.terms];
  }

  noun(): string {
    return this.base === 'chain' ? 'chain' : 'stitch';
  }

  tick(): void {
    if (++this.ops > MAX_OPS) throw new Budget();
  }

  /** `lay`: what the stitches made are for the next round's layout (0 stitches, 1 chains, 2 recorded by the caller). */
  step(action: string, text: string, worksInto: number, makes: number, loop: Loop | null, column: number, lay: 0 | 1 | 2 = 0): void {
    if (this.steps.length >= this.maxSteps) throw new Budget();
    this.tick();
    if (makes > 0 && lay !== 2) this.lay(makes, lay === 1);
    const full = loop ? `${text} — ${LOOP_WORDS[loop]}` : text;
    this.steps.push({
      index: this.steps.length,
      action,
      text: full,
      worksInto,
      makes,
      repeat: this.repeat,
      loop,
      column,
    });
    if (loop && (worksInto > 0 || makes > 0)) this.loops.add(loop);
    if (worksInto > 0) {
      this.pos += worksInto;
      this.anyWorked = true;
      if (this.base !== 'ring' && this.pos > this.pool && this.overCol === null) this.overCol = column;
    }
  }

  lay(n: number, chain: boolean): void {
    if (this.layout === null) {
      if (!chain) {
        this.plain += n;
        return;
      }
      this.layout = this.plain ? [this.plain] : [];
    }
    const L = this.layout;
    const last = L.length - 1;
    if (last >= 0 && L[last] < 0 === chain) L[last] += chain ? -n : n;
    else L.push(chain ? -n : n);
  }

  /** The previous round's chain spaces, or null when they cannot be known here. */
  spaces(): number[] | null {
    if (this.base !== 'prev') return null;
    if (this.spaceList !== undefined) return this.spaceList;
    const layout = this.env.prevLayout;
    let list: number[] | null = null;
    if (layout) {
      let total = 0;
      let stitches = false;
      const pairs: number[] = [];
      for (const run of layout) {
        if (run < 0) pairs.push(total, total - run);
        else stitches = true;
        total += Math.abs(run);
      }
      // A line of chains only is a foundation chain, not chain spaces.
      if (total === this.env.prev && pairs.length && stitches) list = pairs;
    }
    this.spaceList = list;
    return list;
  }

  /** End of the next chain space not yet passed, or -1. */
  nextSpaceEnd(): number {
    const sp = this.spaceList!;
    while (this.spacePtr < sp.length && sp[this.spacePtr + 1] <= this.pos) this.spacePtr += 2;
    return this.spacePtr < sp.length ? sp[this.spacePtr + 1] : -1;
  }

  /** Chain spaces ahead that end by `limit`. */
  spacesAhead(limit: number): number {
    const sp = this.spaceList!;
    this.nextSpaceEnd();
    let n = 0;
    for (let k = this.spacePtr; k < sp.length && sp[k + 1] <= limit; k += 2) n++;
    return n;
  }

  /** "in each ch-sp around" where the spaces cannot be known: said once, the round keeps its stated count. */
  spacesByHand(col: number): void {
    this.uncertain = true;
    if (this.saidSpaces) return;
    this.saidSpaces = true;
    const prev = this.env.prevName;
    let why: string;
    if (this.base !== 'prev') why = 'this round does not work into the stitches of the round before';
    else if (this.env.prevLayout === undefined || !prev || prev === 'the start') why = 'there is no round before this line to count them from';
    else if (this.env.prevLayout === null) why = `${prev} could not be followed stitch by stitch`;
    else if (!this.env.prevLayout.some((x) => x < 0)) why = `${prev} makes no chains between its stitches`;
    else why = `${prev} could not be followed stitch by stitch`;
    this.problems.push(warning(`Whorlbook counts 'in each ch-sp' from the chain spaces of the round before, but ${why}; check this round by hand`, col));
  }

  /** How many times "in each ch-sp around" works: one per chain space left (leaving `leave` stitches). */
  spaceUnits(units: Units, size: number, what: string, col: number): number {
    const leave = units.u === 'fillTo' ? units.leave : 0;
    if (units.u === 'n') return units.n;
    if (!this.spaces()) {
      this.spacesByHand(col);
      const rem = this.remaining() - leave;
      return rem > 0 ? Math.floor(rem / Math.max(1, size)) : 0;
    }
    const count = this.spacesAhead(this.pool - leave);
    if (count === 0) {
      this.problems.push(warning(`'${what}' has no chain spaces left to work into`, col));
      this.clean = false;
    }
    return count;
  }

  /** After a fill over chain spaces: the stitches after the last space belong to it (common practice). */
  markAbsorb(units: Units): void {
    if (units.u === 'fill' && this.steps.length) this.absorb = { step: this.steps.length - 1, pos: this.pos };
  }

  snapshot(): Snapshot {
    return {
      steps: this.steps.length, problems: this.problems.length, pos: this.pos, offset: this.offset, base: this.base,
      ringKind: this.ringKind, side: this.side, chainPool: this.chainPool, foundationLen: this.foundationLen, pool: this.pool,
      made: new Map(this.made), loops: new Set(this.loops), loopMode: this.loopMode, overCol: this.overCol,
      fitFailed: this.fitFailed, leave: this.leave, repeat: this.repeat, anyWorked: this.anyWorked, clean: this.clean,
      uncertain: this.uncertain, layout: this.layout && [...this.layout], plain: this.plain, spaceList: this.spaceList, spacePtr: this.spacePtr,
      saidSpaces: this.saidSpaces, absorb: this.absorb,
    };
  }

  restore(s: Snapshot): void {
    this.steps.length = s.steps;
    this.problems.length = s.problems;
    this.pos = s.pos;
    this.offset = s.offset;
    this.base = s.base;
    this.ringKind = s.ringKind;
    this.side = s.side;
    this.chainPool = s.chainPool;
    this.foundationLen = s.foundationLen;
    this.pool = s.pool;
    this.made = s.made;
    this.loops = s.loops;
    this.loopMode = s.loopMode;
    this.overCol = s.overCol;
    this.fitFailed = s.fitFailed;
    this.leave = s.leave;
    this.repeat = s.repeat;
    this.anyWorked = s.anyWorked;
    this.clean = s.clean;
    this.uncertain = s.uncertain;
    this.layout = s.layout;
    this.plain = s.plain;
    this.spaceList = s.spaceList;
    this.spacePtr = s.spacePtr;
    this.saidSpaces = s.saidSpaces;
    this.absorb = s.absorb;
  }

  /** Stitches worked by one time through `body` from here, without keeping anything of it. */
  trial(g: GroupNode, body: Node[], loop: Loop | null): number {
    const snap = this.snapshot();
    const start = this.pos;
    this.iteration(g, loop, 1, 1, null, [], body);
    const w = this.offset + this.pos - snap.offset - start;
    this.restore(snap);
    return w;
  }

  addMade(key: string, n: number): void {
    if (n) this.made.set(key, (this.made.get(key) ?? 0) + n);
  }

  remaining(): number {
    return this.pool - this.pos;
  }

  choice(id: number): number {
    return this.choices[id] ?? 0;
  }

  /** Stitches each unit works into. */
  worksPer(into: Into, entry: StitchEntry, at: number): number {
    switch (into.t) {
      case 'next':
        // After "MR," or "ch 4, join to form a ring," stitches with no target go into the ring.
        return this.base === 'ring' ? 0 : entry.works;
      case 'same':
        return this.anyWorked || this.base === 'ring' ? 0 : Math.min(1, entry.works);
      case 'ring':
        return 0;
      case 'fromHook':
        this.enterChain(into.nth, at);
        return Math.min(1, entry.works);
      case 'space': {
        if (!this.spaces()) return into.size;
        // With the previous round's layout known, "in next ch-sp" works up to the end of the next chain
        // space, passing the stitches before it.
        const end = this.nextSpaceEnd();
        if (end >= 0) return end - this.pos;
        if (!this.saidSpaces) {
          this.saidSpaces = true;
          this.problems.push(error(`${this.env.prevName ?? 'The round before'} has no chain space left to work into here`, at));
        }
        this.clean = false;
        return 0;
      }
      case 'air':
        return 0;
    }
  }

  enterRing(kind: 'mr' | 'ring'): void {
    this.base = 'ring';
    this.ringKind = kind;
  }

  /** "in 2nd ch from hook": the chain becomes what the round works into; the chains skipped are the turn. */
  enterChain(nth: number, at: number): void {
    if (this.base === 'chain') return;
    const len = this.foundationLen ?? this.env.prev;
    const skipped = Math.max(0, nth - 1);
    if (len <= skipped) {
      this.problems.push(error(`The chain has ${plural(len, 'chain', 'chains')}, so there is no ${ordinal(nth)} ch from the hook`, at));
    }
    this.base = 'chain';
    this.pool = Math.max(0, len - skipped);
    this.chainPool = this.pool;
    this.offset += this.pos;
    this.pos = 0;
  }

  unitCount(units: Units, wpu: number, what: string, col: number): number {
    if (units.u === 'n') return units.n;
    const leave = units.u === 'fillTo' ? units.leave : 0;
    if (this.base === 'ring') {
      this.problems.push(error(`'${what}' needs stitches to work into, but this round works into the ring`, col));
      this.clean = false;
      return 0;
    }
    const rem = this.remaining() - leave;
    if (rem <= 0) {
      this.problems.push(warning(`'${what}' has no stitches left to work into`, col));
      this.clean = false;
      return 0;
    }
    if (wpu <= 0) return rem;
    const count = Math.floor(rem / wpu);
    const left = rem % wpu;
    if (left) {
      this.problems.push(
        error(`'${what}' works ${wpu} stitches each time, but ${rem} are left: ${count} of them leave ${plural(left, 'stitch', 'stitches')} over`, col),
      );
      this.fitFailed = true;
      this.clean = false;
    }
    return count;
  }

  run(nodes: Node[], loop: Loop | null): void {
    for (const n of nodes) this.node(n, loop);
  }

  node(n: Node, loop: Loop | null): void {
    this.tick();
    switch (n.t) {
      case 'st':
        return this.stitch(n, loop);
      case 'group':
        return this.group(n, loop);
      case 'mark':
        return;
      case 'skip': {
        const count = n.noun === 'sp' && n.n !== 'fill' && this.spaces() ? this.worksPer({ t: 'space', size: n.n }, STITCH_BY_ID.get('sc')!, n.col) : n.n === 'fill' ? Math.max(0, this.remaining()) : n.n;
        const what = n.noun === 'ch' ? plural(count, 'chain', 'chains') : n.noun === 'sp' ? 'the next space' : plural(count, 'stitch', 'stitches');
        this.step('sk', count === 1 && n.noun !== 'sp' ? `skip the next ${this.noun()}` : `skip the next ${what}`, count, 0, null, n.col);
        return;
      }
      case 'leave':
        this.leave = { n: n.n, col: n.col };
        return;
      case 'join':
        this.step('join', `join: ${this.terms === 'uk' ? 'ss' : 'sl st'} in the first stitch (makes no stitch)`, 0, 0, null, n.col);
        return;
      case 'turn':
        return;
      case 'loop':
        this.loopMode = n.loop;
        return;
      case 'ring':
        this.enterRing(n.formed ? 'ring' : 'mr');
        if (n.formed) this.step('join', `join with a ${this.terms === 'uk' ? 'ss' : 'sl st'} to form a ring`, 0, 0, null, n.col);
        return;
      case 'otherside':
        if (this.base !== 'chain' || this.chainPool === null) {
          this.problems.push(warning("'the other side' only applies to a foundation chain", n.col));
          return;
        }
        if (this.side === 2) return;
        this.offset += this.pos;
        this.pos = 0;
        this.pool = this.chainPool;
        this.side = 2;
        return;
      case 'leftover': {
        const got = this.env.leftover(n);
        if (got.problem) this.problems.push(warning(got.problem, n.col));
        if (this.steps.length) this.problems.push(warning('Working in leftover loops starts a round; put it first', n.col));
        this.offset += this.pos;
        this.base = 'leftover';
        this.pool = got.count;
        this.pos = 0;
        this.loopMode = n.loop;
        return;
      }
      case 'evenly':
        return this.evenly(n.kind, n.n, n.col, n.loop ?? loop);
    }
  }

  evenly(kind: 'inc' | 'dec', n: number, col: number, loop: Loop | null): void {
    const rem = this.remaining();
    const to = kind === 'inc' ? rem + n : rem - n;
    let plan: string;
    try {
      plan = planRound(rem, to).instruction;
    } catch {
      this.problems.push(error(`${n} ${kind === 'inc' ? 'increases' : 'decreases'} cannot be spread over ${plural(rem, 'stitch', 'stitches')}`, col));
      this.clean = false;
      return;
    }
    const parsed = parseInstruction(plan, 0, 'us');
    const save = this.steps.length;
    this.run(parsed.nodes, loop);
    for (let i = save; i < this.steps.length; i++) this.steps[i] = { ...this.steps[i], column: col };
  }

  stitch(n: StNode, outerLoop: Loop | null): void {
    const loop = n.loop ?? outerLoop ?? this.loopMode;
    const e = n.entry;
    if (e.id === 'ch') return this.chain(n, loop);
    if (n.into.t === 'ring' && this.base !== 'ring') this.enterRing('mr');
    if (e.id === 'sl st' && n.into.t === 'next' && n.units.u === 'n' && n.units.n === 1 && n.per === 1 && this.base === 'prev' && this.pool > 0 && this.pos >= this.pool) {
      // "…, sl st in next st, fasten off" after the round is complete: the slip stitch goes into the
      // first stitch of this round to finish the edge and is not counted (common practice).
      this.step('sl st', `${this.abbr(e)} in the next stitch to finish (not counted)`, 0, 0, loop, n.col);
      return;
    }
    // "in each ch-sp around": how many spaces first, so that none left is said once.
    const spaceFill = n.into.t === 'space' && n.units.u !== 'n' ? this.spaceUnits(n.units, n.into.t === 'space' ? n.into.size : 1, n.word, n.col) : -1;
    const wpuFirst = spaceFill === 0 ? 0 : this.worksPer(n.into, e, n.col);
    const count = spaceFill >= 0 ? spaceFill : this.unitCount(n.units, wpuFirst || e.works, n.word, n.col);
    const madeKey = n.incOf ? n.incOf.madeAs : e.madeAs;
    const makes = n.moving ? 0 : e.kind === 'inc' ? 2 : n.per * e.makes;
    const { action, text } = this.describe(n, makes);
    if (n.into.t === 'fromHook' && n.skippedCountAlt) {
      const pick = this.choice(n.skippedCountAlt.id);
      const counts = pick === 0 ? n.skippedCountAlt.defaultCounts : !n.skippedCountAlt.defaultCounts;
      if (counts) {
        const skipped = n.into.nth - 1;
        this.step(`ch ${skipped}`, `the ${skipped} skipped ch count as the first ${this.abbr(e)}`, 0, 1, null, n.col);
        this.addMade(e.madeAs, 1);
      }
    }
    for (let k = 1; k <= count; k++) {
      const wpu = k === 1 ? wpuFirst : this.worksPer(n.into.t === 'fromHook' ? { t: 'next' } : n.into, e, n.col);
      const counter = count > 1 && n.units.u === 'n' ? ` (${k} of ${count})` : '';
      this.step(action, text + counter, wpu, makes, loop, n.col);
      this.addMade(madeKey, makes);
    }
    if (n.into.t === 'space') this.markAbsorb(n.units);
  }

  /** Where a stitch goes, in words. */
  where(n: StNode): string {
    switch (n.into.t) {
      case 'same':
        return 'in the same stitch';
      case 'ring':
        return this.ringKind === 'mr' ? 'in the magic ring' : 'in the ring';
      case 'fromHook':
        return `in the ${ordinal(n.into.nth)} ch from the hook`;
      case 'space':
        return n.into.size > 1 ? `in the next ch-${n.into.size} space` : 'in the next space';
      default:
        if (this.base === 'ring') return this.ringKind === 'mr' ? 'in the magic ring' : 'in the ring';
        return `in the next ${this.noun()}`;
    }
  }

  // The words for a stitch node depend only on the node and where the round works into; a repeat
  // asks for them thousands of times, so they are kept.
  private said = new Map<StNode, { key: string; action: string; text: string }>();

  describe(n: StNode, makes: number): { action: string; text: string } {
    const key = this.base + this.ringKind;
    const hit = this.said.get(n);
    if (hit && hit.key === key) return hit;
    const d = this.describeFresh(n, makes);
    this.said.set(n, { key, action: d.action, text: d.text });
    return d;
  }

  describeFresh(n: StNode, makes: number): { action: string; text: string } {
    const e = n.entry;
    const a = n.incOf ? this.abbr(n.incOf) : this.abbr(e);
    const noun = this.noun();
    if (e.kind === 'inc') {
      const base = n.incOf ? this.abbr(n.incOf) : this.abbr(STITCH_BY_ID.get('sc')!);
      const action = n.incOf ? `${this.abbrUs(n.incOf)} inc` : 'inc';
      return { action, text: `${n.incOf ? `${base} inc` : 'inc'}: 2 ${base} ${this.where(n)}` };
    }
    if (e.kind === 'dec') {
      const over = e.works;
      if (e.id === 'invdec') return { action: 'invdec', text: `invdec: invisible decrease over the next ${over} stitches (front loops)` };
      const baseId = e.id.replace(/\dtog$/, '');
      const base = STITCH_BY_ID.get(baseId);
      const baseAbbr = base ? this.abbr(base) : this.abbr(e);
      return { action: e.id, text: `${this.abbr(e)}: ${baseAbbr} the next ${over} ${noun === 'chain' ? 'chains' : 'stitches'} together` };
    }
    if (n.moving) return { action: e.id, text: `${a} ${this.where(n)} (moves the yarn into place; not a stitch)` };
    if (n.per > 1) return { action: `${n.per} ${this.abbrUs(e)}`, text: `${n.per} ${a} ${this.where(n)}` };
    if (makes === 0) return { action: e.id, text: `${a} (not counted as a stitch)` };
    return { action: e.id, text: `${a} ${this.where(n)}` };
  }

  iteration(
    g: GroupNode,
    loop: Loop | null,
    index: number,
    of: number,
    keep: { index: number; of: number } | null,
    infos: Array<{ index: number; of: number }>,
    body: Node[] = g.body,
  ): void {
    const info = { index, of };
    infos.push(info);
    this.repeat = keep ?? (g.times.k === 'n' && g.times.n === 1 && !g.star ? this.repeat : info);
    this.run(body, loop);
  }

  abbrUs(e: StitchEntry): string {
    return e.abbr.us;
  }

  chain(n: StNode, loop: Loop | null): void {
    const count = n.units.u === 'n' ? n.units.n : 1;
    const role = n.role ?? (n.roleAlt ? n.roleAlt.options[this.choice(n.roleAlt.id)] : 'chains');
    const ch = 'ch';
    switch (role) {
      case 'turning':
        this.step(`ch ${count}`, `ch ${count} (${count === 1 ? 'turning chain' : 'starting chain'}, not a stitch)`, 0, 0, null, n.col);
        return;
      case 'counts': {
        const as = n.countsAs ?? STITCH_BY_ID.get('dc')!;
        // After slip stitches that moved into place, the chain stands in the stitch they reached.
        const works = this.base === 'ring' || this.pool === 0 || this.anyWorked ? 0 : 1;
        const extra = n.plusCh && n.plusCh < count ? n.plusCh : 0;
        if (!extra) {
          this.step(`ch ${count}`, `ch ${count} (counts as the first ${this.abbr(as)})`, works, 1, loop, n.col);
          this.addMade(as.madeAs, 1);
          return;
        }
        this.step(`ch ${count}`, `ch ${count} (counts as the first ${this.abbr(as)} and a ch-${extra} space)`, works, 1 + extra, loop, n.col, 2);
        this.lay(1, false);
        this.lay(extra, true);
        this.addMade(as.madeAs, 1);
        this.addMade('ch', extra);
        return;
      }
      case 'foundation':
        this.foundationLen = (this.foundationLen ?? 0) + count;
        for (let k = 1; k <= count; k++) this.step(ch, `ch (${k} of ${count}, foundation chain)`, 0, 0, null, n.col);
        return;
      case 'ring':
        for (let k = 1; k <= count; k++) this.step(ch, `ch (${k} of ${count}, for the ring)`, 0, 0, null, n.col);
        return;
      default:
        for (let k = 1; k <= count; k++) this.step(ch, count > 1 ? `ch (${k} of ${count})` : 'ch 1', 0, 1, null, n.col, 1);
        this.addMade('ch', count);
    }
  }

  group(g: GroupNode, outerLoop: Loop | null): void {
    const loop = g.loop ?? outerLoop;
    if (g.into) {
      const inner = innerOf(g);
      const spaceFill = g.into.t === 'space' && g.units.u !== 'n' ? this.spaceUnits(g.units, g.into.size, g.display, g.col) : -1;
      const wpuFirst = g.into.t === 'ring' || spaceFill === 0 ? 0 : this.worksPer(g.into, STITCH_BY_ID.get('sc')!, g.col);
      if (g.into.t === 'ring' && this.base !== 'ring') this.enterRing('mr');
      const count = spaceFill >= 0 ? spaceFill : this.unitCount(g.units, wpuFirst || 1, g.display, g.col);
      const where =
        g.into.t === 'same' ? 'in the same stitch' : g.into.t === 'ring' ? 'in the ring' : g.into.t === 'space' ? 'in the next space' : `in the next ${this.noun()}`;
      for (let k = 1; k <= count; k++) {
        const wpu = k === 1 ? wpuFirst : this.worksPer(g.into.t === 'fromHook' ? { t: 'next' } : g.into, STITCH_BY_ID.get('sc')!, g.col);
        this.step(g.display, `${g.display} ${where}`, wpu, inner.makes, loop ?? this.loopMode, g.col, 2);
        for (const run of inner.runs) this.lay(Math.abs(run), run < 0);
        for (const [key, v] of Object.entries(inner.made)) this.addMade(key, v);
      }
      if (g.into.t === 'space') this.markAbsorb(g.units);
      return;
    }
    if (g.around && g.around.id !== null && (this.choice(g.around.id) === 0) !== g.around.repeatFirst) {
      // "2 sc in first st, sc around": the rest of the round, as written.
      this.run(g.around.literal, loop);
      return;
    }
    const outer = this.repeat;
    const infos: Array<{ index: number; of: number }> = [];
    // A plain group "(sc, inc), sc" is not a repeat: its steps keep the repeat they sit in.
    const plain = g.times.k === 'n' && g.times.n === 1 && !g.star;
    const last = g.last;
    try {
      if (g.times.k === 'n' || g.times.k === 'alt') {
        const times = g.times.k === 'n' ? g.times.n : g.times.options[this.choice(g.times.id)] ?? g.times.options[0];
        for (let i = 1; i <= times; i++) this.iteration(g, loop, i, times, plain ? outer : null, infos, last && i === times ? last : g.body);
        return;
      }
      // Fill: as many times as the stitches left allow, keeping `leave` for the instructions after.
      const leave = g.times.leave;
      if (this.spaces() && this.fillBySpaces(g, loop, leave, infos)) return;
      const start = this.pos;
      const rem0 = this.remaining() - leave;
      if (last) return this.fillWithLast(g, last, loop, rem0, infos);
      this.iteration(g, loop, 1, 1, null, infos);
      const w = this.pos - start;
      if (w <= 0) {
        this.problems.push(error('This repeat works no stitches, so it cannot fill the round', g.col));
        this.clean = false;
        return;
      }
      const after = rem0 - w;
      if (after < 0) return;
      const extra = Math.floor(after / w);
      const left = after % w;
      if (left) {
        const fit = `but ${rem0} are left for it: it cannot fit the round (${plural(extra + 1, 'repeat leaves', 'repeats leave')} ${left} over)`;
        // "Round 2 has 13" when the repeat is the whole round, as "sc, dec around" usually is.
        const whole = start === 0 && leave === 0 && this.base === 'prev' && this.env.prevName && this.env.prevName !== 'the start';
        const has = whole ? `but ${this.env.prevName} has ${rem0}: it cannot fit the round (${plural(extra + 1, 'repeat leaves', 'repeats leave')} ${left} over)` : fit;
        this.problems.push(
          error(
            g.around
              ? `'${g.around.text}' repeats '${g.around.seq}', which works ${plural(w, 'stitch', 'stitches')} each time, ${has}`
              : `The repeat works ${plural(w, 'stitch', 'stitches')} each time, ${fit}`,
            g.col,
          ),
        );
        this.fitFailed = true;
        this.clean = false;
      }
      for (let i = 2; i <= extra + 1; i++) this.iteration(g, loop, i, extra + 1, null, infos);
      for (const info of infos) info.of = extra + 1;
    } finally {
      this.repeat = outer;
    }
  }

  /** "*A**, B; rep from * around, ending last rep at **": full repeats, then one that stops at the mark. */
  fillWithLast(g: GroupNode, last: Node[], loop: Loop | null, rem0: number, infos: Array<{ index: number; of: number }>): void {
    const w = this.trial(g, g.body, loop);
    const wl = this.trial(g, last, loop);
    if (w <= 0) {
      this.problems.push(error('This repeat works no stitches, so it cannot fill the round', g.col));
      this.clean = false;
      return;
    }
    let times = 1;
    if (rem0 >= wl) {
      const full = Math.floor((rem0 - wl) / w);
      const left = (rem0 - wl) % w;
      times = full + 1;
      if (left) {
        this.problems.push(
          error(
            `The repeat works ${plural(w, 'stitch', 'stitches')} each time${wl === w ? '' : ` and ${wl} the last time`}, but ${rem0} are left for it: it cannot fit the round (${plural(times, 'repeat leaves', 'repeats leave')} ${left} over)`,
            g.col,
          ),
        );
        this.fitFailed = true;
        this.clean = false;
      }
    }
    for (let i = 1; i <= times; i++) this.iteration(g, loop, i, times, null, infos, i === times ? last : g.body);
  }

  /**
   * A fill whose body works into chain spaces ("*(3 dc, ch 2, 3 dc) in next ch-2 sp, ch 1; rep from *
   * around"): it is worked once per space (or group of spaces) of the previous round. False when the body
   * does not work into spaces, or not a fixed number of them.
   */
  fillBySpaces(g: GroupNode, loop: Loop | null, leave: number, infos: Array<{ index: number; of: number }>): boolean {
    const a = spaceCount(g.body);
    const b = g.last ? spaceCount(g.last) : a;
    if (!a || b === null) return false;
    const have = this.spacesAhead(this.pool - leave);
    if (have === 0) {
      this.problems.push(warning(`'${g.display === '*' ? 'rep from *' : g.display}' has no chain spaces left to work into`, g.col));
      this.clean = false;
      return true;
    }
    let times = 1;
    if (have >= b) {
      const left = (have - b) % a;
      times = Math.floor((have - b) / a) + 1;
      if (left) {
        this.problems.push(
          error(
            `The repeat works into ${plural(a, 'chain space', 'chain spaces')} each time, but ${this.env.prevName ?? 'the round before'} has ${have} left: it cannot fit the round (${plural(times, 'repeat leaves', 'repeats leave')} ${left} over)`,
            g.col,
          ),
        );
        this.fitFailed = true;
        this.clean = false;
      }
    }
    for (let i = 1; i <= times; i++) this.iteration(g, loop, i, times, null, infos, g.last && i === times ? g.last : g.body);
    this.markAbsorb({ u: 'fill' });
    return true;
  }
}

/** Chain spaces one time through these nodes works into, when fixed (0: none; null: it depends). */
function spaceCount(nodes: Node[]): number | null {
  let n = 0;
  for (const x of nodes) {
    if (x.t === 'st' && x.into.t === 'space') {
      if (x.units.u !== 'n') return null;
      n += x.units.n;
    } else if (x.t === 'skip' && x.noun === 'sp') {
      if (x.n === 'fill') return null;
      n += 1;
    } else if (x.t === 'group') {
      if (x.into) {
        if (x.into.t !== 'space') continue;
        if (x.units.u !== 'n' || x.times.k !== 'n') return null;
        n += x.units.n * x.times.n;
        continue;
      }
      const inner = spaceCount(x.body);
      if (inner === null) return null;
      if (inner === 0) continue;
      if (x.times.k !== 'n' || x.last) return null;
      n += inner * x.times.n;
    }
  }
  return n;
}

interface Inner {
  makes: number;
  made: Record<string, number>;
  /** The layout one unit of the group makes (see Layout). */
  runs: Layout;
}

// A group worked into each stitch is asked for its contents once per stitch; they depend only on the node.
const innerCache = new WeakMap<GroupNode, Inner>();

function innerOf(g: GroupNode): Inner {
  const hit = innerCache.get(g);
  if (hit) return hit;
  const c = collect(g.body);
  let runs: Layout = [];
  if (!runsInto(g.body, runs, { left: 4096 }) || runs.reduce((s, x) => s + Math.abs(x), 0) !== c.makes) runs = c.makes ? [c.makes] : [];
  const inner = { makes: c.makes, made: c.made, runs };
  innerCache.set(g, inner);
  return inner;
}

function pushRun(out: Layout, n: number, chain: boolean): void {
  if (n <= 0) return;
  const last = out.length - 1;
  if (last >= 0 && out[last] < 0 === chain) out[last] += chain ? -n : n;
  else out.push(chain ? -n : n);
}

/** The layout of a group's body, in order; false when it is too long or not fixed. */
function runsInto(nodes: Node[], out: Layout, budget: { left: number }): boolean {
  for (const n of nodes) {
    if (--budget.left < 0) return false;
    if (n.t === 'st') {
      const units = n.units.u === 'n' ? n.units.n : 1;
      if (n.entry.id === 'ch') {
        if (n.role === 'turning') continue;
        pushRun(out, units, n.role !== 'counts');
      } else pushRun(out, units * (n.entry.kind === 'inc' ? 2 : n.per * n.entry.makes), false);
    } else if (n.t === 'group') {
      const t = n.times.k === 'n' ? n.times.n : n.times.k === 'alt' ? n.times.options[0] : 1;
      const each = n.into && n.units.u === 'n' ? n.units.n : 1;
      for (let i = 0; i < t * each; i++) if (!runsInto(n.body, out, budget)) return false;
    }
  }
  return true;
}

function collectInto(ns: Node[], mul: number, out: { makes: number; made: Record<string, number> }): void {
  for (const n of ns) {
    if (n.t === 'st') {
      const units = n.units.u === 'n' ? n.units.n : 1;
      let key: string;
      let count: number;
      if (n.entry.id === 'ch') {
        if (n.role === 'turning') continue;
        key = 'ch';
        count = units * mul;
      } else if (n.entry.kind === 'inc') {
        key = n.incOf ? n.incOf.madeAs : 'sc';
        count = 2 * units * mul;
      } else {
        key = n.entry.madeAs;
        count = n.per * n.entry.makes * units * mul;
      }
      out.made[key] = (out.made[key] ?? 0) + count;
      out.makes += count;
    } else if (n.t === 'group') {
      const t = n.times.k === 'n' ? n.times.n : n.times.k === 'alt' ? n.times.options[0] : 1;
      collectInto(n.body, mul * t * (n.into && n.units.u === 'n' ? n.units.n : 1), out);
    }
  }
}

function collect(nodes: Node[]): { makes: number; made: Record<string, number> } {
  const out = { makes: 0, made: {} as Record<string, number> };
  collectInto(nodes, 1, out);
  return out;
}

function runOnce(nodes: Node[], env: EvalEnv, choices: number[], initialLoop: Loop | null): Walker | null {
  const w = new Walker(env, choices);
  w.loopMode = initialLoop;
  try {
    w.run(nodes, null);
  } catch (e) {
    if (!(e instanceof Budget)) throw e;
    return null;
  }
  return w;
}

/**
 * Evaluates a parsed round. Ambiguous readings (a leading "ch 3" with no "(counts as …)", "rep from * 5
 * times") are tried in order; the first that leaves no count problem (and matches a stated count) wins,
 * else the first, which is the common-practice reading.
 */
export function evaluate(parsed: Parsed, env: EvalEnv, opts: { nodes?: Node[]; initialLoop?: Loop | null; stated?: number | null } = {}): EvalResult {
  const nodes = opts.nodes ?? parsed.nodes;
  const alts = parsed.alts.length;
  const stated = opts.stated === undefined ? parsed.stated : opts.stated;
  const combos: number[][] = [];
  if (!alts) combos.push([]);
  else {
    // Up to 4 ambiguities vary (16 readings); the rest keep their first reading.
    const vary = Math.min(alts, 4);
    const all: number[][] = [];
    for (let mask = 0; mask < 1 << vary; mask++) {
      const c = new Array<number>(alts).fill(0);
      for (let b = 0; b < vary; b++) if (mask & (1 << b)) c[b] = 1;
      all.push(c);
    }
    all.sort((a, b) => a.reduce((s, x) => s + x, 0) - b.reduce((s, x) => s + x, 0));
    combos.push(...all);
  }
  let first: EvalResult | null = null;
  const statedOnly = parsed.statedOnly;
  for (const combo of combos) {
    // A reading that needs the stated count to confirm it is not tried without one.
    if (stated === null && statedOnly.length && first && statedOnly.some((id) => combo[id] === 1)) continue;
    const w = runOnce(nodes, env, combo, opts.initialLoop ?? null);
    if (!w) {
      const over: EvalResult = {
        steps: [],
        made: {},
        loops: [],
        worked: 0,
        stitches: 0,
        problems: [
          error(
            (env.maxSteps ?? MAX_STEPS) < MAX_STEPS
              ? `${env.name} is past what Whorlbook counts in one piece; split the pattern into pieces`
              : `${env.name} is too long to count (more than ${MAX_STEPS} steps); check the repeat counts`,
            parsed.startCol,
          ),
        ],
        clean: false,
        layout: [],
        uncertain: false,
      };
      return over;
    }
    const res = finish(w, env, parsed);
    if (!first) first = res;
    if (combos.length === 1) return res;
    const countOk = res.clean && !res.problems.some((p) => p.severity === 'error');
    if (countOk && (stated === null || stated === res.stitches)) return res;
  }
  return first!;
}

function finish(w: Walker, env: EvalEnv, parsed: Parsed): EvalResult {
  if (w.absorb && w.base === 'prev' && w.pos === w.absorb.pos && w.pos < w.pool && (!w.spaces() || w.spacesAhead(w.pool) === 0)) {
    // "(sc, ch 1) in each ch-sp around" ends in the last space: the stitches after it are passed on the way
    // to the join (common practice), so they are not "left unworked".
    const extra = w.pool - w.pos;
    const st = w.steps[w.absorb.step];
    w.steps[w.absorb.step] = { ...st, worksInto: st.worksInto + extra };
    w.pos = w.pool;
  }
  const worked = w.offset + w.pos;
  let stitches = 0;
  for (const st of w.steps) stitches += st.makes;
  const problems = w.problems;
  const name = env.name;
  const endCol = parsed.endCol;
  if (w.base === 'ring') {
    // Worked into a ring: nothing of a previous round to cover.
  } else if (w.side === 2) {
    if (w.pos > w.pool) {
      problems.push(error(`${name} works ${w.pos} on the other side of the chain, but it has only ${w.pool}`, w.overCol ?? endCol));
      w.clean = false;
    }
  } else if (w.pool === 0 && w.base === 'prev' && worked > 0) {
    problems.push(
      error(`${name} works into ${plural(worked, 'stitch', 'stitches')}, but there are none before it — start with a magic ring or a chain, or give the starting count`, parsed.startCol),
    );
    w.clean = false;
  } else if (worked > w.pool) {
    const from =
      w.base === 'chain'
        ? `the chain has only ${w.pool} to work into`
        : w.base === 'leftover'
          ? `only ${w.pool} loops are left to work into`
          : `${env.prevName ?? 'the round before'} has only ${w.pool}`;
    problems.push(error(`${name} works ${worked} stitches, but ${from}`, w.overCol ?? endCol));
    w.clean = false;
  } else if (worked < w.pool) {
    const left = w.pool - worked;
    const what = w.base === 'chain' ? 'chains' : 'stitches';
    if (w.leave) {
      if (w.leave.n !== null && w.leave.n !== left) {
        problems.push(error(`${name} says to leave ${w.leave.n} unworked, but ${left} ${left === 1 ? 'is' : 'are'} left`, w.leave.col));
        w.clean = false;
      }
    } else if (!w.fitFailed) {
      const sts = w.base === 'chain' ? (left === 1 ? 'ch' : 'ch') : left === 1 ? 'st' : 'sts';
      problems.push(
        error(
          `${name} works ${worked} of ${w.pool} ${what}; ${left} ${left === 1 ? 'is' : 'are'} left unworked — say 'leave the remaining ${left} ${sts} unworked' if that is meant`,
          endCol,
        ),
      );
      w.clean = false;
    }
  } else if (w.leave && w.leave.n !== null && w.leave.n > 0) {
    problems.push(error(`${name} says to leave ${w.leave.n} unworked, but none are left`, w.leave.col));
    w.clean = false;
  }
  const made: Record<string, number> = {};
  for (const [k, v] of w.made) made[k] = v;
  return { steps: w.steps, made, loops: [...w.loops], worked, stitches, problems, clean: w.clean, layout: w.layout ?? (w.plain ? [w.plain] : []), uncertain: w.uncertain };
}
