import type { AppContext } from '../context.js';
import { HttpError } from '../lib/http-error.js';
import { dummyPasswordHash, verifyPassword } from '../lib/password.js';
import { findUserByEmail, type UserRow } from './users.js';

// One message for an unknown e-mail and a wrong password, so sign-in never tells which accounts exist
// (OWASP Authentication Cheat Sheet, "Authentication and error messages").
const WRONG = 'That e-mail and password do not match an account. Check both and try again.';

export async function checkCredentials(ctx: AppContext, email: string, password: string): Promise<UserRow> {
  const user = await findUserByEmail(ctx.db, email);
  if (!user) {
    await verifyPassword(await dummyPasswordHash(), password);
    throw new HttpError(401, WRONG);
  }
  if (!(await verifyPassword(user.password_hash, password))) throw new HttpError(401, WRONG);
  if (user.disabled_at) throw new HttpError(403, 'This account has been disabled. Contact the Whorlbook admins if you think this is a mistake.');
  return user;
}

export async function startSession(ctx: AppContext, userId: string) {
  await ctx.db('users').where({ id: userId }).update({ last_sign_in_at: new Date().toISOString() });
  const session = await ctx.lucia.createSession(userId, {});
  return ctx.lucia.createSessionCookie(session.id).serialize();
}
