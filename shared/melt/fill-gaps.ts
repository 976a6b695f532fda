/**
 * Fills runs of missing values (null) no longer than maxGap by linear interpolation between the
 * neighbouring values; longer runs and gaps at either end stay null so the caller sees them.
 * Returns a new array; the input is not changed.
 *
 * @example fillShortGaps([1, null, 3, null, null, null, 7], 2) // [1, 2, 3, null, null, null, 7]
 */
export function fillShortGaps(values: readonly (number | null)[], maxGap: number): (number | null)[] {
  if (!Number.isInteger(maxGap) || maxGap < 0) throw new RangeError(`fillShortGaps: maxGap ${maxGap} must be a whole number ≥ 0`);
  const out = values.slice();
  let i = 0;
  while (i < out.length) {
    if (out[i] !== null) { i++; continue; }
    const start = i;
    while (i < out.length && out[i] === null) i++;
    const before = start - 1;
    const length = i - start;
    if (before < 0 || i >= out.length || length > maxGap) continue;
    const a = out[before] as number;
    const b = out[i] as number;
    for (let k = 1; k <= length; k++) out[before + k] = a + ((b - a) * k) / (length + 1);
  }
  return out;
}
