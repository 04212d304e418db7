import { Router } from 'express';
import type { AppContext } from '../context.js';

// API routes for accounts (issue 3): /dev/outbox while the local mail fake is in use. Mounted under /api by routes/index.ts.
export function devRouter(ctx: AppContext) {
  const router = Router();
  const outbox = ctx.mailer.outbox;
  // Never with real mail: the route is simply not there, and the API answers its usual JSON 404.
  if (ctx.env.SMTP_URL || !outbox) return router;

  // Open to anyone who can reach the server, signed in or not: it is how a person trying Whorlbook locally
  // reads the links it mails. The server warns at start-up when it runs in production this way.
  router.get('/dev/outbox', async (_req, res) => {
    res.set('Cache-Control', 'no-store');
    res.json(await outbox());
  });

  return router;
}
