import { Router } from 'express';
import type { AppContext } from '../context.js';
import { IdParamsSchema } from '../../src/schemas/common.js';
import {
  CreatePatternSchema,
  UpdatePatternSchema,
  type CreatePatternInput,
  type UpdatePatternInput,
} from '../../src/schemas/pattern.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import {
  createPattern,
  deletePattern,
  getPattern,
  listPatterns,
  updatePattern,
} from '../services/patterns.js';

const idOf = (params: unknown) => (params as { id: number }).id;

// API routes for patterns (issue 5): /patterns. Mounted under /api by routes/index.ts.
export function patternsRouter(ctx: AppContext) {
  const router = Router();

  router.get('/patterns', requireUser, async (_req, res) => {
    res.json({ patterns: await listPatterns(ctx.db, currentUser(res).id) });
  });

  router.post('/patterns', requireUser, validate({ body: CreatePatternSchema }), async (req, res) => {
    const pattern = await createPattern(ctx.db, currentUser(res).id, req.body as CreatePatternInput);
    res.status(201).location(`/api/patterns/${pattern.id}`).json({ pattern });
  });

  router.get('/patterns/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    res.json({ pattern: await getPattern(ctx.db, currentUser(res).id, idOf(req.params)) });
  });

  router.patch(
    '/patterns/:id',
    requireUser,
    validate({ params: IdParamsSchema, body: UpdatePatternSchema }),
    async (req, res) => {
      res.json({
        pattern: await updatePattern(
          ctx.db,
          currentUser(res).id,
          idOf(req.params),
          req.body as UpdatePatternInput,
        ),
      });
    },
  );

  router.delete('/patterns/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    await deletePattern(ctx.db, currentUser(res).id, idOf(req.params));
    res.status(204).end();
  });

  return router;
}
