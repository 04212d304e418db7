import type { Knex } from 'knex';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../lib/http-error.js';
import { ownedProject } from './ownership.js';
import { photoOut, removePhotoFiles, removePhotoRows, type PhotoRow } from './photos.js';
import type { JournalEntry as JournalEntryOut, JournalPhoto as JournalPhotoOut } from '../../src/types/api.js';
import type { JournalTag } from '../../src/schemas/journal.js';

// Journal entries: what a maker did on a day, on a project or one of its pieces. Entries tagged "change"
// are the maker's modifications to the pattern, which the showcase lists.


export type { JournalEntryOut, JournalPhotoOut };

interface EntryRow {
  id: number;
  project_id: number;
  piece_id: number | null;
  piece_name: string | null;
  author_id: string;
  body: string;
  entry_date: string;
  minutes: number | null;
  tags: string;
  on_showcase: number | boolean;
  created_at: string;
  updated_at: string;
}

export interface EntryInput {
  body?: string;
  pieceId?: number | null;
  tags?: JournalTag[];
  minutes?: number | null;
  entryDate?: string;
  onShowcase?: boolean;
}

function parseTags(json: string): JournalTag[] {
  try {
    const v = JSON.parse(json);
    return Array.isArray(v) ? v : [];
  } catch {
    return [];
  }
}

const entryColumns = ['e.*', 'pp.name as piece_name'];

function entriesQuery(db: Knex) {
  return db('journal_entries as e').leftJoin('project_pieces as pp', 'pp.id', 'e.piece_id');
}

/** Serializes entries with their photos (two queries for any number of entries). */
async function toOut(db: Knex, rows: EntryRow[]): Promise<JournalEntryOut[]> {
  if (rows.length === 0) return [];
  const photos: PhotoRow[] = await db('photos')
    .whereIn(
      'entry_id',
      rows.map((r) => r.id),
    )
    .orderBy('id');
  const covers = new Set(
    (await db('projects').whereIn('id', [...new Set(rows.map((r) => r.project_id))]).whereNotNull('cover_photo_id').pluck('cover_photo_id')) as number[],
  );
  const byEntry = new Map<number, JournalPhotoOut[]>();
  for (const p of photos) {
    const list = byEntry.get(p.entry_id!) ?? [];
    list.push({ ...photoOut(p), entryId: p.entry_id!, cover: covers.has(p.id) });
    byEntry.set(p.entry_id!, list);
  }
  return rows.map((r) => ({
    id: r.id,
    projectId: r.project_id,
    pieceId: r.piece_id,
    pieceName: r.piece_name ?? null,
    body: r.body,
    entryDate: r.entry_date,
    minutes: r.minutes,
    tags: parseTags(r.tags),
    onShowcase: Boolean(r.on_showcase),
    photos: byEntry.get(r.id) ?? [],
    createdAt: r.created_at,
    updatedAt: r.updated_at,
  }));
}

async function assertPieceInProject(db: Knex, projectId: number, pieceId: number) {
  const piece = await db('project_pieces').where({ id: pieceId, project_id: projectId }).first('id');
  if (!piece) throw new HttpError(422, 'That piece is not part of this project. Choose one of its pieces, or none.', [{ path: 'pieceId', message: 'Choose one of this project’s pieces.' }]);
}

async function ownedEntry(db: Knex, userId: string, entryId: number): Promise<EntryRow> {
  const row = await entriesQuery(db)
    .join('projects as p', 'p.id', 'e.project_id')
    .where({ 'e.id': entryId, 'p.owner_id': userId })
    .first(entryColumns);
  if (!row) throw notFound('That journal entry');
  return row;
}

const today = () => new Date().toISOString().slice(0, 10);

export async function listEntries(db: Knex, userId: string, projectId: number, filters: { pieceId?: number } = {}) {
  await ownedProject(db, userId, projectId);
  if (filters.pieceId) {
    const piece = await db('project_pieces').where({ id: filters.pieceId, project_id: projectId }).first('id');
    if (!piece) throw notFound('That piece');
  }
  const rows: EntryRow[] = await entriesQuery(db)
    .where('e.project_id', projectId)
    .modify((q) => {
      if (filters.pieceId) q.andWhere('e.piece_id', filters.pieceId);
    })
    // Newest first by the maker's day; entries of the same day by when they were written.
    .orderBy([
      { column: 'e.entry_date', order: 'desc' },
      { column: 'e.created_at', order: 'desc' },
      { column: 'e.id', order: 'desc' },
    ])
    .select(entryColumns);
  return toOut(db, rows);
}

export async function getEntry(db: Knex, userId: string, entryId: number) {
  const [out] = await toOut(db, [await ownedEntry(db, userId, entryId)]);
  return out;
}

export async function createEntry(db: Knex, userId: string, projectId: number, input: EntryInput & { body: string }) {
  await ownedProject(db, userId, projectId);
  if (input.pieceId) await assertPieceInProject(db, projectId, input.pieceId);
  const id = await db.transaction(async (trx) => {
    const [{ id }] = await trx('journal_entries')
      .insert({
        project_id: projectId,
        piece_id: input.pieceId ?? null,
        author_id: userId,
        body: input.body,
        entry_date: input.entryDate ?? today(),
        minutes: input.minutes ?? null,
        tags: JSON.stringify(input.tags ?? []),
        on_showcase: input.onShowcase ?? false,
      })
      .returning('id');
    // A new entry is activity on the project: it moves up "On the hook".
    await trx('projects').where({ id: projectId }).update({ updated_at: db.fn.now() });
    return id as number;
  });
  return getEntry(db, userId, id);
}

export async function updateEntry(db: Knex, userId: string, entryId: number, input: EntryInput) {
  const entry = await ownedEntry(db, userId, entryId);
  if (input.pieceId) await assertPieceInProject(db, entry.project_id, input.pieceId);
  const patch: Record<string, unknown> = { updated_at: db.fn.now() };
  if (input.body !== undefined) patch.body = input.body;
  if (input.pieceId !== undefined) patch.piece_id = input.pieceId;
  if (input.tags !== undefined) patch.tags = JSON.stringify(input.tags);
  if (input.minutes !== undefined) patch.minutes = input.minutes;
  if (input.entryDate !== undefined) patch.entry_date = input.entryDate;
  if (input.onShowcase !== undefined) patch.on_showcase = input.onShowcase;
  await db('journal_entries').where({ id: entry.id }).update(patch);
  return getEntry(db, userId, entry.id);
}

/** Deletes an entry with its photos: rows in one transaction, then the files. */
export async function deleteEntry(ctx: Pick<AppContext, 'db' | 'env' | 'logger'>, userId: string, entryId: number) {
  const entry = await ownedEntry(ctx.db, userId, entryId);
  const photos = await ctx.db.transaction(async (trx) => {
    const rows: PhotoRow[] = await trx('photos').where({ entry_id: entry.id });
    await removePhotoRows(trx, rows);
    await trx('journal_entries').where({ id: entry.id }).delete();
    return rows;
  });
  await removePhotoFiles(ctx, photos);
}

/**
 * Entries the owner chose to show on the shared page, newest first, with their photos. For the showcase,
 * which decides first whether the project is shared at all.
 */
export async function showcaseEntries(db: Knex, projectId: number) {
  const rows: EntryRow[] = await entriesQuery(db)
    .where({ 'e.project_id': projectId, 'e.on_showcase': true })
    .orderBy([
      { column: 'e.entry_date', order: 'desc' },
      { column: 'e.id', order: 'desc' },
    ])
    .select(entryColumns);
  return toOut(db, rows);
}

/** The maker's changes from the pattern (entries tagged "change"), oldest first, for the showcase. */
export async function patternChanges(db: Knex, projectId: number) {
  const rows: EntryRow[] = await entriesQuery(db)
    .where('e.project_id', projectId)
    .whereRaw("exists (select 1 from json_each(e.tags) where json_each.value = 'change')")
    .orderBy([
      { column: 'e.entry_date', order: 'asc' },
      { column: 'e.id', order: 'asc' },
    ])
    .select(entryColumns);
  return toOut(db, rows);
}

/** Throws the usual 404 unless the entry is on one of the member's projects. */
export async function ownedEntryId(db: Knex, userId: string, entryId: number) {
  return (await ownedEntry(db, userId, entryId)).id;
}
