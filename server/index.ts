import { createApp } from './app';
import { loadConfig } from './config';
import { createContext } from './context';
import { createDb } from './db';

/** Starts the API (and the built client) on the configured host and port. */
export async function startServer(): Promise<{ close(): Promise<void>; url: string }> {
  const config = loadConfig();
  const db = createDb(config.db);
  const app = createApp(createContext(config, db), { clientDir: 'dist' });
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
  const url = `http://${config.host}:${config.port}`;
  return {
    url,
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.destroy();
    },
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  startServer().then(({ url }) => console.log(`[tarnish] serving ${url}`));
}
