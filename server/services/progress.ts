import { EventEmitter } from 'node:events';
import type Database from 'better-sqlite3';
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
import { HttpError, notFound } from '../lib/http-error.js';
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
    cached = {
      stepsPerRound,
      roundNumbers: check.rounds.map((r) => r.number),
      roundKinds: check.rounds.map((r) => r.kind),
    };
    shapeCache.set(key, cached);
    if (shapeCache.size > SHAPE_CACHE_LIMIT) shapeCache.delete(shapeCache.keys().next().value!);
  }
  return { ...cached, copies: Math.max(1, copies) };
}

/** The member's piece with its project's terms, in one query; 404 for anyone else's (as ownedPiece answers). */
async function tallyPiece(db: Knex, userId: string, pieceId: number) {
  const piece = (await db('project_pieces as pp')
    .join('projects as p', 'p.id', 'pp.project_id')
    .where({ 'pp.id': pieceId, 'p.owner_id': userId })
    .first('pp.id', 'pp.project_id', 'pp.copies', 'pp.instructions', 'p.terms')) as
    (PieceRow & { terms: string }) | undefined;
  if (!piece) throw notFound('That piece');
  const shape = shapeForInstructions(
    piece.instructions ?? '',
    piece.copies,
    piece.terms === 'uk' ? 'uk' : 'us',
  );
  return { piece, shape };
}

const roundName = (shape: TallyShape) => (index: number) => {
  const kind = shape.roundKinds[index] === 'row' ? 'Row' : 'Rnd';
  return `${kind} ${shape.roundNumbers[index] ?? index + 1}`;
};

function toOut(row: ProgressRow | undefined): ProgressOut {
  if (!row) return { ...startPosition, done: 0, version: 0, updatedAt: null };
  return {
    copy: row.copy,
    round: row.round,
    step: row.step,
    done: row.done,
    version: row.version,
    updatedAt: row.updated_at,
  };
}

const readRow = (db: Knex, pieceId: number) =>
  db<ProgressRow>('piece_progress').where({ piece_id: pieceId }).first();

/** Totals the project page and the Tally agree on, from the same shape the server counts with. */
export function tallyTotals(
  shape: PieceShape,
  progress: Pick<ProgressOut, 'copy' | 'round' | 'step' | 'done'>,
) {
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

// The tap is the app's hottest write, so it runs inside one synchronous better-sqlite3 transaction on the pool's
// only connection (BEGIN IMMEDIATE … COMMIT with nothing else in between) with prepared statements, instead of a
// Knex transaction's round of awaits per statement. Knex still owns the connection: it is borrowed and handed back.
interface Statements {
  piece: Database.Statement<[number, string], PieceRow & { terms: string }>;
  seen: Database.Statement<[number, string], { id: number }>;
  row: Database.Statement<[number], ProgressRow>;
  lastLive: Database.Statement<[number], { id: number; before: string }>;
  insert: Database.Statement<
    [number, string, string, string, string, string, string | null, number],
    { id: number }
  >;
  markUndone: Database.Statement<[number, number]>;
  upsert: Database.Statement<[number, number, number, number, number, number, string]>;
  touchProject: Database.Statement<[string, number]>;
  /** applyOne as a transaction function: called inside the batch's transaction it runs as a SAVEPOINT
   * (better-sqlite3 nests them so), so a throw rolls back that tap alone. */
  applyTap: Database.Transaction<typeof applyOne>;
}
const statements = new WeakMap<Database.Database, Statements>();
function statementsFor(conn: Database.Database): Statements {
  let s = statements.get(conn);
  if (!s) {
    s = {
      // The same owner check as ownedPiece, prepared once.
      piece: conn.prepare(
        'select pp.id, pp.project_id, pp.copies, pp.instructions, p.terms from project_pieces pp join projects p on p.id = pp.project_id where pp.id = ? and p.owner_id = ?',
      ),
      seen: conn.prepare('select id from progress_events where piece_id = ? and op_id = ?'),
      row: conn.prepare('select * from piece_progress where piece_id = ?'),
      lastLive: conn.prepare(
        "select id, before from progress_events where piece_id = ? and action <> 'undo' and undone_by is null order by id desc limit 1",
      ),
      insert: conn.prepare(
        'insert into progress_events (piece_id, op_id, action, payload, before, after, at, version) values (?, ?, ?, ?, ?, ?, ?, ?) returning id',
      ),
      markUndone: conn.prepare('update progress_events set undone_by = ? where id = ?'),
      upsert: conn.prepare(
        'insert into piece_progress (piece_id, copy, round, step, done, version, updated_at) values (?, ?, ?, ?, ?, ?, ?) ' +
          'on conflict (piece_id) do update set copy = excluded.copy, round = excluded.round, step = excluded.step, done = excluded.done, version = excluded.version, updated_at = excluded.updated_at',
      ),
      // "On the hook" lists the project last worked on first.
      touchProject: conn.prepare('update projects set updated_at = ? where id = ?'),
      applyTap: conn.transaction(applyOne),
    };
    statements.set(conn, s);
  }
  return s;
}

const NO_ROUNDS = 'This piece has no rounds to count yet. Add its instructions on the project page first.';

/** One tap's event and new position. A repeated opId changes nothing. Runs inside the batch's transaction. */
function applyOne(st: Statements, tap: PendingTap): { progress: ProgressOut; applied: boolean } {
  const { pieceId, op } = tap;
  // The same owner check as ownedPiece, inside the transaction so it sees what the tap is written against.
  const piece = st.piece.get(pieceId, tap.userId);
  if (!piece) throw notFound('That piece');
  const shape = shapeForInstructions(
    piece.instructions ?? '',
    piece.copies,
    piece.terms === 'uk' ? 'uk' : 'us',
  );
  const row = st.row.get(pieceId);
  if (st.seen.get(pieceId, op.opId)) return { progress: toOut(row), applied: false };
  const before = clampPosition(shape, row ?? startPosition);
  let after: Position | null;
  let undone: { id: number; before: string } | undefined;
  switch (op.action) {
    case 'step':
      after = advance(shape, before);
      if (!after) throw new HttpError(409, shape.stepsPerRound.length ? END_OF_PIECE : NO_ROUNDS);
      break;
    case 'round':
      after = finishRound(shape, before);
      if (!after) throw new HttpError(409, shape.stepsPerRound.length ? END_OF_PIECE : NO_ROUNDS);
      break;
    case 'set': {
      const problem = targetProblem(shape, op.to!, roundName(shape));
      if (problem) throw new HttpError(422, problem, [{ path: 'to', message: problem }]);
      after = normalize(shape, op.to!);
      break;
    }
    case 'undo':
      undone = st.lastLive.get(pieceId);
      if (!undone) throw new HttpError(409, 'There is nothing to undo on this piece yet.');
      after = clampPosition(shape, JSON.parse(undone.before) as Position);
      break;
  }
  const version = (row?.version ?? 0) + 1;
  const done = doneAt(shape, after);
  const payload = JSON.stringify(op.to ? { to: op.to } : {});
  const { id } = st.insert.get(
    pieceId,
    op.opId,
    op.action,
    payload,
    JSON.stringify(before),
    JSON.stringify(after),
    op.at ?? null,
    version,
  )!;
  if (undone) st.markUndone.run(id, undone.id);
  const updatedAt = new Date().toISOString();
  st.upsert.run(pieceId, after.copy, after.round, after.step, done, version, updatedAt);
  st.touchProject.run(updatedAt, piece.project_id);
  return { progress: { ...after, done, version, updatedAt }, applied: true };
}

// Group commit (D11 in DEVELOPERS.md). With synchronous = FULL every COMMIT waits for an fsync, and
// better-sqlite3 waits for it on the event loop, so under load the fsync, not the counting, sets the pace. Taps
// that arrive while one is being written are therefore queued and written together: one BEGIN IMMEDIATE … COMMIT
// (one fsync) for all of them, each tap inside its own savepoint so a refused tap (409/422/404) is rolled back
// alone and the others still count. Nobody is answered before the COMMIT that holds their tap has returned, so
// an acknowledged tap is as durable as before; if the COMMIT fails, every tap in it fails and none is
// acknowledged. Taps are applied in arrival order, so the server order and the versions are as without batching.
// Nothing waits on a timer: a tap that arrives alone is written on the next turn of the event loop.
interface PendingTap {
  userId: string;
  pieceId: number;
  op: ProgressOp;
  resolve: (r: { progress: ProgressOut; applied: boolean }) => void;
  reject: (e: unknown) => void;
}
interface TapQueue {
  pending: PendingTap[];
  busy: boolean;
}
// Keeps one transaction short enough that its first tap does not wait long for the last.
const MAX_BATCH = 64;
const queues = new WeakMap<Knex, TapQueue>();

async function writeBatches(db: Knex, q: TapQueue) {
  try {
    while (q.pending.length) {
      const batch = q.pending.splice(0, MAX_BATCH);
      let outcomes: Array<{ ok: { progress: ProgressOut; applied: boolean } } | { error: unknown }>;
      try {
        const conn = (await db.client.acquireConnection()) as Database.Database;
        try {
          const st = statementsFor(conn);
          outcomes = conn
            .transaction(() =>
              batch.map((tap) => {
                try {
                  return { ok: st.applyTap(st, tap) };
                } catch (error) {
                  return { error };
                }
              }),
            )
            .immediate();
        } finally {
          await db.client.releaseConnection(conn);
        }
      } catch (error) {
        // BEGIN or COMMIT failed (or the connection could not be had): nothing in this batch is kept.
        for (const tap of batch) tap.reject(error);
        continue;
      }
      const hub = hubFor(db);
      batch.forEach((tap, i) => {
        const outcome = outcomes[i];
        if ('error' in outcome) return tap.reject(outcome.error);
        if (outcome.ok.applied) {
          hub.emit(`piece:${tap.pieceId}`, {
            type: 'progress',
            progress: outcome.ok.progress,
            opId: tap.op.opId,
          } satisfies StreamMessage);
        }
        tap.resolve(outcome.ok);
      });
    }
  } finally {
    q.busy = false;
  }
}

/**
 * Applies one tap. A repeated opId (a retry, or the same tap from a second tab) returns the current position
 * without applying anything. Throws 409 past the end of the piece and when there is nothing to undo.
 * Resolves only after the tap's transaction is committed.
 */
export function applyProgress(
  db: Knex,
  userId: string,
  pieceId: number,
  op: ProgressOp,
): Promise<{ progress: ProgressOut; applied: boolean }> {
  let q = queues.get(db);
  if (!q) {
    q = { pending: [], busy: false };
    queues.set(db, q);
  }
  const queue = q;
  return new Promise((resolve, reject) => {
    queue.pending.push({ userId, pieceId, op, resolve, reject });
    if (queue.busy) return;
    queue.busy = true;
    // setImmediate runs after the requests already read in this turn of the event loop have reached this point,
    // so they share the transaction.
    setImmediate(() => void writeBatches(db, queue));
  });
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
    undo: live
      .reverse()
      .map((e: { before: string }) => clampPosition(shape, JSON.parse(e.before) as Position)),
  };
}

/** Writes a starting position for the demo piece (seed only: no events, nothing to undo). */
export async function seedProgress(
  trx: Knex,
  pieceId: number,
  instructions: string,
  copies: number,
  terms: Terms,
  at: Position,
) {
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
  { type: 'progress'; progress: ProgressOut; opId: string | null } | { type: 'placements'; pieceId: number };

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
