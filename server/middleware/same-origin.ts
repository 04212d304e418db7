import type { NextFunction, Request, Response } from 'express';
import { HttpError } from '../lib/http-error.js';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests that a browser sent from another origin (CSRF defence in depth beside
 * SameSite=Lax cookies; OWASP CSRF cheat sheet, "Verifying origin with standard headers"). "Own origin" is the
 * request's Host plus APP_ORIGIN when set. A request with neither Origin nor Referer did not come from a
 * browser page (browsers send Origin on every cross-origin POST), so it carries no ambient-cookie risk.
 */
export function sameOrigin(appOrigin?: string) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE.has(req.method)) return next();
    const source = req.headers.origin ?? req.headers.referer;
    if (source === undefined) return next();
    let sourceHost: string | null;
    try {
      sourceHost = new URL(source).host;
    } catch {
      sourceHost = null; // "null" origins (sandboxed frames, file://) are never ours
    }
    const allowed = [req.headers.host, appOrigin ? new URL(appOrigin).host : undefined].filter(Boolean);
    if (!sourceHost || !allowed.includes(sourceHost)) {
      throw new HttpError(403, 'This request came from another site and was refused. Open Whorlbook directly and try again.');
    }
    next();
  };
}
