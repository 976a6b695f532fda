import type { ParameterSpec } from '../melt/parameters';
import { HydrologyInputError, type HydrologyIssue } from './errors';
import type { ElevationBand } from './stations';

/**
 * Wind drift of snowfall between bands with per-band accumulation factors f (erosion on exposed
 * ridges f < 1, deposition on lee slopes and glacier basins f > 1), in the manner of the
 * snow-distribution multipliers of glacier mass-balance models (e.g. Huss et al. 2008, Hydrol.
 * Process. 22:3888) [memory]. The factors are made mass-conserving each day:
 *   Δb = sb (k fb − 1),   k = Σ A s / Σ A f s,
 * so the catchment keeps its snowfall and only its distribution changes; with all factors equal
 * nothing moves. Only the day's snowfall drifts (old snow stays put).
 */

export const WIND_FACTOR: ParameterSpec = {
  default: 1, min: 0, max: 3, unit: '-',
  source: 'relative snowfall accumulation per band; wind-driven glacier accumulation differs from precipitation by factors of ≈ 0.5–2 (Dadic et al. 2010, JGR 115 F01012; Winstral et al. 2002) [memory]; the range is an assumption',
};

export interface WindDriftPlan {
  readonly factors: Float64Array;
  readonly areaKm2: Float64Array;
}

/**
 * Prepares wind drift.
 * @param factors accumulation factor per band (0 … 3; 1 = keeps its own snowfall)
 * @throws HydrologyInputError naming the factor or band out of range
 */
export function planWindDrift(bands: readonly ElevationBand[], factors: ArrayLike<number>): WindDriftPlan {
  const issues: HydrologyIssue[] = [];
  if (factors.length !== bands.length) issues.push({ path: 'windFactors', message: `${bands.length} factors are needed, one per band; ${factors.length} were given.` });
  for (let i = 0; i < factors.length; i++) {
    if (!(factors[i] >= WIND_FACTOR.min && factors[i] <= WIND_FACTOR.max)) issues.push({ path: `windFactors[${i}]`, message: `the accumulation factor ${factors[i]} is outside ${WIND_FACTOR.min} … ${WIND_FACTOR.max}.` });
  }
  bands.forEach((b, i) => {
    if (!(b.areaKm2 > 0)) issues.push({ path: `bands[${i}].areaKm2`, message: 'a band needs an area greater than 0 km².' });
  });
  if (issues.length > 0) throw new HydrologyInputError(issues);
  return { factors: Float64Array.from(factors), areaKm2: Float64Array.from(bands, (b) => b.areaKm2) };
}

/**
 * One day of wind drift, in place. Call it after the day's snowfall has been added to SWE (the
 * step takes at most a band's own snowfall away, so SWE never turns negative). Writes the day's
 * net change per band (mm w.e. over the band area) into `netChangeMm`. Allocates nothing.
 *
 * @param snowfallMm the day's snowfall per band, mm w.e. over the band area
 * @param sweMm SWE per band, mm w.e., already including the day's snowfall (changed in place)
 * @example // two equal bands, 10 mm snowfall each, factors 0.5 and 1.5 → −5 and +5 mm
 */
export function windDrift(plan: WindDriftPlan, snowfallMm: ArrayLike<number>, sweMm: Float64Array, netChangeMm: Float64Array): void {
  const { factors, areaKm2 } = plan;
  let total = 0;
  let weighted = 0;
  for (let b = 0; b < factors.length; b++) {
    const s = snowfallMm[b] > 0 ? snowfallMm[b] : 0;
    total += areaKm2[b] * s;
    weighted += areaKm2[b] * factors[b] * s;
  }
  if (!(total > 0 && weighted > 0)) {
    netChangeMm.fill(0);
    return;
  }
  const k = total / weighted;
  for (let b = 0; b < factors.length; b++) {
    const s = snowfallMm[b] > 0 ? snowfallMm[b] : 0;
    const change = s * (k * factors[b] - 1);
    sweMm[b] += change;
    netChangeMm[b] = change;
  }
}
