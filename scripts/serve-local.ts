import { startServer } from '../server/index';
import { loadConfig } from '../server/config';
import { startMailCatcher } from '../server/services/mail/mail-catcher';
import { spawnWorker } from '../server/queue/worker-process';
import { startFakeStripe } from '../stripe-fake';
import { DEMO_ACCOUNTS } from '../seeds/data/demo-accounts';
import { replayPlansInFake } from './lib/paid-plan';

/** Local serving for `npm start` and `npm run dev`: the app, one worker process beside it and the local fakes, then the sign-ins. */
async function main(): Promise<void> {
  const config = loadConfig();
  // The payment fake and the mail catcher listen where the config points the app (loopback only).
  const catcher = await startMailCatcher(config.mail.port);
  const fake = await startFakeStripe({
    port: config.billing.port,
    // Straight to the API, also under `npm run dev` where the public URL is Vite's.
    webhookUrl: `http://${config.host}:${config.port}/api/billing/webhook`,
    webhookSecret: config.billing.webhookSecret,
    apiKey: config.billing.secretKey,
  });
  const server = await startServer({ inbox: catcher });
  // Simulations run in a worker process, never in the API: one beside it locally (more with `npm run worker`).
  const worker = spawnWorker();
  await worker.ready;
  const replayed = await replayPlansInFake(server.ctx, fake);

  console.log(`\n  Tarnish is running at ${config.publicUrl}${config.publicUrl === server.url ? '' : ` (API on ${server.url})`}\n`);
  console.log(`  Mail inbox (development only): ${config.publicUrl}/dev/inbox   (SMTP catcher on 127.0.0.1:${catcher.port})`);
  console.log(`  Payment service fake: ${fake.url}   (card 4242 4242 4242 4242; ${replayed} seat plan(s) set up in it)`);
  console.log(`  Job queue: Redis on ${config.queue.redis.host}:${config.queue.redis.port}, one worker process (pid ${worker.child.pid}; start more with npm run worker)\n`);
  console.log('  Demo sign-ins (local use only):');
  for (const a of DEMO_ACCOUNTS) console.log(`    ${a.role.padEnd(11)} ${a.email.padEnd(32)} ${a.password}`);
  console.log('\n  Stop with Ctrl+C.\n');
  const stop = async () => {
    await server.close();
    await worker.stop();
    await fake.close();
    await catcher.close();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop());
  process.once('SIGTERM', () => void stop());
}

void main();
