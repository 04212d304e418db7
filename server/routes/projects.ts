import { Router } from 'express';
import type { z } from 'zod';
import type { AppContext } from '../context.js';
import { IdParamsSchema } from '../../src/schemas/common.js';
import { CreateProjectSchema, ProjectListQuerySchema, UpdateProjectSchema } from '../../src/schemas/project.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { createProject, deleteProject, getProject, listProjects, updateProject } from '../services/projects.js';

type IdParams = z.infer<typeof IdParamsSchema>;

// API routes for projects (issue 5): /projects. Mounted under /api by routes/index.ts.
export function projectsRouter(ctx: AppContext) {
  const router = Router();

  router.get('/projects', requireUser, validate({ query: ProjectListQuerySchema }), async (req, res) => {
    const { status } = req.query as z.infer<typeof ProjectListQuerySchema>;
    res.json({ projects: await listProjects(ctx.db, currentUser(res).id, status) });
  });

  router.post('/projects', requireUser, validate({ body: CreateProjectSchema }), async (req, res) => {
    const project = await createProject(ctx, currentUser(res).id, req.body as z.output<typeof CreateProjectSchema>);
    res.status(201).location(`/api/projects/${project.id}`).json({ project });
  });

  router.get('/projects/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    res.json({ project: await getProject(ctx, currentUser(res).id, id) });
  });

  router.patch('/projects/:id', requireUser, validate({ params: IdParamsSchema, body: UpdateProjectSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    res.json({ project: await updateProject(ctx, currentUser(res).id, id, req.body as z.output<typeof UpdateProjectSchema>) });
  });

  router.delete('/projects/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    await deleteProject(ctx, currentUser(res).id, id);
    res.status(204).end();
  });

  return router;
}
