import { createHash } from 'node:crypto';

/**
 * JSON with object keys sorted at every level, so equal inputs always give the same text.
 * Arrays of plain values (the long forcing series) are written in one JSON.stringify call:
 * hashing a season of hourly forcing must not hold up the event loop.
 */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) {
    return value.every((v) => v === null || typeof v !== 'object') ? JSON.stringify(value) : `[${value.map(canonicalJson).join(',')}]`;
  }
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/** SHA-256 (hex) of the canonical JSON of a run's complete inputs. */
export function inputHash(value: unknown): string {
  return createHash('sha256').update(canonicalJson(value)).digest('hex');
}
