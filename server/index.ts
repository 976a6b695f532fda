import { createApp } from './app';
import { loadConfig } from './config';
import { createContext, type AppContext, type ContextOptions } from './context';
import { createDb } from './db';
import { listenDraining } from './http-server';
import { createLogger } from './logger';

/** Starts the API (and the built client) on the configured host and port. */
export async function startServer(options: ContextOptions = {}): Promise<{ close(): Promise<void>; url: string; ctx: AppContext }> {
  const config = loadConfig();
  const logger = options.logger ?? createLogger(config.log);
  const db = createDb(config.db, logger);
  const ctx = createContext(config, db, { ...options, logger });
  await ctx.start();
  const app = createApp(ctx, { clientDir: 'dist' });
  const http = await listenDraining(app, config.port, config.host, config.shutdownGraceMs);
  return {
    url: http.url,
    ctx,
    // One deadline for the whole shutdown: answers in progress first, then batches of outlines being derived (runs and lab jobs go on in the workers).
    close: async () => {
      const deadline = Date.now() + config.shutdownGraceMs;
      await http.close();
      await ctx.close(Math.max(0, deadline - Date.now()));
      await db.destroy();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const running = await startServer();
  running.ctx.logger.info({ url: running.url }, 'serving');
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    process.once(signal, () => {
      running.ctx.logger.info({ signal }, 'shutting down');
      void running.close().then(() => process.exit(0));
    });
  }
}
