/**
 * Factor separation (Stein & Alpert 1993, J. Atmos. Sci. 50:2107). With N factors, simulate all
 * 2^N combinations: f[mask] is the result with the factors whose bits are set in `mask` switched
 * on (f[0] the baseline, f[2^N − 1] the full change). The contribution of a set S of factors —
 * a single factor's pure effect when |S| = 1, their interaction when |S| ≥ 2 — is
 *   f̂_S = Σ_{T ⊆ S} (−1)^{|S| − |T|} f_T,
 * and the contributions of all non-empty sets add up exactly to f_full − f_0.
 *
 * @param values f for every mask 0 … 2^N − 1
 * @returns one term per non-empty mask, ordered by mask
 * @example separateFactors([10, 13, 15, 19], 2) // [{mask:1, value:3}, {mask:2, value:5}, {mask:3, value:1}]
 */
export function separateFactors(values: readonly number[], factorCount: number): { mask: number; value: number }[] {
  if (!Number.isInteger(factorCount) || factorCount < 1 || factorCount > 8) {
    throw new RangeError(`separateFactors: factorCount must be 1 … 8 (got ${factorCount})`);
  }
  const size = 1 << factorCount;
  if (values.length !== size) throw new RangeError(`separateFactors: need ${size} values for ${factorCount} factors (got ${values.length})`);
  const terms: { mask: number; value: number }[] = [];
  for (let s = 1; s < size; s++) {
    let value = 0;
    // Every subset t of s, including 0 and s itself.
    for (let t = s; ; t = (t - 1) & s) {
      value += (bitCount(s ^ t) % 2 === 0 ? 1 : -1) * values[t];
      if (t === 0) break;
    }
    terms.push({ mask: s, value });
  }
  return terms;
}

export function bitCount(mask: number): number {
  let n = 0;
  for (let m = mask; m; m &= m - 1) n++;
  return n;
}
