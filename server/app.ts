import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppContext } from './context';
import { errorHandler } from './middleware/error-handler';
import { requestLog } from './middleware/request-log';
import { apiRouter } from './routes';

export interface AppOptions {
  /** Folder of the built client to serve (with SPA fallback); omitted in API-only tests. */
  clientDir?: string;
}

/** The Express app: security headers, the API under /api (server/routes), the built client, one error handler. */
export function createApp(ctx: AppContext, options: AppOptions = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(requestLog(ctx.logger));
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Inline style attributes are needed by Quasar transitions and chart tooltips; no inline scripts are allowed.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
        },
      },
    }),
  );
  app.use(cookieParser());
  app.use('/api', apiRouter(ctx));

  if (options.clientDir && existsSync(options.clientDir)) {
    const dir = path.resolve(options.clientDir);
    app.use(express.static(dir, { index: false, maxAge: '1h' }));
    // Client-side routes all load the same page.
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(path.join(dir, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
