import { createHash, randomBytes } from 'node:crypto';

/** 256 random bits, URL-safe; only the sha256 of it is stored. */
export function newMailToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashMailToken(token) };
}

export function hashMailToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
