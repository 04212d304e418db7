import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for accounts (issue 3): /dev/outbox while the local mail fake is in use. Mounted under /api by routes/index.ts.
export function devRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
