import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for showcase (issue 8): /share/:token, comments, cheers, reports. Mounted under /api by routes/index.ts.
export function shareRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
