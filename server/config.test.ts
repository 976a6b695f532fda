import { describe, expect, it } from 'vitest';
import { parseConfig } from './config';

const production = {
  NODE_ENV: 'production',
  JWT_SECRET: 'a-production-secret-of-at-least-thirty-two-characters',
  STRIPE_SECRET_KEY: 'sk_live_example',
  STRIPE_WEBHOOK_SECRET: 'whsec_example',
  PUBLIC_URL: 'https://tarnish.example',
};

describe('session cookie settings', () => {
  it('makes the cookie Secure (and so __Host-) by default in production', () => {
    expect(parseConfig(production).auth.cookieSecure).toBe(true);
  });

  it('keeps it plain on the local http set-up unless asked', () => {
    expect(parseConfig({}).auth.cookieSecure).toBe(false);
    expect(parseConfig({ COOKIE_SECURE: 'true' }).auth.cookieSecure).toBe(true);
  });

  it('refuses to start in production with the cookie made insecure', () => {
    expect(() => parseConfig({ ...production, COOKIE_SECURE: 'false' })).toThrow(/COOKIE_SECURE: must not be false in production/);
  });

  it('refuses to start in production without an https public address', () => {
    expect(() => parseConfig({ ...production, PUBLIC_URL: 'http://tarnish.example' })).toThrow(/PUBLIC_URL: must be the https:\/\//);
    const { PUBLIC_URL: _none, ...withoutUrl } = production;
    expect(() => parseConfig(withoutUrl)).toThrow(/PUBLIC_URL/);
  });
});
