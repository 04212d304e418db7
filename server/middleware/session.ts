import type { NextFunction, Request, Response } from 'express';
import type { User, Session } from 'lucia';
import type { AppLucia } from '../lib/auth.js';

declare module 'express-serve-static-core' {
  interface Locals {
    user: User | null;
    session: Session | null;
  }
}

/** Reads the session cookie on every request, refreshes it when Lucia extends the session. */
export function sessionMiddleware(lucia: AppLucia) {
  return async (req: Request, res: Response, next: NextFunction) => {
    const sessionId = lucia.readSessionCookie(req.headers.cookie ?? '');
    res.locals.user = null;
    res.locals.session = null;
    if (!sessionId) return next();
    const { session, user } = await lucia.validateSession(sessionId);
    if (session?.fresh) res.append('Set-Cookie', lucia.createSessionCookie(session.id).serialize());
    if (!session) res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize());
    if (session && user && user.disabled) {
      // A disabled member keeps no way in, even with a cookie issued before.
      await lucia.invalidateUserSessions(user.id);
      res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize());
      return next();
    }
    res.locals.user = user;
    res.locals.session = session;
    next();
  };
}
