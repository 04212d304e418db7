import { Router } from 'express';
import type { AppContext } from '../context.js';

// Non-API file routes for photos (issue 7), each request checked against who may see the photo.
export function mediaRouter(_ctx: AppContext) {
  const router = Router();
  return router;
}
