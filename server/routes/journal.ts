import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context.js';
import { IdParam, IdParamsSchema } from '../../src/schemas/common.js';
import { CreateEntrySchema, EntryListQuerySchema, UpdateEntrySchema, UpdatePhotoSchema } from '../../src/schemas/journal.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { photoUpload, uploadedFiles } from '../middleware/upload.js';
import { validate } from '../middleware/validate.js';
import { createEntry, deleteEntry, listEntries, ownedEntryId, updateEntry } from '../services/journal.js';
import { addPhotos, deletePhoto, updatePhoto } from '../services/photos.js';
import { imagePool } from '../workers/image-pool.js';

const ProjectParams = z.object({ projectId: IdParam });
const EntryParams = z.object({ entryId: IdParam });

// API routes for journal and photos (issue 7): entries, photos. Mounted under /api by routes/index.ts.
export function journalRouter(ctx: AppContext) {
  const router = Router();

  router.get('/projects/:projectId/entries', requireUser, validate({ params: ProjectParams, query: EntryListQuerySchema }), async (req, res) => {
    const { projectId } = req.params as unknown as z.infer<typeof ProjectParams>;
    const filters = req.query as z.infer<typeof EntryListQuerySchema>;
    // The journal is open, so a photo may follow: start the worker now (~1.4 s of start-up) rather than
    // on the first upload.
    imagePool();
    res.json({ entries: await listEntries(ctx.db, currentUser(res).id, projectId, filters) });
  });

  router.post('/projects/:projectId/entries', requireUser, validate({ params: ProjectParams, body: CreateEntrySchema }), async (req, res) => {
    const { projectId } = req.params as unknown as z.infer<typeof ProjectParams>;
    const entry = await createEntry(ctx.db, currentUser(res).id, projectId, req.body as z.output<typeof CreateEntrySchema>);
    res.status(201).json({ entry });
  });

  router.patch('/entries/:id', requireUser, validate({ params: IdParamsSchema, body: UpdateEntrySchema }), async (req, res) => {
    const { id } = req.params as unknown as z.infer<typeof IdParamsSchema>;
    res.json({ entry: await updateEntry(ctx.db, currentUser(res).id, id, req.body as z.output<typeof UpdateEntrySchema>) });
  });

  router.delete('/entries/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as z.infer<typeof IdParamsSchema>;
    await deleteEntry(ctx, currentUser(res).id, id);
    res.status(204).end();
  });

  router.post(
    '/entries/:entryId/photos',
    requireUser,
    validate({ params: EntryParams }),
    // Refuse before reading megabytes: someone else's entry, or a queue that is already full.
    async (req, res, next) => {
      const { entryId } = req.params as unknown as z.infer<typeof EntryParams>;
      await ownedEntryId(ctx.db, currentUser(res).id, entryId);
      imagePool().assertAccepting();
      next();
    },
    photoUpload,
    async (req, res) => {
      const { entryId } = req.params as unknown as z.infer<typeof EntryParams>;
      const { photos, timing } = await addPhotos(ctx, currentUser(res).id, entryId, uploadedFiles(req));
      // Standard Server-Timing: how long the photos waited for the worker and how long it worked on them.
      res.set('Server-Timing', `queue;dur=${timing.queuedMs.toFixed(0)}, resize;dur=${timing.workMs.toFixed(0)}`);
      res.status(201).json({ photos });
    },
  );

  router.patch('/photos/:id', requireUser, validate({ params: IdParamsSchema, body: UpdatePhotoSchema }), async (req, res) => {
    const { id } = req.params as unknown as z.infer<typeof IdParamsSchema>;
    res.json(await updatePhoto(ctx.db, currentUser(res).id, id, req.body as z.output<typeof UpdatePhotoSchema>));
  });

  router.delete('/photos/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as z.infer<typeof IdParamsSchema>;
    await deletePhoto(ctx, currentUser(res).id, id);
    res.status(204).end();
  });

  return router;
}
