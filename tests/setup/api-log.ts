import { existsSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, expect } from 'vitest';
import { findSecrets } from '../support/log-secrets';

/**
 * Every API test file runs with the server's whole log (every request, at info level) captured
 * in a file of its own; after the file's tests, the log must hold no password, password hash,
 * token or e-mail address. The file is kept when it does, to be read.
 */
const file = path.join(tmpdir(), `tarnish-api-log-${process.pid}-${Date.now()}.jsonl`);
process.env.LOG_FILE = file;
process.env.LOG_LEVEL = 'info';

afterAll(() => {
  const text = existsSync(file) ? readFileSync(file, 'utf8') : '';
  const secrets = findSecrets(text);
  expect(secrets, `secrets in the captured server log ${file}`).toEqual([]);
  rmSync(file, { force: true });
});
