import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';
import { HttpError } from '../lib/http-error.js';

export function zodIssues(error: z.ZodError) {
  return error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
}

/** Parses and replaces req.body / req.params / req.query with the schema's output, or answers 422. */
export function validate(schemas: { body?: z.ZodType; params?: z.ZodType; query?: z.ZodType }) {
  return (req: Request, _res: Response, next: NextFunction) => {
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(part === 'body' ? (req.body ?? {}) : req[part]);
      if (!result.success) {
        const issues = zodIssues(result.error);
        const first = issues[0];
        const where = first?.path ? `${first.path}: ` : '';
        throw new HttpError(422, `Please check the ${part === 'body' ? 'form' : part}: ${where}${first?.message}`, issues);
      }
      // Express 5 exposes req.query through a getter; shadow it with the parsed value.
      Object.defineProperty(req, part, { value: result.data, writable: true, configurable: true, enumerable: true });
    }
    next();
  };
}
