import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { z } from 'zod';

/** Session tokens: HS256 only, with issuer, audience, expiry and a token-type claim. */
const ISSUER = 'tarnish';
const AUDIENCE = 'tarnish-web';
const TOKEN_TYPE = 'session';

/** Every claim we set is required: a token without an expiry (or issued-at, issuer, audience) is refused. */
const claimsSchema = z.object({
  sub: z.string().regex(/^\d+$/),
  org: z.number().int().positive(),
  ver: z.number().int().min(0),
  typ: z.literal(TOKEN_TYPE),
  iss: z.literal(ISSUER),
  aud: z.literal(AUDIENCE),
  iat: z.number().int(),
  exp: z.number().int(),
});
export type SessionClaims = { userId: number; organisationId: number; tokenVersion: number };

/**
 * The secret as a key object, made once: given a string, jsonwebtoken builds one on every call
 * (first trying it as a public key), a tenth of a signed-in request's CPU time.
 */
const keys = new Map<string, KeyObject>();
function keyFor(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret, 'utf8'));
    keys.set(secret, key);
  }
  return key;
}

export function signSessionToken(claims: SessionClaims, secret: string, hours: number): string {
  return jwt.sign({ org: claims.organisationId, ver: claims.tokenVersion, typ: TOKEN_TYPE }, keyFor(secret), {
    algorithm: 'HS256',
    expiresIn: Math.round(hours * 3600),
    issuer: ISSUER,
    audience: AUDIENCE,
    subject: String(claims.userId),
  });
}

/**
 * Returns the claims of a valid token, or null for anything forged, expired, of another type,
 * missing a claim, or living longer than a session may (`maxHours`).
 */
export function verifySessionToken(token: string, secret: string, maxHours: number): SessionClaims | null {
  try {
    const payload = jwt.verify(token, keyFor(secret), { algorithms: ['HS256'], issuer: ISSUER, audience: AUDIENCE, maxAge: `${Math.round(maxHours * 3600)}s` });
    const parsed = claimsSchema.safeParse(payload);
    if (!parsed.success || parsed.data.exp - parsed.data.iat > maxHours * 3600 + 1) return null;
    return { userId: Number(parsed.data.sub), organisationId: parsed.data.org, tokenVersion: parsed.data.ver };
  } catch {
    return null;
  }
}
