// What the parser makes of one round's instructions; the evaluator walks it against a stitch count.

import type { StitchEntry } from './abbreviations';
import type { Loop, Problem } from './types';

/** Where each unit of a stitch instruction goes. */
export type Into =
  | { t: 'next' }
  | { t: 'same' }
  | { t: 'ring' }
  | { t: 'fromHook'; nth: number }
  | { t: 'space'; size: number }
  | { t: 'air' };

/** How many units: a fixed number, every remaining stitch, or every stitch but the last N. */
export type Units = { u: 'n'; n: number } | { u: 'fill' } | { u: 'fillTo'; leave: number };

export type ChainRole = 'turning' | 'counts' | 'chains' | 'foundation' | 'ring';

export interface StNode {
  t: 'st';
  entry: StitchEntry;
  /** As written, for the maker's words ("sc", "invdec", or an unknown word read as one stitch). */
  word: string;
  /** Stitches made into each unit ("3 sc in next st" → 3). */
  per: number;
  units: Units;
  into: Into;
  loop: Loop | null;
  col: number;
  end: number;
  /** "hdc inc": an increase made of another stitch. */
  incOf?: StitchEntry;
  /** Chains only: what the chain is for. A number is an ambiguity id resolved by the evaluator. */
  role?: ChainRole;
  roleAlt?: { id: number; options: ChainRole[] };
  /** For a chain that counts as a stitch: which. */
  countsAs?: StitchEntry;
  /** "ch 5 (counts as dc + ch 2)": the last chains of a counting chain make a chain space. */
  plusCh?: number;
  /** Leading chain followed by "(counts as …)" / "(does not count)". */
  annotated?: boolean;
  /** "dc in 4th ch from hook": do the skipped chains count as a stitch? Resolved like roleAlt. */
  skippedCountAlt?: { id: number; defaultCounts: boolean };
  /** Inherits from "… and in each ch across". */
  inherited?: boolean;
  /** "dec around" with nothing between the stitch and "around": may close a short sequence (see AroundInfo). */
  bareFill?: boolean;
  /** "sl st in next 2 sts, ch 3, …": slip stitches before the starting chain move the yarn; they make no stitch. */
  moving?: boolean;
}

export type Times =
  | { k: 'n'; n: number }
  | { k: 'fill'; leave: number }
  | { k: 'alt'; id: number; options: number[] };

export interface GroupNode {
  t: 'group';
  body: Node[];
  /** "(sc, hdc) in next st": the whole group goes into each unit. Null: the body is worked in turn. */
  into: Into | null;
  units: Units;
  times: Times;
  col: number;
  end: number;
  /** As written, e.g. "(sc, hdc)". */
  display: string;
  loop: Loop | null;
  /** Star repeats keep their marker column for problems. */
  star?: boolean;
  /** "…, ending last rep at **" / "ending last rep with …": what the last time through works instead of `body`. */
  last?: Node[];
  /** "sc, dec around": a short sequence read as a repeat around (see AroundInfo). */
  around?: AroundInfo;
}

/**
 * "sc, dec around" means "(sc, dec) around" (common practice), while "2 sc in first st, sc around" means
 * "then sc in each remaining st". The group holds the repeat reading; `literal` is the other one, chosen
 * by the ambiguity `id` (null: no other reading). `repeatFirst` says which reading is tried first.
 */
export interface AroundInfo {
  id: number | null;
  repeatFirst: boolean;
  literal: Node[];
  /** As written, e.g. "sc, dec around", and the sequence repeated, e.g. "sc, dec". */
  text: string;
  seq: string;
}

export interface SkipNode { t: 'skip'; n: number | 'fill'; col: number; noun: 'st' | 'ch' | 'sp' }
export interface LeaveNode { t: 'leave'; n: number | null; col: number }
export interface JoinNode { t: 'join'; col: number }
export interface TurnNode { t: 'turn'; col: number }
export interface LoopNode { t: 'loop'; loop: Loop | null; col: number }
export interface RingNode { t: 'ring'; col: number; formed: boolean }
export interface OtherSideNode { t: 'otherside'; col: number }
export interface LeftoverNode { t: 'leftover'; loop: Loop; round: number; kind: 'round' | 'row'; wording: 'left' | 'of'; col: number }
export interface EvenlyNode { t: 'evenly'; kind: 'inc' | 'dec'; n: number; col: number; loop: Loop | null }
/** A run of 2 or more stars ("**"): a place a repeat refers to ("rep from * to **", "ending last rep at **", "rep from **"). Works nothing. */
export interface MarkNode { t: 'mark'; level: number; col: number }

export type Node =
  | StNode
  | GroupNode
  | SkipNode
  | LeaveNode
  | JoinNode
  | TurnNode
  | LoopNode
  | RingNode
  | OtherSideNode
  | LeftoverNode
  | EvenlyNode
  | MarkNode;

export interface RepRound {
  kind: 'round' | 'row';
  refs: number[];
  /** "twice", "3 more times": how many times the refs are worked (null: once through, or the label's range). */
  times: number | null;
  col: number;
}

export interface ParsedNote {
  text: string;
  col: number;
  /** A note clause before the first stitch comes before the round; anything else after it. */
  position: 'before' | 'after';
}

export interface Parsed {
  nodes: Node[];
  stated: number | null;
  statedCol: number | null;
  /** Problems found while reading (unknown words, brackets); count problems come from the evaluator. */
  problems: Problem[];
  notes: ParsedNote[];
  /** Number of alternatives per ambiguity id. */
  alts: number[];
  /** Ambiguity ids whose second reading is taken only when it gives the stated count (never when none is stated). */
  statedOnly: number[];
  repRound: RepRound | null;
  /** Nothing to do in the text (only a stated count, or empty). */
  empty: boolean;
  /** Part of the text could not be read: count checks would only add noise. */
  uncertain: boolean;
  /** Words that belong to the other terms (for the hint). */
  telltales: string[];
  /** Column where the instructions end (problems about unworked stitches point here). */
  endCol: number;
  /** Column where the instructions start. */
  startCol: number;
}
