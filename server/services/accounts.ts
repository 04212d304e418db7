import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { AppContext } from '../context.js';
import { HttpError } from '../lib/http-error.js';
import { renderMail, tokenLink } from '../lib/mail-template.js';
import type { MailMessage } from '../lib/mail.js';
import { hashPassword, verifyPassword } from '../lib/password.js';
import { createUser, findUserByEmail, normalizeEmail, type UserRow } from './users.js';
import type { ChangeEmailInput, DeleteAccountInput, PasswordChangeInput, SignUpInput } from '../../src/schemas/auth.js';
import { deleteProjectPhotoFiles } from '../lib/storage.js';

// Guidance followed here: OWASP Authentication Cheat Sheet and Forgot Password Cheat Sheet (random single-use
// tokens stored hashed, short expiry, the same answer whether or not an account exists, no automatic sign-in
// after a reset, a notice e-mail after a change) and NIST SP 800-63B §5.1.1 (length rules live in src/schemas/auth.ts).

export type TokenPurpose = 'verify_email' | 'reset_password' | 'change_email';
export const TOKEN_TTL_MS: Record<TokenPurpose, number> = {
  verify_email: 48 * 60 * 60 * 1000,
  reset_password: 60 * 60 * 1000,
  change_email: 24 * 60 * 60 * 1000,
};

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
const nowIso = () => new Date().toISOString();

interface TokenRow {
  id: number;
  user_id: string;
  purpose: TokenPurpose;
  token_hash: string;
  email: string;
  expires_at: number;
  used_at: number | null;
}

/**
 * A fresh 32-byte random token; only its SHA-256 is stored. Returns the token to put in the link. `email` is the
 * address the link goes to (for an address change, the new one).
 */
export async function issueToken(db: Knex, user: Pick<UserRow, 'id' | 'email'>, purpose: TokenPurpose, email = user.email): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await db('auth_tokens').insert({
    user_id: user.id,
    purpose,
    token_hash: hashToken(token),
    email,
    expires_at: Date.now() + TOKEN_TTL_MS[purpose],
  });
  return token;
}

const TOKEN_PROBLEM: Record<TokenPurpose, { unknown: string; used: string; expired: string }> = {
  verify_email: {
    unknown: 'This confirmation link is not valid. Open the newest link from your e-mail, or ask for a new one.',
    used: 'This confirmation link was already used. If your address still shows as unconfirmed, ask for a new link.',
    expired: 'This confirmation link has expired (links last 48 hours). Sign in and ask for a new one.',
  },
  change_email: {
    unknown: 'This link to change your e-mail is not valid. Open the newest one, or ask again from the Me page.',
    used: 'This link to change your e-mail was already used. Sign in with the address it changed to.',
    expired: 'This link to change your e-mail has expired (links last 24 hours). Ask again from the Me page.',
  },
  reset_password: {
    unknown: 'This reset link is not valid. Ask for a new one from "Forgot your password?".',
    used: 'This reset link was already used. Ask for a new one from "Forgot your password?" if you still need it.',
    expired: 'This reset link has expired (links last 1 hour). Ask for a new one from "Forgot your password?".',
  },
};

/**
 * Marks the token used and returns its row, inside the caller's transaction. The conditional UPDATE is what
 * makes a token single-use even when two requests race with the same link.
 */
async function consumeToken(trx: Knex.Transaction, token: string, purpose: TokenPurpose): Promise<TokenRow> {
  const row = await checkToken(trx, token, purpose);
  const updated = await trx('auth_tokens').where({ id: row.id }).whereNull('used_at').update({ used_at: Date.now() });
  if (updated !== 1) throw new HttpError(400, TOKEN_PROBLEM[purpose].used);
  return row;
}

/** The token's row if it is known, unused and unexpired; otherwise a 400 saying which. Changes nothing. */
async function checkToken(db: Knex, token: string, purpose: TokenPurpose): Promise<TokenRow> {
  const row = await db<TokenRow>('auth_tokens').where({ token_hash: hashToken(token), purpose }).first();
  const problem = TOKEN_PROBLEM[purpose];
  if (!row) throw new HttpError(400, problem.unknown);
  if (row.used_at !== null) throw new HttpError(400, problem.used);
  if (Number(row.expires_at) <= Date.now()) throw new HttpError(400, problem.expired);
  return row;
}

/** Sends and reports failure in the log only: a mail server hiccup must not undo an account or a reset. */
async function deliver(ctx: AppContext, message: MailMessage): Promise<boolean> {
  try {
    await ctx.mailer.send(message);
    return true;
  } catch (err) {
    ctx.logger.error({ err, subject: message.subject }, 'sending e-mail failed');
    return false;
  }
}

function verificationMail(user: Pick<UserRow, 'email' | 'display_name'>, link: string): MailMessage {
  return {
    to: user.email,
    subject: 'Confirm your e-mail for Whorlbook',
    ...renderMail({
      greeting: `Hello ${user.display_name},`,
      paragraphs: [
        'Welcome to Whorlbook. Please confirm that this is your e-mail address, so we can reach you if you ever forget your password.',
        'The link works once and lasts 48 hours.',
      ],
      action: { label: 'Confirm my e-mail', url: link },
      footer: 'If you did not make a Whorlbook account, ignore this e-mail and nothing will happen.\n\nWhorlbook',
    }),
  };
}

export async function sendVerification(ctx: AppContext, user: Pick<UserRow, 'id' | 'email' | 'display_name'>, origin: string) {
  const token = await issueToken(ctx.db, user, 'verify_email');
  return deliver(ctx, verificationMail(user, tokenLink(origin, '/verify-email', token)));
}

function isUniqueViolation(err: unknown) {
  return typeof err === 'object' && err !== null && 'code' in err && String((err as { code: unknown }).code).startsWith('SQLITE_CONSTRAINT');
}

export async function signUp(ctx: AppContext, input: SignUpInput, origin: string): Promise<UserRow> {
  let user: UserRow;
  try {
    user = await createUser(ctx.db, { email: input.email, password: input.password, displayName: input.displayName });
  } catch (err) {
    // Two sign-ups with one address at the same moment: the unique index decides, and the loser hears the same 409.
    if (isUniqueViolation(err)) throw new HttpError(409, 'An account with that e-mail already exists. Try signing in instead.');
    throw err;
  }
  await sendVerification(ctx, user, origin);
  return user;
}

export async function verifyEmail(ctx: AppContext, token: string) {
  return ctx.db.transaction(async (trx) => {
    const row = await consumeToken(trx, token, 'verify_email');
    const user = await trx<UserRow>('users').where({ id: row.user_id }).first();
    // The address changed since the link was sent: the link no longer proves anything about the account.
    if (!user || user.email !== row.email) throw new HttpError(400, TOKEN_PROBLEM.verify_email.unknown);
    if (!user.email_verified_at) await trx('users').where({ id: user.id }).update({ email_verified_at: nowIso(), updated_at: nowIso() });
    return { email: user.email, userId: user.id };
  });
}

export async function resendVerification(ctx: AppContext, userId: string, origin: string) {
  const user = await ctx.db<UserRow>('users').where({ id: userId }).first();
  if (!user) throw new HttpError(401, 'Please sign in to continue.');
  if (user.email_verified_at) throw new HttpError(409, 'Your e-mail address is already confirmed. Nothing more to do.');
  if (!(await sendVerification(ctx, user, origin))) {
    throw new HttpError(503, 'We could not send the e-mail just now. Please try again in a few minutes.');
  }
  return user.email;
}

export const RESET_REQUESTED =
  'If an account uses that e-mail address, we have sent it a link to choose a new password. The link works once, for 1 hour. Check your spam folder if nothing arrives in a few minutes.';

/**
 * Always resolves the same way. The e-mail goes out after the answer, so an existing account does not take
 * measurably longer to answer than a missing one (OWASP Forgot Password Cheat Sheet, "consistent response time").
 */
export async function requestPasswordReset(ctx: AppContext, email: string, origin: string): Promise<void> {
  const user = await findUserByEmail(ctx.db, email);
  if (!user || user.disabled_at) return;
  const token = await issueToken(ctx.db, user, 'reset_password');
  const link = tokenLink(origin, '/reset-password', token);
  void deliver(ctx, {
    to: user.email,
    subject: 'Choose a new Whorlbook password',
    ...renderMail({
      greeting: `Hello ${user.display_name},`,
      paragraphs: [
        'Someone (we hope you) asked to reset the password of your Whorlbook account. Use the button below to choose a new one.',
        'The link works once and lasts 1 hour. Choosing a new password signs you out everywhere, so you then sign in with the new one.',
      ],
      action: { label: 'Choose a new password', url: link },
      footer: 'If you did not ask for this, ignore this e-mail: your password stays as it is.\n\nWhorlbook',
    }),
  });
}

function passwordChangedMail(user: Pick<UserRow, 'email' | 'display_name'>, origin: string): MailMessage {
  return {
    to: user.email,
    subject: 'Your Whorlbook password was changed',
    ...renderMail({
      greeting: `Hello ${user.display_name},`,
      paragraphs: [
        `The password of your Whorlbook account was just changed (${new Date().toUTCString()}), and other devices were signed out.`,
        'If that was you, there is nothing more to do. If it was not, choose a new password straight away with "Forgot your password?" on the sign-in page.',
      ],
      action: { label: 'Open Whorlbook', url: new URL('/sign-in', origin).toString() },
    }),
  };
}

export async function confirmPasswordReset(ctx: AppContext, token: string, password: string, origin: string) {
  // Check the link before paying for scrypt (~90 ms), so junk tokens cost next to nothing; the transaction below
  // checks again and is what actually decides.
  await checkToken(ctx.db, token, 'reset_password');
  const passwordHash = await hashPassword(password);
  const user = await ctx.db.transaction(async (trx) => {
    const row = await consumeToken(trx, token, 'reset_password');
    const user = await trx<UserRow>('users').where({ id: row.user_id }).first();
    if (!user || user.email !== row.email) throw new HttpError(400, TOKEN_PROBLEM.reset_password.unknown);
    if (user.disabled_at) throw new HttpError(403, 'This account has been disabled. Contact the Whorlbook admins if you think this is a mistake.');
    const now = nowIso();
    // Receiving the link proves the address works, so an unconfirmed address counts as confirmed from here on.
    await trx('users')
      .where({ id: user.id })
      .update({ password_hash: passwordHash, updated_at: now, email_verified_at: user.email_verified_at ?? now });
    // Every other outstanding reset link dies with this one, and every session ends.
    await trx('auth_tokens').where({ user_id: user.id, purpose: 'reset_password' }).whereNull('used_at').update({ used_at: Date.now() });
    await trx('sessions').where({ user_id: user.id }).delete();
    return user;
  });
  void deliver(ctx, passwordChangedMail(user, origin));
}

/** Changes the signed-in member's password and ends every session but the one making the change. */
export async function changePassword(ctx: AppContext, userId: string, keepSessionId: string, input: PasswordChangeInput, origin: string) {
  const user = await ctx.db<UserRow>('users').where({ id: userId }).first();
  if (!user) throw new HttpError(401, 'Please sign in to continue.');
  if (!(await verifyPassword(user.password_hash, input.current))) {
    throw new HttpError(403, 'That is not your current password.', [{ path: 'current', message: 'That is not your current password.' }]);
  }
  const passwordHash = await hashPassword(input.next);
  await ctx.db.transaction(async (trx) => {
    await trx('users').where({ id: user.id }).update({ password_hash: passwordHash, updated_at: nowIso() });
    await trx('sessions').where({ user_id: user.id }).whereNot({ id: keepSessionId }).delete();
    await trx('auth_tokens').where({ user_id: user.id, purpose: 'reset_password' }).whereNull('used_at').update({ used_at: Date.now() });
  });
  void deliver(ctx, passwordChangedMail(user, origin));
}

function accountDeletedMail(user: Pick<UserRow, 'email' | 'display_name'>, origin: string): MailMessage {
  return {
    to: user.email,
    subject: 'Your Whorlbook account is deleted',
    ...renderMail({
      greeting: `Hello ${user.display_name},`,
      paragraphs: [
        `Your Whorlbook account was deleted (${new Date().toUTCString()}), with its patterns, projects, counts, journal, photos, comments and shared pages.`,
        'If you did not ask for this, someone had your password: tell the people who run this Whorlbook straight away. You are welcome to sign up again at any time.',
      ],
      action: { label: 'Open Whorlbook', url: new URL('/', origin).toString() },
    }),
  };
}

/**
 * Deletes the signed-in member and everything that is theirs. The rows go in one transaction (every table that
 * names a member cascades from `users`), then the photo files of their projects. The last admin cannot leave,
 * or nobody could look after the members.
 */
export async function deleteAccount(ctx: AppContext, userId: string, input: DeleteAccountInput, origin: string) {
  const user = await ctx.db<UserRow>('users').where({ id: userId }).first();
  if (!user) throw new HttpError(401, 'Please sign in to continue.');
  if (!(await verifyPassword(user.password_hash, input.password))) {
    throw new HttpError(403, 'That is not your password.', [{ path: 'password', message: 'That is not your password.' }]);
  }
  const projectIds = await ctx.db.transaction(async (trx) => {
    if (user.role === 'admin') {
      const others = await trx('users').where({ role: 'admin' }).whereNull('disabled_at').whereNot({ id: user.id }).count<{ n: number }[]>({ n: '*' });
      if (!Number(others[0]?.n)) {
        throw new HttpError(409, 'You are the only admin. Make another member an admin before deleting your account.');
      }
    }
    const ids: number[] = (await trx('projects').where({ owner_id: user.id }).select('id')).map((r: { id: number }) => r.id);
    await trx('users').where({ id: user.id }).delete();
    return ids;
  });
  for (const id of projectIds) await deleteProjectPhotoFiles(ctx, id);
  void deliver(ctx, accountDeletedMail(user, origin));
}

export const EMAIL_CHANGE_SENT = (email: string) =>
  `We sent a link to ${email}. Your sign-in address changes when you open it (within 24 hours); until then it stays as it is.`;

/**
 * Starts a change of sign-in address: after the password, a link goes to the new address, which changes only when
 * that link is opened. The answer is the same whether or not the new address already has an account (that
 * address hears about it instead), so this cannot be used to find out who is a member.
 */
export async function requestEmailChange(ctx: AppContext, userId: string, input: ChangeEmailInput, origin: string) {
  const user = await ctx.db<UserRow>('users').where({ id: userId }).first();
  if (!user) throw new HttpError(401, 'Please sign in to continue.');
  if (!(await verifyPassword(user.password_hash, input.password))) {
    throw new HttpError(403, 'That is not your password.', [{ path: 'password', message: 'That is not your password.' }]);
  }
  const email = normalizeEmail(input.email);
  if (email === user.email) {
    throw new HttpError(422, 'That is already your e-mail address.', [{ path: 'email', message: 'That is already your e-mail address.' }]);
  }
  const taken = await findUserByEmail(ctx.db, email);
  if (taken) {
    void deliver(ctx, {
      to: email,
      subject: 'Someone tried to use this address on Whorlbook',
      ...renderMail({
        greeting: 'Hello,',
        paragraphs: [
          'A Whorlbook member asked to move their account to this e-mail address, but this address already has a Whorlbook account, so nothing changed.',
          'If that was you, sign in with this address instead, or delete one of the two accounts from its Me page first.',
        ],
        action: { label: 'Open Whorlbook', url: new URL('/sign-in', origin).toString() },
      }),
    });
    return email;
  }
  const token = await issueToken(ctx.db, user, 'change_email', email);
  void deliver(ctx, {
    to: email,
    subject: 'Confirm your new e-mail for Whorlbook',
    ...renderMail({
      greeting: `Hello ${user.display_name},`,
      paragraphs: [
        'You asked to sign in to Whorlbook with this address from now on. Open the link below to make the change.',
        'The link works once and lasts 24 hours. Until then you still sign in with your current address.',
      ],
      action: { label: 'Use this e-mail', url: tokenLink(origin, '/change-email', token) },
      footer: 'If you did not ask for this, ignore this e-mail and nothing will change.\n\nWhorlbook',
    }),
  });
  return email;
}

/**
 * Opens the link sent to the new address: the account's address becomes it (and counts as confirmed, since the
 * link proves it), other links still out for the old address stop working, and the old address is told.
 */
export async function confirmEmailChange(ctx: AppContext, token: string) {
  const { user, email } = await ctx.db.transaction(async (trx) => {
    const row = await consumeToken(trx, token, 'change_email');
    const user = await trx<UserRow>('users').where({ id: row.user_id }).first();
    if (!user || user.disabled_at) throw new HttpError(400, TOKEN_PROBLEM.change_email.unknown);
    const taken = await trx<UserRow>('users').where({ email: row.email }).whereNot({ id: user.id }).first();
    if (taken) throw new HttpError(409, 'That address got its own Whorlbook account meanwhile, so your address stays as it is.');
    const now = nowIso();
    await trx('users').where({ id: user.id }).update({ email: row.email, email_verified_at: now, updated_at: now });
    // Reset and verification links, and other address changes, were for the old state of the account.
    await trx('auth_tokens').where({ user_id: user.id }).whereNull('used_at').update({ used_at: Date.now() });
    return { user, email: row.email };
  });
  void deliver(ctx, {
    to: user.email,
    subject: 'Your Whorlbook e-mail was changed',
    ...renderMail({
      greeting: `Hello ${user.display_name},`,
      paragraphs: [
        `Your Whorlbook account now signs in with ${email} instead of this address (${new Date().toUTCString()}).`,
        'If that was you, there is nothing more to do. If it was not, someone has your password: tell the people who run this Whorlbook straight away.',
      ],
    }),
  });
  return { email };
}
