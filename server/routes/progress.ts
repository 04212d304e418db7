import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for the Tally (issue 6): /pieces/:pieceId/progress, placements. Mounted under /api by routes/index.ts.
export function progressRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
