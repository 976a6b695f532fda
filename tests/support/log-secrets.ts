import { DEMO_ACCOUNTS } from '../../seeds/data/demo-accounts';
import { TEST_PASSWORD } from './factories';

/** What must never be written to the log: hashes, tokens, addresses and the passwords tests use. */
const PATTERNS: { what: string; pattern: RegExp }[] = [
  { what: 'bcrypt hash', pattern: /\$2[aby]?\$\d{2}\$[./A-Za-z0-9]{53}/g },
  { what: 'session token', pattern: /eyJ[A-Za-z0-9_-]{8,}\.[A-Za-z0-9_-]{8,}\.[A-Za-z0-9_-]{8,}/g },
  { what: 'mail or upload token', pattern: /(?<![A-Za-z0-9_-])[A-Za-z0-9_-]{32}(?:[A-Za-z0-9_-]{11})?(?![A-Za-z0-9_-])/g },
  { what: 'token hash', pattern: /\b[0-9a-f]{64}\b/g },
  { what: 'e-mail address', pattern: /[A-Za-z0-9._%+-]+@[A-Za-z0-9-]+(?:\.[A-Za-z0-9-]+)*\.[A-Za-z]{2,}/g },
];
const PASSWORDS = [TEST_PASSWORD, ...DEMO_ACCOUNTS.map((a) => a.password)];

/** Every secret-looking string in `text`, with what it looks like (empty when the text is clean). */
export function findSecrets(text: string): string[] {
  const found = PATTERNS.flatMap(({ what, pattern }) => [...text.matchAll(pattern)].map((m) => `${what}: ${m[0]}`));
  for (const password of PASSWORDS) if (text.includes(password)) found.push(`password: ${password}`);
  return [...new Set(found)];
}
