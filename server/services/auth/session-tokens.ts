import jwt from 'jsonwebtoken';
import { z } from 'zod';

/** Session tokens: HS256 only, with issuer, audience, expiry and a token-type claim. */
const ISSUER = 'tarnish';
const AUDIENCE = 'tarnish-web';
const TOKEN_TYPE = 'session';

const claimsSchema = z.object({
  sub: z.string().regex(/^\d+$/),
  org: z.number().int().positive(),
  ver: z.number().int().min(0),
  typ: z.literal(TOKEN_TYPE),
});
export type SessionClaims = { userId: number; organisationId: number; tokenVersion: number };

export function signSessionToken(claims: SessionClaims, secret: string, hours: number): string {
  return jwt.sign({ org: claims.organisationId, ver: claims.tokenVersion, typ: TOKEN_TYPE }, secret, {
    algorithm: 'HS256',
    expiresIn: Math.round(hours * 3600),
    issuer: ISSUER,
    audience: AUDIENCE,
    subject: String(claims.userId),
  });
}

/** Returns the claims of a valid token, or null for anything forged, expired or of another type. */
export function verifySessionToken(token: string, secret: string): SessionClaims | null {
  try {
    const payload = jwt.verify(token, secret, { algorithms: ['HS256'], issuer: ISSUER, audience: AUDIENCE });
    const parsed = claimsSchema.safeParse(payload);
    if (!parsed.success) return null;
    return { userId: Number(parsed.data.sub), organisationId: parsed.data.org, tokenVersion: parsed.data.ver };
  } catch {
    return null;
  }
}
