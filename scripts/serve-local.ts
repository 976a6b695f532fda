import { startServer } from '../server/index';
import { DEMO_ACCOUNTS } from '../seeds/data/demo-accounts';

/** Local serving for `npm start` and `npm run dev`: the app plus its local fakes, then the sign-ins. */
async function main(): Promise<void> {
  const server = await startServer();
  console.log(`\n  Tarnish is running at ${server.url}\n`);
  console.log('  Demo sign-ins (local use only):');
  for (const a of DEMO_ACCOUNTS) console.log(`    ${a.role.padEnd(11)} ${a.email.padEnd(32)} ${a.password}`);
  console.log('\n  Stop with Ctrl+C.\n');
  const stop = async () => {
    await server.close();
    process.exit(0);
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

void main();
