import { Router } from 'express';
import type { AppContext } from '../context.js';
import { notFound } from '../lib/http-error.js';
import { isStorageKey, openPhotoFile, type PhotoVariant } from '../lib/storage.js';
import { canViewPhoto, photoByKey, photoCacheControl } from '../services/photos.js';

const FILES: Record<string, PhotoVariant> = { 'display.jpg': 'display', 'thumb.jpg': 'thumb' };

// Non-API file routes for photos (issue 7), each request checked against who may see the photo.
// uploads/ is never served statically: every request looks the key up and asks canViewPhoto.
export function mediaRouter(ctx: AppContext) {
  const router = Router();

  router.get('/media/photos/:key/:file', async (req, res) => {
    const { key, file } = req.params;
    const variant = FILES[file];
    if (!variant || !isStorageKey(key)) throw notFound('That photo');
    const photo = await photoByKey(ctx.db, key);
    if (!photo || !(await canViewPhoto(ctx.db, res.locals.user, photo))) throw notFound('That photo');

    // A key names one picture forever (edits make new keys), so a strong ETag never goes stale; the
    // permission check above still runs on every request, revalidations included.
    const etag = `"${key}-${variant}"`;
    res.set({
      'Cache-Control': await photoCacheControl(ctx.db, photo),
      ETag: etag,
      Vary: 'Cookie',
      'Content-Type': 'image/jpeg',
    });
    if (req.headers['if-none-match']?.split(/\s*,\s*/).includes(etag)) {
      res.status(304).end();
      return;
    }
    const opened = await openPhotoFile(ctx.env.uploadsDir, photo.project_id, key, variant);
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
  });

  return router;
}
