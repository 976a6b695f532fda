import { describe, expect, it } from 'vitest';
import { mailTokenSchema } from '../../../shared/schemas/members';
import { hashMailToken, newMailToken } from './mail-tokens';

describe('mail tokens', () => {
  it('carry 256 random bits that the shared schema accepts', () => {
    const { token } = newMailToken();
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    expect(mailTokenSchema.safeParse(token).success).toBe(true);
  });

  it('are stored as their sha256, never in clear', () => {
    const { token, hash } = newMailToken();
    expect(hash).toMatch(/^[0-9a-f]{64}$/);
    expect(hash).not.toContain(token);
    expect(hashMailToken(token)).toBe(hash);
  });

  it('differ every time', () => {
    const tokens = new Set(Array.from({ length: 200 }, () => newMailToken().token));
    expect(tokens.size).toBe(200);
  });
});
