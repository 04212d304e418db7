// The stitch engine's public contract. Client (pattern editor, Tally) and server (check on save)
// both code against these types; keep them stable and additive.

export type Terms = 'us' | 'uk';

export type Loop = 'blo' | 'flo';

export interface Problem {
  /** A sentence a designer can act on, e.g. "Round 4 makes 24 stitches, not 25". */
  message: string;
  /** 0-based column in the round's source line the problem points at, or null for the whole line. */
  column: number | null;
  severity: 'error' | 'warning';
}

export interface Step {
  /** 0-based position in the round's steps. */
  index: number;
  /** Short US abbreviation of what this step does: 'sc', 'inc', 'sc2tog', 'ch', 'sk', 'hdc', '3 sc', '(sc, hdc)' … */
  action: string;
  /** Words for the maker, e.g. "inc: 2 sc in the next stitch". */
  text: string;
  /** Stitches of the previous round (or chain) this step works into (0 for a chain made in the air). */
  worksInto: number;
  /** Stitches this step makes for the next round. */
  makes: number;
  /** The repeat this step sits in (1-based), or null outside repeats. Innermost repeat when nested. */
  repeat: { index: number; of: number } | null;
  loop: Loop | null;
  /** 0-based column in the source line where this step's instruction starts. */
  column: number;
}

export interface Round {
  /** Round/row number as labelled (a range "Rnds 8-12" yields rounds 8…12). Unlabelled lines are numbered on. */
  number: number;
  /** Label as written, e.g. "Rnd 5", "Rnds 8-12". */
  label: string;
  kind: 'round' | 'row';
  /** 0-based line index in the piece text. */
  line: number;
  /** The instruction text after the label (what the round says to do). */
  text: string;
  /** Stitches this round leaves for the next. */
  stitches: number;
  /** Stitches of the previous round worked into, skipped ones included. */
  worked: number;
  /** Count stated at the end of the line or in the label ("Round 5 (36 sts):"), or null. Of two that differ, the one the round makes, else the one at the end. */
  stated: number | null;
  /** Stitches made by type in US abbreviations, e.g. { sc: 18, hdc: 6 }. An inc counts as 2 of its base stitch, a dec/invdec as one sc2tog. */
  made: Record<string, number>;
  loops: Loop[];
  steps: Step[];
  problems: Problem[];
}

/**
 * 'join': "Join with sl st to first sc." on its own line — the end of the round before it (`afterRound`),
 * making no stitch. Only given when a round comes before it.
 */
export type NoteKind = 'colour' | 'hook' | 'stuffing' | 'placement' | 'fasten-off' | 'join' | 'other';

export interface Note {
  /** 0-based line index in the piece text. */
  line: number;
  text: string;
  kind: NoteKind;
  /** Number of the round this note follows (null when it comes before any round). */
  afterRound: number | null;
  /** Number of the round the maker reaches next (null when no round follows). */
  beforeRound: number | null;
  /** For kind 'hook': the new hook size in mm when stated. */
  hookMm?: number;
  /** For kind 'placement': what is placed and where, when it can be read. */
  placement?: { label: string; betweenRounds: [number, number] | null; atRound: number | null; apart: number | null };
  /** The note names safety eyes, buttons, beads or other small parts: show the small-parts caution. */
  smallParts?: boolean;
}

export interface PieceCheck {
  terms: Terms;
  rounds: Round[];
  notes: Note[];
  /** Top-level hints, e.g. "This looks like UK terms (htr, yrh)". Said once, not per round. */
  hints: string[];
  /** Sum of the stitches made over all rounds. */
  totalStitches: number;
  /** Sum of the steps over all rounds (what the Tally walks for one copy). */
  totalSteps: number;
}

export interface CheckOptions {
  terms?: Terms;
  /** Stitches the piece already has before its first line (e.g. when it continues another piece). */
  start?: number;
}

export interface PlanOptions {
  staggered?: boolean;
  /** Write the instruction in UK terms ("(3 dc, inc) x6"). Default US. */
  terms?: Terms;
}

export interface Plan {
  /** The round in our own standard notation, e.g. "(3 sc, inc) x6". */
  instruction: string;
}
