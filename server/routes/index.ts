import { Router } from 'express';
import type { AppContext } from '../context.js';
import { HttpError } from '../lib/http-error.js';
import { adminRouter } from './admin.js';
import { authRouter } from './auth.js';
import { devRouter } from './dev.js';
import { hooksRouter } from './hooks.js';
import { journalRouter } from './journal.js';
import { patternsRouter } from './patterns.js';
import { progressRouter } from './progress.js';
import { projectsRouter } from './projects.js';
import { shareRouter } from './share.js';
import { yarnsRouter } from './yarns.js';

/** Every /api route. Each area's router declares its own full paths under /api. */
export function apiRouter(ctx: AppContext) {
  const api = Router();
  api.get('/health', (_req, res) => {
    res.json({ ok: true });
  });
  api.use(authRouter(ctx));
  api.use(adminRouter(ctx));
  api.use(devRouter(ctx));
  api.use(patternsRouter(ctx));
  api.use(projectsRouter(ctx));
  api.use(yarnsRouter(ctx));
  api.use(hooksRouter(ctx));
  api.use(progressRouter(ctx));
  api.use(journalRouter(ctx));
  api.use(shareRouter(ctx));
  api.use((req) => {
    throw new HttpError(404, `There is no API route ${req.method} ${req.originalUrl}.`);
  });
  return api;
}
