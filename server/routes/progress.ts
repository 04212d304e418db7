import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context.js';
import { IdParam } from '../../src/schemas/common.js';
import { PlacementInputSchema, ProgressOpSchema, type PlacementInput, type ProgressOp } from '../../src/schemas/progress.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { createPlacement, deletePlacement, listPlacements } from '../services/placements.js';
import { applyProgress, getProgress, hubFor, progressHistory, type StreamMessage } from '../services/progress.js';
import { ownedPiece } from '../services/ownership.js';

const PieceParams = z.object({ pieceId: IdParam });
const IdParams = z.object({ id: IdParam });
type PieceParams = z.infer<typeof PieceParams>;

// A comment line every so often keeps proxies and phones from closing a quiet stream, and lets the server notice
// a session that was signed out meanwhile.
const HEARTBEAT_MS = 20_000;

// API routes for the Tally (issue 6). Mounted under /api by routes/index.ts.
export function progressRouter(ctx: AppContext) {
  const router = Router();
  const pieceRoute = [requireUser, validate({ params: PieceParams })];
  const pieceId = (req: { params: unknown }) => (req.params as PieceParams).pieceId;

  router.get('/pieces/:pieceId/progress', ...pieceRoute, async (req, res) => {
    res.set('Cache-Control', 'no-store');
    res.json({ progress: await getProgress(ctx.db, currentUser(res).id, pieceId(req)) });
  });

  router.post('/pieces/:pieceId/progress', ...pieceRoute, validate({ body: ProgressOpSchema }), async (req, res) => {
    const { progress } = await applyProgress(ctx.db, currentUser(res).id, pieceId(req), req.body as ProgressOp);
    res.set('Cache-Control', 'no-store');
    res.json({ progress });
  });

  router.get('/pieces/:pieceId/progress/history', ...pieceRoute, async (req, res) => {
    res.set('Cache-Control', 'no-store');
    res.json(await progressHistory(ctx.db, currentUser(res).id, pieceId(req)));
  });

  // Server-sent events rather than polling: a second device hears a tap as soon as it is committed, and an idle
  // Tally costs one quiet connection instead of a request every few seconds.
  router.get('/pieces/:pieceId/stream', ...pieceRoute, async (req, res) => {
    const user = currentUser(res);
    const id = pieceId(req);
    await ownedPiece(ctx.db, user.id, id);
    const sessionId = res.locals.session?.id;

    res.writeHead(200, {
      'Content-Type': 'text/event-stream; charset=utf-8',
      'Cache-Control': 'no-store, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    const send = (msg: StreamMessage | { type: 'hello' }, eventId?: number) => {
      if (res.writableEnded) return;
      res.write(`${eventId !== undefined ? `id: ${eventId}\n` : ''}event: ${msg.type}\ndata: ${JSON.stringify(msg)}\n\n`);
    };
    const hub = hubFor(ctx.db);
    const channel = `piece:${id}`;
    const onMessage = (msg: StreamMessage) => send(msg, msg.type === 'progress' ? msg.progress.version : undefined);
    hub.on(channel, onMessage);
    res.write('retry: 3000\n\n');
    // The position right now, so a device that reconnects after a gap catches up without a separate request.
    const now = await getProgress(ctx.db, user.id, id);
    send({ type: 'progress', progress: now, opId: null }, now.version);

    let closed = false;
    const close = () => {
      if (closed) return;
      closed = true;
      clearInterval(beat);
      hub.off(channel, onMessage);
      if (!res.writableEnded) res.end();
    };
    const beat = setInterval(async () => {
      try {
        const { session } = sessionId ? await ctx.lucia.validateSession(sessionId) : { session: null };
        if (!session) return close();
        await ownedPiece(ctx.db, user.id, id);
        res.write(': still here\n\n');
      } catch {
        close();
      }
    }, HEARTBEAT_MS);
    req.on('close', close);
    res.on('error', close);
  });

  router.get('/pieces/:pieceId/placements', ...pieceRoute, async (req, res) => {
    res.json({ placements: await listPlacements(ctx.db, currentUser(res).id, pieceId(req)) });
  });

  router.post('/pieces/:pieceId/placements', ...pieceRoute, validate({ body: PlacementInputSchema }), async (req, res) => {
    const { placement } = await createPlacement(ctx.db, currentUser(res).id, pieceId(req), req.body as PlacementInput);
    res.status(201).json({ placement });
  });

  router.delete('/placements/:id', requireUser, validate({ params: IdParams }), async (req, res) => {
    await deletePlacement(ctx.db, currentUser(res).id, (req.params as unknown as z.infer<typeof IdParams>).id);
    res.status(204).end();
  });

  return router;
}
