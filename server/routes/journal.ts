import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for journal and photos (issue 7): entries, photos. Mounted under /api by routes/index.ts.
export function journalRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
