import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for projects (issue 5): /projects. Mounted under /api by routes/index.ts.
export function projectsRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
