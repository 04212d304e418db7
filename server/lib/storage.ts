import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { AppContext } from '../context.js';

// The one module that touches UPLOADS_DIR. Files are named by server-made random keys, never by anything a
// person typed or a file was called, and live per project so a deleted project's files go in one sweep:
//   UPLOADS_DIR/photos/p<projectId>/<key>-display.jpg   (long side 1600 px)
//   UPLOADS_DIR/photos/p<projectId>/<key>-thumb.jpg     (400 px square)
// Project ids come from SQLite AUTOINCREMENT, so a deleted project's folder name is never handed out again.

export type PhotoVariant = 'display' | 'thumb';
export const PHOTO_VARIANTS: readonly PhotoVariant[] = ['display', 'thumb'];

/** 18 random bytes = 144 bits, base64url: 24 characters that also make the photo's URL unguessable. */
const KEY_BYTES = 18;
const KEY_PATTERN = /^[A-Za-z0-9_-]{24}$/;

export function newStorageKey() {
  return randomBytes(KEY_BYTES).toString('base64url');
}

export function isStorageKey(value: string) {
  return KEY_PATTERN.test(value);
}

function projectDir(uploadsDir: string, projectId: number) {
  if (!Number.isSafeInteger(projectId) || projectId <= 0) throw new Error(`bad project id for storage: ${projectId}`);
  return path.join(uploadsDir, 'photos', `p${projectId}`);
}

export function photoFilePath(uploadsDir: string, projectId: number, key: string, variant: PhotoVariant) {
  if (!isStorageKey(key)) throw new Error('bad storage key');
  return path.join(projectDir(uploadsDir, projectId), `${key}-${variant}.jpg`);
}

/**
 * Writes every variant of one photo, each through a temporary name and a rename, so a reader never sees
 * half a file. If any write fails, whatever was written is removed before the error goes on.
 */
export async function writePhotoFiles(uploadsDir: string, projectId: number, key: string, files: Record<PhotoVariant, Uint8Array>) {
  await fs.promises.mkdir(projectDir(uploadsDir, projectId), { recursive: true });
  const written: string[] = [];
  try {
    for (const variant of PHOTO_VARIANTS) {
      const target = photoFilePath(uploadsDir, projectId, key, variant);
      const tmp = `${target}.${randomBytes(6).toString('hex')}.tmp`;
      written.push(tmp);
      await fs.promises.writeFile(tmp, files[variant], { flag: 'wx' });
      await fs.promises.rename(tmp, target);
      written.push(target);
    }
  } catch (err) {
    await Promise.all(written.map((f) => fs.promises.rm(f, { force: true })));
    throw err;
  }
}

/** Size and a read stream for one variant, or null when the file is missing. */
export async function openPhotoFile(uploadsDir: string, projectId: number, key: string, variant: PhotoVariant) {
  const file = photoFilePath(uploadsDir, projectId, key, variant);
  try {
    const stat = await fs.promises.stat(file);
    if (!stat.isFile()) return null;
    return { size: stat.size, stream: () => fs.createReadStream(file) };
  } catch {
    return null;
  }
}

export async function deletePhotoFiles(uploadsDir: string, projectId: number, key: string) {
  await Promise.all(PHOTO_VARIANTS.map((v) => fs.promises.rm(photoFilePath(uploadsDir, projectId, key, v), { force: true })));
}

/**
 * Removes every photo file of a project. Call it after the project's row is deleted (the photos' rows go
 * with it by cascade); it needs no rows, and a failure is logged rather than undoing the deletion.
 */
export async function deleteProjectPhotoFiles(ctx: Pick<AppContext, 'env' | 'logger'>, projectId: number) {
  try {
    await fs.promises.rm(projectDir(ctx.env.uploadsDir, projectId), { recursive: true, force: true });
  } catch (err) {
    ctx.logger.warn({ err, projectId }, 'could not remove a deleted project’s photo files');
  }
}
