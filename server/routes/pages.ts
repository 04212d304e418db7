import { Router } from 'express';
import type { AppContext } from '../context.js';

// Server-rendered page routes that need their own <head> (the showcase /p/:token, issue 8).
export function pagesRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
