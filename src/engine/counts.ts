// Count helpers the app uses around a checked piece: totals, steps per round, notes at a round.

import type { Note, PieceCheck, Round } from './types';

export interface PieceTotals {
  rounds: number;
  /** Sum of the stitches every round leaves (what the maker makes for one copy). */
  stitches: number;
  /** Steps the Tally walks for one copy. */
  steps: number;
  /** The count the piece ends with (0 for an empty piece). */
  finalCount: number;
  errors: number;
  warnings: number;
}

export function pieceTotals(check: PieceCheck): PieceTotals {
  let errors = 0;
  let warnings = 0;
  for (const r of check.rounds) {
    for (const p of r.problems) {
      if (p.severity === 'error') errors++;
      else warnings++;
    }
  }
  const last = check.rounds[check.rounds.length - 1];
  return {
    rounds: check.rounds.length,
    stitches: check.totalStitches,
    steps: check.totalSteps,
    finalCount: last ? last.stitches : 0,
    errors,
    warnings,
  };
}

export function stepsPerRound(check: PieceCheck): Array<{ number: number; label: string; steps: number }> {
  return check.rounds.map((r) => ({ number: r.number, label: r.label, steps: r.steps.length }));
}

/** The round with this number (the last one, if a piece numbers its parts from 1 again). */
export function roundAt(check: PieceCheck, number: number): Round | undefined {
  for (let i = check.rounds.length - 1; i >= 0; i--) if (check.rounds[i].number === number) return check.rounds[i];
  return undefined;
}

function roundIndex(check: PieceCheck, round: number | Round): number {
  if (typeof round !== 'number') return check.rounds.indexOf(round);
  for (let i = check.rounds.length - 1; i >= 0; i--) if (check.rounds[i].number === round) return i;
  return -1;
}

/**
 * Notes the maker meets just before starting a round (colour change, "Working in the front loops …").
 * Pass the Round itself when a piece numbers its parts from 1 again.
 */
export function notesBefore(check: PieceCheck, round: number | Round): Note[] {
  const i = roundIndex(check, round);
  if (i < 0) return [];
  const r = check.rounds[i];
  const prev = check.rounds[i - 1];
  // A range ("Rnds 8-12") shares one line: notes come before its first round only.
  if (prev && prev.line === r.line) return [];
  return check.notes.filter((n) => n.beforeRound === r.number && n.line <= r.line && (!prev || n.line >= prev.line));
}

/** Notes right after a round (stuffing, placements, fasten off). */
export function notesAfter(check: PieceCheck, round: number | Round): Note[] {
  const i = roundIndex(check, round);
  if (i < 0) return [];
  const r = check.rounds[i];
  const next = check.rounds[i + 1];
  if (next && next.line === r.line) return [];
  return check.notes.filter((n) => n.afterRound === r.number && n.line >= r.line && (!next || n.line <= next.line));
}

/** Placement notes with the rounds they name, for noting where parts went. */
export function placements(check: PieceCheck): Note[] {
  return check.notes.filter((n) => n.kind === 'placement');
}
