import type { AddressInfo } from 'node:net';
import { createFakeStripeApp, type FakeStripeApp, type FakeStripeOptions } from './app';

export interface StartOptions extends FakeStripeOptions {
  /** 0 picks a free port. */
  port?: number;
}

export interface RunningFakeStripe extends FakeStripeApp {
  url: string;
  port: number;
  close(): Promise<void>;
}

/** Starts the fake on 127.0.0.1 (never on other interfaces) and says where it listens. */
export function startFakeStripe(options: StartOptions = {}): Promise<RunningFakeStripe> {
  const fake = createFakeStripeApp(options);
  return new Promise((resolve, reject) => {
    const server = fake.app.listen(options.port ?? 0, '127.0.0.1', (error?: Error) => {
      if (error) return reject(error);
      const { port } = server.address() as AddressInfo;
      const url = `http://127.0.0.1:${port}`;
      fake.context.publicUrl = options.publicUrl ?? url;
      resolve({
        ...fake,
        url,
        port,
        close: () =>
          new Promise<void>((done, fail) => {
            fake.controls.reset();
            server.closeAllConnections();
            server.close((closeError) => (closeError ? fail(closeError) : done()));
          }),
      });
    });
    server.on('error', reject);
  });
}
