import { createApp } from './app';
import { loadConfig } from './config';
import { createContext, type AppContext, type ContextOptions } from './context';
import { createDb } from './db';

/** Starts the API (and the built client) on the configured host and port. */
export async function startServer(options: ContextOptions = {}): Promise<{ close(): Promise<void>; url: string; ctx: AppContext }> {
  const config = loadConfig();
  const db = createDb(config.db);
  const ctx = createContext(config, db, options);
  await ctx.start();
  const app = createApp(ctx, { clientDir: 'dist' });
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
  const url = `http://${config.host}:${config.port}`;
  return {
    url,
    ctx,
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await ctx.close();
      await db.destroy();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  void startServer().then(({ url }) => console.log(`[tarnish] serving ${url}`));
}
