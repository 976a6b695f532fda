import net from 'node:net';
import type { AddressInfo } from 'node:net';

/**
 * A TCP pass-through to `target` that can be cut and restored, to play a database that goes
 * away and comes back. Cutting closes every open connection and refuses new ones.
 */
export async function tcpSwitch(targetHost: string, targetPort: number) {
  const sockets = new Set<net.Socket>();
  let open = true;
  const server = net.createServer((client) => {
    if (!open) return client.destroy();
    const upstream = net.connect(targetPort, targetHost);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on('close', () => sockets.delete(s));
      s.on('error', () => s.destroy());
    }
    client.pipe(upstream).pipe(client);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    port: (server.address() as AddressInfo).port,
    cut(): void {
      open = false;
      for (const s of sockets) s.destroy();
    },
    restore(): void {
      open = true;
    },
    close: () => new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      server.close(() => resolve());
    }),
  };
}
