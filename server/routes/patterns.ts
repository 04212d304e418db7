import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for patterns (issue 5): /patterns. Mounted under /api by routes/index.ts.
export function patternsRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
