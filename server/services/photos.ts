import { fileTypeFromBuffer } from 'file-type';
import { imageSize } from 'image-size';
import type { Knex } from 'knex';
import type { AppContext } from '../context.js';
import { HttpError, notFound, type IssueOut } from '../lib/http-error.js';
import { deletePhotoFiles, newStorageKey, writePhotoFiles } from '../lib/storage.js';
import { imagePool } from '../workers/image-pool.js';
import { PHOTO_LIMITS } from '../../src/schemas/journal.js';
import type { ImageFormat, ImageJob } from '../workers/image.js';
import type { PhotoOut } from '../../src/types/api.js';

// Photos: every upload is sniffed from its bytes, measured from its header before anything decodes it,
// then resized off the request thread into two JPEGs without EXIF. The original is never kept.

export interface PhotoRow {
  id: number;
  project_id: number;
  entry_id: number | null;
  owner_id: string;
  storage_key: string;
  width: number;
  height: number;
  bytes: number;
  alt: string;
  created_at: string;
}

export type { PhotoOut };

export interface UploadedFile {
  originalname: string;
  size: number;
  buffer: Buffer;
}

export const photoUrl = (key: string, variant: 'display' | 'thumb') => `/media/photos/${key}/${variant}.jpg`;

export function photoOut(row: PhotoRow): PhotoOut {
  return {
    id: row.id,
    url: photoUrl(row.storage_key, 'display'),
    thumbUrl: photoUrl(row.storage_key, 'thumb'),
    width: row.width,
    height: row.height,
    alt: row.alt,
  };
}

/**
 * Who may see a photo through its own URL (/media/photos/<key>/…): its project's owner while their account is open,
 * no one else, whether or not the project is shared. Visitors of a shared page get the photos the page shows
 * through that link's own URLs (/media/shared/<token>/<ref>/…, services/share.ts), which stop working the moment
 * the link is replaced or closed; a photo URL copied from the page cannot outlive its link. A disabled owner has
 * no session, and the rule refuses them too. Everyone refused gets the same 404 as for a photo that does not exist.
 */
export async function canViewPhoto(db: Knex, user: { id: string } | null | undefined, photo: Pick<PhotoRow, 'project_id'>) {
  if (!user) return false;
  const project = await db('projects as p')
    .join('users as u', 'u.id', 'p.owner_id')
    .where('p.id', photo.project_id)
    .first('p.owner_id', 'u.disabled_at');
  return Boolean(project && !project.disabled_at && project.owner_id === user.id);
}

/**
 * The owner's own copy: cached for an hour in their browser only (Vary: Cookie), never in a shared cache. A key
 * names one picture forever (edits make new keys), so the copy never goes stale.
 */
export const OWNER_PHOTO_CACHE = 'private, max-age=3600';

export async function photoByKey(db: Knex, key: string): Promise<PhotoRow | undefined> {
  return db('photos').where({ storage_key: key }).first();
}

/** Every photo of a project, oldest first, for pages that show a project's pictures (the showcase). */
export async function projectPhotos(db: Knex, projectId: number): Promise<Array<PhotoOut & { entryId: number | null }>> {
  const rows: PhotoRow[] = await db('photos').where({ project_id: projectId }).orderBy('id');
  return rows.map((r) => ({ ...photoOut(r), entryId: r.entry_id }));
}

// ---------------------------------------------------------------------------------------------------------
// Checking a file before any decoding

interface Refusal {
  status: number;
  reason: string;
}

const WORKING_FORMATS = 'JPEG, PNG or WebP';
const name = (f: UploadedFile) => `“${f.originalname || 'unnamed file'}”`;

/**
 * A baseline or progressive JPEG is complete when, after its last scan, the end-of-image marker (FF D9)
 * arrives. Walking the segments skips APP1 (EXIF), whose embedded thumbnail has its own FF D9; inside
 * entropy-coded data FF is always followed by 00 or a restart marker (ITU-T T.81, B.1.1.2/B.1.1.5).
 * Data after the marker (phone "motion photo" trailers) is allowed.
 */
export function jpegIsComplete(buf: Uint8Array) {
  let i = 2;
  while (i + 1 < buf.length) {
    if (buf[i] !== 0xff) {
      i += 1; // stray bytes between segments: some encoders write them; keep looking for the end marker
      continue;
    }
    const marker = buf[i + 1];
    if (marker === 0xff) {
      i += 1; // fill byte
      continue;
    }
    if (marker === 0xd9) return true;
    if ((marker >= 0xd0 && marker <= 0xd7) || marker === 0x01) {
      i += 2;
      continue;
    }
    if (i + 3 >= buf.length) return false;
    const length = (buf[i + 2] << 8) | buf[i + 3];
    i += 2 + length;
    if (marker === 0xda) {
      // Skip the entropy-coded scan to the next real marker. indexOf is native: a byte-by-byte loop here held the
      // request thread for 13–20 ms on a 4 MB photo.
      for (;;) {
        i = buf.indexOf(0xff, i);
        if (i < 0 || i + 1 >= buf.length) return false;
        const next = buf[i + 1];
        if (next !== 0x00 && !(next >= 0xd0 && next <= 0xd7)) break;
        i += 1;
      }
    }
  }
  return false;
}

/**
 * A WebP file is one RIFF chunk whose header states its size: the 4 bytes after "RIFF" hold the file's
 * length minus 8, little-endian (RIFF container spec, developers.google.com/speed/webp/docs/riff_container).
 * Fewer bytes than that means the file was cut short. Bytes after the chunk are tolerated, as for JPEG.
 */
function webpIsComplete(buf: Uint8Array) {
  if (buf.length < 12) return false;
  const riffSize = buf[4] | (buf[5] << 8) | (buf[6] << 16) | (buf[7] * 0x1000000);
  return buf.length >= riffSize + 8;
}

/** The VP8X chunk's animation flag (bit 1 of its first byte; same spec): such a file is a clip, not a photo. */
function webpIsAnimated(buf: Uint8Array) {
  const vp8x = buf.length >= 21 && String.fromCharCode(buf[12], buf[13], buf[14], buf[15]) === 'VP8X';
  return vp8x && (buf[20] & 0x02) !== 0;
}

/** PNG ends with an IEND chunk; a file cut short has none (PNG spec, 11.2.5). */
function pngIsComplete(buf: Uint8Array) {
  const iend = [0x49, 0x45, 0x4e, 0x44];
  for (let i = buf.length - 8; i >= Math.max(8, buf.length - 64); i -= 1) {
    if (iend.every((b, k) => buf[i + k] === b)) return true;
  }
  return false;
}

const COMPLETE: Record<ImageFormat, (buf: Uint8Array) => boolean> = { jpg: jpegIsComplete, png: pngIsComplete, webp: webpIsComplete };

export async function checkUpload(file: UploadedFile): Promise<Refusal | null> {
  const buf = file.buffer;
  if (!buf || buf.length === 0) return { status: 400, reason: `${name(file)} is empty (0 bytes). Choose the photo again.` };
  if (buf.length > PHOTO_LIMITS.maxFileBytes) {
    return { status: 413, reason: `${name(file)} is larger than 15 MB. Choose a smaller copy of the photo.` };
  }
  const type = await fileTypeFromBuffer(buf);
  if (!type) {
    return {
      status: 415,
      reason: `${name(file)} is not a photo Whorlbook can read: its contents are not an image, whatever its name says. Photos work as ${WORKING_FORMATS}.`,
    };
  }
  if (type.ext === 'heic' || type.ext === 'avif') {
    return {
      status: 415,
      reason: `${name(file)} is a ${type.ext.toUpperCase()} photo, which Whorlbook cannot read. Photos work as ${WORKING_FORMATS}; on an iPhone, set Camera › Formats to "Most Compatible", or add it through Whorlbook's photo picker, which converts it.`,
    };
  }
  if (type.ext !== 'jpg' && type.ext !== 'png' && type.ext !== 'webp') {
    return { status: 415, reason: `${name(file)} is a ${type.ext.toUpperCase()} file, not a photo Whorlbook can read. Photos work as ${WORKING_FORMATS}.` };
  }
  const format: ImageFormat = type.ext;

  let size: { width?: number; height?: number };
  try {
    size = imageSize(buf);
  } catch {
    return { status: 422, reason: `${name(file)} is damaged: its header cannot be read. Try exporting the photo again.` };
  }
  const { width = 0, height = 0 } = size;
  if (!width || !height) return { status: 422, reason: `${name(file)} is damaged: it says it has no pixels.` };
  // 422, not 413: the request is small enough, but the picture it describes is too big to open safely.
  if (width > PHOTO_LIMITS.maxSide || height > PHOTO_LIMITS.maxSide || width * height > PHOTO_LIMITS.maxMegapixels * 1_000_000) {
    return {
      status: 422,
      reason: `${name(file)} is ${width} × ${height} pixels; Whorlbook takes photos up to ${PHOTO_LIMITS.maxMegapixels} megapixels and ${PHOTO_LIMITS.maxSide.toLocaleString('en')} pixels a side. Choose a smaller copy.`,
    };
  }
  if (!COMPLETE[format](buf)) {
    return { status: 422, reason: `${name(file)} is cut off: the file ends before the picture does. Copy the photo again and retry.` };
  }
  if (format === 'webp' && webpIsAnimated(buf)) {
    return { status: 415, reason: `${name(file)} is an animated WebP, not a still photo. Choose a photo, or save one frame of it as a picture first.` };
  }
  return null;
}

/** The format the bytes start with, for a file checkUpload has already passed. */
function sniffedFormat(buf: Uint8Array): ImageFormat {
  if (buf[0] === 0xff) return 'jpg';
  return buf[0] === 0x89 ? 'png' : 'webp';
}

function refuse(files: UploadedFile[], refusals: Array<Refusal | null>): never {
  const failed = refusals.map((r, i) => (r ? { r, i } : null)).filter((x): x is { r: Refusal; i: number } => x !== null);
  const issues: IssueOut[] = failed.map(({ r, i }) => ({ path: `photos.${i}`, message: r.reason }));
  const nothing = files.length > 1 ? ' Nothing from this upload was saved; leave that photo out and send the others again.' : '';
  const message =
    failed.length === 1
      ? `${failed[0].r.reason}${nothing}`
      : `${failed.length} of ${files.length} photos were refused and nothing was saved: ${failed.map(({ r }) => r.reason).join(' ')}`;
  throw new HttpError(failed[0].r.status, message, issues);
}

// ---------------------------------------------------------------------------------------------------------
// Adding, changing and removing photos

const dayFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
/** "Body — 25 Nov 2026": the piece (or the project, for a whole-project entry) and the entry's day. */
export function defaultAlt(subject: string, entryDate: string) {
  const d = new Date(`${entryDate}T00:00:00Z`);
  return `${subject} — ${Number.isNaN(d.getTime()) ? entryDate : dayFormat.format(d)}`.slice(0, 300);
}

async function ownedEntryWithSubject(db: Knex, userId: string, entryId: number) {
  const row = await db('journal_entries as e')
    .join('projects as p', 'p.id', 'e.project_id')
    .leftJoin('project_pieces as pp', 'pp.id', 'e.piece_id')
    .where({ 'e.id': entryId, 'p.owner_id': userId })
    .first('e.id', 'e.project_id', 'e.entry_date', 'p.title as project_title', 'pp.name as piece_name');
  if (!row) throw notFound('That journal entry');
  return row as { id: number; project_id: number; entry_date: string; project_title: string; piece_name: string | null };
}

/**
 * Adds photos to an entry, all or nothing: if any file is refused, none is kept and the answer names each
 * refused file and why. Files are written before the rows and removed again if the rows cannot be saved.
 */
export async function addPhotos(
  ctx: Pick<AppContext, 'db' | 'env' | 'logger'>,
  userId: string,
  entryId: number,
  files: UploadedFile[],
): Promise<{ photos: PhotoOut[]; timing: { queuedMs: number; workMs: number } }> {
  const { db, env, logger } = ctx;
  const entry = await ownedEntryWithSubject(db, userId, entryId);
  if (files.length === 0) throw new HttpError(422, 'Choose at least one photo to add (form field "photos").');

  const checks = await Promise.all(files.map(checkUpload));
  if (checks.some(Boolean)) refuse(files, checks);

  const jobs: ImageJob[] = files.map((f) => ({
    bytes: new Uint8Array(f.buffer.buffer, f.buffer.byteOffset, f.buffer.byteLength),
    format: sniffedFormat(f.buffer),
    displayLongSide: PHOTO_LIMITS.displayLongSide,
    thumbSide: PHOTO_LIMITS.thumbSide,
  }));
  const sent = performance.now();
  const results = await imagePool().runBatch(jobs);
  const waited = performance.now() - sent;
  const decodeRefusals = results.map((r, i): Refusal | null => {
    if (!(r instanceof Error)) return null;
    logger.warn({ err: r, file: files[i].originalname }, 'photo could not be decoded');
    return { status: 422, reason: `${name(files[i])} could not be opened as a picture; the file may be damaged. Try exporting the photo again.` };
  });
  if (decodeRefusals.some(Boolean)) refuse(files, decodeRefusals);

  const ready = results.map((r, i) => ({ key: newStorageKey(), result: r as Exclude<(typeof results)[number], Error>, file: files[i] }));
  const written: string[] = [];
  try {
    for (const p of ready) {
      await writePhotoFiles(env.uploadsDir, entry.project_id, p.key, { display: p.result.display, thumb: p.result.thumb });
      written.push(p.key);
    }
    const alt = defaultAlt(entry.piece_name ?? entry.project_title, entry.entry_date);
    const rows = await db.transaction(async (trx) => {
      // The resize took seconds: the entry may have been deleted meanwhile.
      const still = await trx('journal_entries').where({ id: entry.id }).first('id');
      if (!still) throw notFound('That journal entry');
      const inserted: PhotoRow[] = [];
      for (const p of ready) {
        const [row] = await trx('photos')
          .insert({
            project_id: entry.project_id,
            entry_id: entry.id,
            owner_id: userId,
            storage_key: p.key,
            width: p.result.width,
            height: p.result.height,
            bytes: p.result.display.byteLength + p.result.thumb.byteLength,
            alt,
          })
          .returning('*');
        inserted.push(row);
      }
      await trx('journal_entries').where({ id: entry.id }).update({ updated_at: db.fn.now() });
      return inserted;
    });
    const workMs = ready.reduce((sum, p) => sum + p.result.ms, 0);
    return { photos: rows.map(photoOut), timing: { workMs, queuedMs: Math.max(0, waited - workMs) } };
  } catch (err) {
    await Promise.all(written.map((key) => deletePhotoFiles(env.uploadsDir, entry.project_id, key)));
    throw err;
  }
}

async function ownedPhoto(db: Knex, userId: string, photoId: number): Promise<PhotoRow> {
  const row = await db('photos as ph')
    .join('projects as p', 'p.id', 'ph.project_id')
    .where({ 'ph.id': photoId, 'p.owner_id': userId })
    .first('ph.*');
  if (!row) throw notFound('That photo');
  return row;
}

export async function updatePhoto(db: Knex, userId: string, photoId: number, input: { alt?: string; cover?: boolean }) {
  const photo = await ownedPhoto(db, userId, photoId);
  return db.transaction(async (trx) => {
    if (input.alt !== undefined) await trx('photos').where({ id: photo.id }).update({ alt: input.alt });
    if (input.cover === true) {
      await trx('projects').where({ id: photo.project_id }).update({ cover_photo_id: photo.id, updated_at: db.fn.now() });
    } else if (input.cover === false) {
      await trx('projects').where({ id: photo.project_id, cover_photo_id: photo.id }).update({ cover_photo_id: null, updated_at: db.fn.now() });
    }
    const row: PhotoRow = await trx('photos').where({ id: photo.id }).first();
    const project = await trx('projects').where({ id: photo.project_id }).first('cover_photo_id');
    return { photo: photoOut(row), cover: project?.cover_photo_id === photo.id };
  });
}

/** Removes rows first (clearing the cover if it pointed at one), then the files; a file left behind is only logged. */
export async function removePhotoRows(trx: Knex, rows: PhotoRow[]) {
  if (rows.length === 0) return;
  const ids = rows.map((r) => r.id);
  await trx('projects').whereIn('cover_photo_id', ids).update({ cover_photo_id: null });
  await trx('photos').whereIn('id', ids).delete();
}

export async function removePhotoFiles(ctx: Pick<AppContext, 'env' | 'logger'>, rows: PhotoRow[]) {
  await Promise.all(
    rows.map((r) =>
      deletePhotoFiles(ctx.env.uploadsDir, r.project_id, r.storage_key).catch((err) => ctx.logger.warn({ err, photoId: r.id }, 'could not remove a photo’s files')),
    ),
  );
}

export async function deletePhoto(ctx: Pick<AppContext, 'db' | 'env' | 'logger'>, userId: string, photoId: number) {
  const photo = await ownedPhoto(ctx.db, userId, photoId);
  await ctx.db.transaction((trx) => removePhotoRows(trx, [photo]));
  await removePhotoFiles(ctx, [photo]);
}
