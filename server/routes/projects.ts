import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context.js';
import { ProjectStatusSchema } from '../../src/schemas/common.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { listProjects } from '../services/projects.js';

const ListQuery = z.object({ status: ProjectStatusSchema.optional() });

// API routes for projects (issue 5): /projects. Mounted under /api by routes/index.ts.
export function projectsRouter(ctx: AppContext) {
  const router = Router();

  router.get('/projects', requireUser, validate({ query: ListQuery }), async (req, res) => {
    const { status } = req.query as z.infer<typeof ListQuery>;
    res.json({ projects: await listProjects(ctx.db, currentUser(res).id, status) });
  });

  return router;
}
