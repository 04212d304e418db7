import { Router } from 'express';
import type { z } from 'zod';
import type { AppContext } from '../context.js';
import { IdParamsSchema } from '../../src/schemas/common.js';
import { ShelfYarnInputSchema, UpdateShelfYarnSchema } from '../../src/schemas/yarn.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { createYarn, deleteYarn, getYarn, listYarns, updateYarn } from '../services/yarns.js';

type IdParams = z.infer<typeof IdParamsSchema>;

// API routes for the yarn shelf (issue 5): /yarns. Mounted under /api by routes/index.ts.
export function yarnsRouter(ctx: AppContext) {
  const router = Router();

  router.get('/yarns', requireUser, async (_req, res) => {
    res.json({ yarns: await listYarns(ctx.db, currentUser(res).id) });
  });

  router.post('/yarns', requireUser, validate({ body: ShelfYarnInputSchema }), async (req, res) => {
    const yarn = await createYarn(ctx.db, currentUser(res).id, req.body as z.output<typeof ShelfYarnInputSchema>);
    res.status(201).json({ yarn });
  });

  router.get('/yarns/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    res.json({ yarn: await getYarn(ctx.db, currentUser(res).id, id) });
  });

  router.patch('/yarns/:id', requireUser, validate({ params: IdParamsSchema, body: UpdateShelfYarnSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    res.json({ yarn: await updateYarn(ctx.db, currentUser(res).id, id, req.body as z.output<typeof UpdateShelfYarnSchema>) });
  });

  router.delete('/yarns/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    await deleteYarn(ctx.db, currentUser(res).id, id);
    res.status(204).end();
  });

  return router;
}
