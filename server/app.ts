import fs from 'node:fs';
import path from 'node:path';
import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppContext } from './context.js';
import { errorHandler } from './middleware/error-handler.js';
import { sameOrigin } from './middleware/same-origin.js';
import { sessionMiddleware } from './middleware/session.js';
import { apiRouter } from './routes/index.js';
import { mediaRouter } from './routes/media.js';
import { pagesRouter } from './routes/pages.js';
import { distDir, renderIndex } from './lib/spa.js';

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp(ctx: AppContext) {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          manifestSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          ...(ctx.env.APP_ORIGIN?.startsWith('https:') ? { upgradeInsecureRequests: [] } : {}),
        },
      },
      crossOriginEmbedderPolicy: false,
      // HSTS only means something over https; on http://127.0.0.1 it would only confuse.
      strictTransportSecurity: ctx.env.APP_ORIGIN?.startsWith('https:') ? undefined : false,
    }),
  );
  app.use(pinoHttp({ logger: ctx.logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  app.use(express.json({ limit: '1mb' }));
  app.use(sessionMiddleware(ctx.lucia));
  app.use(sameOrigin(ctx.env.APP_ORIGIN));

  app.use('/api', apiRouter(ctx));
  app.use(mediaRouter(ctx));
  app.use(pagesRouter(ctx));

  if (fs.existsSync(distDir)) {
    // Hashed build assets never change under the same name; everything else revalidates.
    app.use('/assets', express.static(path.join(distDir, 'assets'), { immutable: true, maxAge: '1y', index: false }));
    app.use(express.static(distDir, { index: false }));
  }
  app.get('/{*splat}', (_req, res) => {
    res.type('html').set('Cache-Control', 'no-cache').send(renderIndex());
  });

  app.use(errorHandler(ctx.logger));
  return app;
}
