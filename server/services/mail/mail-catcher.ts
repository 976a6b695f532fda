import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { InboxMessage } from '../../../shared/schemas/members';
import { parseMail } from './parse-mail';

/** What the development inbox reads. */
export interface MailInbox {
  messages(): InboxMessage[];
}

export interface MailCatcher extends MailInbox {
  port: number;
  /** Resolves with the first message (already received or arriving) that matches. */
  waitFor(match: (message: InboxMessage) => boolean, timeoutMs?: number): Promise<InboxMessage>;
  close(): Promise<void>;
}

const KEEP_AT_MOST = 500;

/** An SMTP server on loopback that keeps every message in memory, for local use and tests. */
export async function startMailCatcher(port = 0): Promise<MailCatcher> {
  const kept: InboxMessage[] = [];
  const waiters = new Set<() => void>();
  let nextId = 1;

  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, done) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const to = session.envelope.rcptTo.map((r) => r.address);
        const mail = parseMail(Buffer.concat(chunks).toString('utf8'), to);
        kept.unshift({ id: nextId++, receivedAt: new Date().toISOString(), ...mail });
        kept.length = Math.min(kept.length, KEEP_AT_MOST);
        for (const wake of waiters) wake();
        done();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = (server as unknown as { server: { address(): AddressInfo } }).server.address();

  return {
    port: address.port,
    messages: () => [...kept],
    waitFor: (match, timeoutMs = 10_000) =>
      new Promise((resolve, reject) => {
        const check = () => {
          const found = kept.find(match);
          if (!found) return;
          cleanup();
          resolve(found);
        };
        const timer = setTimeout(() => {
          cleanup();
          reject(new Error(`No matching mail arrived within ${timeoutMs} ms.`));
        }, timeoutMs);
        const cleanup = () => {
          clearTimeout(timer);
          waiters.delete(check);
        };
        waiters.add(check);
        check();
      }),
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
