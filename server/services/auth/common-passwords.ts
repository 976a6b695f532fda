import { readFileSync } from 'node:fs';
import { gunzipSync } from 'node:zlib';

/** Built by scripts/passwords/build-common-passwords.ts from a published breach corpus (see its header). */
const ASSET = new URL('../../assets/common-passwords.txt.gz', import.meta.url);

let loaded: ReadonlySet<string> | undefined;

/** The list, read and unpacked once (about 44,000 entries, a few MB in memory). */
export function commonPasswords(): ReadonlySet<string> {
  loaded ??= new Set(gunzipSync(readFileSync(ASSET)).toString('utf8').split('\n').filter((line) => line !== ''));
  return loaded;
}

/** True when the password, compared case-insensitively, is among the breach corpus's common passwords. */
export const isCommonPassword = (password: string): boolean => commonPasswords().has(password.toLowerCase());
