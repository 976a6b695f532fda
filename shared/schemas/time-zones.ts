import { z } from 'zod';
import { remembered } from '../melt/remembered';

/**
 * IANA time zones as users pick them. `Intl.supportedValuesOf('timeZone')` lists ICU's names,
 * which keep some links renamed long ago in the IANA database (Asia/Calcutta for Asia/Kolkata,
 * Asia/Katmandu for Asia/Kathmandu) and leaves out UTC; this table maps those to the current
 * canonical names (IANA tz database, "backward" file), so the list is complete and what is stored
 * is always the canonical name.
 */
const CANONICAL_OF_LEGACY: Readonly<Record<string, string>> = {
  'Asia/Calcutta': 'Asia/Kolkata',
  'Asia/Katmandu': 'Asia/Kathmandu',
  'Asia/Dacca': 'Asia/Dhaka',
  'Asia/Thimbu': 'Asia/Thimphu',
  'Asia/Ulan_Bator': 'Asia/Ulaanbaatar',
  'Asia/Saigon': 'Asia/Ho_Chi_Minh',
  'Asia/Rangoon': 'Asia/Yangon',
  'Asia/Chongqing': 'Asia/Shanghai',
  'Asia/Chungking': 'Asia/Shanghai',
  'Asia/Harbin': 'Asia/Shanghai',
  'Asia/Kashgar': 'Asia/Urumqi',
  'Europe/Kiev': 'Europe/Kyiv',
  'Europe/Uzhgorod': 'Europe/Kyiv',
  'Europe/Zaporozhye': 'Europe/Kyiv',
  'America/Godthab': 'America/Nuuk',
  'America/Buenos_Aires': 'America/Argentina/Buenos_Aires',
  'America/Catamarca': 'America/Argentina/Catamarca',
  'America/Cordoba': 'America/Argentina/Cordoba',
  'America/Jujuy': 'America/Argentina/Jujuy',
  'America/Mendoza': 'America/Argentina/Mendoza',
  'America/Indianapolis': 'America/Indiana/Indianapolis',
  'America/Louisville': 'America/Kentucky/Louisville',
  'Atlantic/Faeroe': 'Atlantic/Faroe',
  'Pacific/Enderbury': 'Pacific/Kanton',
  'Pacific/Truk': 'Pacific/Chuuk',
  'Pacific/Ponape': 'Pacific/Pohnpei',
  'Etc/UTC': 'UTC', 'Etc/UCT': 'UTC', 'Etc/Universal': 'UTC', 'Etc/Zulu': 'UTC', UCT: 'UTC', Universal: 'UTC', Zulu: 'UTC',
  GMT: 'UTC', 'Etc/GMT': 'UTC', 'Etc/GMT0': 'UTC', 'Etc/GMT+0': 'UTC', 'Etc/GMT-0': 'UTC', 'Etc/Greenwich': 'UTC', Greenwich: 'UTC', GMT0: 'UTC',
};

/** A time zone the runtime knows (any spelling case); offsets such as "+05:45" are not zones. Remembered: building a formatter costs tens of microseconds, and every catchment write asks. */
const runtimeZone = remembered((name: string): string | null => {
  if (!/^[A-Za-z][A-Za-z0-9_+\-/]*$/.test(name)) return null;
  try {
    return new Intl.DateTimeFormat('en-US', { timeZone: name }).resolvedOptions().timeZone;
  } catch {
    return null;
  }
}, (name) => name, 2000);

/** The canonical IANA name of a zone or one of its aliases ("asia/calcutta" → "Asia/Kolkata"); null for anything else. */
export function canonicalTimeZone(input: string): string | null {
  const resolved = runtimeZone(input.trim());
  if (!resolved) return null;
  return CANONICAL_OF_LEGACY[resolved] ?? resolved;
}

/** Every zone a user can pick, canonical names only, sorted, UTC first. */
export function timeZoneNames(): string[] {
  const names = new Set(Intl.supportedValuesOf('timeZone').map((z) => CANONICAL_OF_LEGACY[z] ?? z));
  names.delete('UTC');
  return ['UTC', ...[...names].sort()];
}

/** The legacy names that lead to each canonical zone, so a search for "Calcutta" finds Asia/Kolkata. */
export const aliasesOf = (canonical: string): string[] => Object.keys(CANONICAL_OF_LEGACY).filter((legacy) => CANONICAL_OF_LEGACY[legacy] === canonical);

/** A time-zone field: refused with a message unless it is a zone; stored as the canonical name. */
export const timeZoneSchema = z.string().trim().min(1, 'is required')
  .refine((v) => canonicalTimeZone(v) !== null, { message: 'is not a time zone; choose one from the list (e.g. Asia/Kathmandu)' })
  .transform((v) => canonicalTimeZone(v)!);
