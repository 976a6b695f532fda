import compression from 'compression';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppContext } from './context';
import { clientAssets } from './middleware/client-assets';
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
  // API answers are no-store, never revalidated: hashing every body for an entity tag would be wasted (the client's files keep theirs).
  app.set('etag', false);
  app.set('trust proxy', 'loopback');
  app.use(requestLog(ctx.logger));
  const clientDir = options.clientDir && existsSync(options.clientDir) ? path.resolve(options.clientDir) : null;
  // Hashed scripts, styles and fonts first: the compressed copies of the build, with a subresource's headers only.
  if (clientDir && existsSync(path.join(clientDir, 'assets'))) app.use('/assets', clientAssets(path.join(clientDir, 'assets')));
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
  // gzip or brotli, as the browser asks, for JSON and text assets (compression skips what is already compressed).
  app.use(compression());
  app.use(cookieParser());
  app.use('/api', apiRouter(ctx));

  if (clientDir) {
    app.use(express.static(clientDir, { index: false, setHeaders: setClientCacheHeaders }));
    // Client-side routes all load the same page.
    app.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(path.join(clientDir, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } }));
  }

  app.use(errorHandler);
  return app;
}

/**
 * The page itself is revalidated on every load so a release reaches everyone at once; other public
 * files (logo, favicon) keep an hour. Hashed assets are clientAssets' (a year, immutable).
 */
function setClientCacheHeaders(res: express.Response, file: string): void {
  res.setHeader('Cache-Control', path.basename(file) === 'index.html' ? 'no-cache' : 'public, max-age=3600');
}
