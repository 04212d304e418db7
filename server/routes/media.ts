import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../context.js';
import { notFound } from '../lib/http-error.js';
import { isStorageKey, openPhotoFile, type PhotoVariant } from '../lib/storage.js';
import { canViewPhoto, OWNER_PHOTO_CACHE, photoByKey } from '../services/photos.js';
import { sharedPhotoByRef } from '../services/share.js';

const FILES: Record<string, PhotoVariant> = { 'display.jpg': 'display', 'thumb.jpg': 'thumb' };

/**
 * A shared page's photos may sit in any cache, but every use asks again (no-cache + ETag: a 304 costs no body), so
 * a replaced or closed link stops its photos at once instead of an hour later. The answer depends only on the link,
 * not on who asks, so there is no Vary: Cookie.
 */
const SHARED_PHOTO_CACHE = 'public, no-cache';

// Non-API file routes for photos (issues 7 and 8). uploads/ is never served statically: every request, a
// revalidation included, looks the photo up and checks it may be seen before anything is sent.
//   /media/photos/<key>/<file>          the owner's own URL (journal, project page): the owner only
//   /media/shared/<token>/<ref>/<file>  a shared page's URL: anyone, while <token> is the project's current link
//                                       and the photo is one the page shows
export function mediaRouter(ctx: AppContext) {
  const router = Router();

  async function send(req: Request, res: Response, photo: { id: number; project_id: number; storage_key: string }, variant: PhotoVariant, etag: string, cacheControl: string) {
    res.set({ 'Cache-Control': cacheControl, ETag: etag, 'Content-Type': 'image/jpeg' });
    if (req.headers['if-none-match']?.split(/\s*,\s*/).includes(etag)) {
      res.status(304).end();
      return;
    }
    const opened = await openPhotoFile(ctx.env.uploadsDir, photo.project_id, photo.storage_key, variant);
    if (!opened) {
      ctx.logger.warn({ photoId: photo.id, variant }, 'photo file missing on disk');
      res.removeHeader('ETag');
      res.set('Cache-Control', 'no-store');
      throw notFound('That photo');
    }
    res.set('Content-Length', String(opened.size));
    if (req.method === 'HEAD') {
      res.end();
      return;
    }
    const stream = opened.stream();
    stream.on('error', (err) => {
      ctx.logger.warn({ err, photoId: photo.id }, 'photo read failed');
      res.destroy(err);
    });
    stream.pipe(res);
  }

  router.get('/media/photos/:key/:file', async (req, res) => {
    const { key, file } = req.params;
    const variant = FILES[file];
    if (!variant || !isStorageKey(key)) throw notFound('That photo');
    const photo = await photoByKey(ctx.db, key);
    if (!photo || !(await canViewPhoto(ctx.db, res.locals.user, photo))) throw notFound('That photo');
    // A key names one picture forever (edits make new keys), so a strong ETag never goes stale.
    res.set('Vary', 'Cookie');
    await send(req, res, photo, variant, `"${key}-${variant}"`, OWNER_PHOTO_CACHE);
  });

  router.get('/media/shared/:token/:ref/:file', async (req, res) => {
    const { token, ref, file } = req.params;
    const variant = FILES[file];
    if (!variant) throw notFound('That photo');
    const photo = await sharedPhotoByRef(ctx.db, token, ref);
    // The ref already differs per link and per picture; the storage key stays out of every visitor-facing header.
    await send(req, res, photo, variant, `"${ref}-${variant}"`, SHARED_PHOTO_CACHE);
  });

  // Anything else under /media is a photo that does not exist, not the app's HTML.
  router.use('/media', () => {
    throw notFound('That photo');
  });

  return router;
}
