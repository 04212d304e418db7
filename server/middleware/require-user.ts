import type { NextFunction, Request, Response } from 'express';
import type { User } from 'lucia';
import { HttpError } from '../lib/http-error.js';
import type { Role } from '../lib/auth.js';

export function requireUser(_req: Request, res: Response, next: NextFunction) {
  if (!res.locals.user) throw new HttpError(401, 'Please sign in to continue.');
  next();
}

export function requireRole(role: Role) {
  return (_req: Request, res: Response, next: NextFunction) => {
    const user = res.locals.user;
    if (!user) throw new HttpError(401, 'Please sign in to continue.');
    if (user.role !== role) throw new HttpError(403, 'Only an admin can do that.');
    next();
  };
}

/** The signed-in member; only call after requireUser. */
export function currentUser(res: Response): User {
  const user = res.locals.user;
  if (!user) throw new HttpError(401, 'Please sign in to continue.');
  return user;
}
