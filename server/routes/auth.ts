import { Router } from 'express';
import type { AppContext } from '../context.js';
import { validate } from '../middleware/validate.js';
import { currentUser, requireUser } from '../middleware/require-user.js';
import {
  ChangeEmailSchema,
  ConfirmEmailChangeSchema,
  DeleteAccountSchema,
  PasswordChangeSchema,
  PasswordResetConfirmSchema,
  PasswordResetRequestSchema,
  SignInSchema,
  SignUpSchema,
  VerifyEmailSchema,
  type ChangeEmailInput,
  type DeleteAccountInput,
  type PasswordChangeInput,
  type PasswordResetConfirmInput,
  type PasswordResetRequestInput,
  type SignInInput,
  type SignUpInput,
  type VerifyEmailInput,
} from '../../src/schemas/auth.js';
import { checkCredentials, startSession } from '../services/auth.js';
import {
  RESET_REQUESTED,
  EMAIL_CHANGE_SENT,
  changePassword,
  confirmEmailChange,
  confirmPasswordReset,
  deleteAccount,
  requestEmailChange,
  requestPasswordReset,
  resendVerification,
  signUp,
  verifyEmail,
} from '../services/accounts.js';
import { toPublicUser } from '../services/users.js';
import { DEMO_MAKER, hasDemo } from '../services/demo.js';
import { authLimiters } from '../lib/rate-limit.js';
import { publicOrigin } from '../lib/mail-template.js';

export function authRouter(ctx: AppContext) {
  const router = Router();
  // Built here, so every createApp() starts with empty counters.
  const limit = authLimiters();

  // Limiters run before validation, so a script sending junk is counted too.
  router.post('/auth/signin', limit.signInIp, limit.signInAccount, validate({ body: SignInSchema }), async (req, res) => {
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

  router.post('/auth/signup', limit.signUpIp, validate({ body: SignUpSchema }), async (req, res) => {
    const user = await signUp(ctx, req.body as SignUpInput, publicOrigin(ctx.env, req));
    // A new member starts signed in, on whatever session the browser had before (that one ends).
    if (res.locals.session) await ctx.lucia.invalidateSession(res.locals.session.id);
    res.append('Set-Cookie', await startSession(ctx, user.id));
    res.status(201).json({ user: toPublicUser(user) });
  });

  // No sign-in needed: the link may be opened on another device than the one that signed up.
  router.post('/auth/verify-email', validate({ body: VerifyEmailSchema }), async (req, res) => {
    const { email } = await verifyEmail(ctx, (req.body as VerifyEmailInput).token);
    res.json({ ok: true, email });
  });

  router.post('/auth/verify-email/resend', requireUser, limit.resendAccount, async (req, res) => {
    const email = await resendVerification(ctx, currentUser(res).id, publicOrigin(ctx.env, req));
    res.status(202).json({ ok: true, message: `We sent a new confirmation link to ${email}. It lasts 48 hours.` });
  });

  router.post('/auth/password-reset/request', limit.resetIp, limit.resetAccount, validate({ body: PasswordResetRequestSchema }), async (req, res) => {
    await requestPasswordReset(ctx, (req.body as PasswordResetRequestInput).email, publicOrigin(ctx.env, req));
    res.status(202).json({ ok: true, message: RESET_REQUESTED });
  });

  router.post('/auth/password-reset/confirm', validate({ body: PasswordResetConfirmSchema }), async (req, res) => {
    const { token, password } = req.body as PasswordResetConfirmInput;
    await confirmPasswordReset(ctx, token, password, publicOrigin(ctx.env, req));
    // Every session of the member ended, this browser's too if it had one; they sign in with the new password.
    if (res.locals.session) res.append('Set-Cookie', ctx.lucia.createBlankSessionCookie().serialize());
    res.json({ ok: true, message: 'Your password is changed and every device was signed out. Sign in with the new password.' });
  });

  router.post('/auth/password', requireUser, limit.passwordChangeAccount, validate({ body: PasswordChangeSchema }), async (req, res) => {
    await changePassword(ctx, currentUser(res).id, res.locals.session!.id, req.body as PasswordChangeInput, publicOrigin(ctx.env, req));
    res.json({ ok: true, message: 'Your password is changed. Other devices were signed out; this one stays signed in.' });
  });

  // A link goes to the new address; the account changes only when it is opened (answered the same either way).
  router.post('/auth/email', requireUser, limit.passwordChangeAccount, validate({ body: ChangeEmailSchema }), async (req, res) => {
    const email = await requestEmailChange(ctx, currentUser(res).id, req.body as ChangeEmailInput, publicOrigin(ctx.env, req));
    res.status(202).json({ ok: true, message: EMAIL_CHANGE_SENT(email) });
  });

  router.post('/auth/email/confirm', validate({ body: ConfirmEmailChangeSchema }), async (req, res) => {
    const { email } = await confirmEmailChange(ctx, (req.body as VerifyEmailInput).token);
    res.json({ ok: true, email, message: `Done: you now sign in with ${email}.` });
  });

  // The password is asked again (and rate limited like a password change); the session cookie goes with the account.
  router.delete('/auth/account', requireUser, limit.passwordChangeAccount, validate({ body: DeleteAccountSchema }), async (req, res) => {
    await deleteAccount(ctx, currentUser(res).id, req.body as DeleteAccountInput, publicOrigin(ctx.env, req));
    res.append('Set-Cookie', ctx.lucia.createBlankSessionCookie().serialize());
    res.json({ ok: true, message: 'Your account and everything in it are deleted.' });
  });

  return router;
}
