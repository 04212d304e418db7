import crypto from 'node:crypto';
import type { Knex } from 'knex';
import type { AppContext } from '../context.js';
import type { ProjectStatus } from '../../src/schemas/common.js';
import { MaterialsSchema, type Materials } from '../../src/schemas/materials.js';
import type { CreateProjectSchema, ProjectPieceInputSchema, UpdateProjectSchema } from '../../src/schemas/project.js';
import { cautionsFor } from '../../src/reference/safety.js';
import { hook } from '../../src/reference/hooks.js';
import type { Placement, PieceProgress, Project, ProjectListItem, ProjectPiece } from '../../src/types/api.js';

export type { ProjectListItem };
import type { z } from 'zod';
import { HttpError, notFound } from '../lib/http-error.js';
import { deleteProjectPhotoFiles } from '../lib/storage.js';
import { ownedProject } from './ownership.js';
import { photoOut, type PhotoRow } from './photos.js';
import { hubFor, shapeForInstructions, tallyTotals, type StreamMessage } from './progress.js';
import { checkPiece } from '../../src/engine/index.js';
import { copiesProblem, reworkPiece, reworkRounds } from '../../src/schemas/piece-rework.js';
import { samePosition, type Position } from '../../src/schemas/progress-position.js';
import { parseJson, readMaterials } from '../lib/json-columns.js';

type CreateInput = z.output<typeof CreateProjectSchema>;
type UpdateInput = z.output<typeof UpdateProjectSchema>;
type PieceInput = z.output<typeof ProjectPieceInputSchema>;
type Row = Record<string, any>;


const nowIso = () => new Date().toISOString();
const today = () => new Date().toISOString().slice(0, 10);



export async function listProjects(db: Knex, ownerId: string, status?: ProjectStatus): Promise<ProjectListItem[]> {
  const rows = await db('projects as p')
    .where('p.owner_id', ownerId)
    .modify((q) => {
      if (status) q.andWhere('p.status', status);
    })
    .select('p.id', 'p.title', 'p.status', 'p.started_on', 'p.finished_on', 'p.updated_at', 'p.recipient', 'p.pattern_credit', 'p.for_young_child', 'p.visibility', 'p.materials')
    .select(db.raw('(select count(*) from project_pieces pp where pp.project_id = p.id) as piece_count'))
    .orderBy('p.updated_at', 'desc')
    .orderBy('p.id', 'desc');
  return rows.map((r: Row) => ({
    id: r.id,
    title: r.title,
    status: r.status,
    startedOn: r.started_on,
    finishedOn: r.finished_on,
    updatedAt: r.updated_at,
    pieceCount: Number(r.piece_count),
    recipient: r.recipient ?? null,
    patternTitle: parseJson<{ title?: string } | null>(r.pattern_credit, null)?.title ?? null,
    forYoungChild: Boolean(r.for_young_child),
    visibility: r.visibility,
    cautionCount: cautionsFor({ forYoungChild: Boolean(r.for_young_child), notions: readMaterials(r.materials).notions }).length,
  }));
}

const defaultProgress = (): PieceProgress => ({ copy: 1, round: 0, step: 0, done: 0, version: 0, updatedAt: null });

function toPlacement(r: Row): Placement {
  return { id: r.id, pieceId: r.piece_id, copy: r.copy, round: r.round, step: r.step ?? null, label: r.label, note: r.note ?? null, createdAt: r.created_at };
}

/**
 * Rounds done count the current copy only ("Rnd 7 of 17 · copy 1 of 2"); a copy is done once the Tally has moved
 * past its last round, or on to the next copy.
 */
export function pieceTotals(instructions: string, terms: 'us' | 'uk', copies: number, progress: PieceProgress) {
  // The Tally's own reading of the piece (cached), so the project page and the counter never disagree on counts.
  return tallyTotals(shapeForInstructions(instructions, copies, terms), progress);
}

function shareUrl(env: AppContext['env'], row: Row): string | null {
  if (row.visibility === 'private' || !row.share_token) return null;
  const p = `/p/${row.share_token}`;
  return env.APP_ORIGIN ? `${env.APP_ORIGIN}${p}` : p;
}

async function serializeProject(ctx: AppContext, row: Row): Promise<Project> {
  const { db } = ctx;
  const pieceRows: Row[] = await db('project_pieces').where({ project_id: row.id }).orderBy([{ column: 'position' }, { column: 'id' }]);
  const ids = pieceRows.map((p) => p.id);
  const progressRows: Row[] = ids.length ? await db('piece_progress').whereIn('piece_id', ids) : [];
  const placementRows: Row[] = ids.length ? await db('placements').whereIn('piece_id', ids).orderBy([{ column: 'created_at' }, { column: 'id' }]) : [];
  const progressBy = new Map(progressRows.map((p) => [p.piece_id, p]));
  const materials = readMaterials(row.materials);
  const cover: PhotoRow | undefined = row.cover_photo_id ? await db('photos').where({ id: row.cover_photo_id, project_id: row.id }).first() : undefined;

  const pieces: ProjectPiece[] = pieceRows.map((p) => {
    const pr = progressBy.get(p.id);
    const progress: PieceProgress = pr
      ? { copy: pr.copy, round: pr.round, step: pr.step, done: pr.done, version: pr.version, updatedAt: pr.updated_at ?? null }
      : defaultProgress();
    return {
      id: p.id,
      position: p.position,
      name: p.name,
      copies: p.copies,
      hookMm: p.hook_mm ?? null,
      hook: p.hook_mm != null ? hook(p.hook_mm) : null,
      yarns: parseJson<string[]>(p.yarns, []),
      instructions: p.instructions,
      progress,
      totals: pieceTotals(p.instructions, row.terms, p.copies, progress),
      placements: placementRows.filter((pl) => pl.piece_id === p.id).map(toPlacement),
    };
  });

  return {
    id: row.id,
    title: row.title,
    status: row.status,
    patternId: row.pattern_id ?? null,
    patternCredit: parseJson(row.pattern_credit, null),
    terms: row.terms,
    startedOn: row.started_on ?? null,
    finishedOn: row.finished_on ?? null,
    recipient: row.recipient ?? null,
    forYoungChild: Boolean(row.for_young_child),
    materials,
    notes: row.notes ?? null,
    visibility: row.visibility,
    shareUrl: shareUrl(ctx.env, row),
    coverPhoto: cover ? photoOut(cover) : null,
    pieces,
    cautions: cautionsFor({ forYoungChild: Boolean(row.for_young_child), notions: materials.notions }),
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

/** A pattern a member may start a project from: their own, or a public one. Anything else is "not found". */
async function startablePattern(db: Knex, userId: string, patternId: number) {
  const row = await db('patterns')
    .where({ id: patternId })
    .andWhere((q) => q.where('owner_id', userId).orWhere('visibility', 'public'))
    .first();
  if (!row) throw notFound('That pattern');
  return row;
}

/** Shelf yarns named in materials must be on this member's own shelf. */
async function checkShelfYarns(db: Knex, userId: string, materials: Materials) {
  const ids = [...new Set(materials.yarns.map((y) => y.shelfYarnId).filter((id): id is number => id != null))];
  if (!ids.length) return;
  const found = await db('yarns').where('owner_id', userId).whereIn('id', ids).pluck('id');
  const missing = ids.filter((id) => !found.includes(id));
  if (missing.length) {
    const at = materials.yarns.findIndex((y) => y.shelfYarnId === missing[0]);
    throw new HttpError(422, 'That yarn is not on your yarn shelf. Pick one from your shelf or type it in.', [
      { path: `materials.yarns.${at}.shelfYarnId`, message: 'Not on your yarn shelf.' },
    ]);
  }
}

function mergeMaterials(base: Materials, patch?: Partial<Materials>, notions?: Materials['notions']): Materials {
  return MaterialsSchema.parse({
    yarns: patch?.yarns ?? base.yarns,
    hooks: patch?.hooks ?? base.hooks,
    notions: notions ?? patch?.notions ?? base.notions,
  });
}

const pieceRow = (projectId: number, piece: PieceInput, position: number) => ({
  project_id: projectId,
  position,
  name: piece.name,
  copies: piece.copies,
  hook_mm: piece.hookMm ?? null,
  yarns: JSON.stringify(piece.yarns ?? []),
  instructions: piece.instructions,
});

/** Dates a status change implies, unless the maker gave them in the same request. */
function datesForStatus(status: ProjectStatus | undefined, current: { started_on?: string | null; finished_on?: string | null }, given: { startedOn?: string | null; finishedOn?: string | null }) {
  const out: Record<string, string> = {};
  if (status === 'on_the_hook' && !current.started_on && given.startedOn === undefined) out.started_on = today();
  if (status === 'finished' && !current.finished_on && given.finishedOn === undefined) out.finished_on = today();
  return out;
}

export async function getProject(ctx: AppContext, userId: string, projectId: number) {
  const row = await ownedProject(ctx.db, userId, projectId);
  return serializeProject(ctx, row);
}

export async function createProject(ctx: AppContext, userId: string, input: CreateInput) {
  const { db } = ctx;
  const projectId = await db.transaction(async (trx) => {
    let base: Materials = { yarns: [], hooks: [], notions: [] };
    let pieces: PieceInput[] = input.pieces ?? [];
    let terms = input.terms ?? 'us';
    let patternCredit: string | null = null;
    if (input.patternId) {
      const pattern = await startablePattern(trx, userId, input.patternId);
      const patternPieces: Row[] = await trx('pattern_pieces').where({ pattern_id: pattern.id }).orderBy([{ column: 'position' }, { column: 'id' }]);
      // The project keeps its own copy: later edits to the pattern never shift a started project's counts.
      pieces = patternPieces.map((pp) => ({
        name: pp.name,
        copies: pp.copies,
        hookMm: pp.hook_mm ?? null,
        yarns: parseJson<string[]>(pp.yarns, []),
        instructions: pp.instructions,
      }));
      base = readMaterials(pattern.materials);
      terms = input.terms ?? pattern.terms;
      patternCredit = JSON.stringify({ title: pattern.title, designerCredit: pattern.designer_credit ?? null, sourceUrl: pattern.source_url ?? null });
    }
    const materials = mergeMaterials(base, input.materials, input.notions);
    await checkShelfYarns(trx, userId, materials);
    const status = input.status ?? 'planned';
    const [{ id }] = await trx('projects')
      .insert({
        owner_id: userId,
        pattern_id: input.patternId ?? null,
        title: input.title,
        status,
        terms,
        pattern_credit: patternCredit,
        started_on: input.startedOn ?? null,
        finished_on: input.finishedOn ?? null,
        recipient: input.recipient || null,
        for_young_child: input.forYoungChild ?? false,
        materials: JSON.stringify(materials),
        notes: input.notes || null,
        ...datesForStatus(status, {}, input),
      })
      .returning('id');
    if (pieces.length) await trx('project_pieces').insert(pieces.map((p, i) => pieceRow(id, p, i)));
    return id as number;
  });
  return getProject(ctx, userId, projectId);
}

export async function updateProject(ctx: AppContext, userId: string, projectId: number, input: UpdateInput) {
  const moved = await ctx.db.transaction(async (trx) => {
    const row = await ownedProject(trx, userId, projectId);
    const terms = input.terms ?? row.terms;
    // What the Tally has counted so far, read before anything changes (a new reading may move it).
    const before = input.pieces || terms !== row.terms ? await countedPieces(trx, row.id) : new Map<number, CountedPiece>();
    const patch: Row = { updated_at: nowIso() };
    if (input.title !== undefined) patch.title = input.title;
    if (input.terms !== undefined) patch.terms = input.terms;
    if (input.forYoungChild !== undefined) patch.for_young_child = input.forYoungChild;
    if (input.startedOn !== undefined) patch.started_on = input.startedOn;
    if (input.finishedOn !== undefined) patch.finished_on = input.finishedOn;
    if (input.recipient !== undefined) patch.recipient = input.recipient || null;
    if (input.notes !== undefined) patch.notes = input.notes || null;
    if (input.status !== undefined) Object.assign(patch, { status: input.status }, datesForStatus(input.status, row, input));
    if (input.materials !== undefined || input.notions !== undefined) {
      const materials = mergeMaterials(readMaterials(row.materials), input.materials, input.notions);
      await checkShelfYarns(trx, userId, materials);
      patch.materials = JSON.stringify(materials);
    }
    if (input.visibility !== undefined) {
      patch.visibility = input.visibility;
      // The link is made once, on the first switch away from private; going private again keeps it but the
      // showcase refuses it while private (rotating it is the showcase's own action).
      if (input.visibility !== 'private' && !row.share_token) patch.share_token = crypto.randomBytes(18).toString('base64url');
    }
    await trx('projects').where({ id: row.id }).update(patch);
    if (input.pieces) await replacePieces(trx, row.id, input.pieces, before);
    return moveCounts(trx, before, row.terms, terms);
  });
  // Only after the commit: an open Tally on another device takes the moved count from here.
  const hub = hubFor(ctx.db);
  for (const m of moved) hub.emit(`piece:${m.pieceId}`, { type: 'progress', progress: m.progress, opId: null } satisfies StreamMessage);
  return getProject(ctx, userId, projectId);
}

interface CountedPiece {
  id: number;
  name: string;
  instructions: string;
  copies: number;
  progress: Row | null;
  /** Highest copy a placement is recorded on (0 for none). */
  markedCopy: number;
}

/** The project's pieces that have a Tally count or a placement, with what they read like now. */
async function countedPieces(trx: Knex.Transaction, projectId: number): Promise<Map<number, CountedPiece>> {
  const rows: Row[] = await trx('project_pieces as pp')
    .leftJoin('piece_progress as pr', 'pr.piece_id', 'pp.id')
    .where('pp.project_id', projectId)
    .select('pp.id', 'pp.name', 'pp.instructions', 'pp.copies', 'pr.piece_id as progress_id', 'pr.copy', 'pr.round', 'pr.step', 'pr.done', 'pr.version')
    .select(trx.raw('(select max(pl.copy) from placements pl where pl.piece_id = pp.id) as marked_copy'));
  const out = new Map<number, CountedPiece>();
  for (const r of rows) {
    if (r.progress_id == null && r.marked_copy == null) continue;
    out.set(r.id, {
      id: r.id,
      name: r.name,
      instructions: r.instructions ?? '',
      copies: r.copies,
      progress: r.progress_id == null ? null : { copy: r.copy, round: r.round, step: r.step, done: r.done, version: r.version },
      markedCopy: Number(r.marked_copy ?? 0),
    });
  }
  return out;
}

const positionOf = (p: Row): Position => ({ copy: p.copy, round: p.round, step: p.step });

/**
 * Moves the Tally count of every counted piece whose reading changed (its instructions, copies or the project's
 * terms) with the same rules the project page showed the maker before saving (src/schemas/piece-rework.ts).
 * The undo history moves with it, so an undo after the edit lands on the same written round as before.
 */
async function moveCounts(trx: Knex.Transaction, before: Map<number, CountedPiece>, oldTerms: 'us' | 'uk', newTerms: 'us' | 'uk') {
  const moved: Array<{ pieceId: number; progress: PieceProgress }> = [];
  const counted = [...before.values()].filter((p) => p.progress);
  if (!counted.length) return moved;
  const now: Row[] = await trx('project_pieces').whereIn('id', counted.map((p) => p.id)).select('id', 'instructions', 'copies');
  for (const piece of now) {
    const was = before.get(piece.id)!;
    const progress = was.progress!;
    if (piece.instructions === was.instructions && piece.copies === was.copies && oldTerms === newTerms) continue;
    const rework = reworkPiece({
      before: { rounds: reworkRounds(checkPiece(was.instructions, { terms: oldTerms }).rounds), copies: was.copies },
      after: { rounds: reworkRounds(checkPiece(piece.instructions ?? '', { terms: newTerms }).rounds), copies: piece.copies },
      position: positionOf(progress),
    });
    if (samePosition(rework.to, positionOf(progress)) && rework.done === progress.done) continue;
    const updatedAt = nowIso();
    const out: PieceProgress = { ...rework.to, done: rework.done, version: progress.version + 1, updatedAt };
    await trx('piece_progress').where({ piece_id: piece.id }).update({ ...rework.to, done: rework.done, version: out.version, updated_at: updatedAt });
    const events: Row[] = await trx('progress_events').where({ piece_id: piece.id }).select('id', 'before', 'after');
    for (const e of events) {
      const change: Row = {};
      for (const column of ['before', 'after'] as const) {
        const p = parseJson<Position | null>(e[column], null);
        if (!p) continue;
        const next = rework.map(p);
        if (!samePosition(next, p)) change[column] = JSON.stringify(next);
      }
      if (Object.keys(change).length) await trx('progress_events').where({ id: e.id }).update(change);
    }
    moved.push({ pieceId: piece.id, progress: out });
  }
  return moved;
}

/** Pieces with an id are changed, new ones added, and the ones left out removed (with their Tally progress). */
async function replacePieces(trx: Knex.Transaction, projectId: number, pieces: NonNullable<UpdateInput['pieces']>, counted: Map<number, CountedPiece>) {
  const existing: Row[] = await trx('project_pieces').where({ project_id: projectId });
  const byId = new Map(existing.map((p) => [p.id, p]));
  const kept = new Set<number>();
  for (const [i, piece] of pieces.entries()) {
    if (piece.id === undefined) continue;
    if (!byId.has(piece.id) || kept.has(piece.id)) {
      throw new HttpError(422, 'One of those pieces is not part of this project. Reload the page and try again.', [
        { path: `pieces.${i}.id`, message: 'Not a piece of this project.' },
      ]);
    }
    kept.add(piece.id);
    // Fewer copies than the one being worked would leave the Tally counting a copy that no longer exists.
    const c = counted.get(piece.id);
    if (c && piece.copies !== undefined && piece.copies !== c.copies) {
      const problem = copiesProblem(piece.name, c.progress ? positionOf(c.progress) : { copy: 1, round: 0, step: 0 }, piece.copies, [c.markedCopy]);
      if (problem) throw new HttpError(422, problem, [{ path: `pieces.${i}.copies`, message: problem }]);
    }
  }
  const removed = existing.filter((p) => !kept.has(p.id)).map((p) => p.id);
  if (removed.length) await trx('project_pieces').whereIn('id', removed).delete();
  for (const [position, piece] of pieces.entries()) {
    if (piece.id !== undefined) {
      const upd: Row = { position, name: piece.name };
      if (piece.copies !== undefined) upd.copies = piece.copies;
      if (piece.instructions !== undefined) upd.instructions = piece.instructions;
      if (piece.hookMm !== undefined) upd.hook_mm = piece.hookMm;
      if (piece.yarns !== undefined) upd.yarns = JSON.stringify(piece.yarns);
      await trx('project_pieces').where({ id: piece.id }).update(upd);
    } else {
      await trx('project_pieces').insert(pieceRow(projectId, { ...piece, copies: piece.copies ?? 1, instructions: piece.instructions ?? '' }, position));
    }
  }
}

/**
 * Removes the project (pieces, progress, journal and photo rows go with it by cascade), then its photo files.
 * Files go only after the rows are gone, so a failed delete never leaves rows pointing at missing files.
 */
export async function deleteProject(ctx: AppContext, userId: string, projectId: number) {
  await ctx.db.transaction(async (trx) => {
    const row = await ownedProject(trx, userId, projectId);
    await trx('projects').where({ id: row.id }).delete();
  });
  await deleteProjectPhotoFiles(ctx, projectId);
}
