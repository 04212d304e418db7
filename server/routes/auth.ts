import { Router } from 'express';
import type { AppContext } from '../context.js';
import { validate } from '../middleware/validate.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import { SignInSchema, type SignInInput } from '../../src/schemas/auth.js';
import { checkCredentials, startSession } from '../services/auth.js';
import { toPublicUser } from '../services/users.js';
import { DEMO_MAKER, hasDemo } from '../services/demo.js';

export function authRouter(ctx: AppContext) {
  const router = Router();

  router.post('/auth/signin', validate({ body: SignInSchema }), async (req, res) => {
    const { email, password } = req.body as SignInInput;
    const user = await checkCredentials(ctx, email, password);
    res.append('Set-Cookie', await startSession(ctx, user.id));
    res.json({ user: toPublicUser(user) });
  });

  router.post('/auth/signout', async (_req, res) => {
    if (res.locals.session) await ctx.lucia.invalidateSession(res.locals.session.id);
    res.append('Set-Cookie', ctx.lucia.createBlankSessionCookie().serialize());
    res.json({ ok: true });
  });

  router.get('/auth/me', requireUser, (_req, res) => {
    res.json({ user: toPublicUser(currentUser(res)) });
  });

  // The sign-in page offers the demo account only while this server runs with demo data.
  router.get('/auth/demo', async (_req, res) => {
    const demo = ctx.env.SEED_DEMO && (await hasDemo(ctx.db));
    res.json({ demo: demo ? { email: DEMO_MAKER.email, password: DEMO_MAKER.password } : null });
  });

  return router;
}
