import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context.js';
import { currentUser, requireRole } from '../middleware/require-user.js';
import { validate } from '../middleware/validate.js';
import { AdminSetRoleSchema, AdminUserListQuerySchema, type AdminSetRoleInput, type AdminUserListQuery } from '../../src/schemas/auth.js';
import { listUsers, setDisabled, setRole } from '../services/admin.js';

const UserParams = z.object({ id: z.string().regex(/^[a-z0-9]{1,64}$/, { message: 'That member id is not valid.' }) });

// API routes for accounts (issue 3): /admin/*. Mounted under /api by routes/index.ts.
export function adminRouter(ctx: AppContext) {
  const router = Router();
  // Every /admin route: signed out → 401, a member → 403.
  router.use('/admin', requireRole('admin'));

  router.get('/admin/users', validate({ query: AdminUserListQuerySchema }), async (req, res) => {
    res.json(await listUsers(ctx.db, req.query as unknown as AdminUserListQuery));
  });

  router.post('/admin/users/:id/disable', validate({ params: UserParams }), async (req, res) => {
    res.json({ user: await setDisabled(ctx, currentUser(res).id, String(req.params.id), true) });
  });

  router.post('/admin/users/:id/enable', validate({ params: UserParams }), async (req, res) => {
    res.json({ user: await setDisabled(ctx, currentUser(res).id, String(req.params.id), false) });
  });

  router.post('/admin/users/:id/role', validate({ params: UserParams, body: AdminSetRoleSchema }), async (req, res) => {
    res.json({ user: await setRole(ctx, currentUser(res).id, String(req.params.id), (req.body as AdminSetRoleInput).role) });
  });

  return router;
}
