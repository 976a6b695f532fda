import type { Metadata } from './types';

/**
 * Applies metadata changes the way the service does: a key with an empty value is
 * removed, and `null` (sent as `metadata=`) removes every key.
 */
export function applyMetadataChanges(target: Metadata, changes: Metadata | null): void {
  if (changes === null) {
    for (const key of Object.keys(target)) delete target[key];
    return;
  }
  for (const [key, value] of Object.entries(changes)) {
    if (value === '') delete target[key];
    else target[key] = value;
  }
}
