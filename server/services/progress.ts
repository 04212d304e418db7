import { EventEmitter } from 'node:events';
import type { Knex } from 'knex';
import { checkPiece } from '../../src/engine/index.js';
import type { Terms } from '../../src/engine/types.js';
import type { ProgressOp } from '../../src/schemas/progress.js';
import {
  advance,
  clampPosition,
  doneAt,
  finishRound,
  isFinished,
  normalize,
  shapeOf,
  startPosition,
  stepsPerCopy,
  targetProblem,
  type PieceShape,
  type Position,
} from '../../src/schemas/progress-position.js';
import { HttpError } from '../lib/http-error.js';
import { ownedPiece } from './ownership.js';

// The Tally's counting (issue 6). Every tap is an event with the device's opId, applied at most once: the event,
// the new position and the version bump are written in one transaction, and the route answers only after the
// commit (SQLite in WAL mode), so an acknowledged tap is on disk before the device forgets it.
// Positions: `round` is the 0-based index into the engine's rounds for the piece's own instructions (checkPiece),
// `step` the steps done in that round, `copy` 1-based; see src/schemas/progress-position.ts.

export interface ProgressOut {
  copy: number;
  round: number;
  step: number;
  done: number;
  version: number;
  updatedAt: string | null;
}

interface ProgressRow {
  piece_id: number;
  copy: number;
  round: number;
  step: number;
  done: number;
  version: number;
  updated_at: string;
}

interface PieceRow {
  id: number;
  project_id: number;
  copies: number;
  instructions: string;
}

export interface TallyShape extends PieceShape {
  /** Round numbers as labelled, by index (for sentences). */
  roundNumbers: number[];
  roundKinds: Array<'round' | 'row'>;
}

// checkPiece is pure but not free; the same instructions are counted on every tap, so keep the recent answers.
const SHAPE_CACHE_LIMIT = 500;
const shapeCache = new Map<string, Omit<TallyShape, 'copies'>>();

export function shapeForInstructions(instructions: string, copies: number, terms: Terms = 'us'): TallyShape {
  const key = `${terms}\u0000${instructions}`;
  let cached = shapeCache.get(key);
  if (cached) {
    // Refresh its place so the most used pieces stay.
    shapeCache.delete(key);
    shapeCache.set(key, cached);
  } else {
    const check = checkPiece(instructions, { terms });
    const { stepsPerRound } = shapeOf(check.rounds, 1);
    cached = { stepsPerRound, roundNumbers: check.rounds.map((r) => r.number), roundKinds: check.rounds.map((r) => r.kind) };
    shapeCache.set(key, cached);
    if (shapeCache.size > SHAPE_CACHE_LIMIT) shapeCache.delete(shapeCache.keys().next().value!);
  }
  return { ...cached, copies: Math.max(1, copies) };
}

async function termsOf(db: Knex, projectId: number): Promise<Terms> {
  const row = await db('projects').where({ id: projectId }).first('terms');
  return row?.terms === 'uk' ? 'uk' : 'us';
}

async function tallyPiece(db: Knex, userId: string, pieceId: number) {
  const piece = (await ownedPiece(db, userId, pieceId)) as PieceRow;
  const shape = shapeForInstructions(piece.instructions ?? '', piece.copies, await termsOf(db, piece.project_id));
  return { piece, shape };
}

const roundName = (shape: TallyShape) => (index: number) => {
  const kind = shape.roundKinds[index] === 'row' ? 'Row' : 'Rnd';
  return `${kind} ${shape.roundNumbers[index] ?? index + 1}`;
};

function toOut(row: ProgressRow | undefined): ProgressOut {
  if (!row) return { ...startPosition, done: 0, version: 0, updatedAt: null };
  return { copy: row.copy, round: row.round, step: row.step, done: row.done, version: row.version, updatedAt: row.updated_at };
}

const readRow = (db: Knex, pieceId: number) => db<ProgressRow>('piece_progress').where({ piece_id: pieceId }).first();

/** Totals the project page and the Tally agree on, from the same shape the server counts with. */
export function tallyTotals(shape: PieceShape, progress: Pick<ProgressOut, 'copy' | 'round' | 'step' | 'done'>) {
  const perCopy = stepsPerCopy(shape);
  const finished = isFinished(shape, progress);
  return {
    rounds: shape.stepsPerRound.length,
    stepsPerCopy: perCopy,
    copiesDone: finished ? shape.copies : progress.copy - 1,
    roundsDone: finished ? shape.stepsPerRound.length : progress.round,
  };
}

export async function getProgress(db: Knex, userId: string, pieceId: number): Promise<ProgressOut> {
  await ownedPiece(db, userId, pieceId);
  return toOut(await readRow(db, pieceId));
}

const END_OF_PIECE =
  'This piece is already counted to its last stitch of its last copy. Undo, or jump to a round, to count again.';

function isUniqueViolation(e: unknown) {
  return typeof e === 'object' && e !== null && 'code' in e && String((e as { code: unknown }).code).startsWith('SQLITE_CONSTRAINT');
}

/**
 * Applies one tap. A repeated opId (a retry, or the same tap from a second tab) returns the current position
 * without applying anything. Throws 409 past the end of the piece and when there is nothing to undo.
 */
export async function applyProgress(db: Knex, userId: string, pieceId: number, op: ProgressOp): Promise<{ progress: ProgressOut; applied: boolean }> {
  const { shape } = await tallyPiece(db, userId, pieceId);
  let result: { progress: ProgressOut; applied: boolean };
  try {
    result = await db.transaction(async (trx) => {
      const seen = await trx('progress_events').where({ piece_id: pieceId, op_id: op.opId }).first('id');
      const row = await readRow(trx, pieceId);
      if (seen) return { progress: toOut(row), applied: false };

      const before = clampPosition(shape, row ?? startPosition);
      let after: Position | null;
      let undone: { id: number; before: string } | undefined;
      switch (op.action) {
        case 'step':
          after = advance(shape, before);
          if (!after) throw new HttpError(409, shape.stepsPerRound.length ? END_OF_PIECE : 'This piece has no rounds to count yet. Add its instructions on the project page first.');
          break;
        case 'round':
          after = finishRound(shape, before);
          if (!after) throw new HttpError(409, shape.stepsPerRound.length ? END_OF_PIECE : 'This piece has no rounds to count yet. Add its instructions on the project page first.');
          break;
        case 'set': {
          const problem = targetProblem(shape, op.to!, roundName(shape));
          if (problem) throw new HttpError(422, problem, [{ path: 'to', message: problem }]);
          after = normalize(shape, op.to!);
          break;
        }
        case 'undo': {
          undone = await trx('progress_events')
            .where({ piece_id: pieceId })
            .whereNot({ action: 'undo' })
            .whereNull('undone_by')
            .orderBy('id', 'desc')
            .first('id', 'before');
          if (!undone) throw new HttpError(409, 'There is nothing to undo on this piece yet.');
          after = clampPosition(shape, JSON.parse(undone.before) as Position);
          break;
        }
      }
      const version = (row?.version ?? 0) + 1;
      const done = doneAt(shape, after);
      const [{ id }] = await trx('progress_events')
        .insert({
          piece_id: pieceId,
          op_id: op.opId,
          action: op.action,
          payload: JSON.stringify(op.to ? { to: op.to } : {}),
          before: JSON.stringify(before),
          after: JSON.stringify(after),
          at: op.at ?? null,
          version,
        })
        .returning('id');
      if (undone) await trx('progress_events').where({ id: undone.id }).update({ undone_by: id });
      const updatedAt = new Date().toISOString();
      const next = { piece_id: pieceId, ...after, done, version, updated_at: updatedAt };
      await trx('piece_progress').insert(next).onConflict('piece_id').merge();
      return { progress: toOut(next), applied: true };
    });
  } catch (e) {
    // Two requests with the same opId raced past the first check: the other one won, so this is a repeat.
    if (!isUniqueViolation(e)) throw e;
    result = { progress: toOut(await readRow(db, pieceId)), applied: false };
  }
  if (result.applied) hubFor(db).emit(`piece:${pieceId}`, { type: 'progress', progress: result.progress, opId: op.opId } satisfies StreamMessage);
  return result;
}

/**
 * What undo would go back to, newest last: the position before each event still counting. Lets a device show
 * an undo instantly while it is offline.
 */
export async function progressHistory(db: Knex, userId: string, pieceId: number, limit = 50) {
  const { shape } = await tallyPiece(db, userId, pieceId);
  const row = await readRow(db, pieceId);
  const live = await db('progress_events')
    .where({ piece_id: pieceId })
    .whereNot({ action: 'undo' })
    .whereNull('undone_by')
    .orderBy('id', 'desc')
    .limit(limit)
    .select('before');
  return {
    version: row?.version ?? 0,
    undo: live.reverse().map((e: { before: string }) => clampPosition(shape, JSON.parse(e.before) as Position)),
  };
}

/** Writes a starting position for the demo piece (seed only: no events, nothing to undo). */
export async function seedProgress(trx: Knex, pieceId: number, instructions: string, copies: number, terms: Terms, at: Position) {
  const shape = shapeForInstructions(instructions, copies, terms);
  const p = clampPosition(shape, at);
  await trx('piece_progress')
    .insert({ piece_id: pieceId, ...p, done: doneAt(shape, p), version: 0 })
    .onConflict('piece_id')
    .merge();
  return p;
}

// ---- live updates for a second device (server-sent events) ----

export type StreamMessage =
  | { type: 'progress'; progress: ProgressOut; opId: string | null }
  | { type: 'placements'; pieceId: number };

// One emitter per database, so apps built for separate test databases in one process never hear each other.
const hubs = new WeakMap<Knex, EventEmitter>();
export function hubFor(db: Knex) {
  let hub = hubs.get(db);
  if (!hub) {
    hub = new EventEmitter();
    // Every open Tally adds a listener; a household's phones and tablets are far below this.
    hub.setMaxListeners(0);
    hubs.set(db, hub);
  }
  return hub;
}
