/** How long a file read in a worker thread is kept after its last use. */
const KEEP_MS = 30_000;
/** Files kept at once per thread: one upload's DEM and its glacier and debris outlines. */
const MAX_ENTRIES = 3;

const entries = new Map<string, { value: Promise<unknown>; timer: ReturnType<typeof setTimeout> }>();

/**
 * What a worker thread read from a stored file, kept for a while: the outlines of one upload are
 * derived one task at a time over the same DEM, and reading a large DEM takes longer than
 * deriving a small catchment from it. Stored files are written once under random names, so the
 * path (with how it is read) names the content. A failed read is not kept.
 */
export function cachedRead<T>(key: string, read: () => Promise<T>): Promise<T> {
  const hit = entries.get(key);
  if (hit) clearTimeout(hit.timer);
  const value = (hit?.value as Promise<T> | undefined) ?? read();
  entries.delete(key);
  entries.set(key, { value, timer: setTimeout(() => entries.delete(key), KEEP_MS).unref() });
  if (!hit) value.catch(() => entries.delete(key));
  for (const [oldest, entry] of entries) {
    if (entries.size <= MAX_ENTRIES) break;
    clearTimeout(entry.timer);
    entries.delete(oldest);
  }
  return value;
}
