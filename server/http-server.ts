import type { Server, ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';

export interface DrainingServer {
  server: Server;
  url: string;
  /**
   * Stops taking connections, closes idle keep-alive ones at once, answers requests still being
   * served with `Connection: close`, and ends whatever is left once `graceMs` has passed.
   */
  close(): Promise<void>;
}

/** Listens with the app and shuts down gracefully but within a deadline (a deploy or restart never waits on a keep-alive client). */
export async function listenDraining(app: Express, port: number, host: string, graceMs: number): Promise<DrainingServer> {
  const server = app.listen(port, host);
  await new Promise<void>((resolve, reject) => server.once('listening', resolve).once('error', reject));
  let draining = false;
  const answering = new Set<ServerResponse>();
  // Before the app's own listener, so the header is set before any answer is written.
  server.prependListener('request', (_req, res) => {
    if (draining) res.setHeader('Connection', 'close');
    answering.add(res);
    res.once('close', () => answering.delete(res));
  });
  const { port: bound } = server.address() as AddressInfo;
  return {
    server,
    url: `http://${host}:${bound}`,
    close: async () => {
      draining = true;
      for (const res of answering) if (!res.headersSent) res.setHeader('Connection', 'close');
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeIdleConnections();
      // Requests still being answered get their answer with Connection: close; those that outlast the grace are cut.
      const deadline = setTimeout(() => server.closeAllConnections(), graceMs);
      const idle = setInterval(() => server.closeIdleConnections(), 50);
      try {
        await closed;
      } finally {
        clearTimeout(deadline);
        clearInterval(idle);
      }
    },
  };
}
