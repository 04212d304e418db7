import type { Knex } from 'knex';
import type { PlacementInput } from '../../src/schemas/progress.js';
import { HttpError, notFound } from '../lib/http-error.js';
import { ownedPiece } from './ownership.js';
import { hubFor, type StreamMessage } from './progress.js';
import type { Placement } from '../../src/types/api.js';

// Where a part went ("left eye" at Rnd 9, stitch 15), marked from the Tally, so the second ear goes where the first did.

export type PlacementOut = Placement;

interface PlacementRow {
  id: number;
  piece_id: number;
  copy: number;
  round: number;
  step: number | null;
  label: string;
  note: string | null;
  created_at: string;
}

export const toPlacement = (r: PlacementRow): PlacementOut => ({
  id: r.id,
  pieceId: r.piece_id,
  copy: r.copy,
  round: r.round,
  step: r.step,
  label: r.label,
  note: r.note,
  createdAt: r.created_at,
});

const announce = (db: Knex, pieceId: number) => hubFor(db).emit(`piece:${pieceId}`, { type: 'placements', pieceId } satisfies StreamMessage);

export async function listPlacements(db: Knex, userId: string, pieceId: number): Promise<PlacementOut[]> {
  await ownedPiece(db, userId, pieceId);
  const rows = await db<PlacementRow>('placements').where({ piece_id: pieceId }).orderBy([{ column: 'copy' }, { column: 'round' }, { column: 'step' }, { column: 'id' }]);
  return rows.map(toPlacement);
}

/** Adds a placement; with an opId seen before on this piece it returns that placement instead of a second one. */
export async function createPlacement(db: Knex, userId: string, pieceId: number, input: PlacementInput): Promise<{ placement: PlacementOut; created: boolean }> {
  const piece = await ownedPiece(db, userId, pieceId);
  if (input.copy !== undefined && input.copy > piece.copies) {
    const message = `This piece is made ${piece.copies === 1 ? 'once' : `${piece.copies} times`}, so there is no copy ${input.copy}.`;
    throw new HttpError(422, message, [{ path: 'copy', message }]);
  }
  const byOpId = (opId: string) => db('placements').where({ piece_id: pieceId, op_id: opId }).first() as Promise<PlacementRow | undefined>;
  const existing = input.opId ? await byOpId(input.opId) : undefined;
  if (existing) return { placement: toPlacement(existing), created: false };
  // Without a copy, the mark belongs to the copy the Tally is on.
  const copy = input.copy ?? (await db('piece_progress').where({ piece_id: pieceId }).first('copy'))?.copy ?? 1;
  try {
    const [row] = (await db('placements')
      .insert({ piece_id: pieceId, copy, round: input.round, step: input.step ?? null, label: input.label, note: input.note || null, op_id: input.opId ?? null })
      .returning('*')) as PlacementRow[];
    announce(db, pieceId);
    return { placement: toPlacement(row), created: true };
  } catch (e) {
    const code = (e as { code?: string })?.code ?? '';
    if (input.opId && code.startsWith('SQLITE_CONSTRAINT')) {
      const again = await byOpId(input.opId);
      if (again) return { placement: toPlacement(again), created: false };
    }
    throw e;
  }
}

export async function deletePlacement(db: Knex, userId: string, placementId: number) {
  const row = await db('placements as pl')
    .join('project_pieces as pp', 'pp.id', 'pl.piece_id')
    .join('projects as p', 'p.id', 'pp.project_id')
    .where({ 'pl.id': placementId, 'p.owner_id': userId })
    .first('pl.id', 'pl.piece_id');
  if (!row) throw notFound('That placement');
  await db('placements').where({ id: placementId }).del();
  announce(db, row.piece_id);
}
