/**
 * Snow cover within a band. The band's snow water equivalent is not spread evenly: at the peak of
 * accumulation it follows a lognormal distribution with coefficient of variation CV (Liston 2004,
 * J. Climate 17:1381; the same idea as the depletion curves of Luce et al. 1999) [memory]. Melt
 * takes the same depth M everywhere snow lies, so with the distribution normalised to mean 1
 * (ζ² = ln(1 + CV²), λ = −ζ²/2):
 *   snow-covered fraction   fsc(m) = 1 − Φ((ln m − λ)/ζ)
 *   mean SWE left           w(m)   = 1 − Φ((ln m − λ − ζ²)/ζ) − m fsc(m)
 * with m = M / peak. The engine needs fsc as a function of w = SWE / peak SWE, so the pair is
 * tabulated once per CV and inverted: the snowline retreats smoothly through a band instead of
 * jumping when its mean SWE reaches zero.
 */

import { remembered } from './remembered';

/** Standard normal distribution function; erf after Abramowitz & Stegun 7.1.26 (error < 1.5·10⁻⁷). */
export function normalCdf(x: number): number {
  const z = Math.abs(x) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * z);
  const erf = 1 - ((((1.061405429 * t - 1.453152027) * t + 1.421413741) * t - 0.284496736) * t + 0.254829592) * t * Math.exp(-z * z);
  return x >= 0 ? 0.5 * (1 + erf) : 0.5 * (1 - erf);
}

/** Snow-covered fraction and mean SWE left (both relative to the peak) after a uniform melt depth m (relative to the peak mean). */
export function depletion(meltRelative: number, variation: number): { cover: number; remaining: number } {
  if (meltRelative <= 0) return { cover: 1, remaining: 1 };
  const zeta2 = Math.log(1 + variation * variation);
  const zeta = Math.sqrt(zeta2);
  const lambda = -zeta2 / 2;
  const cover = 1 - normalCdf((Math.log(meltRelative) - lambda) / zeta);
  const remaining = 1 - normalCdf((Math.log(meltRelative) - lambda - zeta2) / zeta) - meltRelative * cover;
  return { cover, remaining: Math.max(0, remaining) };
}

/** Nodes of the cover table over w = 0 … 1. */
export const COVER_TABLE_NODES = 1001;

/**
 * Snow-covered fraction at w = i/(nodes − 1), i = 0 … nodes − 1, for one CV. Built by walking m
 * from 0 upwards on a fine logarithmic grid and interpolating the (w, fsc) pairs.
 */
export function buildCoverTable(variation: number): Float64Array {
  if (!(variation >= 0.01 && variation <= 3)) throw new RangeError(`buildCoverTable: coefficient of variation ${variation} is outside 0.01 … 3`);
  const table = new Float64Array(COVER_TABLE_NODES);
  const pairs: { w: number; f: number }[] = [{ w: 1, f: 1 }];
  for (let k = -6000; k <= 2000; k++) {
    const { cover, remaining } = depletion(10 ** (k / 1000), variation);
    pairs.push({ w: remaining, f: cover });
  }
  pairs.push({ w: 0, f: 0 });
  let j = 0;
  for (let i = COVER_TABLE_NODES - 1; i >= 0; i--) {
    const w = i / (COVER_TABLE_NODES - 1);
    while (j < pairs.length - 2 && pairs[j + 1].w >= w) j++;
    const a = pairs[j];
    const b = pairs[j + 1];
    const share = a.w === b.w ? 0 : (a.w - w) / (a.w - b.w);
    table[i] = a.f + (b.f - a.f) * share;
  }
  table[COVER_TABLE_NODES - 1] = 1;
  table[0] = 0;
  return table;
}

/** The cover table of a CV, built once per thread (about a millisecond each; most runs share a few CVs) and shared read-only by every run that uses it. */
export const coverTableFor = remembered(buildCoverTable, (variation) => variation, 64);

/** Snow-covered fraction for w = SWE / peak SWE read from a cover table (w clamped to 0 … 1). */
export function readCover(table: Float64Array, relativeSwe: number): number {
  const x = (relativeSwe <= 0 ? 0 : relativeSwe >= 1 ? 1 : relativeSwe) * (COVER_TABLE_NODES - 1);
  const i = x | 0;
  if (i >= COVER_TABLE_NODES - 1) return table[COVER_TABLE_NODES - 1];
  return table[i] + (table[i + 1] - table[i]) * (x - i);
}
