import type { NextFunction, Request, Response } from 'express';
import { ZodError } from 'zod';
import { HttpError } from '../lib/http-error.js';
import type { Logger } from '../lib/logger.js';
import { zodIssues } from './validate.js';

interface BodyParserError extends Error {
  type?: string;
  status?: number;
}

/** The one error shape: { error, issues? }. Unknown errors are 500 with the detail only in the log. */
export function errorHandler(logger: Logger) {
  return (err: unknown, req: Request, res: Response, _next: NextFunction) => {
    if (res.headersSent) return;
    if (err instanceof HttpError) {
      if (err.headers) res.set(err.headers);
      res.status(err.status).json({ error: err.message, ...(err.issues ? { issues: err.issues } : {}) });
      return;
    }
    if (err instanceof ZodError) {
      res.status(422).json({ error: 'Some fields need another look.', issues: zodIssues(err) });
      return;
    }
    const bp = err as BodyParserError;
    if (bp?.type === 'entity.parse.failed') {
      res.status(400).json({ error: 'The request body is not valid JSON.' });
      return;
    }
    if (bp?.type === 'entity.too.large') {
      res.status(413).json({ error: 'That request is too large.' });
      return;
    }
    if (typeof bp?.status === 'number' && bp.status >= 400 && bp.status < 500) {
      res.status(bp.status).json({ error: 'That request could not be read.' });
      return;
    }
    logger.error({ err, url: req.originalUrl, method: req.method }, 'unhandled error');
    res.status(500).json({ error: 'Something went wrong on our side. Please try again in a moment.' });
  };
}
