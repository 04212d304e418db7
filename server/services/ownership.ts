import type { Knex } from 'knex';
import { notFound } from '../lib/http-error.js';

// Every private record is looked up together with its owner: a member asking for someone else's
// record gets the same 404 as for one that does not exist, so ids reveal nothing.

export async function ownedProject(db: Knex, userId: string, projectId: number) {
  const row = await db('projects').where({ id: projectId, owner_id: userId }).first();
  if (!row) throw notFound('That project');
  return row;
}

export async function ownedPiece(db: Knex, userId: string, pieceId: number) {
  const row = await db('project_pieces as pp')
    .join('projects as p', 'p.id', 'pp.project_id')
    .where({ 'pp.id': pieceId, 'p.owner_id': userId })
    .first('pp.*');
  if (!row) throw notFound('That piece');
  return row;
}

export async function ownedPattern(db: Knex, userId: string, patternId: number) {
  const row = await db('patterns').where({ id: patternId, owner_id: userId }).first();
  if (!row) throw notFound('That pattern');
  return row;
}
