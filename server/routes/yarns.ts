import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for yarn shelf (issue 5): /yarns. Mounted under /api by routes/index.ts.
export function yarnsRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
