import { Router, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import type { AppContext } from '../context.js';
import { IdParamsSchema } from '../../src/schemas/common.js';
import {
  CreateCommentSchema,
  CreateReportSchema,
  ReportListQuerySchema,
  ResolveReportSchema,
  ShareCommentParamsSchema,
  ShareSettingsSchema,
  ShareTokenParamsSchema as TokenParams,
  UpdateCommentSchema,
  type CreateReportInput,
  type ShareCommentParams,
} from '../../src/schemas/share.js';
import { HttpError } from '../lib/http-error.js';
import { currentUser, requireRole, requireUser } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { addCheer, removeCheer } from '../services/cheers.js';
import { addComment, deleteComment, deleteCommentById, listComments, setCommentHidden } from '../services/comments.js';
import { getProject } from '../services/projects.js';
import { createReport, listReports, resolveReport } from '../services/reports.js';
import { getShareSettings, makerProfile, rotateShareToken, shareStatus, showcaseView, updateShareSettings } from '../services/share.js';

type IdParams = z.infer<typeof IdParamsSchema>;
const MakerParams = z.object({ makerId: z.string().max(100) });

/**
 * Links in answers and e-mails start here: APP_ORIGIN when set (it must be whenever real mail goes out), else the
 * origin the request came to, so the demo works on whatever address and port it runs on.
 */
export function requestOrigin(ctx: AppContext, req: Request) {
  return ctx.env.APP_ORIGIN ?? `${req.protocol}://${req.get('host') ?? `127.0.0.1:${ctx.env.PORT}`}`;
}

const count = (name: string, fallback: number) => {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0) throw new Error(`Whorlbook cannot start; fix this setting:\n  ${name}: must be a whole number (0 turns the limit off)`);
  return n;
};

/** Per member, in memory, per app instance (one process serves one database). 0 turns a limit off. */
function memberLimiter(limit: number, windowMs: number, message: string) {
  if (limit === 0) return (_req: Request, _res: Response, next: () => void) => next();
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    // Only used after requireUser, so there is always a member to count against.
    keyGenerator: (_req, res) => `member:${res.locals.user!.id}`,
    handler(req, res) {
      const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = reset ? Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000)) : Math.ceil(windowMs / 1000);
      const wait = seconds < 90 ? `${seconds} seconds` : `${Math.ceil(seconds / 60)} minutes`;
      res.status(429).json({ error: message.replace('{wait}', wait) });
    },
  });
}

const noStore = (res: Response) => res.set('Cache-Control', 'private, no-cache');

// API routes for the showcase (issue 8): /share/:token, comments, cheers, reports, share settings, maker profiles
// and the admins' report queue. Mounted under /api by routes/index.ts.
export function shareRouter(ctx: AppContext) {
  const router = Router();
  const { db } = ctx;

  // A person writes a comment in a minute or two; ten in ten minutes stops a script long before anyone notices.
  const commentLimit = memberLimiter(
    count('RATE_LIMIT_COMMENTS_PER_MEMBER', 10),
    10 * 60_000,
    'You have left a lot of comments in a short time. Wait {wait} and try again.',
  );
  const reportLimit = memberLimiter(count('RATE_LIMIT_REPORTS_PER_MEMBER', 20), 60 * 60_000, 'You have sent a lot of reports in a short time. Wait {wait} and try again.');

  // ---- The owner's side

  router.post('/projects/:id/share-link', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    const user = currentUser(res);
    await rotateShareToken(db, user.id, id);
    const project = await getProject(ctx, user.id, id);
    const status = await shareStatus(db, user.id, id, requestOrigin(ctx, req));
    res.json({ project, shareUrl: status.shareUrl, share: status });
  });

  router.get('/projects/:id/share', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    noStore(res).json({ share: await shareStatus(db, currentUser(res).id, id, requestOrigin(ctx, req)) });
  });

  router.get('/share-settings', requireUser, async (_req, res) => {
    noStore(res).json({ settings: await getShareSettings(db, currentUser(res).id) });
  });

  router.patch('/share-settings', requireUser, validate({ body: ShareSettingsSchema }), async (req, res) => {
    res.json({ settings: await updateShareSettings(db, currentUser(res).id, req.body as z.infer<typeof ShareSettingsSchema>) });
  });

  // ---- The public page

  router.get('/share/:token', validate({ params: TokenParams }), async (req, res) => {
    const view = await showcaseView(ctx, String(req.params.token), res.locals.user, requestOrigin(ctx, req));
    noStore(res).json({ showcase: view });
  });

  router.get('/share/:token/comments', validate({ params: TokenParams }), async (req, res) => {
    noStore(res).json({ comments: await listComments(db, String(req.params.token), res.locals.user) });
  });

  router.post('/share/:token/comments', requireUser, commentLimit, validate({ params: TokenParams, body: CreateCommentSchema }), async (req, res) => {
    const { body } = req.body as z.infer<typeof CreateCommentSchema>;
    const comment = await addComment(ctx, String(req.params.token), currentUser(res), body, requestOrigin(ctx, req));
    res.status(201).json({ comment });
  });

  router.post('/share/:token/cheer', requireUser, validate({ params: TokenParams }), async (req, res) => {
    res.json({ cheers: await addCheer(db, String(req.params.token), currentUser(res)) });
  });

  router.delete('/share/:token/cheer', requireUser, validate({ params: TokenParams }), async (req, res) => {
    res.json({ cheers: await removeCheer(db, String(req.params.token), currentUser(res)) });
  });

  // A comment is reached only through the page it is on (its link), never by id alone: see services/comments.ts.
  router.delete('/share/:token/comments/:id', requireUser, validate({ params: ShareCommentParamsSchema }), async (req, res) => {
    const { token, id } = req.params as unknown as ShareCommentParams;
    await deleteComment(db, token, id, currentUser(res));
    res.status(204).end();
  });

  // The published shape: the author or the page owner only, and the same 404 for everyone else (services/comments.ts).
  router.delete('/comments/:id', requireUser, validate({ params: IdParamsSchema }), async (req, res) => {
    await deleteCommentById(db, Number(req.params.id), currentUser(res));
    res.status(204).end();
  });

  router.patch('/share/:token/comments/:id', requireUser, validate({ params: ShareCommentParamsSchema, body: UpdateCommentSchema }), async (req, res) => {
    const { token, id } = req.params as unknown as ShareCommentParams;
    const { hidden } = req.body as z.infer<typeof UpdateCommentSchema>;
    res.json({ comment: await setCommentHidden(db, token, id, currentUser(res), hidden) });
  });

  // The showcase page sends the page's link token (and a comment id for one comment); a bare comment id is also taken.
  router.post('/reports', (_req, res, next) => {
    if (!res.locals.user) throw new HttpError(401, 'Please sign in to report something, so the admins can reach you if they need to.');
    next();
  }, reportLimit, validate({ body: CreateReportSchema }), async (req, res) => {
    const report = await createReport(db, currentUser(res), req.body as CreateReportInput);
    res.status(report.duplicate ? 200 : 201).json({ report: { id: report.id, status: report.status } });
  });

  // ---- Maker profiles (only public projects are listed)

  router.get('/makers/:makerId', validate({ params: MakerParams }), async (req, res) => {
    noStore(res).json(await makerProfile(db, String(req.params.makerId)));
  });

  // ---- The admins' report queue

  router.get('/admin/reports', requireRole('admin'), validate({ query: ReportListQuerySchema }), async (req, res) => {
    const { status } = req.query as unknown as z.infer<typeof ReportListQuerySchema>;
    noStore(res).json({ reports: await listReports(db, status) });
  });

  router.post('/admin/reports/:id/resolve', requireRole('admin'), validate({ params: IdParamsSchema, body: ResolveReportSchema }), async (req, res) => {
    const { id } = req.params as unknown as IdParams;
    const { action } = req.body as z.infer<typeof ResolveReportSchema>;
    res.json({ report: await resolveReport(db, currentUser(res), id, action) });
  });

  return router;
}
