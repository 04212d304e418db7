import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for accounts (issue 3): /admin/*. Mounted under /api by routes/index.ts.
export function adminRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
