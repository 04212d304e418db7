// The stitch engine: pure TypeScript shared by the client (pattern editor, Tally) and the server (check on save).

export * from './types';
export { checkPiece, MAX_ROUNDS } from './check';
export { planRound } from './planner';
export { convertTerms } from './terms';
export { pieceTotals, stepsPerRound, roundAt, notesBefore, notesAfter, placements, type PieceTotals } from './counts';
export { classifyNote, hookMmOf } from './notes';
export { STITCHES, STRUCTURE_WORDS, TERMS_TELLTALES, abbrIn, type StitchEntry, type Source } from './abbreviations';
export { MAX_STEPS } from './evaluate';
export { MAX_RANGE } from './labels';
