import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Random base-62 text; ids look like the service's (`cus_` + 14–24 characters). */
function randomText(length: number): string {
  const bytes = randomBytes(length);
  let text = '';
  for (const byte of bytes) text += ALPHABET[byte % ALPHABET.length];
  return text;
}

export type IdPrefix =
  | 'cus' | 'prod' | 'price' | 'cs_test' | 'sub' | 'si' | 'in' | 'il' | 'evt' | 'req' | 'pm' | 'whdel' | 'inpay' | 'pi' | 're';

export function newId(prefix: IdPrefix): string {
  return `${prefix}_${randomText(prefix === 'cs_test' ? 58 : 24)}`;
}

/** Invoice numbers are a per-customer prefix plus a sequence, e.g. `7F3K2Q9A-0001`. */
export function newInvoicePrefix(): string {
  return randomText(8).toUpperCase();
}
