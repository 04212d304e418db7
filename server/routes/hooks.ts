import { Router } from 'express';
import type { z } from 'zod';
import type { AppContext } from '../context.js';
import { IdParamsSchema } from '../../src/schemas/common.js';
import { HookInputSchema, UpdateHookSchema } from '../../src/schemas/hooks.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { createHook, deleteHook, listHooks, updateHook } from '../services/hooks.js';

type IdParams = z.infer<typeof IdParamsSchema>;

// API routes for the hook roll: /hooks. Mounted under /api by routes/index.ts.
export function hooksRouter(ctx: AppContext) {
  const router = Router();

  router.get('/hooks', requireUser, async (_req, res) => {
    res.json({ hooks: await listHooks(ctx.db, currentUser(res).id) });
  });

  router.post('/hooks', requireUser, validate({ body: HookInputSchema }), async (req, res) => {
    const hook = await createHook(ctx.db, currentUser(res).id, req.body as z.output<typeof HookInputSchema>);
    res.status(201).json({ hook });
  });

  router.patch('/hooks/:id', requireUser, validate({ params: IdParamsSchema, body: UpdateHookSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    res.json({ hook: await updateHook(ctx.db, currentUser(res).id, id, req.body as z.output<typeof UpdateHookSchema>) });
  });

  router.delete('/hooks/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    await deleteHook(ctx.db, currentUser(res).id, id);
    res.status(204).end();
  });

  return router;
}
